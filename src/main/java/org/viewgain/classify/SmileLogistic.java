package org.viewgain.classify;

import java.util.List;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.spec.ParamDef;
import org.viewgain.spec.Params;
import smile.classification.LogisticRegression;

/**
 * {@code logistic}: L2-penalised logistic regression (binomial for two classes, multinomial otherwise) fitted by
 * Smile with BFGS (le Cessie &amp; van Houwelingen 1992, Applied Statistics 41:191-201). Deterministic. Scores are
 * the fitted class probabilities. Importance: absolute coefficients on standardized inputs (for more than two classes
 * the mean over the coefficient rows, each class against the last), kind {@code abs_weight}.
 */
public final class SmileLogistic implements ClassifierMethod {

    @Override
    public String method() {
        return "logistic";
    }

    @Override
    public List<ParamDef> parameters() {
        return List.of(
                ParamDef.number("lambda", 0, Double.MAX_VALUE, 0.1, "L2 penalty on the coefficients"),
                ParamDef.number("tolerance", Double.MIN_VALUE, 1, 1e-5, "BFGS convergence tolerance"),
                ParamDef.integer("iterations", 1, 100_000, 500, "maximum BFGS iterations"));
    }

    @Override
    public boolean producesScores() {
        return true;
    }

    @Override
    public Model fit(FitContext ctx, Rows x, int[] y, int classes, Params params) {
        TrainingLabels.check(method(), x, y, classes);
        LogisticRegression model = LogisticRegression.fit(x.x(), y, params.getDouble("lambda"),
                params.getDouble("tolerance"), params.getInt("iterations"));
        ClassifierMethod.Model fitted = rows -> {
            int[] labels = new int[rows.n()];
            double[][] scores = new double[rows.n()][classes];
            for (int i = 0; i < rows.n(); i++) {
                labels[i] = model.predict(rows.x()[i], scores[i]);
            }
            return new Predictions(labels, scores);
        };
        // coefficients: feature weights then the intercept (last); multinomial: one row per class but the last
        double[][] w = model instanceof LogisticRegression.Binomial b ? new double[][] {b.coefficients()}
                : ((LogisticRegression.Multinomial) model).coefficients();
        return new Explained(fitted, Explained.absWeights(w, x.x()), Explained.ABS_WEIGHT);
    }
}
