package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.viewgain.spec.SpecLoader;
import org.viewgain.testing.TestCohorts;

/**
 * Every outer scheme with every feature set, on a cohort with missing targets, with the forest and an SVM: a left-out
 * subject without a target leaves the complete-case pipelines with an empty test fold, which is skipped (it once
 * stopped leave-one-out runs). Each pipeline tests each subject of its population exactly once per repeat, and the
 * metrics' n says how many that is.
 */
class EverySchemeAndFeatureSetTest {
    @TempDir
    Path dir;

    @ParameterizedTest
    @ValueSource(strings = {"stratified-k-fold", "leave-one-out", "leave-site-out"})
    void givenMissingTargets_whenEveryFeatureSetRuns_thenEveryPopulationSubjectIsTestedOnce(String scheme) {
        TestCohorts.synthetic(dir, 30, 5, 3, 2.0, 0.3, 41);
        String outer = scheme.equals("stratified-k-fold") ? "{ scheme: " + scheme + ", folds: 3 }"
                : "{ scheme: " + scheme + " }";
        Experiment ex = Setup.prepare(SpecLoader.load(TestCohorts.spec(dir, """
                imputers: [ { name: ridge, method: ridge, fixed: { alpha: 5 } } ]
                feature-sets: [source, target, imputed, source+imputed, source+target]
                classifiers:
                  - { name: forest, method: random-forest, fixed: { trees: 15 } }
                  - { name: svm, method: svm-linear, grid: { C: [0.01, 1] } }
                validation: { outer: %s, inner: { folds: 2 } }
                significance: { permutations: 2, bootstrap: 0 }
                """.formatted(outer))));
        RunResults res = new Runner(ex, 2, Progress.NONE).run();
        int withTarget = 0;
        for (int i = 0; i < ex.data().n(); i++) {
            withTarget += ex.data().hasTarget(i) ? 1 : 0;
        }
        assertTrue(withTarget < ex.data().n(), "the cohort must miss some targets");
        assertEquals(10, ex.pipelines().size());
        for (Pipeline p : ex.pipelines()) {
            Map<Integer, Integer> seen = new HashMap<>();
            res.predictions().stream().filter(pr -> pr.pipeline().equals(p))
                    .forEach(pr -> seen.merge(pr.subject(), 1, Integer::sum));
            for (int i = 0; i < ex.data().n(); i++) {
                assertEquals(ex.inPopulation(p.featureSet(), i) ? 1 : 0, seen.getOrDefault(i, 0).intValue(),
                        p.label() + ", subject " + i);
            }
            int expected = p.featureSet().needsObservedTarget() ? withTarget : ex.data().n();
            List<Evaluation.MetricRow> rows = Evaluation.metrics(res).stream()
                    .filter(r -> r.pipeline().equals(p)).toList();
            rows.forEach(r -> assertEquals(expected, r.n(), p.label() + " " + r.metric()));
        }
        // the permutation test ran for every pipeline
        assertEquals(10, res.permutations().size());
        res.permutations().forEach(r -> assertEquals(2, r.null_().length, r.pipeline().label()));
    }
}
