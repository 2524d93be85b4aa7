package org.viewgain.classify;

/**
 * The RBF kernel matrix {@code K_ij = exp(-gamma |x_i - x_j|^2)} of a block of rows, with squared distances from
 * inner products ({@code |x_i|^2 + |x_j|^2 - 2 x_i.x_j}, floored at 0), as LIBSVM computes them. Symmetric; the
 * diagonal is exactly 1.
 */
final class RbfKernel {
    private RbfKernel() {
    }

    static double[][] matrix(double[][] x, double gamma) {
        int n = x.length;
        double[] norms = new double[n];
        for (int i = 0; i < n; i++) {
            norms[i] = dot(x[i], x[i]);
        }
        double[][] k = new double[n][n];
        for (int i = 0; i < n; i++) {
            k[i][i] = 1.0;
            double[] xi = x[i];
            for (int j = 0; j < i; j++) {
                double d = Math.max(0, norms[i] + norms[j] - 2 * dot(xi, x[j]));
                double v = Math.exp(-gamma * d);
                k[i][j] = v;
                k[j][i] = v;
            }
        }
        return k;
    }

    /** {@code |a - b|^2} summed directly (as LIBSVM's prediction does), in four running sums. */
    static double squaredDistance(double[] a, double[] b) {
        double s0 = 0;
        double s1 = 0;
        double s2 = 0;
        double s3 = 0;
        int j = 0;
        for (; j + 3 < a.length; j += 4) {
            double d0 = a[j] - b[j];
            double d1 = a[j + 1] - b[j + 1];
            double d2 = a[j + 2] - b[j + 2];
            double d3 = a[j + 3] - b[j + 3];
            s0 += d0 * d0;
            s1 += d1 * d1;
            s2 += d2 * d2;
            s3 += d3 * d3;
        }
        for (; j < a.length; j++) {
            double d = a[j] - b[j];
            s0 += d * d;
        }
        return (s0 + s1) + (s2 + s3);
    }

    /** {@code a.b} in four running sums (summed in a fixed order, so the result is deterministic). */
    static double dot(double[] a, double[] b) {
        double s0 = 0;
        double s1 = 0;
        double s2 = 0;
        double s3 = 0;
        int j = 0;
        for (; j + 3 < a.length; j += 4) {
            s0 += a[j] * b[j];
            s1 += a[j + 1] * b[j + 1];
            s2 += a[j + 2] * b[j + 2];
            s3 += a[j + 3] * b[j + 3];
        }
        for (; j < a.length; j++) {
            s0 += a[j] * b[j];
        }
        return (s0 + s1) + (s2 + s3);
    }
}
