package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.junit.jupiter.api.Test;
import org.viewgain.folds.FitContext;
import org.viewgain.folds.FoldPlan;
import org.viewgain.spec.FeatureSet;
import org.viewgain.spec.SpecLoader;
import org.viewgain.testing.TestCohorts;

/**
 * Leakage canary: recording stand-ins for the scaler, the imputers and the classifiers show that no fit ever sees an
 * outer-test subject (its target view or its label), nor an inner-validation subject of its own inner fold (nor do
 * the imputers behind the imputed features a classifier is tuned on), in every
 * fold and for both ways of imputing training subjects, and in the permutation test, whose fits use the permuted
 * labels and the fold plan drawn from them.
 */
class LeakageCanaryTest {
    @TempDir
    Path dir;

    static final String BODY = """
            imputers:
              - { name: nn, method: nearest-neighbours, grid: { k: [2, 4] } }
              - { name: ridge, method: ridge, fixed: { alpha: 5 } }
            imputed-for-training: %s
            feature-sets: [source, target, imputed, source+imputed, source+target]
            classifiers:
              - { name: lr, method: logistic, grid: { lambda: [0.1, 10] } }
            validation: { outer: { folds: 4, repeats: 2 }, inner: { folds: 3 } }
            significance: { permutations: 2, bootstrap: 0 }
            """;

    Experiment run(String mode, Recording rec) {
        TestCohorts.synthetic(dir, 48, 6, 4, 1.0, 0.3, 5);
        Experiment ex = Setup.prepare(SpecLoader.load(TestCohorts.spec(dir, BODY.formatted(mode))), rec);
        RunResults res = new Runner(ex, 2, Progress.NONE).run();
        // each outer-test subject of a feature set's population is predicted exactly once per pipeline and repeat
        for (Pipeline p : ex.pipelines()) {
            for (int r = 0; r < ex.plan().repeats(); r++) {
                Map<Integer, Integer> seen = new HashMap<>();
                for (RunResults.Prediction pr : res.predictions()) {
                    if (pr.pipeline().equals(p) && pr.repeat() == r) {
                        seen.merge(pr.subject(), 1, Integer::sum);
                        assertEquals(ex.plan().foldOf(r, pr.subject()), pr.fold());
                    }
                }
                for (int i = 0; i < ex.data().n(); i++) {
                    assertEquals(ex.inPopulation(p.featureSet(), i) ? 1 : 0, seen.getOrDefault(i, 0).intValue());
                }
            }
        }
        return ex;
    }

    /** Every way a recorded fit could have seen what it must not; empty when leak-free. */
    static List<String> leaks(Experiment ex, List<Recording.Fit> fits) {
        List<String> out = new ArrayList<>();
        for (Recording.Fit fit : fits) {
            int k = fit.ctx().permutation();
            if (k == 0) {
                out.addAll(leaks(ex, fit, ex.data().y()));
                continue;
            }
            // a permutation's fit belongs to one of the two populations (everyone, or those with a target), each
            // with its own permuted labels and the plan drawn from them: it must be clean under one of them
            List<String> all = leaks(ex, fit, PermutedLabels.of(ex, k, FeatureSet.SOURCE));
            List<String> withTarget = leaks(ex, fit, PermutedLabels.of(ex, k, FeatureSet.TARGET));
            if (!all.isEmpty() && !withTarget.isEmpty()) {
                out.addAll(all);
            }
        }
        return out;
    }

