package org.viewgain.classify;

/**
 * Solves the dual of the soft-margin support vector machine on a precomputed kernel matrix: minimize
 * {@code 1/2 a'Qa - e'a} subject to {@code 0 <= a_i <= C} and {@code y'a = 0}, with {@code Q_ij = y_i y_j K_ij}.
 * Sequential minimal optimization (Platt 1998, "Sequential minimal optimization: a fast algorithm for training
 * support vector machines", MSR-TR-98-14) with the second-order working-set selection of Fan, Chen &amp; Lin (2005,
 * JMLR 6:1889-1918, WSS 3), the update, clipping and bias as described for LIBSVM (Chang &amp; Lin 2011, ACM TIST 2:27,
 * sections 4.1.2-4.1.5), without shrinking. It stops when the maximal violating pair's gap {@code m(a) - M(a)} falls
 * below {@code eps} (LIBSVM's stopping rule; LIBSVM's default eps is 1e-3), or after {@code maxIterations}.
 *
 * <p>The kernel matrix is read, never written, so one matrix serves every C and every one-against-rest machine.
 */
final class Smo {
    private static final double TAU = 1e-12;

    private Smo() {
    }

    /**
     * A solution.
     *
     * @param alpha      the dual coefficients (0 for non-support vectors)
     * @param rho        the bias term: decision value {@code sum_i alpha_i y_i K(x_i, x) - rho}
     * @param objective  the dual objective at the solution
     * @param iterations pairs optimized
     * @param converged  false when the solver stopped at its iteration limit
     */
    record Solution(double[] alpha, double rho, double objective, int iterations, boolean converged) {
    }

    /**
     * Solves one machine.
     *
     * @param k    the symmetric kernel matrix of the training rows ({@code k[i][j]}), only read
     * @param y    +1 or -1 per row
     * @param c    the box constraint
     * @param eps  stopping tolerance on the maximal violating pair
     */
    static Solution solve(double[][] k, int[] y, double c, double eps, int maxIterations) {
        int n = y.length;
        double[] alpha = new double[n];
        double[] g = new double[n];
        java.util.Arrays.fill(g, -1.0);
        int iter = 0;
        boolean converged = false;
        while (iter < maxIterations) {
            // WSS 3: i maximizes -y_t G_t over I_up; j minimizes the second-order objective decrease over I_low (for
            // either sign of y_t, the curvature along the pair's direction is K_ii + K_tt - 2 K_it)
            int i = -1;
            double gmax = Double.NEGATIVE_INFINITY;
            for (int t = 0; t < n; t++) {
                if (y[t] == 1) {
                    if (alpha[t] < c && -g[t] >= gmax) {
                        gmax = -g[t];
                        i = t;
                    }
                } else if (alpha[t] > 0 && g[t] >= gmax) {
                    gmax = g[t];
                    i = t;
                }
            }
            int j = -1;
            double gmax2 = Double.NEGATIVE_INFINITY;
            double objMin = Double.POSITIVE_INFINITY;
            double[] ki = i >= 0 ? k[i] : null;
            for (int t = 0; t < n; t++) {
                double gradDiff;
                double quad;
                if (y[t] == 1) {
                    if (!(alpha[t] > 0)) {
                        continue;
                    }
                    gradDiff = gmax + g[t];
                    gmax2 = Math.max(gmax2, g[t]);
                    if (i < 0 || !(gradDiff > 0)) {
                        continue;
                    }
                    quad = ki[i] + k[t][t] - 2.0 * ki[t];
                } else {
                    if (!(alpha[t] < c)) {
                        continue;
                    }
                    gradDiff = gmax - g[t];
                    gmax2 = Math.max(gmax2, -g[t]);
                    if (i < 0 || !(gradDiff > 0)) {
                        continue;
                    }
                    quad = ki[i] + k[t][t] - 2.0 * ki[t];
                }
                double obj = -(gradDiff * gradDiff) / (quad > 0 ? quad : TAU);
                if (obj <= objMin) {
                    objMin = obj;
                    j = t;
                }
            }
            if (gmax + gmax2 < eps || j < 0) {
                converged = true;
                break;
            }
            iter++;
            update(k, y, c, alpha, g, i, j);
        }
        return new Solution(alpha, rho(y, c, alpha, g), objective(alpha, g), iter, converged);
    }

