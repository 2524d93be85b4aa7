package org.viewgain.engine;

import java.util.List;
import org.viewgain.folds.FoldPlan;

/**
 * What a run produced, in a fixed order that does not depend on threads: out-of-fold predictions, the chosen
 * hyperparameters, and the imputation quality rows. The report package turns these into tables.
 */
public record RunResults(Experiment experiment, FoldPlan plan, List<Prediction> predictions,
                         List<Choice> choices, List<ImputationRow> imputation, List<PermutationResult> permutations,
                         List<Importance.Fold> importance) {
    public RunResults {
        predictions = List.copyOf(predictions);
        choices = List.copyOf(choices);
        imputation = List.copyOf(imputation);
        permutations = List.copyOf(permutations);
        importance = List.copyOf(importance);
    }

    /** The same results with the permutation tests added. */
    public RunResults withPermutations(List<PermutationResult> perms) {
        return new RunResults(experiment, plan, predictions, choices, imputation, perms, importance);
    }

    /**
     * One out-of-fold prediction.
     *
     * @param score the positive group's score for two groups, the predicted group's score for more; NaN when the
     *              classifier gives labels only
     */
    public record Prediction(Pipeline pipeline, int repeat, int fold, int subject, int truth, int predicted,
                             double score, double[] scores) {
    }

    /**
     * A hyperparameter choice made by inner cross-validation in one outer fold.
     *
     * @param stage      {@code imputer} or {@code classifier}
     * @param innerScore the inner cross-validated score of the chosen point (MAE for imputers, the tune-by metric for
     *                   classifiers; NaN when there was nothing to choose)
     */
    public record Choice(int repeat, int fold, String stage, String imputer, String featureSet, String classifier,
                         String params, double innerScore, int gridSize) {
    }

    /**
     * Imputation quality of one outer-test subject with an observed target.
     *
     * @param skill    {@code 1 - mae / mae_mean} against a {@code mean} imputer fitted on the same training subjects
     *                 (NaN when not computed)
     * @param absError absolute error of each target feature in base-vector order, or null when not recorded; read
     *                 only
     */
    public record ImputationRow(String imputer, int repeat, int fold, int subject, double mae, double rmse,
                                double pearsonR, double strengthMae, double skill, double[] absError) {
    }
}
