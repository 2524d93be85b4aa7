package org.viewgain.stats;

import java.util.Arrays;
import java.util.Comparator;
import java.util.stream.IntStream;

/**
 * Multiple-testing adjustment of p-values, returned in input order: Bonferroni, Holm (1979, Scand J Stat 6:65-70)
 * and Benjamini &amp; Hochberg (1995, JRSS-B 57:289-300). Reject hypothesis i at level alpha when adjusted[i] &lt;=
 * alpha. NaN p-values stay NaN and do not count towards the number of tests.
 */
public final class Adjust {
    private Adjust() {
    }

    /** Bonferroni: min(1, m p). */
    public static double[] bonferroni(double[] p) {
        int m = validCount(p);
        return Arrays.stream(p).map(v -> Double.isNaN(v) ? v : Math.min(1, m * v)).toArray();
    }

    /** Holm step-down: sorted ascending, adjusted_(i) = max over j &lt;= i of min(1, (m - j + 1) p_(j)). */
    public static double[] holm(double[] p) {
        int[] order = ascending(p);
        int m = order.length;
        double[] out = nanCopy(p);
        double running = 0;
        for (int rank = 0; rank < m; rank++) {
            running = Math.max(running, Math.min(1, (m - rank) * p[order[rank]]));
            out[order[rank]] = running;
        }
        return out;
    }

    /** Benjamini-Hochberg step-up: adjusted_(i) = min over j &gt;= i of min(1, m p_(j) / j). */
    public static double[] benjaminiHochberg(double[] p) {
        int[] order = ascending(p);
        int m = order.length;
        double[] out = nanCopy(p);
        double running = 1;
        for (int rank = m - 1; rank >= 0; rank--) {
            running = Math.min(running, m * p[order[rank]] / (rank + 1));
            out[order[rank]] = running;
        }
        return out;
    }

    /** Indices of the non-NaN p-values sorted ascending by p (stable, so ties keep input order). */
    private static int[] ascending(double[] p) {
        validCount(p);
        return IntStream.range(0, p.length).filter(i -> !Double.isNaN(p[i])).boxed()
                .sorted(Comparator.comparingDouble(i -> p[i])).mapToInt(Integer::intValue).toArray();
    }

    private static double[] nanCopy(double[] p) {
        double[] out = new double[p.length];
        Arrays.fill(out, Double.NaN);
        return out;
    }

    private static int validCount(double[] p) {
        int m = 0;
        for (double v : p) {
            if (v >= 0 && v <= 1) {
                m++;
            } else if (!Double.isNaN(v)) {
                throw new IllegalArgumentException("p-value outside [0, 1]: " + v);
            }
        }
        return m;
    }
}
