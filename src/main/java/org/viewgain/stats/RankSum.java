package org.viewgain.stats;

import java.util.Arrays;

/**
 * Wilcoxon rank-sum (Mann-Whitney) test of two independent samples (Wilcoxon 1945; Mann &amp; Whitney 1947), by the
 * normal approximation with mid-ranks for ties, the tie-corrected variance and a continuity correction of 1/2, as
 * R's {@code wilcox.test(exact = FALSE, correct = TRUE)} computes it: W = rank sum of x minus m(m+1)/2, E[W] = mn/2,
 * Var[W] = mn/12 ((N+1) - sum(t^3 - t)/(N(N-1))), z = (W - E[W] -/+ 1/2) / sd. Two-sided p.
 */
public final class RankSum {
    private RankSum() {
    }

    /** The result: W, z and the two-sided p; z and p NaN when a sample is empty or every value ties. */
    public record Result(double w, double z, double p) {
    }

    /** The test of x against y; NaN values are not allowed. */
    public static Result test(double[] x, double[] y) {
        int m = x.length;
        int n = y.length;
        if (m == 0 || n == 0) {
            return new Result(Double.NaN, Double.NaN, Double.NaN);
        }
        double[] all = new double[m + n];
        System.arraycopy(x, 0, all, 0, m);
        System.arraycopy(y, 0, all, m, n);
        for (double v : all) {
            if (Double.isNaN(v)) {
                throw new IllegalArgumentException("NaN in the samples");
            }
        }
        double[] sorted = all.clone();
        Arrays.sort(sorted);
        double rankSumX = 0;
        for (int i = 0; i < m; i++) {
            rankSumX += midRank(sorted, x[i]);
        }
        double ties = 0;
        for (int i = 0; i < sorted.length; ) {
            int j = i;
            while (j < sorted.length && sorted[j] == sorted[i]) {
                j++;
            }
            double t = j - i;
            ties += t * t * t - t;
            i = j;
        }
        int total = m + n;
        double w = rankSumX - m * (m + 1) / 2.0;
        double mean = m * (double) n / 2;
        double variance = m * (double) n / 12 * ((total + 1) - ties / (total * (total - 1.0)));
        if (!(variance > 0)) {
            return new Result(w, Double.NaN, Double.NaN);
        }
        double diff = w - mean;
        double z = (diff - Math.signum(diff) * 0.5) / Math.sqrt(variance);
        return new Result(w, z, Normal.twoSidedP(z));
    }

    /** The mid-rank (1-based) of v in the sorted values. */
    private static double midRank(double[] sorted, double v) {
        int lo = Placements.countBelow(sorted, v);
        int hi = Placements.countBelow(sorted, Math.nextUp(v));
        return (lo + 1 + hi) / 2.0;
    }
}
