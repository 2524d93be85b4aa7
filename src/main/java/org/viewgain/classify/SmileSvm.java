package org.viewgain.classify;

import java.util.ArrayList;
import java.util.List;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.folds.Seeds;
import org.viewgain.spec.ParamDef;
import org.viewgain.spec.Params;
import smile.classification.SVM;
import smile.math.MathEx;
import smile.math.kernel.GaussianKernel;
import smile.math.kernel.MercerKernel;

/**
 * {@code smile-svm-rbf}: a support vector machine (Cortes &amp; Vapnik 1995, Machine Learning 20:273-297) with the RBF
 * kernel, trained by Smile's LASVM solver (Bordes et al. 2005, JMLR 6:1579-1619). Two classes: one machine with
 * class 1 as the positive side; more classes: one machine per class against the rest, fitted one after another.
 * Scores are decision values (not probabilities): for two classes {@code scores[i][1]} is the decision value and
 * {@code scores[i][0]} its negative, which orders subjects for AUC. ({@code svm-linear} is {@link LinearSvm}; the
 * default {@code svm-rbf}, solved exactly on a shared kernel matrix, is {@link KernelSvm}.)
 *
 * <p>Kernel {@code exp(-gamma * |x - x'|^2)}; {@code gamma: scale} means {@code 1 / (p * var)} with {@code var} the
 * variance of all training values (population form), as scikit-learn's default. LASVM visits the rows in a random
 * order, so Smile's thread-local generator is seeded right before each machine is fitted, on the fitting thread.
 */
public final class SmileSvm implements ClassifierMethod {

    @Override
    public String method() {
        return "smile-svm-rbf";
    }

    @Override
    public List<ParamDef> parameters() {
        List<ParamDef> defs = new ArrayList<>();
        defs.add(ParamDef.number("C", Double.MIN_VALUE, Double.MAX_VALUE, 1.0, "soft-margin penalty"));
        defs.add(ParamDef.numberOrChoice("gamma", Double.MIN_VALUE, Double.MAX_VALUE, List.of("scale"), "scale",
                "RBF kernel width exp(-gamma |x-x'|^2); scale = 1/(features * variance of training values)"));
        defs.add(ParamDef.number("tolerance", Double.MIN_VALUE, 1, 1e-3, "LASVM stopping tolerance"));
        defs.add(ParamDef.integer("epochs", 1, 1000, 1, "LASVM passes over the training rows"));
        return defs;
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
    public Model fit(FitContext ctx, Rows x, int[] y, int classes, Params params) {
        TrainingLabels.check(method(), x, y, classes);
        // Smile's Gaussian kernel is exp(-|x-x'|^2 / (2 sigma^2)), so sigma = sqrt(1 / (2 gamma)).
        double gamma = RbfKernel.gamma(params.get("gamma"), x.x());
        MercerKernel<double[]> kernel = new GaussianKernel(Math.sqrt(1.0 / (2.0 * gamma)));
        int machines = OneAgainstRest.machines(classes);
        List<SVM<double[]>> fitted = new ArrayList<>(machines);
        for (int m = 0; m < machines; m++) {
            int[] signs = OneAgainstRest.signs(y, classes, m);
            MathEx.setSeed(Seeds.derive(ctx.seed(), "svm", m));
            fitted.add(SVM.fit(x.x(), signs, kernel, params.getDouble("C"), params.getDouble("tolerance"),
                    params.getInt("epochs")));
        }
        return rows -> OneAgainstRest.predict(rows, classes, (m, row) -> fitted.get(m).score(row));
    }
}
