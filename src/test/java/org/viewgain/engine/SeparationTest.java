package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.spec.SpecLoader;
import org.viewgain.testing.TestCohorts;

/**
 * Descriptive group separation (PERMANOVA, Anderson 2001) per feature set: on a cohort with a planted effect in the
 * target view only, the target separates the groups (small p, larger pseudo-F) and the effect-free source does not
 * reach that; n follows each set's population. The pseudo-F formula itself is checked against reference values in
 * stats/PermanovaTest.
 */
class SeparationTest {
    @TempDir
    Path dir;

    @Test
    void givenEffectInTargetOnly_whenSeparationComputed_thenTargetSeparatesAndNFollowsPopulation() {
        TestCohorts.synthetic(dir, 60, 6, 5, 3.0, 0.0, 0.25, 21);
        Experiment ex = Setup.prepare(SpecLoader.load(TestCohorts.spec(dir, """
                imputers: [ { name: ridge, method: ridge, fixed: { alpha: 1 } } ]
                feature-sets: [source, target, source+imputed]
                classifiers: [ { name: lr, method: logistic }, { name: knn, method: knn } ]
                validation: { outer: { folds: 3 }, inner: { folds: 2 } }
                significance: { bootstrap: 0 }
                """)));
        RunResults res = new Runner(ex, 2, Progress.NONE).run();
        List<Separation.Row> rows = Separation.of(res);
        assertEquals(3, rows.size(), "one row per feature set and imputer, not per classifier");
        // the run computed the rows alongside its last units; computed afterwards (as a merge of shards does) they
        // are the same, whichever threads ran them
        assertTrue(res.separation() != null, "computed by the run");
        assertEquals(rows, Separation.of(res.withSeparation(null)));
        Map<String, Separation.Row> by = rows.stream().collect(Collectors.toMap(Separation.Row::featureSet, r -> r));
        long withTarget = java.util.stream.IntStream.range(0, ex.data().n()).filter(ex.data()::hasTarget).count();
        assertEquals(60, by.get("source").n());
        assertEquals(withTarget, by.get("target").n());
        assertEquals(60, by.get("source+imputed").n());
        assertTrue(by.get("target").pValue() <= 0.01, "target p " + by.get("target").pValue());
        assertTrue(by.get("target").pseudoF() > by.get("source").pseudoF());
        assertEquals(999, by.get("target").permutations());
    }
}
