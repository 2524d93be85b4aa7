package org.viewgain.classify;

import org.viewgain.cohort.Rows;

/**
 * A trained model together with what it used: an importance per input feature and its kind. Linear weights are
 * reported on the scale of standardized inputs, {@code |w_j| * sd_j} with {@code sd_j} the training standard
 * deviation of input j (divisor n - 1), so they compare across features whether or not the pipeline scaled them.
 */
final class Explained implements ClassifierMethod.Model {
    static final String ABS_WEIGHT = "abs_weight";
    static final String IMPURITY = "impurity";

    private final ClassifierMethod.Model inner;
    private final double[] importance;
    private final String kind;
    private final boolean converged;

    Explained(ClassifierMethod.Model inner, double[] importance, String kind) {
        this(inner, importance, kind, inner.converged());
    }

    Explained(ClassifierMethod.Model inner, double[] importance, String kind, boolean converged) {
        this.inner = inner;
        this.importance = importance.clone();
        this.kind = kind;
        this.converged = converged;
    }

    /** The wrapped model. */
    ClassifierMethod.Model inner() {
        return inner;
    }

    @Override
    public Predictions predict(Rows x) {
        return inner.predict(x);
    }

    @Override
    public double[] importance() {
        return importance.clone();
    }

    @Override
    public String importanceKind() {
        return kind;
    }

    @Override
    public boolean converged() {
        return converged;
    }

    /**
     * Mean over the rows of {@code weights} (one per discriminant or contrast; only the first {@code p} entries of a
     * row are feature weights) of {@code |w_j| * sd_j}.
     */
    static double[] absWeights(double[][] weights, double[][] x) {
        int p = x[0].length;
        double[] sd = sd(x, p);
        double[] out = new double[p];
        for (double[] w : weights) {
            for (int j = 0; j < p; j++) {
                out[j] += Math.abs(w[j]) * sd[j] / weights.length;
            }
        }
        return out;
    }

    private static double[] sd(double[][] x, int p) {
        int n = x.length;
        double[] mean = new double[p];
        for (double[] r : x) {
            for (int j = 0; j < p; j++) {
                mean[j] += r[j] / n;
            }
        }
        double[] sd = new double[p];
        for (double[] r : x) {
            for (int j = 0; j < p; j++) {
                sd[j] += (r[j] - mean[j]) * (r[j] - mean[j]);
            }
        }
        for (int j = 0; j < p; j++) {
            sd[j] = n > 1 ? Math.sqrt(sd[j] / (n - 1)) : 0;
        }
        return sd;
    }
}
