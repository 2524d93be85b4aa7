package org.viewgain.classify;

/**
 * The RBF kernel matrix {@code K_ij = exp(-gamma |x_i - x_j|^2)} of a block of rows, with squared distances from
 * inner products ({@code |x_i|^2 + |x_j|^2 - 2 x_i.x_j}, floored at 0), as LIBSVM computes them. Symmetric; the
 * diagonal is exactly 1.
 */
final class RbfKernel {
    private RbfKernel() {
    }

    /**
     * The gamma a parameter value stands for on these training rows: a number as it is, {@code scale} as
     * {@code 1 / (p * var)} with {@code var} the variance of all training values (population form), as
     * scikit-learn's default ({@code 1 / p} when the values are constant).
     */
    static double gamma(Object setting, double[][] x) {
        if (setting instanceof Number n) {
            return n.doubleValue();
        }
        double sum = 0;
        double sumSq = 0;
        long count = 0;
        for (double[] row : x) {
            for (double v : row) {
                sum += v;
                sumSq += v * v;
                count++;
            }
        }
        double mean = sum / count;
        double var = sumSq / count - mean * mean;
        int p = x[0].length;
        return var > 0 ? 1.0 / (p * var) : 1.0 / p;
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
