package org.viewgain.engine;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.folds.Seeds;
import org.viewgain.prep.Standardize;
import org.viewgain.spec.Params;
import org.viewgain.stats.Distances;
import org.viewgain.stats.Permanova;
import org.viewgain.stats.SmileMatrices;

/**
 * Group separation without a classifier, per feature set: PERMANOVA pseudo-F and permutation p (Anderson 2001) on
 * Euclidean distances between the features of all subjects of the set, each feature standardized over those subjects.
 * This is descriptive: nothing here is cross-validated, and it must not be read as a predictive result. Imputed
 * features are each subject's out-of-fold imputation from the first repeat (every subject is imputed exactly once
 * there, by an imputer that never saw its target).
 */
public final class Separation {
    /** Subjects beyond which the O(n^2) permutations are skipped (the row then says so with no p-value). */
    public static final int MAX_SUBJECTS = 1500;
    static final int PERMUTATIONS = 999;

    private Separation() {
    }

    /** One feature set (and imputer). */
    public record Row(String featureSet, String imputer, int n, double pseudoF, double pValue, long permutations) {
    }

    /**
     * The rows, one per feature set and imputer, in pipeline order: those the run computed alongside its last units
     * ({@link RunResults#separation}), or computed here two or more at a time (the common pool and the calling thread:
     * each row seeds its own permutations, so the rows do not depend on which thread ran them). On 1,000 x 268
     * regions the five rows took 15 s on the calling thread alone at the end of the run.
     */
    public static List<Row> of(RunResults res) {
        if (res.separation() != null) {
            return res.separation(); // computed by the run while its threads had room
        }
        Experiment ex = res.experiment();
        List<Pipeline> rows = pipelines(ex);
        return java.util.stream.IntStream.range(0, rows.size()).parallel()
                .mapToObj(k -> row(ex, res.firstRepeatImputed(), rows.get(k))).toList();
    }

    /** The pipelines that name the rows: one per feature set and imputer (the first classifier's), in order. */
    static List<Pipeline> pipelines(Experiment ex) {
        List<Pipeline> rows = new ArrayList<>();
        for (Pipeline p : ex.pipelines()) {
            if (p.classifier().equals(ex.classifiers().get(0).name())) {
                rows.add(p); // one row per feature set and imputer, not per classifier
            }
        }
        return rows;
    }

    /**
     * One row; {@code firstRepeat} holds the run's out-of-fold imputations of the first repeat per imputer (those
     * missing are recomputed).
     */
    static Row row(Experiment ex, Map<String, float[][]> firstRepeat, Pipeline p) {
        List<Integer> members = new ArrayList<>();
        for (int i = 0; i < ex.data().n(); i++) {
            if (ex.inPopulation(p.featureSet(), i)) {
                members.add(i);
            }
        }
        int n = members.size();
        if (n > MAX_SUBJECTS || n < 3) {
            return new Row(p.featureSet().label(), p.imputer(), n, Double.NaN, Double.NaN, 0);
        }
        ImputedFold imputed = null;
        if (p.featureSet().needsImputer()) {
            float[][] kept = firstRepeat.get(p.imputer());
            imputed = kept != null ? new ImputedFold(kept, Params.NONE, Double.NaN, List.of(), null)
                    : firstRepeatImputations(ex, p.imputer());
        }
        int[] positions = members.stream().mapToInt(Integer::intValue).toArray();
        int[] groups = new int[members.size()];
        for (int k = 0; k < members.size(); k++) {
            groups[k] = ex.data().y()[positions[k]];
        }
        // each feature standardized over these subjects (the same step as in the fits, fitted on all of them)
        Rows rows = ClassifierStage.rows(ex, p.featureSet(), positions, imputed);
        FitContext ctx = new FitContext(0, 0, 0, FitContext.WHOLE, FitContext.Role.FINAL, 0L);
        double[][] x = new Standardize().fit(ctx, rows, groups).applyInPlace(rows).x();
        // from the rows' Gram matrix by native BLAS (standardized rows sit around the origin, so nothing cancels
        // badly; 1,000 subjects x 143,112 edges took about 100 s as a scalar sum of squared differences)
        double[][] d = Distances.euclideanFromGram(SmileMatrices.rowGram(x));
        Permanova.Result r = Permanova.monteCarlo(d, groups, PERMUTATIONS,
                Seeds.derive(ex.spec().seed(), "separation", p.featureSet().label(), p.imputer()));
        return new Row(p.featureSet().label(), p.imputer(), n, r.pseudoF(), r.p(), r.permutations());
    }

    /** Out-of-fold imputed base vectors of the first repeat (recomputed: imputation is deterministic). */
    private static ImputedFold firstRepeatImputations(Experiment ex, String imputer) {
        float[][] out = new float[ex.data().n()][];
        Resolved.Imputer imp = ex.imputer(imputer);
        ImputationStage stage = new ImputationStage(ex);
        for (int f = 0; f < ex.plan().folds(0); f++) {
            ImputedFold fold = stage.run(imp, 0, ex.plan(), 0, f);
            for (int i : ex.plan().test(0, f)) {
                out[i] = fold.imputed()[i];
            }
        }
        return new ImputedFold(out, Params.NONE, Double.NaN, List.of(), null);
    }
}
