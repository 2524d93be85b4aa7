package org.viewgain.prep;

/** Column means and per-class summaries shared by the transforms of this package. */
final class ColumnStats {
    private ColumnStats() {
    }

    static double[] means(double[][] x, int p) {
        double[] mean = new double[p];
        for (double[] r : x) {
            for (int j = 0; j < p; j++) {
                mean[j] += r[j];
            }
        }
        for (int j = 0; j < p; j++) {
            mean[j] /= x.length;
        }
        return mean;
    }

    /** Mean of column j over the rows of class c. */
    static double classMean(double[][] x, int[] y, int c, int j) {
        double sum = 0;
        int n = 0;
        for (int i = 0; i < x.length; i++) {
            if (y[i] == c) {
                sum += x[i][j];
                n++;
            }
        }
        return sum / n;
    }

    /** Sum of squared deviations of column j from {@code centre} over the rows of class c. */
    static double classSumSquares(double[][] x, int[] y, int c, int j, double centre) {
        double ss = 0;
        for (int i = 0; i < x.length; i++) {
            if (y[i] == c) {
                double d = x[i][j] - centre;
                ss += d * d;
            }
        }
        return ss;
    }
}
