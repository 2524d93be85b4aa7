package org.viewgain.classify;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.spec.ParamDef;
import org.viewgain.spec.Params;
import org.viewgain.stats.Distances;

/**
 * {@code svm-rbf}: the soft-margin support vector machine (Cortes &amp; Vapnik 1995, Machine Learning 20:273-297)
 * with the RBF kernel {@code exp(-gamma |x - x'|^2)}, solved exactly (to {@code tolerance}) by {@link Smo} on a
 * kernel matrix computed once per training block and gamma. The matrix is label-free, so every C of a grid and every
 * one-against-rest machine reads the same one ({@link #fitGrid}); the solver is deterministic (no random order).
 * The grid's models are predicted together ({@link #predictGrid}): distances to the shared support vectors once.
 *
 * <p>{@code gamma: scale} means {@code 1 / (p * var)} with {@code var} the variance of all training values
 * (population form), as scikit-learn's default. Two classes: one machine with class 1 as the positive side; more
 * classes: one machine per class against the rest. Scores are decision values {@code sum_i a_i y_i K(x_i, x) - rho}
 * (not probabilities): for two classes {@code scores[i][1]} is the value and {@code scores[i][0]} its negative. The
 * previous online approximation (Smile's LASVM) stays available as {@code smile-svm-rbf}.
 */
public final class KernelSvm implements ClassifierMethod {

    /**
     * The label-free distance work behind the kernels (a seam for tests that count the computations): the squared
     * distances of a training block, and those from rows being predicted to support vectors.
     */
    interface KernelWork {
        double[][] squaredDistances(double[][] x);

        double[][] crossDistances(double[][] rows, double[][] vectors);
    }

    private static final KernelWork RBF = new KernelWork() {
        @Override
        public double[][] squaredDistances(double[][] x) {
            return RbfKernel.squaredDistances(x);
        }

        @Override
        public double[][] crossDistances(double[][] rows, double[][] vectors) {
            return RbfKernel.crossDistances(rows, vectors);
        }
    };

    private final KernelWork work;

    public KernelSvm() {
        this(RBF);
    }

    KernelSvm(KernelWork work) {
        this.work = work;
    }

    @Override
    public String method() {
        return "svm-rbf";
    }

    @Override
    public List<ParamDef> parameters() {
        return List.of(
                ParamDef.number("C", Double.MIN_VALUE, Double.MAX_VALUE, 1.0, "soft-margin penalty"),
                ParamDef.numberOrChoice("gamma", Double.MIN_VALUE, Double.MAX_VALUE, List.of("scale"), "scale",
                        "RBF kernel width exp(-gamma |x-x'|^2); scale = 1/(features * variance of training values)"),
                ParamDef.number("tolerance", Double.MIN_VALUE, 1, 1e-3,
                        "stop when the maximal violating pair's gap is below this (LIBSVM's eps)"),
                ParamDef.integer("iterations", 1, 1_000_000_000, 10_000_000,
                        "most pairs optimized per machine (LIBSVM's limit)"));
    }

    @Override
    public boolean producesScores() {
        return true;
    }

    @Override
    public String scoreKind() {
        return "decision_value";
    }

    @Override
    public boolean freezable() {
        return true;
    }

    @Override
    public Model fit(FitContext ctx, Rows x, int[] y, int classes, Params params) {
        return fitGrid(List.of(ctx), x, y, classes, List.of(params)).get(0);
    }

    /**
     * One matrix of squared distances for the block (label-free, gamma-free), one kernel matrix per gamma from it,
     * and one SMO solution per grid point on its gamma's matrix.
     */
    @Override
    public List<Model> fitGrid(List<FitContext> contexts, Rows x, int[] y, int classes, List<Params> grid) {
        TrainingLabels.check(method(), x, y, classes);
        double[][] d = work.squaredDistances(x.x());
        Map<Double, double[][]> byGamma = new HashMap<>();
        List<Model> out = new ArrayList<>(grid.size());
        for (Params params : grid) {
            double gamma = RbfKernel.gamma(params.get("gamma"), x.x());
            double[][] k = byGamma.computeIfAbsent(gamma, g -> RbfKernel.fromDistances(d, g));
            out.add(fit(k, gamma, x.x(), y, classes, params));
        }
        return out;
    }

