package org.viewgain.stats;

/** Distance matrices from feature rows, for distance-based tests such as {@link Permanova}. */
public final class Distances {
    private Distances() {
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
        double[][] d = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = i + 1; j < n; j++) {
                double sum = 0;
                for (int k = 0; k < rows[i].length; k++) {
                    double diff = rows[i][k] - rows[j][k];
                    sum += diff * diff;
                }
                d[i][j] = Math.sqrt(sum);
                d[j][i] = d[i][j];
            }
        }
        return d;
    }
}