    /** The leaks of one fit made with the given labels and the plan drawn from them. */
    private static List<String> leaks(Experiment ex, Recording.Fit fit, int[] labels) {
        List<String> out = new ArrayList<>();
        Map<String, Integer> position = new HashMap<>();
        for (int i = 0; i < ex.data().n(); i++) {
            position.put(ex.data().id(i), i);
        }
        FoldPlan plan = ex.planFor(labels);
        FitContext c = fit.ctx();
        Set<Integer> forbidden = new HashSet<>();
        for (int i : plan.test(c.repeat(), c.outerFold())) {
            forbidden.add(i);
        }
        if (c.innerFold() != FitContext.WHOLE) {
            // imputers are tuned and cross-fitted in label-free folds, everything else in label-stratified ones; a
            // nested imputer fit (for tuning a classifier) must not see the classifier's inner fold
            boolean imputationFold = fit.kind().equals("imputer") && c.role() != FitContext.Role.NESTED;
            int[] innerOf = imputationFold ? ImputationFolds.of(ex, plan, c.repeat(), c.outerFold())
                    : InnerFolds.of(ex, plan, labels, c.repeat(), c.outerFold());
            for (int i = 0; i < innerOf.length; i++) {
                if (innerOf[i] == c.innerFold()) {
                    forbidden.add(i);
                }
            }
        }
        for (int k = 0; k < fit.ids().size(); k++) {
            int i = position.get(fit.ids().get(k));
            if (forbidden.contains(i)) {
                out.add(fit.kind() + " " + c + " saw held-out subject " + fit.ids().get(k));
            }
            if (fit.kind().equals("imputer") && !ex.data().hasTarget(i)) {
                out.add("imputer " + c + " was given subject " + fit.ids().get(k) + " without a target");
            }
            if (fit.labels() != null && fit.labels()[k] != labels[i]) {
                out.add(fit.kind() + " " + c + " got a wrong label for " + fit.ids().get(k));
            }
        }
        return out;
    }

    @ParameterizedTest
    @ValueSource(strings = {"cross-fitted", "observed"})
    void givenRecordingStandIns_whenRunInBothModes_thenNoFitSeesAHeldOutSubject(String mode) {
        Recording rec = new Recording();
        Experiment ex = run(mode, rec);
        List<Recording.Fit> fits = rec.all();
        List<String> leaks = leaks(ex, fits);
        assertTrue(leaks.isEmpty(), () -> leaks.size() + " leaks, first: " + leaks.get(0));
        // the canary must actually have watched every kind of fit, or the check above proves nothing
        Set<String> kinds = new HashSet<>();
        fits.forEach(f -> kinds.add(f.kind() + ":" + f.ctx().role()));
        assertTrue(kinds.containsAll(List.of("imputer:FINAL", "classifier:TUNE", "classifier:FINAL",
                "scaler:TUNE", "scaler:FINAL")), kinds.toString());
        // inner imputer fits happen in both modes here: the nn grid has two points to choose between
        assertTrue(kinds.contains("imputer:CROSS_FIT"), kinds.toString());
        // the nested imputer fits behind classifier tuning (lr has a grid) were watched
        assertTrue(kinds.contains("imputer:NESTED"), kinds.toString());
        // and the permutations' own imputer and classifier fits were watched too
        for (String kind : List.of("imputer", "classifier")) {
            assertTrue(fits.stream().anyMatch(f -> f.ctx().permutation() > 0 && f.kind().equals(kind)), kind);
        }
    }

    @Test
    void givenAFabricatedLeak_whenChecked_thenTheCanaryReportsIt() {
        Recording rec = new Recording();
        Experiment ex = run("cross-fitted", rec);
        int testSubject = ex.plan().test(0, 1)[0];
        FitContext ctx = new FitContext(0, 0, 1, FitContext.WHOLE, FitContext.Role.FINAL, 1L);
        List<Recording.Fit> fake = List.of(new Recording.Fit("classifier", ctx,
                List.of(ex.data().id(testSubject)), new int[] {ex.data().y()[testSubject]}));
        List<String> found = leaks(ex, fake);
        assertEquals(1, found.size());
        assertTrue(found.get(0).contains("saw held-out subject " + ex.data().id(testSubject)));
        assertFalse(leaks(ex, rec.all()).size() > 0);
    }
}
