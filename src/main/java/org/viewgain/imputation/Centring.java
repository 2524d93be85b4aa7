package org.viewgain.imputation;

/** Column means of a training block and centring of rows on them. */
final class Centring {
    private Centring() {
    }

    static double[] columnMeans(double[][] x, int p) {
        double[] m = new double[p];
        for (double[] row : x) {
            for (int j = 0; j < p; j++) {
                m[j] += row[j];
            }
        }
        for (int j = 0; j < p; j++) {
            m[j] /= x.length;
        }
        return m;
    }

    /** A new array: each row minus the means. */
    static double[][] centre(double[][] x, double[] means) {
        double[][] c = new double[x.length][means.length];
        for (int i = 0; i < x.length; i++) {
            for (int j = 0; j < means.length; j++) {
                c[i][j] = x[i][j] - means[j];
            }
        }
        return c;
    }
}
