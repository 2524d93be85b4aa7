package org.viewgain.classify;

import java.util.List;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.spec.ParamDef;
import org.viewgain.spec.Params;
import smile.classification.KNN;

/**
 * {@code knn}: k-nearest-neighbour vote in Euclidean distance (Cover &amp; Hart 1967, IEEE Trans. Inf. Theory
 * 13:21-27) through Smile. Deterministic. Scores are the fractions of the k neighbours in each class.
 */
public final class SmileKnn implements ClassifierMethod {

    @Override
    public String method() {
        return "knn";
    }

    @Override
    public List<ParamDef> parameters() {
        return List.of(ParamDef.integer("k", 1, 100_000, 5, "number of neighbours"));
    }

    @Override
    public boolean producesScores() {
        return true;
    }

    @Override
    public Model fit(FitContext ctx, Rows x, int[] y, int classes, Params params) {
        TrainingLabels.check(method(), x, y, classes);
        int k = params.getInt("k");
        if (!(k <= x.n())) {
            throw new IllegalArgumentException("knn: k = " + k + " exceeds the " + x.n() + " training rows");
        }
        KNN<double[]> model = KNN.fit(x.x(), y, k);
        return rows -> {
            int[] labels = new int[rows.n()];
            double[][] scores = new double[rows.n()][classes];
            for (int i = 0; i < rows.n(); i++) {
                model.predict(rows.x()[i], scores[i]);
                labels[i] = TrainingLabels.argmax(scores[i]);
            }
            return new Predictions(labels, scores);
        };
    }
}
