package org.viewgain.classify;

import org.viewgain.stats.Distances;

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
        return fromDistances(squaredDistances(x), gamma);
    }

    /**
     * The squared distances {@code |x_i - x_j|^2} of a block of rows from inner products, floored at 0 (label-free
     * and gamma-free: one matrix serves every gamma of a grid). Symmetric with a zero diagonal.
     */
    static double[][] squaredDistances(double[][] x) {
        int n = x.length;
        double[] norms = new double[n];
        for (int i = 0; i < n; i++) {
            norms[i] = dot(x[i], x[i]);
        }
        double[][] d = new double[n][n];
        for (int i = 0; i < n; i++) {
            double[] xi = x[i];
            for (int j = 0; j < i; j++) {
                double v = Math.max(0, norms[i] + norms[j] - 2 * dot(xi, x[j]));
                d[i][j] = v;
                d[j][i] = v;
            }
        }
        return d;
    }

    /** The kernel matrix {@code exp(-gamma d_ij)} of squared distances, with a diagonal of exactly 1. */
    static double[][] fromDistances(double[][] d, double gamma) {
        int n = d.length;
        double[][] k = new double[n][n];
        for (int i = 0; i < n; i++) {
            k[i][i] = 1.0;
            for (int j = 0; j < i; j++) {
                double v = Math.exp(-gamma * d[i][j]);
                k[i][j] = v;
                k[j][i] = v;
            }
        }
        return k;
    }

    /**
     * The squared distances from each row to each vector, {@code d[i][s] = |vectors[s] - rows[i]|^2}, in the
     * arithmetic of {@link Distances#squared} (as a machine's decision value computes them one by one).
     */
    static double[][] crossDistances(double[][] rows, double[][] vectors) {
        double[][] d = new double[rows.length][vectors.length];
        for (int i = 0; i < rows.length; i++) {
            for (int s = 0; s < vectors.length; s++) {
                d[i][s] = Distances.squared(vectors[s], rows[i]);
            }
        }
        return d;
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
