package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.spec.SpecLoader;
import org.viewgain.testing.TestCohorts;

/**
 * Selection bias on pure noise, after Hastie, Tibshirani &amp; Friedman, ESL 2nd ed., section 7.10.2 (N = 50, two
 * equal classes, p = 5000 noise features; here p = 500 source + 50 target features to stay fast): labels are
 * independent of every feature, so the nested, tuned pipeline must stay near chance. Tuning outside the outer loop
 * would drift upwards (Varma &amp; Simon 2006).
 */
class NullCohortTest {
    @TempDir
    Path dir;

    @Test
    void givenNoiseFeatures_whenNestedPipelinesTuned_thenBalancedAccuracyWithinBinomialBoundOfChance() {
        TestCohorts.synthetic(dir, 50, 500, 50, 0.0, 0.2, 31);
        Path spec = TestCohorts.spec(dir, """
                imputers:
                  - { name: ridge, method: ridge, grid: { alpha: [1, 100] } }
                feature-sets: [source, source+imputed]
                classifiers:
                  - { name: knn, method: knn, grid: { k: [1, 3, 7] } }
                  - { name: svm, method: svm-linear, grid: { C: [0.01, 1] } }
                validation: { outer: { folds: 5, repeats: 3 }, inner: { folds: 3 } }
                """);
        Experiment ex = Setup.prepare(SpecLoader.load(spec));
        List<Evaluation.MetricRow> rows = Evaluation.metrics(new Runner(ex, 2, Progress.NONE).run());
        List<Evaluation.MetricRow> ba = rows.stream().filter(r -> r.metric().equals("balanced_accuracy")).toList();
        assertEquals(4, ba.size());
        // 99% normal-approximation binomial bound for one repeat of n = 50 (common practice, no source), Bonferroni
        // over the 4 pipelines: z = 3.02, half-width 3.02 * sqrt(0.25 / 50) = 0.213. Averaging repeats only narrows it.
        double half = 3.02 * Math.sqrt(0.25 / 50);
        for (Evaluation.MetricRow r : ba) {
            assertTrue(Math.abs(r.estimate() - 0.5) < half, r.pipeline().label() + " = " + r.estimate());
            assertEquals(50, r.n());
        }
    }
}