    /** Optimizes the pair (i, j) analytically, clips it to the box, and updates the gradient. */
    private static void update(double[][] k, int[] y, double c, double[] alpha, double[] g, int i, int j) {
        double[] ki = k[i];
        double[] kj = k[j];
        double oldI = alpha[i];
        double oldJ = alpha[j];
        if (y[i] != y[j]) {
            double quad = ki[i] + kj[j] - 2 * ki[j];
            double delta = (-g[i] - g[j]) / (quad > 0 ? quad : TAU);
            double diff = alpha[i] - alpha[j];
            alpha[i] += delta;
            alpha[j] += delta;
            if (diff > 0) {
                if (alpha[j] < 0) {
                    alpha[j] = 0;
                    alpha[i] = diff;
                }
            } else if (alpha[i] < 0) {
                alpha[i] = 0;
                alpha[j] = -diff;
            }
            if (diff > 0) {
                if (alpha[i] > c) {
                    alpha[i] = c;
                    alpha[j] = c - diff;
                }
            } else if (alpha[j] > c) {
                alpha[j] = c;
                alpha[i] = c + diff;
            }
        } else {
            double quad = ki[i] + kj[j] - 2 * ki[j];
            double delta = (g[i] - g[j]) / (quad > 0 ? quad : TAU);
            double sum = alpha[i] + alpha[j];
            alpha[i] -= delta;
            alpha[j] += delta;
            if (sum > c) {
                if (alpha[i] > c) {
                    alpha[i] = c;
                    alpha[j] = sum - c;
                }
            } else if (alpha[j] < 0) {
                alpha[j] = 0;
                alpha[i] = sum;
            }
            if (sum > c) {
                if (alpha[j] > c) {
                    alpha[j] = c;
                    alpha[i] = sum - c;
                }
            } else if (alpha[i] < 0) {
                alpha[i] = 0;
                alpha[j] = sum;
            }
        }
        // G_t += Q_ti dA_i + Q_tj dA_j, with Q_ti = y_t y_i K_ti
        double di = (alpha[i] - oldI) * y[i];
        double dj = (alpha[j] - oldJ) * y[j];
        for (int t = 0; t < g.length; t++) {
            g[t] += y[t] * (ki[t] * di + kj[t] * dj);
        }
    }

    /** The bias: the mean of y_t G_t over free vectors, or the middle of the feasible interval when none is free. */
    private static double rho(int[] y, double c, double[] alpha, double[] g) {
        double ub = Double.POSITIVE_INFINITY;
        double lb = Double.NEGATIVE_INFINITY;
        double sumFree = 0;
        int free = 0;
        for (int t = 0; t < y.length; t++) {
            double yg = y[t] * g[t];
            if (alpha[t] >= c) {
                if (y[t] == -1) {
                    ub = Math.min(ub, yg);
                } else {
                    lb = Math.max(lb, yg);
                }
            } else if (alpha[t] <= 0) {
                if (y[t] == 1) {
                    ub = Math.min(ub, yg);
                } else {
                    lb = Math.max(lb, yg);
                }
            } else {
                free++;
                sumFree += yg;
            }
        }
        return free > 0 ? sumFree / free : (ub + lb) / 2;
    }

    /** {@code 1/2 a'Qa - e'a} from the gradient {@code G = Qa - e}: {@code sum_t a_t (G_t - 1) / 2}. */
    private static double objective(double[] alpha, double[] g) {
        double v = 0;
        for (int t = 0; t < alpha.length; t++) {
            v += alpha[t] * (g[t] - 1);
        }
        return v / 2;
    }
}
