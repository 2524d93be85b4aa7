package org.viewgain.stats;

/**
 * Wilson score interval for a binomial proportion (Wilson 1927), without and with continuity correction, as given
 * by Newcombe (1998, Statistics in Medicine 17:857-872, methods 3 and 4).
 */
public final class Wilson {
    private Wilson() {
    }

    /**
     * Wilson score interval for {@code successes} out of {@code trials}; undefined (NaN) when trials is 0.
     *
     * @param confidence two-sided level, e.g. 0.95
     */
    public static Interval interval(long successes, long trials, double confidence) {
        double z = checked(successes, trials, confidence);
        if (trials == 0) {
            return Interval.undefined();
        }
        double n = trials;
        double p = successes / n;
        double z2 = z * z;
        double centre = 2 * n * p + z2;
        double half = z * Math.sqrt(z2 + 4 * n * p * (1 - p));
        double denominator = 2 * (n + z2);
        return new Interval(Math.max(0, (centre - half) / denominator), Math.min(1, (centre + half) / denominator));
    }

    /**
     * Continuity-corrected Wilson interval (Newcombe 1998, method 4); the lower end is 0 when there are no
     * successes and the upper end 1 when all trials succeed. Undefined (NaN) when trials is 0.
     */
    public static Interval continuityCorrected(long successes, long trials, double confidence) {
        double z = checked(successes, trials, confidence);
        if (trials == 0) {
            return Interval.undefined();
        }
        double n = trials;
        double p = successes / n;
        double z2 = z * z;
        double denominator = 2 * (n + z2);
        double low = 0;
        if (successes > 0) {
            low = (2 * n * p + z2 - 1 - z * Math.sqrt(z2 - 2 - 1 / n + 4 * p * (n * (1 - p) + 1))) / denominator;
        }
        double high = 1;
        if (successes < trials) {
            high = (2 * n * p + z2 + 1 + z * Math.sqrt(z2 + 2 - 1 / n + 4 * p * (n * (1 - p) - 1))) / denominator;
        }
        return new Interval(Math.max(0, low), Math.min(1, high));
    }

    private static double checked(long successes, long trials, double confidence) {
        if (!(successes >= 0 && successes <= trials)) {
            throw new IllegalArgumentException("need 0 <= successes <= trials, got " + successes + " of " + trials);
        }
        return Normal.twoSidedZ(confidence);
    }
}
