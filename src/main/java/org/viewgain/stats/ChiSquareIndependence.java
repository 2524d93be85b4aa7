package org.viewgain.stats;

import org.apache.commons.math3.special.Gamma;

/**
 * Pearson's chi-square test of independence of an r x c table of counts (Agresti 2002, section 3.2): X^2 = sum
 * (observed - expected)^2 / expected on (r - 1)(c - 1) degrees of freedom, expected = row total x column total / n.
 * An approximation: with expected counts below 5 it can be far from exact (Cochran 1954), which {@link #smallExpected}
 * reports. Rows or columns with a zero total are dropped (they carry no information).
 */
public final class ChiSquareIndependence {
    private ChiSquareIndependence() {
    }

    /** The statistic and p (both NaN when fewer than two non-empty rows or columns remain). */
    public static TestResult test(long[][] table) {
        long[][] t = nonEmpty(table);
        if (t.length < 2 || t[0].length < 2) {
            return new TestResult(Double.NaN, Double.NaN);
        }
        double[][] e = expected(t);
        double x2 = 0;
        for (int i = 0; i < t.length; i++) {
            for (int j = 0; j < t[0].length; j++) {
                x2 += (t[i][j] - e[i][j]) * (t[i][j] - e[i][j]) / e[i][j];
            }
        }
        int df = (t.length - 1) * (t[0].length - 1);
        // upper tail of chi-square(df) = Q(df/2, x2/2), without 1 - cdf cancellation
        return new TestResult(x2, Gamma.regularizedGammaQ(df / 2.0, x2 / 2));
    }

    /** True when some expected count of the non-empty table is below 5 (the approximation is then doubtful). */
    public static boolean smallExpected(long[][] table) {
        long[][] t = nonEmpty(table);
        if (t.length < 2 || t[0].length < 2) {
            return false;
        }
        for (double[] row : expected(t)) {
            for (double v : row) {
                if (v < 5) {
                    return true;
                }
            }
        }
        return false;
    }

    private static double[][] expected(long[][] t) {
        double[] row = new double[t.length];
        double[] col = new double[t[0].length];
        double n = 0;
        for (int i = 0; i < t.length; i++) {
            for (int j = 0; j < col.length; j++) {
                row[i] += t[i][j];
                col[j] += t[i][j];
                n += t[i][j];
            }
        }
        double[][] e = new double[t.length][col.length];
        for (int i = 0; i < t.length; i++) {
            for (int j = 0; j < col.length; j++) {
                e[i][j] = row[i] * col[j] / n;
            }
        }
        return e;
    }

    private static long[][] nonEmpty(long[][] table) {
        int cols = table.length == 0 ? 0 : table[0].length;
        boolean[] keepCol = new boolean[cols];
        int rows = 0;
        for (long[] r : table) {
            long sum = 0;
            for (int j = 0; j < cols; j++) {
                if (r[j] < 0) {
                    throw new IllegalArgumentException("counts must be non-negative");
                }
                sum += r[j];
                keepCol[j] |= r[j] > 0;
            }
            rows += sum > 0 ? 1 : 0;
        }
        int kept = 0;
        for (boolean k : keepCol) {
            kept += k ? 1 : 0;
        }
        long[][] out = new long[rows][kept];
        int i = 0;
        for (long[] r : table) {
            long sum = 0;
            for (long v : r) {
                sum += v;
            }
            if (sum == 0) {
                continue;
            }
            int j = 0;
            for (int c = 0; c < cols; c++) {
                if (keepCol[c]) {
                    out[i][j++] = r[c];
                }
            }
            i++;
        }
        return out;
    }
}
