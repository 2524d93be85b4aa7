package org.viewgain.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.testing.TestCohorts;

/**
 * Smile's forest on more than 2,000 features is flagged by {@code check} (its trees re-sort every feature at every
 * split; 400 subjects x 9,900 features did not finish in 30 minutes, docs/benchmarks.md), not when selection keeps
 * fewer features and not for other classifiers.
 */
class CostWarningCliTest {
    @TempDir
    Path dir;

    String check(String body) {
        Path spec = TestCohorts.spec(dir, body);
        CliTest.Outcome c = CliTest.run("check", spec.toString());
        assertEquals(0, c.code(), c.err());
        return c.out();
    }

    @Test
    void givenSmileForestOnWideSource_whenChecked_thenWarnedUnlessSelectedOrAnotherClassifier() {
        TestCohorts.synthetic(dir, 24, 2_100, 3, 1.0, 0.0, 4);
        String tail = """
                feature-sets: [source]
                validation: { outer: { folds: 3 }, inner: { folds: 2 } }
                """;
        String forest = "classifiers: [ { name: rf, method: smile-random-forest, fixed: { trees: 5 } } ]\n";
        String wide = check(forest + tail);
        assertTrue(wide.contains("smile-random-forest will see up to 2100 features per subject"), wide);
        String selected = check("features: { select: { method: variance, keep: 500 } }\n" + forest + tail);
        assertFalse(selected.contains("smile-random-forest will"), selected);
        String knn = check("classifiers: [ { name: k, method: knn, fixed: { k: 3 } } ]\n" + tail);
        assertFalse(knn.contains("smile-random-forest will"), knn);
    }
}
