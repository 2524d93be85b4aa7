package org.viewgain.engine;

import java.util.List;
import java.util.Map;
import org.viewgain.folds.FoldPlan;

/**
 * What a run produced, in a fixed order that does not depend on threads: out-of-fold predictions, the chosen
 * hyperparameters, and the imputation quality rows. The report package turns these into tables.
 *
 * @param firstRepeatImputed per imputer, the out-of-fold imputed base vectors of repeat 1 (rows shared with the
 *                           run's imputations, read only), for {@link Separation}; empty when the run did not compute
 *                           them (e.g. a merge of shards), in which case they are recomputed
 * @param availability       the levels of the spec's availability curve, the full data last (empty without one)
 * @param separation         the separation test's rows when the run computed them alongside its units, null when
 *                           {@link Separation#of} computes them (a merge of shards, a resumed run)
 */
public record RunResults(Experiment experiment, FoldPlan plan, List<Prediction> predictions,
                         List<Choice> choices, List<ImputationRow> imputation, List<EdgeErrors> edgeErrors,
                         List<PermutationResult> permutations, List<Importance.Fold> importance,
                         Map<String, float[][]> firstRepeatImputed, List<AvailabilityLevel> availability,
                         List<Separation.Row> separation) {
    /** Results without an availability curve. */
    public RunResults(Experiment experiment, FoldPlan plan, List<Prediction> predictions, List<Choice> choices,
                      List<ImputationRow> imputation, List<EdgeErrors> edgeErrors,
                      List<PermutationResult> permutations, List<Importance.Fold> importance,
                      Map<String, float[][]> firstRepeatImputed) {
        this(experiment, plan, predictions, choices, imputation, edgeErrors, permutations, importance,
                firstRepeatImputed, List.of(), null);
    }

    public RunResults {
        availability = List.copyOf(availability);
        separation = separation == null ? null : List.copyOf(separation);
        firstRepeatImputed = Map.copyOf(firstRepeatImputed);
        predictions = List.copyOf(predictions);
        choices = List.copyOf(choices);
        imputation = List.copyOf(imputation);
        edgeErrors = List.copyOf(edgeErrors);
        permutations = List.copyOf(permutations);
        importance = List.copyOf(importance);
    }

    /** The same results with the permutation tests added. */
    public RunResults withPermutations(List<PermutationResult> perms) {
        return new RunResults(experiment, plan, predictions, choices, imputation, edgeErrors, perms, importance,
                firstRepeatImputed, availability, separation);
    }

    /** The same results with the levels of an availability curve. */
    public RunResults withAvailability(List<AvailabilityLevel> levels) {
        return new RunResults(experiment, plan, predictions, choices, imputation, edgeErrors, permutations,
                importance, firstRepeatImputed, levels, separation);
    }

    /** The same results with the separation test's rows, computed by the run. */
    public RunResults withSeparation(List<Separation.Row> rows) {
        return new RunResults(experiment, plan, predictions, choices, imputation, edgeErrors, permutations,
                importance, firstRepeatImputed, availability, rows);
    }

    /**
     * One level of the availability curve: the out-of-fold predictions of the {@code source+imputed} pipelines and
     * the imputation quality rows when each outer training block kept only this level's subjects with a target.
     *
     * @param label       the level as the spec wrote it ({@code 0.25}, {@code 40}), or {@code all} for the full data
     *                    appended after a list that does not end with fraction 1
     * @param fraction    the spec's fraction (1 for the full data), NaN for a count
     * @param count       the spec's count, -1 for a fraction or the full data
     * @param full        true for the full-data level: the run's own results, nothing re-fitted
     * @param targets     per outer fold slot (repeat-major), the training subjects with a target the level kept
     * @param predictions the level's predictions of every {@code source+imputed} pipeline
     * @param quality     the level's imputation quality rows (outer-test subjects with an observed target)
     */
    public record AvailabilityLevel(String label, double fraction, int count, boolean full, List<Integer> targets,
                                    List<Prediction> predictions, List<ImputationRow> quality) {
        public AvailabilityLevel {
            targets = List.copyOf(targets);
            predictions = List.copyOf(predictions);
            quality = List.copyOf(quality);
        }
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
     * @param unconverged how many of the unit's model fits (inner and final) stopped at their solver's iteration
     *                    limit before its stopping rule held (see {@code ClassifierMethod.Model#converged()})
     */
    public record Choice(int repeat, int fold, String stage, String imputer, String featureSet, String classifier,
                         String params, double innerScore, int gridSize, int unconverged) {
    }

    /**
     * Imputation quality of one outer-test subject with an observed target.
     *
     * @param skill    {@code 1 - mae / mae_mean} against a {@code mean} imputer fitted on the same training subjects
     *                 (NaN when not computed)
     */
    public record ImputationRow(String imputer, int repeat, int fold, int subject, double mae, double rmse,
                                double pearsonR, double strengthMae, double skill) {
    }

    /**
     * Per-feature imputation error of one imputer in one outer fold, kept as sums so that a fold costs one vector
     * whatever its number of subjects.
     *
     * @param subjects the outer-test subjects with an observed target (the quality rows of that fold)
     * @param sum      per target feature (base-vector order), the sum over those subjects of the absolute error;
     *                 read only
     */
    public record EdgeErrors(String imputer, int repeat, int fold, int subjects, double[] sum) {
    }
}
