package org.viewgain.classify;

import java.util.List;
import org.apache.commons.math3.linear.EigenDecomposition;
import org.apache.commons.math3.linear.MatrixUtils;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.spec.ParamDef;
import org.viewgain.spec.Params;
import smile.classification.LDA;
import smile.math.matrix.Matrix;

/**
 * {@code lda}: linear discriminant analysis (Fisher 1936; Hastie, Tibshirani &amp; Friedman, ESL 2nd ed., 4.3) with
 * the pooled within-class covariance {@code S} (divisor n - classes) shrunk toward a scaled identity,
 * {@code (1 - shrinkage) S + shrinkage (trace(S)/p) I} (Friedman 1989, JASA 84:165-175, the gamma of regularised
 * discriminant analysis; the target of Ledoit &amp; Wolf 2004). Smile's own {@code LDA.fit} uses the total
 * covariance and stops on a constant column, so the covariance is built here and handed to Smile's {@code LDA}
 * constructor, which evaluates the discriminant. Eigenvalues below 1e-10 of the largest are raised to that floor, so
 * constant columns (shrinkage 0) do not divide by zero. Deterministic. Scores are posterior class probabilities.
 * Importance: absolute discriminant weights {@code S^-1 (mu1 - mu0)} on standardized inputs (more classes: the mean
 * over classes of {@code |S^-1 (mu_c - mu)|}), kind {@code abs_weight}.
 */
public final class SmileLda implements ClassifierMethod {

    private static final double EIGEN_FLOOR = 1e-10;

    @Override
    public String method() {
        return "lda";
    }

    @Override
    public List<ParamDef> parameters() {
        return List.of(ParamDef.number("shrinkage", 0, 1, 0.1,
                "weight of trace(S)/p * I in the covariance: 0 = plain LDA, 1 = nearest centroid scaled"));
    }

    @Override
    public boolean producesScores() {
        return true;
    }

    @Override
    public Model fit(FitContext ctx, Rows x, int[] y, int classes, Params params) {
        TrainingLabels.check(method(), x, y, classes);
        int n = x.n();
        int p = x.p();
        double[] prior = new double[classes];
        double[][] mu = new double[classes][p];
        for (int i = 0; i < n; i++) {
            prior[y[i]]++;
            for (int j = 0; j < p; j++) {
                mu[y[i]][j] += x.x()[i][j];
            }
        }
        for (int c = 0; c < classes; c++) {
            for (int j = 0; j < p; j++) {
                mu[c][j] /= prior[c];
            }
            prior[c] /= n;
        }
        double[][] cov = pooledCovariance(x.x(), y, mu, classes);
        double lambda = params.getDouble("shrinkage");
        double trace = 0;
        for (int j = 0; j < p; j++) {
            trace += cov[j][j];
        }
        for (int j = 0; j < p; j++) {
            for (int l = 0; l < p; l++) {
                cov[j][l] *= 1 - lambda;
            }
            cov[j][j] += lambda * trace / p;
        }
        EigenDecomposition evd = new EigenDecomposition(MatrixUtils.createRealMatrix(cov));
        double[] eigen = evd.getRealEigenvalues();
        double largest = 0;
        for (double e : eigen) {
            largest = Math.max(largest, e);
        }
        double floor = largest > 0 ? largest * EIGEN_FLOOR : 1.0;
        for (int j = 0; j < p; j++) {
            eigen[j] = Math.max(eigen[j], floor);
        }
        double[][] v = evd.getV().getData();
        LDA model = new LDA(prior, mu, eigen, Matrix.of(v));
        ClassifierMethod.Model fitted = rows -> {
            int[] labels = new int[rows.n()];
            double[][] scores = new double[rows.n()][classes];
            for (int i = 0; i < rows.n(); i++) {
                labels[i] = model.predict(rows.x()[i], scores[i]);
            }
            return new Predictions(labels, scores);
        };
        return new Explained(fitted, Explained.absWeights(discriminants(mu, prior, eigen, v), x.x()),
                Explained.ABS_WEIGHT);
    }

    /**
     * Discriminant directions {@code S^-1 d} with {@code S = V diag(eigen) V'}: for two classes {@code d = mu1 - mu0};
     * for more, one per class, {@code d = mu_c - sum_k prior_k mu_k}.
     */
    static double[][] discriminants(double[][] mu, double[] prior, double[] eigen, double[][] v) {
        int classes = mu.length;
        int p = eigen.length;
        double[] centre = new double[p];
        for (int c = 0; c < classes; c++) {
            for (int j = 0; j < p; j++) {
                centre[j] += prior[c] * mu[c][j];
            }
        }
        int rows = classes == 2 ? 1 : classes;
        double[][] out = new double[rows][p];
        for (int r = 0; r < rows; r++) {
            double[] d = new double[p];
            for (int j = 0; j < p; j++) {
                d[j] = classes == 2 ? mu[1][j] - mu[0][j] : mu[r][j] - centre[j];
            }
            for (int e = 0; e < p; e++) {
                double proj = 0;
                for (int j = 0; j < p; j++) {
                    proj += v[j][e] * d[j];
                }
                proj /= eigen[e];
                for (int j = 0; j < p; j++) {
                    out[r][j] += v[j][e] * proj;
                }
            }
        }
        return out;
    }

    private static double[][] pooledCovariance(double[][] x, int[] y, double[][] mu, int classes) {
        int p = mu[0].length;
        double[][] cov = new double[p][p];
        for (int i = 0; i < x.length; i++) {
            double[] m = mu[y[i]];
            for (int j = 0; j < p; j++) {
                double dj = x[i][j] - m[j];
                for (int l = 0; l <= j; l++) {
                    cov[j][l] += dj * (x[i][l] - m[l]);
                }
            }
        }
        double dof = Math.max(1, x.length - classes);
        for (int j = 0; j < p; j++) {
            for (int l = 0; l <= j; l++) {
                cov[j][l] /= dof;
                cov[l][j] = cov[j][l];
            }
        }
        return cov;
    }
}
