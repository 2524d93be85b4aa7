package org.viewgain.engine;

import org.viewgain.folds.FoldPlan;
import org.viewgain.folds.Seeds;

/** Inner folds of an outer training set: stratified by group, seeded by (run seed, repeat, outer fold). */
final class InnerFolds {
    private InnerFolds() {
    }

    /** Inner fold of every subject position; -1 for positions outside the outer training set. */
    static int[] of(Experiment ex, int repeat, int fold) {
        int[] train = ex.plan().train(repeat, fold);
        int[] strata = new int[train.length];
        for (int k = 0; k < train.length; k++) {
            strata[k] = ex.data().y()[train[k]];
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
