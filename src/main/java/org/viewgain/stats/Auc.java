package org.viewgain.stats;

/**
 * Area under the ROC curve as the Mann-Whitney probability that a positive scores above a negative, ties counting
 * one half, with the Hanley &amp; McNeil (1982, Radiology 143:29-36) standard error. Higher score means more likely
 * positive.
 */
public final class Auc {
    private Auc() {
    }

    /**
     * The AUC of {@code scores} for the rows marked {@code positive}; NaN when either class is empty or a score is
     * NaN (undefined).
     *
     * @throws IllegalArgumentException if the arrays differ in length
     */
    public static double of(double[] scores, boolean[] positive) {
        Placements p = Placements.of(scores, positive);
        return p == null ? Double.NaN : p.auc();
    }

    /**
     * Hanley &amp; McNeil (1982) standard error computed from the data, as in their Table I: Q1 and Q2 are the
     * observed probabilities that two positives both outrank a negative and that a positive outranks two negatives,
     * a tie scoring one half for one pair and one third for both; NaN when a class is empty or a score is NaN.
     */
    public static double hanleyMcNeilSe(double[] scores, boolean[] positive) {
        Placements p = Placements.of(scores, positive);
        if (p == null) {
            return Double.NaN;
        }
        double auc = p.auc();
        int nPos = p.ofPositives.length;
        int nNeg = p.ofNegatives.length;
        double q1 = p.pairMomentOfNegatives();
        double q2 = p.pairMomentOfPositives();
        double var = (auc * (1 - auc) + (nPos - 1) * (q1 - auc * auc) + (nNeg - 1) * (q2 - auc * auc))
                / ((double) nPos * nNeg);
        return Math.sqrt(Math.max(0, var));
    }

    /**
     * Hanley &amp; McNeil (1982) standard error of an AUC from its value and the numbers of positives and negatives
     * (their equation 1 with the approximations Q1 = A/(2-A), Q2 = 2A^2/(1+A)); NaN when a class is empty or the AUC is NaN.
     */
    public static double hanleyMcNeilSe(double auc, int positives, int negatives) {
        if (!(positives > 0 && negatives > 0 && auc >= 0 && auc <= 1)) {
            return Double.NaN;
        }
        double q1 = auc / (2 - auc);
        double q2 = 2 * auc * auc / (1 + auc);
        double var = (auc * (1 - auc) + (positives - 1) * (q1 - auc * auc) + (negatives - 1) * (q2 - auc * auc))
                / ((double) positives * negatives);
        return Math.sqrt(Math.max(0, var));
    }
}
