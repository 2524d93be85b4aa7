package org.viewgain.engine;

import java.util.HashMap;
import java.util.Map;
import org.viewgain.cohort.Subject;
import org.viewgain.folds.FoldPlan;
import org.viewgain.folds.Seeds;

/**
 * Folds for tuning and cross-fitting imputers inside an outer training set. They never depend on group labels:
 * stratified by site (when given) and by whether the target was observed, seeded by (run seed, repeat, outer fold).
 * So an outer training set's imputations are a function of its subjects' views alone, and a label permutation that
 * keeps the training set (leave-one-out, leave-site-out) reuses them unchanged.
 */
final class ImputationFolds {
    private ImputationFolds() {
    }

    /** Imputation fold of every subject position in an outer fold of a plan; -1 outside its training set. */
    static int[] of(Experiment ex, FoldPlan plan, int repeat, int fold) {
        return of(ex, plan.train(repeat, fold), Seeds.derive(ex.spec().seed(), "imputation-folds", repeat, fold));
    }

    /** Imputation fold of every subject position of a training set; -1 for positions outside it. */
    static int[] of(Experiment ex, int[] train, long seed) {
        boolean sites = ex.spec().cohort().site() != null;
        Map<String, Integer> codes = new HashMap<>();
        int[] strata = new int[train.length];
        for (int k = 0; k < train.length; k++) {
            Subject s = ex.data().subjects().get(train[k]);
            String key = (sites ? s.site() : "") + "|" + ex.data().hasTarget(train[k]);
            strata[k] = codes.computeIfAbsent(key, c -> codes.size());
        }
        int[] a = FoldPlan.stratifiedAssignment(strata, ex.spec().validation().innerFolds(), seed);
        int[] out = new int[ex.data().n()];
        java.util.Arrays.fill(out, -1);
        for (int k = 0; k < train.length; k++) {
            out[train[k]] = a[k];
        }
        return out;
    }
}