    /**
     * The models of one {@link #fitGrid} share their training rows as support vectors: the distance from each row
     * to each distinct support vector (by identity) is computed once for all of them, and every machine sums its own
     * terms in its own order, so the values are those of {@link Machine#decision} bit for bit.
     */
    @Override
    public List<Predictions> predictGrid(List<Model> models, Rows x) {
        Map<double[], Integer> at = new IdentityHashMap<>();
        List<double[]> distinct = new ArrayList<>();
        for (Model m : models) {
            if (!(m instanceof FrozenModels.Kernel k)) {
                return ClassifierMethod.super.predictGrid(models, x);
            }
            for (Machine machine : k.machines()) {
                for (double[] v : machine.vectors()) {
                    at.computeIfAbsent(v, key -> {
                        distinct.add(key);
                        return distinct.size() - 1;
                    });
                }
            }
        }
        double[][] d = work.crossDistances(x.x(), distinct.toArray(new double[0][]));
        List<Predictions> out = new ArrayList<>(models.size());
        for (Model m : models) {
            FrozenModels.Kernel k = (FrozenModels.Kernel) m;
            int[][] positions = new int[k.machines().size()][];
            for (int c = 0; c < positions.length; c++) {
                double[][] vectors = k.machines().get(c).vectors();
                positions[c] = new int[vectors.length];
                for (int s = 0; s < vectors.length; s++) {
                    positions[c][s] = at.get(vectors[s]);
                }
            }
            out.add(OneAgainstRest.predict(x.n(), k.classes(),
                    (c, i) -> k.machines().get(c).decision(d[i], positions[c])));
        }
        return out;
    }

    private static Model fit(double[][] k, double gamma, double[][] x, int[] y, int classes, Params params) {
        int machines = OneAgainstRest.machines(classes);
        List<Machine> fitted = new ArrayList<>(machines);
        boolean converged = true;
        for (int m = 0; m < machines; m++) {
            int[] signs = OneAgainstRest.signs(y, classes, m);
            Smo.Solution s = Smo.solve(k, signs, params.getDouble("C"), params.getDouble("tolerance"),
                    params.getInt("iterations"));
            converged &= s.converged();
            fitted.add(Machine.of(s, signs, x, gamma));
        }
        boolean allConverged = converged;
        return new FrozenModels.Kernel(List.copyOf(fitted), classes, allConverged);
    }

    /** One machine: its support vectors (shared training rows), their coefficients {@code a_i y_i}, and rho. */
    record Machine(double[][] vectors, double[] coef, double rho, double gamma, double objective) {
        static Machine of(Smo.Solution s, int[] signs, double[][] x, double gamma) {
            int count = 0;
            for (double a : s.alpha()) {
                count += a > 0 ? 1 : 0;
            }
            double[][] v = new double[count][];
            double[] coef = new double[count];
            int at = 0;
            for (int i = 0; i < signs.length; i++) {
                if (s.alpha()[i] > 0) {
                    v[at] = x[i];
                    coef[at++] = s.alpha()[i] * signs[i];
                }
            }
            return new Machine(v, coef, s.rho(), gamma, s.objective());
        }

        double decision(double[] row) {
            double f = -rho;
            for (int s = 0; s < vectors.length; s++) {
                f += coef[s] * Math.exp(-gamma * Distances.squared(vectors[s], row));
            }
            return f;
        }

        /** {@link #decision(double[])} from a row's squared distances, support vector s at {@code d[at[s]]}. */
        double decision(double[] d, int[] at) {
            double f = -rho;
            for (int s = 0; s < vectors.length; s++) {
                f += coef[s] * Math.exp(-gamma * d[at[s]]);
            }
            return f;
        }
    }
}
