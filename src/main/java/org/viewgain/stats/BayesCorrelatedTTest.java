package org.viewgain.stats;

import org.apache.commons.math3.distribution.TDistribution;

/**
 * Bayesian correlated t-test for per-fold differences from cross-validation (Corani &amp; Benavoli 2015, Machine
 * Learning 100:285-304; Benavoli, Corani, Demsar &amp; Zaffalon 2017, JMLR 18(77)): the posterior of the mean
 * difference is Student t with n - 1 degrees of freedom, location mean(d) and scale^2 = (1/n + rho/(1-rho)) s^2,
 * rho = n_test/(n_test + n_train). It gives the probabilities that the difference lies left of, inside, or right
 * of a region of practical equivalence [-rope, rope].
 */
public final class BayesCorrelatedTTest {
    private BayesCorrelatedTTest() {
    }

    /**
     * Posterior summary. With zero sample variance the posterior is the point mass at the mean (the limit of the
     * Student posterior), so exactly one of the probabilities is 1.
     *
     * @param mean  posterior location, mean(d)
     * @param scale posterior scale
     * @param df    degrees of freedom, n - 1
     * @param left  P(difference &lt; -rope)
     * @param rope  P(-rope &lt;= difference &lt;= rope)
     * @param right P(difference &gt; rope)
     */
    public record Posterior(double mean, double scale, double df, double left, double rope, double right) {
    }

    /** rho = n_test / (n_test + n_train), the correlation of the fold differences used by the test. */
    public static double rho(int testSize, int trainSize) {
        if (!(testSize > 0 && trainSize > 0)) {
            throw new IllegalArgumentException("sizes must be positive");
        }
        return testSize / (double) (testSize + trainSize);
    }

    /**
     * Posterior probabilities for the differences d (metric A minus metric B, one per fold and repeat).
     *
     * @param differences   at least 2 values
     * @param rho           correlation in [0, 1), see {@link #rho(int, int)}
     * @param ropeHalfWidth half-width of the region of practical equivalence, &gt;= 0
     */
    public static Posterior of(double[] differences, double rho, double ropeHalfWidth) {
        if (!(rho >= 0 && rho < 1)) {
            throw new IllegalArgumentException("rho must be in [0, 1), got " + rho);
        }
        if (!(ropeHalfWidth >= 0)) {
            throw new IllegalArgumentException("rope half-width must be >= 0, got " + ropeHalfWidth);
        }
        if (differences.length < 2) {
            throw new IllegalArgumentException("need at least 2 differences, got " + differences.length);
        }
        int n = differences.length;
        double[] mv = StudentT.meanAndVariance(differences);
        double mean = mv[0];
        double scale = Math.sqrt((1.0 / n + rho / (1 - rho)) * mv[1]);
        double df = n - 1;
        if (!(scale > 0)) {
            if (Double.isNaN(mean)) {
                throw new IllegalArgumentException("differences contain NaN");
            }
            double left = mean < -ropeHalfWidth ? 1 : 0;
            double right = mean > ropeHalfWidth ? 1 : 0;
            return new Posterior(mean, 0, df, left, 1 - left - right, right);
        }
        TDistribution t = StudentT.of(df);
        double left = t.cumulativeProbability((-ropeHalfWidth - mean) / scale);
        // upper tail by symmetry, avoiding 1 - cdf cancellation
        double right = t.cumulativeProbability((mean - ropeHalfWidth) / scale);
        double inside = t.cumulativeProbability((ropeHalfWidth - mean) / scale) - left;
        return new Posterior(mean, scale, df, left, inside, right);
    }
}
