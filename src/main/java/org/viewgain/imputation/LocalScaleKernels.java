package org.viewgain.imputation;

import java.util.Arrays;
import org.viewgain.stats.SmileMatrices;

/**
 * The Gaussian kernels with local scales of SIMLR (Wang et al. 2017, Nature Methods 14:414-416): for each k in
 * {10, 12, ..., 30} with k &lt; n and each sigma in {2, 1.75, 1.5, 1.25, 1},
 * {@code K(i,j) = exp(-d_ij^2 / (2 (sigma (mu_i + mu_j) / 2)^2))}, where mu_i is the mean Euclidean distance from i
 * to its k nearest training subjects. The normal density's constant is left out so that {@code K(i,i) = 1} and
 * {@code 1 - K} is a kernel distance in [0, 1]. When n &lt;= 10 the only k used is n - 1.
 */
final class LocalScaleKernels {
    static final double[] SIGMAS = {2, 1.75, 1.5, 1.25, 1};

    private final int[] ks;
    /** mu[kIndex][i] for the training subjects. */
    private final double[][] mu;
    private final double floor;

    private LocalScaleKernels(int[] ks, double[][] mu, double floor) {
        this.ks = ks;
        this.mu = mu;
        this.floor = floor;
    }

    /** Writes the local scales into a bundle part ({@link #thaw} reads them back). */
    void freeze(org.viewgain.frozen.FrozenOut out) {
        out.integers(ks).matrix(mu).number(floor);
    }

    /** Local scales read back from a bundle part. */
    static LocalScaleKernels thaw(org.viewgain.frozen.FrozenIn in) {
        int[] ks = in.integers();
        double[][] mu = in.matrix();
        double floor = in.number();
        if (ks == null || mu == null || ks.length != mu.length) {
            throw in.bad("neighbour counts and local scales differ in count");
        }
        return new LocalScaleKernels(ks, mu, floor);
    }

    /** The local scales of the training subjects, from their squared distances to each other. */
    static LocalScaleKernels of(double[][] sqDist) {
        int n = sqDist.length;
        int[] ks = kGrid(n);
        double[][] mu = new double[ks.length][n];
        double total = 0;
        for (int i = 0; i < n; i++) {
            double[] others = new double[n - 1];
            int h = 0;
            for (int j = 0; j < n; j++) {
                if (j != i) {
                    others[h++] = Math.sqrt(sqDist[i][j]);
                    total += others[h - 1];
                }
            }
            Arrays.sort(others);
            fillMeans(others, ks, mu, i);
        }
        double meanDist = n > 1 ? total / ((double) n * (n - 1)) : 0;
        return new LocalScaleKernels(ks, mu, 1e-10 * meanDist + Double.MIN_NORMAL);
    }

    static int[] kGrid(int n) {
        int[] ks = java.util.stream.IntStream.iterate(10, k -> k <= 30, k -> k + 2).filter(k -> k < n).toArray();
        return ks.length > 0 ? ks : new int[] {Math.max(1, n - 1)};
    }

    private static void fillMeans(double[] sortedDist, int[] ks, double[][] mu, int i) {
        double run = 0;
        int done = 0;
        for (int a = 0; a < ks.length; a++) {
            int k = Math.min(ks[a], sortedDist.length);
            while (done < k) {
                run += sortedDist[done++];
            }
            mu[a][i] = run / k;
        }
    }

    int count() {
        return ks.length * SIGMAS.length;
    }

    /** All training kernels, index {@code kIndex * 5 + sigmaIndex}. */
    double[][][] trainingKernels(double[][] sqDist) {
        int n = sqDist.length;
        double[][][] out = new double[count()][n][n];
        for (int a = 0; a < ks.length; a++) {
            for (int i = 0; i < n; i++) {
                for (int j = i; j < n; j++) {
                    double scale = Math.max((mu[a][i] + mu[a][j]) / 2, floor);
                    double d2 = sqDist[i][j] / (2 * scale * scale);
                    for (int s = 0; s < SIGMAS.length; s++) {
                        double v = i == j ? 1 : Math.exp(-d2 / (SIGMAS[s] * SIGMAS[s]));
                        out[a * SIGMAS.length + s][i][j] = v;
                        out[a * SIGMAS.length + s][j][i] = v;
                    }
                }
            }
        }
        return out;
    }

    /**
     * The similarity of one new subject to each training subject: the kernel weights applied to the kernels between
     * its source and the training sources, its local scales taken from its own nearest training subjects.
     */
    double[] similarityToTraining(double[] sqDistToTrain, double[] weights) {
        int n = sqDistToTrain.length;
        double[] sorted = new double[n];
        for (int j = 0; j < n; j++) {
            sorted[j] = Math.sqrt(sqDistToTrain[j]);
        }
        Arrays.sort(sorted);
        double[][] own = new double[ks.length][1];
        fillMeans(sorted, ks, own, 0);
        double[] sim = new double[n];
        for (int a = 0; a < ks.length; a++) {
            for (int j = 0; j < n; j++) {
                double scale = Math.max((own[a][0] + mu[a][j]) / 2, floor);
                double d2 = sqDistToTrain[j] / (2 * scale * scale);
                for (int s = 0; s < SIGMAS.length; s++) {
                    sim[j] += weights[a * SIGMAS.length + s] * Math.exp(-d2 / (SIGMAS[s] * SIGMAS[s]));
                }
            }
        }
        return sim;
    }

    /** Squared Euclidean distances between the rows of a, via the Gram matrix (clamped at 0, diagonal exactly 0). */
    static double[][] squaredDistances(double[][] a) {
        double[][] g = SmileMatrices.gram(a);
        int n = a.length;
        double[][] d = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = i + 1; j < n; j++) {
                double v = Math.max(0, g[i][i] + g[j][j] - 2 * g[i][j]);
                d[i][j] = v;
                d[j][i] = v;
            }
        }
        return d;
    }

    /** Squared Euclidean distances from each row of a to each row of b. */
    static double[][] squaredDistances(double[][] a, double[][] b) {
        double[][] g = SmileMatrices.cross(a, b);
        double[] na = rowNorms(a);
        double[] nb = rowNorms(b);
        for (int i = 0; i < a.length; i++) {
            for (int j = 0; j < b.length; j++) {
                g[i][j] = Math.max(0, na[i] + nb[j] - 2 * g[i][j]);
            }
        }
        return g;
    }

    private static double[] rowNorms(double[][] a) {
        double[] out = new double[a.length];
        for (int i = 0; i < a.length; i++) {
            double s = 0;
            for (double v : a[i]) {
                s += v * v;
            }
            out[i] = s;
        }
        return out;
    }
}
