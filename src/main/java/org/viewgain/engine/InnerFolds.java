package org.viewgain.engine;

import org.viewgain.folds.FoldPlan;
import org.viewgain.folds.Seeds;

/**
 * Inner folds for tuning a classifier inside an outer training set: stratified by group (the labels in use, so a
 * permutation's inner folds are balanced for the permuted labels as the run's are for the real ones) and by whether
 * the target was observed, seeded by
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
            // group x target observed: complete-case feature sets get inner folds balanced by group too
            strata[k] = 2 * labels[train[k]] + (ex.data().hasTarget(train[k]) ? 1 : 0);
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
}
