package org.viewgain.imputation;

/**
 * A fitted SIMPLS model: predictions are {@code my + sum_a ((x - mx) . r_a) q_a}.
 *
 * @param xMeans training source means
 * @param yMeans training target means
 * @param weights r_a, one row per component (source weights giving scores t_a = X0 r_a)
 * @param loadings q_a = Y0' t_a, one row per component
 * @param scores training scores, one row per component (unit length, mutually orthogonal)
 */
record SimplsModel(double[] xMeans, double[] yMeans, double[][] weights, double[][] loadings, double[][] scores) {

    int components() {
        return weights.length;
    }

    double[][] predict(double[][] x) {
        double[][] out = new double[x.length][];
        for (int i = 0; i < x.length; i++) {
            double[] y = yMeans.clone();
            for (int a = 0; a < weights.length; a++) {
                double[] r = weights[a];
                double s = 0;
                for (int j = 0; j < r.length; j++) {
                    s += (x[i][j] - xMeans[j]) * r[j];
                }
                double[] q = loadings[a];
                for (int j = 0; j < y.length; j++) {
                    y[j] += s * q[j];
                }
            }
            out[i] = y;
        }
        return out;
    }
}
