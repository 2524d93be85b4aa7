package org.viewgain.engine;

import org.viewgain.folds.FoldPlan;
import org.viewgain.folds.Seeds;

/**
 * Inner folds for tuning a classifier inside an outer training set: stratified by group (the labels in use, so a
 * permutation's inner folds are balanced for the permuted labels as the run's are for the real ones), seeded by
 * (run seed, repeat, outer fold). Imputers use {@link ImputationFolds}, which never depend on labels.
 */
final class InnerFolds {
    private InnerFolds() {
    }

    /** The run's inner folds: real labels, the run's outer plan. */
    static int[] of(Experiment ex, int repeat, int fold) {
        return of(ex, ex.plan(), ex.data().y(), repeat, fold);
    }

    /** Inner fold of every subject position; -1 for positions outside the outer training set. */
    static int[] of(Experiment ex, FoldPlan plan, int[] labels, int repeat, int fold) {
        int[] train = plan.train(repeat, fold);
        int[] strata = new int[train.length];
        for (int k = 0; k < train.length; k++) {
            strata[k] = labels[train[k]];
        }
        int[] a = FoldPlan.stratifiedAssignment(strata, ex.spec().validation().innerFolds(),
                Seeds.derive(ex.spec().seed(), "inner-folds", repeat, fold));
        int[] out = new int[ex.data().n()];
        java.util.Arrays.fill(out, -1);
        for (int k = 0; k < train.length; k++) {
            out[train[k]] = a[k];
        }
        return out;
    }

    /** Inner folds over the whole development cohort, for tuning a final pipeline (real labels). */
    static int[] whole(Experiment ex) {
        int n = ex.data().n();
        int[] strata = ex.data().y().clone();
        return FoldPlan.stratifiedAssignment(strata, ex.spec().validation().innerFolds(),
                Seeds.derive(ex.spec().seed(), "inner-folds", "final"));
    }
}
