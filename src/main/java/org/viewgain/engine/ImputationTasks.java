package org.viewgain.engine;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.viewgain.imputation.ExternalImputer;
import org.viewgain.spec.Specs;

/**
 * Who an imputer trains on and whom it imputes in each fit of an outer fold. The {@code final} task trains on the
 * outer-training subjects with an observed target and imputes the outer-test subjects (with {@code
 * imputed-for-training: observed} also the outer-training subjects without a target); cross-fit task {@code j}
 * trains on the outer-training subjects with a target outside imputation fold {@code j} ({@link ImputationFolds},
 * label-free) and imputes every outer-training subject in that fold. {@link ImputationStage} and {@code viewgain folds} both take their subject lists
 * from here, so an outside program is told exactly what the engine will ask for.
 */
public final class ImputationTasks {
    /** Task name of the fit on the whole outer training set. */
    public static final String FINAL = "final";
    /** Task name of a fit on the outer training set minus one inner fold. */
    public static final String CROSS_FIT = "cross-fit";

    private ImputationTasks() {
    }

    /**
     * One imputation fit. Subjects are positions in the cohort (subjects-table order), ascending.
     *
     * @param inner the inner fold from 0 for a cross-fit task, -1 for the final task
     */
    public record Task(int repeat, int fold, String name, int inner, List<Integer> train, List<Integer> impute) {
        public Task {
            train = List.copyOf(train);
            impute = List.copyOf(impute);
        }

        int[] trainPositions() {
            return train.stream().mapToInt(Integer::intValue).toArray();
        }

        int[] imputePositions() {
            return impute.stream().mapToInt(Integer::intValue).toArray();
        }
    }

    /** The final task of one outer fold of the run's plan. */
    public static Task finalTask(Experiment ex, int repeat, int fold) {
        return finalTask(ex, repeat, fold, ex.plan().train(repeat, fold), ex.plan().test(repeat, fold));
    }

    /**
     * The final task of a training set and the subjects it predicts: an outer fold's, or one level down, an outer
     * training set minus a classifier inner fold and that fold (nested imputations for tuning).
     */
    static Task finalTask(Experiment ex, int repeat, int fold, int[] train, int[] test) {
        StudyData d = ex.data();
        int[] withTarget = Arrays.stream(train).filter(d::hasTarget).toArray();
        int[] impute = test.clone();
        if (ex.spec().imputedForTraining() == Specs.TrainingImputation.OBSERVED) {
            int[] without = Arrays.stream(train).filter(i -> !d.hasTarget(i)).toArray();
            impute = concat(impute, without);
        }
        Arrays.sort(impute);
        return new Task(repeat, fold, FINAL, -1, list(withTarget), list(impute));
    }

    /** Cross-fit task {@code j} (from 0) of a training set, with the folds of {@link ImputationFolds#of}. */
    static Task crossFit(Experiment ex, int repeat, int fold, int[] train, int[] foldOf, int j) {
        StudyData d = ex.data();
        int[] fitSet = Arrays.stream(train).filter(i -> d.hasTarget(i) && foldOf[i] != j).toArray();
        int[] predSet = Arrays.stream(train).filter(i -> foldOf[i] == j).toArray();
        return new Task(repeat, fold, CROSS_FIT, j, list(fitSet), list(predSet));
    }

    /**
     * The tasks an outside ({@code external}) imputer must provide for one outer fold: the final task, then the
     * non-empty cross-fit tasks when {@link #crossFitNeeded} says the engine will ask for them.
     */
    public static List<Task> of(Experiment ex, int repeat, int fold) {
        List<Task> out = new ArrayList<>();
        out.add(finalTask(ex, repeat, fold));
        if (crossFitNeeded(ex)) {
            int[] foldOf = ImputationFolds.of(ex, ex.plan(), repeat, fold);
            for (int j = 0; j < ex.spec().validation().innerFolds(); j++) {
                Task t = crossFit(ex, repeat, fold, ex.plan().train(repeat, fold), foldOf, j);
                if (!t.impute().isEmpty()) {
                    out.add(t);
                }
            }
        }
        return out;
    }

    /**
     * True when the engine fits external imputers inside the inner folds: always with {@code imputed-for-training:
     * cross-fitted}, and with {@code observed} only when an {@code external} entry has more than one grid point
     * (several files tuned against each other).
     */
    public static boolean crossFitNeeded(Experiment ex) {
        return ex.spec().imputedForTraining() == Specs.TrainingImputation.CROSS_FITTED
                || ex.imputers().stream().anyMatch(i -> ExternalImputer.METHOD.equals(i.method().method())
                && i.grid().size() > 1);
    }

    /** True when the stage tunes or cross-fits this imputer (it then runs every cross-fit task). */
    static boolean runsCrossFits(Experiment ex, Resolved.Imputer imp) {
        return ex.spec().imputedForTraining() == Specs.TrainingImputation.CROSS_FITTED || imp.grid().size() > 1;
    }

    private static List<Integer> list(int[] a) {
        return Arrays.stream(a).boxed().toList();
    }

    private static int[] concat(int[] a, int[] b) {
        int[] r = Arrays.copyOf(a, a.length + b.length);
        System.arraycopy(b, 0, r, a.length, b.length);
        return r;
    }
}
