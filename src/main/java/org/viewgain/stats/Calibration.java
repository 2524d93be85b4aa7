package org.viewgain.stats;

import java.util.ArrayList;
import java.util.List;

/**
 * Calibration of predicted probabilities of a two-group outcome: the Brier score (Brier 1950, Monthly Weather Review
 * 78:1-3), the mean of {@code (p - y)^2} with {@code y} 1 for a positive and 0 otherwise; the calibration slope, the
 * coefficient {@code b} of the logistic regression {@code logit P(y = 1) = a + b logit(p)} (Cox 1958, Biometrika
 * 45:562-565); and the calibration intercept ("calibration-in-the-large"), the {@code a} of
 * {@code logit P(y = 1) = a + logit(p)} with {@code logit(p)} as an offset, slope fixed at 1 (Van Calster et al. 2016,
 * J Clin Epidemiol 74:167-176; Steyerberg, Clinical Prediction Models, 2nd ed. 2019). Perfect calibration
 * gives intercept 0 and slope 1; a slope below 1 means predictions too extreme (typical of overfitting), above 1 too
 * modest; an intercept above 0 means the predicted risks are too low on average.
 *
 * <p>Before the logit, {@code p} is clipped to {@code [EPSILON, 1 - EPSILON]} so that probabilities of exactly 0 or
 * 1 (a forest whose trees all agree) have a finite logit of about -13.8 or 13.8. The Brier score uses the unclipped
 * {@code p}. Both logistic models are fitted by maximum likelihood with Newton-Raphson (the two-parameter model is
 * IRLS) from intercept 0 and slope 1, halving a step that lowers the log-likelihood by more than rounding
 * (1e-12 relative), until the change of each coefficient is below
 * {@code 1e-10 * (1 + |coefficient|)}, at most 100 iterations.
 *
 * <p>Undefined values are NaN, never an exception and never a substitute number:
 * <ul>
 *   <li>no subjects, or a probability that is NaN or outside [0, 1]: everything NaN (n still counts the rows);</li>
 *   <li>only one group present (no positives or no negatives): the maximum likelihood estimates are infinite, so
 *       intercept and slope are NaN; the Brier score is defined;</li>
 *   <li>all clipped probabilities equal: the slope is not identifiable (logit(p) does not vary), NaN; the intercept
 *       is defined, {@code logit(mean y) - logit(p)};</li>
 *   <li>complete or quasi-complete separation (every positive's logit(p) at or above every negative's, or at or
 *       below it; Albert &amp; Anderson 1984, Biometrika 71:1-10): the slope's estimate is infinite, NaN;</li>
 *   <li>Newton-Raphson not converged within the iteration limit: that coefficient NaN.</li>
 * </ul>
 *
 * @param n         number of subjects
 * @param brier     Brier score, in [0, 1]; lower is better
 * @param intercept calibration intercept (calibration-in-the-large), on the logit scale
 * @param slope     calibration slope
 */
public record Calibration(int n, double brier, double intercept, double slope) {
    /** Probabilities are clipped to {@code [EPSILON, 1 - EPSILON]} before the logit. */
    public static final double EPSILON = 1e-6;

    private static final int MAX_ITERATIONS = 100;
    private static final double TOLERANCE = 1e-10;

