package org.viewgain.stats;

import org.apache.commons.math3.distribution.BinomialDistribution;

/**
 * McNemar's test of paired predictions from their discordant counts b and c (McNemar 1947): the chi-square form
 * with and without continuity correction (Agresti 1990, section 10.1), and the exact conditional binomial test and
 * its mid-p version (Fagerland, Lydersen &amp; Laake 2013, BMC Med Res Methodol 13:91).
 */
public final class McNemar {
    private McNemar() {
    }

    /**
     * Discordant pairs of two classifiers on the same rows.
     *
     * @param onlyACorrect rows that A classifies correctly and B does not (b)
     * @param onlyBCorrect rows that B classifies correctly and A does not (c)
     */
    public record Discordant(long onlyACorrect, long onlyBCorrect) {
        public Discordant {
            if (!(onlyACorrect >= 0 && onlyBCorrect >= 0)) {
                throw new IllegalArgumentException("discordant counts must be non-negative");
            }
        }
    }

    /** Counts the discordant pairs of predictions {@code a} and {@code b} against {@code truth}. */
    public static Discordant discordant(int[] truth, int[] a, int[] b) {
        if (truth.length != a.length || truth.length != b.length) {
            throw new IllegalArgumentException("truth and predictions differ in length");
        }
        long onlyA = 0;
        long onlyB = 0;
        for (int i = 0; i < truth.length; i++) {
            boolean aRight = a[i] == truth[i];
            boolean bRight = b[i] == truth[i];
            if (aRight && !bRight) {
                onlyA++;
            } else if (bRight && !aRight) {
                onlyB++;
            }
        }
        return new Discordant(onlyA, onlyB);
    }

    /**
     * Chi-square statistic (|b-c| - k)^2/(b+c) on 1 degree of freedom, k = 1 with continuity correction (floored at
     * 0 when b = c) else 0; undefined (NaN) when there are no discordant pairs.
     */
    public static TestResult chiSquare(Discordant d, boolean continuityCorrection) {
        double n = d.onlyACorrect() + d.onlyBCorrect();
        if (!(n > 0)) {
            return new TestResult(Double.NaN, Double.NaN);
        }
        double diff = Math.abs(d.onlyACorrect() - d.onlyBCorrect());
        if (continuityCorrection) {
            diff = Math.max(0, diff - 1);
        }
        double statistic = diff * diff / n;
        // chi-square(1) upper tail via 2 P(Z > sqrt(x)): the same number without 1 - cdf cancellation
        return new TestResult(statistic, Normal.twoSidedP(Math.sqrt(statistic)));
    }

    /** Exact two-sided p = min(1, 2 P(X &lt;= min(b, c))), X ~ Binomial(b + c, 1/2); 1 when b + c = 0. */
    public static double exactP(Discordant d) {
        long n = d.onlyACorrect() + d.onlyBCorrect();
        if (n == 0) {
            return 1;
        }
        BinomialDistribution x = binomial(n);
        return Math.min(1, 2 * x.cumulativeProbability((int) Math.min(d.onlyACorrect(), d.onlyBCorrect())));
    }

    /** Mid-p = exact p - P(X = min(b, c)) (Fagerland et al. 2013); 1 when b + c = 0. */
    public static double midP(Discordant d) {
        long n = d.onlyACorrect() + d.onlyBCorrect();
        if (n == 0) {
            return 1;
        }
        int k = (int) Math.min(d.onlyACorrect(), d.onlyBCorrect());
        BinomialDistribution x = binomial(n);
        return Math.min(1, 2 * x.cumulativeProbability(k) - x.probability(k));
    }

    private static BinomialDistribution binomial(long n) {
        if (n > Integer.MAX_VALUE) {
            throw new IllegalArgumentException("too many discordant pairs: " + n);
        }
        return new BinomialDistribution(null, (int) n, 0.5);
    }
}
