package org.viewgain.classify;

import java.util.ArrayList;
import java.util.HashMap;
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
 *
 * <p>{@code gamma: scale} means {@code 1 / (p * var)} with {@code var} the variance of all training values
 * (population form), as scikit-learn's default. Two classes: one machine with class 1 as the positive side; more
 * classes: one machine per class against the rest. Scores are decision values {@code sum_i a_i y_i K(x_i, x) - rho}
 * (not probabilities): for two classes {@code scores[i][1]} is the value and {@code scores[i][0]} its negative. The
 * previous online approximation (Smile's LASVM) stays available as {@code smile-svm-rbf}.
 */
public final class KernelSvm implements ClassifierMethod {

    /** Computes the kernel matrix of training rows for a gamma (a seam for tests that count the computations). */
    interface KernelSource {
        double[][] matrix(double[][] x, double gamma);
    }

    private final KernelSource kernels;

    public KernelSvm() {
        this(RbfKernel::matrix);
    }

    KernelSvm(KernelSource kernels) {
        this.kernels = kernels;
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

    @Override
    public List<Model> fitGrid(List<FitContext> contexts, Rows x, int[] y, int classes, List<Params> grid) {
        TrainingLabels.check(method(), x, y, classes);
        Map<Double, double[][]> byGamma = new HashMap<>();
        List<Model> out = new ArrayList<>(grid.size());
        for (Params params : grid) {
            double gamma = RbfKernel.gamma(params.get("gamma"), x.x());
            double[][] k = byGamma.computeIfAbsent(gamma, g -> kernels.matrix(x.x(), g));
            out.add(fit(k, gamma, x.x(), y, classes, params));
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
    }
}