    /**
     * Calibration of {@code probability} (of being positive) against the truth.
     *
     * @param positive    whether each subject is positive
     * @param probability predicted probability of being positive, per subject
     * @throws IllegalArgumentException when the arrays differ in length (a caller's mistake, not the data's)
     */
    public static Calibration of(boolean[] positive, double[] probability) {
        if (positive.length != probability.length) {
            throw new IllegalArgumentException("truth and probabilities differ in length: " + positive.length
                    + " vs " + probability.length);
        }
        int n = positive.length;
        if (n == 0 || !probabilities(probability)) {
            return new Calibration(n, Double.NaN, Double.NaN, Double.NaN);
        }
        double squares = 0;
        int events = 0;
        double[] x = new double[n];
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            y[i] = positive[i] ? 1 : 0;
            events += positive[i] ? 1 : 0;
            double d = probability[i] - y[i];
            squares += d * d;
            x[i] = logit(probability[i]);
        }
        double brier = squares / n;
        if (events == 0 || events == n) {
            return new Calibration(n, brier, Double.NaN, Double.NaN);
        }
        return new Calibration(n, brier, offsetIntercept(x, y), slope(x, y, positive));
    }

    /**
     * The reliability diagram's points: {@code bins} equal-width bins of the predicted probability over [0, 1], bin
     * k holding {@code k/bins <= p < (k+1)/bins} (the last bin also p = 1), each with its number of subjects, mean
     * predicted probability and observed rate of positives. Every bin is returned, in order; an empty bin has n 0
     * and NaN means.
     *
     * @throws IllegalArgumentException when the arrays differ in length, bins is below 1, or a probability is NaN or
     *                                  outside [0, 1]
     */
    public static List<ReliabilityBin> reliability(boolean[] positive, double[] probability, int bins) {
        if (positive.length != probability.length) {
            throw new IllegalArgumentException("truth and probabilities differ in length: " + positive.length
                    + " vs " + probability.length);
        }
        if (bins < 1) {
            throw new IllegalArgumentException("bins must be at least 1, got " + bins);
        }
        if (!probabilities(probability)) {
            throw new IllegalArgumentException("a probability is NaN or outside [0, 1]");
        }
        int[] count = new int[bins];
        double[] sumP = new double[bins];
        int[] events = new int[bins];
        for (int i = 0; i < probability.length; i++) {
            int k = bin(probability[i], bins);
            count[k]++;
            sumP[k] += probability[i];
            events[k] += positive[i] ? 1 : 0;
        }
        List<ReliabilityBin> out = new ArrayList<>(bins);
        for (int k = 0; k < bins; k++) {
            double mean = count[k] > 0 ? sumP[k] / count[k] : Double.NaN;
            double rate = count[k] > 0 ? (double) events[k] / count[k] : Double.NaN;
            out.add(new ReliabilityBin((double) k / bins, (double) (k + 1) / bins, count[k], mean, rate));
        }
        return out;
    }

    /**
     * One bin of a reliability diagram.
     *
     * @param lower          lower edge (inclusive)
     * @param upper          upper edge (exclusive, except 1 for the last bin)
     * @param n              subjects whose probability falls in the bin
     * @param meanPredicted  their mean predicted probability; NaN when n is 0
     * @param observedRate   their fraction of positives; NaN when n is 0
     */
    public record ReliabilityBin(double lower, double upper, int n, double meanPredicted, double observedRate) {
    }

    /** logit of p clipped to [EPSILON, 1 - EPSILON]. */
    static double logit(double p) {
        double q = Math.min(1 - EPSILON, Math.max(EPSILON, p));
        return Math.log(q / (1 - q));
    }

    private static boolean probabilities(double[] p) {
        for (double v : p) {
            if (!(v >= 0 && v <= 1)) {
                return false;
            }
        }
        return true;
    }

    private static int bin(double p, int bins) {
        int k = Math.min(bins - 1, (int) (p * bins));
        // p * bins can round across an edge; the edges are k / bins
        while (k > 0 && p < (double) k / bins) {
            k--;
        }
        while (k < bins - 1 && p >= (double) (k + 1) / bins) {
            k++;
        }
        return k;
    }

    /** Maximum likelihood a of logit P(y) = a + x (x an offset), by Newton-Raphson; both classes present. */
    private static double offsetIntercept(double[] x, double[] y) {
        double[] fit = newton(x, y, true);
        return fit == null ? Double.NaN : fit[0];
    }

    /** Maximum likelihood b of logit P(y) = a + b x by IRLS; NaN when x is constant, separates, or no convergence. */
    private static double slope(double[] x, double[] y, boolean[] positive) {
        double minPos = Double.POSITIVE_INFINITY;
        double maxPos = Double.NEGATIVE_INFINITY;
        double minNeg = Double.POSITIVE_INFINITY;
        double maxNeg = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < x.length; i++) {
            if (positive[i]) {
                minPos = Math.min(minPos, x[i]);
                maxPos = Math.max(maxPos, x[i]);
            } else {
                minNeg = Math.min(minNeg, x[i]);
                maxNeg = Math.max(maxNeg, x[i]);
            }
        }
        if (Math.min(minPos, minNeg) == Math.max(maxPos, maxNeg)) {
            return Double.NaN; // constant logit(p): slope not identifiable
        }
        if (maxNeg <= minPos || maxPos <= minNeg) {
            return Double.NaN; // (quasi-)complete separation: the estimate is infinite
        }
        double[] fit = newton(x, y, false);
        return fit == null ? Double.NaN : fit[1];
    }

    /**
     * Newton-Raphson for logit P(y) = a + b x from (0, 1), with b held at 1 when {@code offset}; a step that lowers
     * the log-likelihood (beyond rounding) is halved. Returns {a, b}, or null without convergence.
     */
    private static double[] newton(double[] x, double[] y, boolean offset) {
        double a = 0;
        double b = 1;
        double[] at = pass(x, y, a, b);
        for (int it = 0; it < MAX_ITERATIONS; it++) {
            double da;
            double db = 0;
            if (offset) {
                if (!(at[3] > 0)) {
                    return null;
                }
                da = at[1] / at[3];
            } else {
                double det = at[3] * at[5] - at[4] * at[4];
                if (!(det > 0)) {
                    return null;
                }
                da = (at[5] * at[1] - at[4] * at[2]) / det;
                db = (at[3] * at[2] - at[4] * at[1]) / det;
            }
            double[] next = pass(x, y, a + da, b + db);
            for (int h = 0; h < 50 && next[0] < at[0] - 1e-12 * (1 + Math.abs(at[0])); h++) {
                da /= 2;
                db /= 2;
                next = pass(x, y, a + da, b + db);
            }
            a += da;
            b += db;
            at = next;
            if (Math.abs(da) < TOLERANCE * (1 + Math.abs(a)) && Math.abs(db) < TOLERANCE * (1 + Math.abs(b))) {
                return new double[] {a, b};
            }
        }
        return null;
    }

    /**
     * One pass over the data at (a, b): {log-likelihood, score for a, score for b, information aa, ab, bb}, with one
     * exponential and one logarithm per subject.
     */
    private static double[] pass(double[] x, double[] y, double a, double b) {
        double ll = 0;
        double g0 = 0;
        double g1 = 0;
        double h00 = 0;
        double h01 = 0;
        double h11 = 0;
        for (int i = 0; i < x.length; i++) {
            double eta = a + b * x[i];
            double e = Math.exp(-Math.abs(eta));
            double mu = eta >= 0 ? 1 / (1 + e) : e / (1 + e);
            // y * eta - log(1 + e^eta), without overflow
            ll += y[i] * eta - Math.max(eta, 0) - Math.log1p(e);
            double r = y[i] - mu;
            double w = mu * (1 - mu);
            g0 += r;
            g1 += r * x[i];
            h00 += w;
            h01 += w * x[i];
            h11 += w * x[i] * x[i];
        }
        return new double[] {ll, g0, g1, h00, h01, h11};
    }
}
