package org.viewgain.stats;

import org.apache.commons.math3.util.CombinatoricsUtils;

/**
 * The Freeman-Halton extension of Fisher's exact test to a 2 x c table (Freeman &amp; Halton 1951, Biometrika
 * 38:141-149): given the margins, the first row follows the multivariate hypergeometric distribution, P(x) =
 * prod_j C(c_j, x_j) / C(n, r_1). The p-value sums the probabilities of every table no more likely than the observed
 * one (relative tolerance 1e-7, as for {@link FisherExact}). Tables are enumerated, so the test is refused (NaN) when
 * there are more than {@link #MAX_TABLES} of them; use a chi-square test there.
 */
public final class FreemanHalton {
    /** Most tables enumerated before the test gives up. */
    public static final long MAX_TABLES = 2_000_000;

    private FreemanHalton() {
    }

    /** The p-value of the 2 x c table {@code {row1, row2}}; NaN when too many tables would be enumerated. */
    public static double p(long[] row1, long[] row2) {
        int c = row1.length;
        if (row2.length != c) {
            throw new IllegalArgumentException("rows differ in length");
        }
        long[] col = new long[c];
        long r1 = 0;
        long n = 0;
        for (int j = 0; j < c; j++) {
            if (!(row1[j] >= 0 && row2[j] >= 0)) {
                throw new IllegalArgumentException("counts must be non-negative");
            }
            col[j] = row1[j] + row2[j];
            r1 += row1[j];
            n += col[j];
        }
        long tables = 1;
        for (int j = 0; j + 1 < c; j++) {
            tables *= Math.min(col[j], r1) + 1;
            if (tables > MAX_TABLES) {
                return Double.NaN;
            }
        }
        double logTotal = CombinatoricsUtils.binomialCoefficientLog((int) n, (int) r1);
        // log C(c_j, x) for every column and count, computed once
        double[][] logC = new double[c][];
        for (int j = 0; j < c; j++) {
            logC[j] = new double[(int) col[j] + 1];
            for (int x = 0; x <= col[j]; x++) {
                logC[j][x] = CombinatoricsUtils.binomialCoefficientLog((int) col[j], x);
            }
        }
        double observed = logP(row1, logC, logTotal);
        long[] after = new long[c + 1];
        for (int j = c - 1; j >= 0; j--) {
            after[j] = after[j + 1] + col[j];
        }
        double[] sum = {0};
        enumerate(0, r1, new long[c], col, after, logC, logTotal, observed + Math.log1p(1e-7), sum);
        return Math.min(1, sum[0]);
    }

    private static void enumerate(int j, long remaining, long[] x, long[] col, long[] after, double[][] logC,
                                  double logTotal, double bound, double[] sum) {
        if (j == x.length) {
            double lp = logP(x, logC, logTotal);
            if (lp <= bound) {
                sum[0] += Math.exp(lp);
            }
            return;
        }
        long lo = Math.max(0, remaining - after[j + 1]);
        long hi = Math.min(col[j], remaining);
        for (long v = lo; v <= hi; v++) {
            x[j] = v;
            enumerate(j + 1, remaining - v, x, col, after, logC, logTotal, bound, sum);
        }
    }

    private static double logP(long[] x, double[][] logC, double logTotal) {
        double lp = -logTotal;
        for (int j = 0; j < x.length; j++) {
            lp += logC[j][(int) x[j]];
        }
        return lp;
    }
}
