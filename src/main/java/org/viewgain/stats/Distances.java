package org.viewgain.stats;

/** Distance matrices from feature rows, for distance-based tests such as {@link Permanova}. */
public final class Distances {
    private static final int TILE = 32;
    private static final int CHUNK = 1024;

    private Distances() {
    }

    /** The squared Euclidean distance of two rows of equal length (four partial sums, in a fixed order). */
    public static double squared(double[] a, double[] b) {
        return squares(a, b, 0, a.length);
    }

    /** Sum of squared differences over columns [c0, c1), with four partial sums (in a fixed order). */
    private static double squares(double[] a, double[] b, int c0, int c1) {
        double s0 = 0;
        double s1 = 0;
        double s2 = 0;
        double s3 = 0;
        int k = c0;
        for (; k + 3 < c1; k += 4) {
            double d0 = a[k] - b[k];
            double d1 = a[k + 1] - b[k + 1];
            double d2 = a[k + 2] - b[k + 2];
            double d3 = a[k + 3] - b[k + 3];
            s0 += d0 * d0;
            s1 += d1 * d1;
            s2 += d2 * d2;
            s3 += d3 * d3;
        }
        for (; k < c1; k++) {
            double dk = a[k] - b[k];
            s0 += dk * dk;
        }
        return (s0 + s1) + (s2 + s3);
    }

    /**
     * Euclidean distances between rows from their Gram matrix ({@code g_ij} = row i . row j, e.g. from
     * {@link SmileMatrices#rowGram}): {@code sqrt(max(0, g_ii + g_jj - 2 g_ij))}, symmetric with a zero diagonal.
     * The squared distances agree with the sums of squared differences to rounding relative to the rows' squared
     * lengths; where the rows are far from the origin next to their distances, prefer {@link #euclidean}. A
     * non-finite entry (from a non-finite value in a row) is refused, as {@link #euclidean} refuses the value.
     */
    public static double[][] euclideanFromGram(double[][] g) {
        int n = g.length;
        double[][] d = new double[n][n];
        for (int i = 0; i < n; i++) {
            if (g[i].length != n) {
                throw new IllegalArgumentException("Gram row " + i + " has " + g[i].length + " values, expected " + n);
            }
            for (int j = 0; j <= i; j++) {
                if (!Double.isFinite(g[i][j])) {
                    throw new IllegalArgumentException("non-finite Gram entry at " + i + ", " + j
                            + " (a non-finite value in row " + i + " or " + j + ")");
                }
            }
            for (int j = 0; j < i; j++) {
                double v = Math.sqrt(Math.max(0, g[i][i] + g[j][j] - 2 * g[i][j]));
                d[i][j] = v;
                d[j][i] = v;
            }
        }
        return d;
    }

    /**
     * Euclidean distances between the rows (one row per subject, equal lengths, finite values).
     *
     * @return a new symmetric n x n matrix with a zero diagonal
     */
    public static double[][] euclidean(double[][] rows) {
        int n = rows.length;
        for (int i = 0; i < n; i++) {
            if (rows[i].length != rows[0].length) {
                throw new IllegalArgumentException("row " + i + " has " + rows[i].length + " values, row 0 has "
                        + rows[0].length);
            }
            for (int k = 0; k < rows[i].length; k++) {
                if (!Double.isFinite(rows[i][k])) {
                    throw new IllegalArgumentException("non-finite value at row " + i + ", column " + k);
                }
            }
        }
        // Tiles of rows x column chunks, so that each chunk of a row is read from cache for a whole tile instead of
        // from memory for every pair (at 1,000 x 71,556 the plain double loop streams ~290 GB). Every pair still sums
        // its chunks in column order, so the result does not depend on the tiling.
        double[][] d = new double[n][n];
        int p = n == 0 ? 0 : rows[0].length;
        for (int ib = 0; ib < n; ib += TILE) {
            int ie = Math.min(n, ib + TILE);
            for (int jb = ib; jb < n; jb += TILE) {
                int je = Math.min(n, jb + TILE);
                for (int c0 = 0; c0 < p; c0 += CHUNK) {
                    int c1 = Math.min(p, c0 + CHUNK);
                    for (int i = ib; i < ie; i++) {
                        for (int j = Math.max(jb, i + 1); j < je; j++) {
                            d[i][j] += squares(rows[i], rows[j], c0, c1);
                        }
                    }
                }
            }
        }
        for (int i = 0; i < n; i++) {
            for (int j = i + 1; j < n; j++) {
                d[i][j] = Math.sqrt(d[i][j]);
                d[j][i] = d[i][j];
            }
        }
        return d;
    }
}
