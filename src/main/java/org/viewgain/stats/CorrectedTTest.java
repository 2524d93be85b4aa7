package org.viewgain.stats;

/**
 * Corrected resampled t-test of per-fold metric differences from (repeated) cross-validation (Nadeau &amp; Bengio
 * 2003, Machine Learning 52:239-281; Bouckaert &amp; Frank 2004, PAKDD, LNCS 3056:3-12):
 * t = mean(d) / sqrt((1/n + n_test/n_train) s^2) on n - 1 degrees of freedom, n = folds x repeats.
 */
public final class CorrectedTTest {
    /** Outer folds of the plan Bouckaert &amp; Frank (2004) recommend for this test: 10 repeats of 10-fold CV. */
    public static final int RECOMMENDED_FOLDS = 10;
    /** Repeats of that recommended plan. */
    public static final int RECOMMENDED_REPEATS = 10;

    private CorrectedTTest() {
    }

    /**
     * True when a k-fold plan has fewer folds or repeats than Bouckaert &amp; Frank (2004) recommend (10 x 10): the
     * correction then leaves the test with little power (on null cohorts with 5 x 2 it rejected well under its
     * nominal level; docs/benchmarks.md), so a p above alpha is not evidence of no difference.
     */
    public static boolean fewResamples(int folds, int repeats) {
        return folds < RECOMMENDED_FOLDS || repeats < RECOMMENDED_REPEATS;
    }

    /**
     * Result of the test. t and p are NaN when the differences have zero variance (or fewer than 2 values):
     * the test is undefined there, not significant nor insignificant.
     *
     * @param meanDifference mean of the differences
     * @param se             corrected standard error sqrt((1/n + n_test/n_train) s^2)
     * @param t              meanDifference / se
     * @param df             n - 1
     * @param p              two-sided p-value from Student's t
     */
    public record Result(double meanDifference, double se, double t, double df, double p) {
        /** meanDifference +/- t_{df} * se at the two-sided level; undefined when se is undefined. */
        public Interval interval(double confidence) {
            Normal.checkConfidence(confidence);
            if (!(df >= 1 && se >= 0)) {
                return Interval.undefined();
            }
            double q = StudentT.of(df).inverseCumulativeProbability(0.5 + confidence / 2);
            return new Interval(meanDifference - q * se, meanDifference + q * se);
        }
    }

    /**
     * The test for differences d (one per fold and repeat) with the given test-to-training size ratio.
     *
     * @param differences     per-fold metric of A minus metric of B
     * @param testToTrainRatio n_test / n_train of one fold, e.g. 1/(k-1) for k-fold
     */
    public static Result test(double[] differences, double testToTrainRatio) {
        if (!(testToTrainRatio >= 0 && Double.isFinite(testToTrainRatio))) {
            throw new IllegalArgumentException("test-to-train ratio must be finite and >= 0, got "
                    + testToTrainRatio);
        }
        int n = differences.length;
        double[] mv = StudentT.meanAndVariance(differences);
        double se = Math.sqrt((1.0 / n + testToTrainRatio) * mv[1]);
        double df = n - 1;
        double t = se > 0 ? mv[0] / se : Double.NaN;
        double p = Double.isNaN(t) ? Double.NaN : 2 * StudentT.of(df).cumulativeProbability(-Math.abs(t));
        return new Result(mv[0], n > 1 ? se : Double.NaN, t, df, p);
    }

    /** The test for k-fold cross-validation (any number of repeats), where n_test/n_train = 1/(k-1). */
    public static Result kFold(double[] differences, int folds) {
        if (folds < 2) {
            throw new IllegalArgumentException("k-fold needs at least 2 folds, got " + folds);
        }
        return test(differences, 1.0 / (folds - 1));
    }
}
