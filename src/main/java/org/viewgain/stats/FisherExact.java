package org.viewgain.stats;

import org.apache.commons.math3.distribution.HypergeometricDistribution;

/**
 * Fisher's exact test of a 2 x 2 table [[a, b], [c, d]] (Fisher 1935; Agresti 2002, Categorical Data Analysis,
 * section 3.5): given the margins, a follows the hypergeometric distribution. The two-sided p sums the probabilities
 * of every table no more likely than the observed one (with a relative tolerance of 1e-7 for ties in floating
 * point, as R's fisher.test does).
 */
public final class FisherExact {
    private FisherExact() {
    }

    /** Two-sided p-value. */
    public static double twoSided(int a, int b, int c, int d) {
        HypergeometricDistribution h = distribution(a, b, c, d);
        double observed = h.probability(a);
        double p = 0;
        for (int x = h.getSupportLowerBound(); x <= h.getSupportUpperBound(); x++) {
            double px = h.probability(x);
            if (px <= observed * (1 + 1e-7)) {
                p += px;
            }
        }
        return Math.min(1, p);
    }

    /** One-sided p-value P(A &gt;= a): evidence that the odds ratio is above 1. */
    public static double greater(int a, int b, int c, int d) {
        HypergeometricDistribution h = distribution(a, b, c, d);
        return Math.min(1, h.upperCumulativeProbability(a));
    }

    private static HypergeometricDistribution distribution(int a, int b, int c, int d) {
        if (!(a >= 0 && b >= 0 && c >= 0 && d >= 0)) {
            throw new IllegalArgumentException("counts must be non-negative");
        }
        // population a+b+c+d, "successes" the first row (a + b), draws the first column (a + c)
        return new HypergeometricDistribution(null, a + b + c + d, a + b, a + c);
    }
}
