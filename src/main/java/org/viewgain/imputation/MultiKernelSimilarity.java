package org.viewgain.imputation;

import org.viewgain.stats.SmileMatrices;

/**
 * Multiple-kernel similarity learning after SIMLR (Wang, Zhu, Pierson, Ramazzotti &amp; Batzoglou 2017, Nature
 * Methods 14:414-416). It minimises
 * {@code sum_ij S_ij (sum_l w_l D_l(i,j) + gamma |F_i - F_j|^2) + beta |S|^2 + rho sum_l w_l log w_l}
 * over a similarity S (rows on the simplex), an embedding F (orthonormal columns) and kernel weights w (on the
 * simplex), where {@code D_l = 1 - K_l}, by updating each in turn for a fixed number of iterations:
 * <ol>
 * <li>S, row by row, in closed form with beta chosen per row so that each row keeps exactly {@code sparsity}
 * non-zero entries (the adaptive-neighbour rule of Nie, Wang &amp; Huang 2014, KDD, which the authors' code uses to
 * start); a subject is never its own neighbour;</li>
 * <li>F = the top {@code rank} eigenvectors of (S + S')/2, rows scaled to unit length as in the authors' code;</li>
 * <li>w_l proportional to exp(-(1/rho) mean_i sum_j S_ij D_l(i,j)), the entropy-regularised closed form, with rho
 * set by bisection so that the weights' perplexity is 20 for 55 kernels (the authors' code), scaled down in
 * proportion when fewer kernels exist.</li>
 * </ol>
 * gamma is fixed after the first S update at the mean of the per-row betas (the authors' code starts its lambda
 * there). Nothing is random.
 */
final class MultiKernelSimilarity {
    private MultiKernelSimilarity() {
    }

    /**
     * The learned structure.
     *
     * @param similarity n x n, rows sum to 1, zero diagonal, {@code sparsity} non-zero entries a row
     * @param weights    kernel weights, non-negative, summing to 1
     * @param embedding  n x rank, rows of unit length
     */
    record Result(double[][] similarity, double[] weights, double[][] embedding) {
    }

    static Result learn(double[][][] kernels, int sparsity, int rank, int iterations) {
        int nk = kernels.length;
        int n = kernels[0].length;
        int k = Math.min(sparsity, n - 2);
        int r = Math.min(rank, n);
        double[] w = new double[nk];
        java.util.Arrays.fill(w, 1.0 / nk);
        double[][] s = null;
        double[][] f = null;
        double gamma = 0;
        for (int it = 0; it < iterations; it++) {
            double[][] e = combinedDistance(kernels, w, f, gamma);
            double[] betas = new double[n];
            s = adaptiveNeighbours(e, k, betas);
            if (it == 0) {
                gamma = mean(betas);
            }
            f = embedding(s, r);
            w = kernelWeights(kernels, s);
        }
        return new Result(s, w, f);
    }

    private static double[][] combinedDistance(double[][][] kernels, double[] w, double[][] f, double gamma) {
        int n = kernels[0].length;
        double[][] e = new double[n][n];
        for (int l = 0; l < kernels.length; l++) {
            double wl = w[l];
            double[][] kl = kernels[l];
            for (int i = 0; i < n; i++) {
                double[] ei = e[i];
                double[] ki = kl[i];
                for (int j = 0; j < n; j++) {
                    ei[j] += wl * (1 - ki[j]);
                }
            }
        }
        if (f != null && gamma > 0) {
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    double d = 0;
                    for (int c = 0; c < f[i].length; c++) {
                        double t = f[i][c] - f[j][c];
                        d += t * t;
                    }
                    e[i][j] += gamma * d;
                }
            }
        }
        return e;
    }

    /**
     * Row i: {@code s_ij = (e_(k+1) - e_ij) / (k e_(k+1) - sum_{h<=k} e_(h))} on its k nearest j != i, 0 elsewhere;
     * equal weights 1/k when the k + 1 nearest are all equally far. betas[i] receives the row's implied beta.
     */
    static double[][] adaptiveNeighbours(double[][] e, int k, double[] betas) {
        int n = e.length;
        double[][] s = new double[n][n];
        double[] row = new double[n];
        for (int i = 0; i < n; i++) {
            System.arraycopy(e[i], 0, row, 0, n);
            row[i] = Double.POSITIVE_INFINITY;
            int[] near = Neighbours.smallest(row, k + 1);
            double edge = row[near[k]];
            double sum = 0;
            for (int h = 0; h < k; h++) {
                sum += row[near[h]];
            }
            double denom = k * edge - sum;
            betas[i] = denom / 2;
            for (int h = 0; h < k; h++) {
                s[i][near[h]] = denom > 0 ? (edge - row[near[h]]) / denom : 1.0 / k;
            }
        }
        return s;
    }

    private static double[][] embedding(double[][] s, int r) {
        int n = s.length;
        double[][] sym = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                sym[i][j] = (s[i][j] + s[j][i]) / 2;
            }
        }
        double[][] vec = SmileMatrices.topEigenvectors(sym, r);
        double[][] f = new double[n][r];
        for (int i = 0; i < n; i++) {
            double norm = 0;
            for (int c = 0; c < r; c++) {
                f[i][c] = vec[i][c];
                norm += vec[i][c] * vec[i][c];
            }
            norm = Math.sqrt(norm);
            for (int c = 0; c < r && norm > 0; c++) {
                f[i][c] /= norm;
            }
        }
        return f;
    }

    static double[] kernelWeights(double[][][] kernels, double[][] s) {
        int nk = kernels.length;
        int n = s.length;
        int[][] nonZero = new int[n][];
        for (int i = 0; i < n; i++) {
            int[] buf = new int[n];
            int c = 0;
            for (int j = 0; j < n; j++) {
                if (s[i][j] != 0) {
                    buf[c++] = j;
                }
            }
            nonZero[i] = java.util.Arrays.copyOf(buf, c);
        }
        double[] dd = new double[nk];
        for (int l = 0; l < nk; l++) {
            double t = 0;
            for (int i = 0; i < n; i++) {
                for (int j : nonZero[i]) {
                    t += s[i][j] * (1 - kernels[l][i][j]);
                }
            }
            dd[l] = t / n;
        }
        return EntropyWeights.withPerplexity(dd, Math.max(1.0, 20.0 * nk / 55.0));
    }

    private static double mean(double[] v) {
        double s = 0;
        for (double x : v) {
            s += x;
        }
        return s / v.length;
    }
}
