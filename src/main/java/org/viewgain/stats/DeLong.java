package org.viewgain.stats;

/**
 * Variance of an AUC and the paired test of two correlated AUCs from placement values (DeLong, DeLong &amp;
 * Clarke-Pearson 1988, Biometrics 44:837-845), with ties counting one half. Higher score means more likely positive.
 */
public final class DeLong {
    private DeLong() {
    }

    /**
     * One AUC with its DeLong variance.
     *
     * @param auc       the AUC (NaN when undefined)
     * @param variance  DeLong variance S10/m + S01/n (NaN when undefined)
     * @param positives number of positives
     * @param negatives number of negatives
     */
    public record Estimate(double auc, double variance, int positives, int negatives) {
        /** Standard error, the square root of the variance. */
        public double se() {
            return Math.sqrt(variance);
        }

        /** Normal-theory interval auc +/- z*se at the two-sided level, clipped to [0, 1]. */
        public Interval interval(double confidence) {
            double half = Normal.twoSidedZ(confidence) * se();
            if (Double.isNaN(half) || Double.isNaN(auc)) {
                return Interval.undefined();
            }
            return new Interval(Math.max(0, auc - half), Math.min(1, auc + half));
        }
    }

    /**
     * Paired comparison of AUC(A) and AUC(B) on the same rows; z = (aucA - aucB) / sqrt(variance), two-sided p.
     * z and p are NaN when the variance of the difference is 0 (e.g. identical scores) or undefined.
     *
     * @param aucA     AUC of the first scores
     * @param aucB     AUC of the second scores
     * @param variance DeLong variance of aucA - aucB
     * @param z        the test statistic
     * @param p        two-sided normal p-value
     */
    public record Comparison(double aucA, double aucB, double variance, double z, double p) {
        /** aucA - aucB. */
        public double difference() {
            return aucA - aucB;
        }

        /** Normal-theory interval of aucA - aucB at the two-sided level. */
        public Interval interval(double confidence) {
            double half = Normal.twoSidedZ(confidence) * Math.sqrt(variance);
            if (Double.isNaN(half) || Double.isNaN(difference())) {
                return Interval.undefined();
            }
            return new Interval(difference() - half, difference() + half);
        }
    }

    /** The AUC of the scores with its DeLong variance; NaN values when a class is empty or a score is NaN. */
    public static Estimate estimate(double[] scores, boolean[] positive) {
        Placements p = Placements.of(scores, positive);
        int nPos = count(positive, true);
        int nNeg = positive.length - nPos;
        if (p == null) {
            return new Estimate(Double.NaN, Double.NaN, nPos, nNeg);
        }
        double variance = covariance(p.ofPositives, p.ofPositives) / nPos
                + covariance(p.ofNegatives, p.ofNegatives) / nNeg;
        return new Estimate(p.auc(), variance, nPos, nNeg);
    }

    /** DeLong test of two correlated AUCs of scores {@code a} and {@code b} on the same rows and labels. */
    public static Comparison compare(double[] a, double[] b, boolean[] positive) {
        Placements pa = Placements.of(a, positive);
        Placements pb = Placements.of(b, positive);
        if (pa == null || pb == null) {
            double aucA = pa == null ? Double.NaN : pa.auc();
            double aucB = pb == null ? Double.NaN : pb.auc();
            return new Comparison(aucA, aucB, Double.NaN, Double.NaN, Double.NaN);
        }
        int nPos = pa.ofPositives.length;
        int nNeg = pa.ofNegatives.length;
        double varA = covariance(pa.ofPositives, pa.ofPositives) / nPos
                + covariance(pa.ofNegatives, pa.ofNegatives) / nNeg;
        double varB = covariance(pb.ofPositives, pb.ofPositives) / nPos
                + covariance(pb.ofNegatives, pb.ofNegatives) / nNeg;
        double cov = covariance(pa.ofPositives, pb.ofPositives) / nPos
                + covariance(pa.ofNegatives, pb.ofNegatives) / nNeg;
        double variance = Math.max(0, varA + varB - 2 * cov);
        double z = variance > 0 ? (pa.auc() - pb.auc()) / Math.sqrt(variance) : Double.NaN;
        return new Comparison(pa.auc(), pb.auc(), variance, z, Normal.twoSidedP(z));
    }

    /** Sample covariance with the n - 1 divisor (DeLong's S10, S01); NaN for a single value. */
    private static double covariance(double[] x, double[] y) {
        int n = x.length;
        if (n < 2) {
            return Double.NaN;
        }
        double mx = 0;
        double my = 0;
        for (int i = 0; i < n; i++) {
            mx += x[i] / n;
            my += y[i] / n;
        }
        double sum = 0;
        for (int i = 0; i < n; i++) {
            sum += (x[i] - mx) * (y[i] - my);
        }
        return sum / (n - 1);
    }

    private static int count(boolean[] flags, boolean value) {
        int c = 0;
        for (boolean f : flags) {
            if (f == value) {
                c++;
            }
        }
        return c;
    }
}
