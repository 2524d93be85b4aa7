package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.spec.SpecLoader;
import org.viewgain.testing.TestCohorts;

/** Progress counts every unit once, imputer fits included, and reaches its total for a whole run and for a shard. */
class ProgressCountTest {
    @TempDir
    Path dir;

    /** Every update received, as {done, total}. */
    static final class Seen implements Progress {
        final List<long[]> updates = new ArrayList<>();

        @Override
        public synchronized void update(long done, long total) {
            updates.add(new long[] {done, total});
        }

        long[] last() {
            return updates.get(updates.size() - 1);
        }
    }

    Experiment experiment() {
        TestCohorts.synthetic(dir, 30, 5, 4, 0.5, 0.2, 9);
        return Setup.prepare(SpecLoader.load(TestCohorts.spec(dir, """
                features: { extract: [edges], scale: standardize }
                imputers:
                  - { name: avg, method: mean }
                  - { name: ridge, method: ridge, grid: { alpha: [1, 10] } }
                feature-sets: [source, source+imputed]
                classifiers:
                  - { name: knn, method: knn, fixed: { k: 3 } }
                validation: { outer: { folds: 3, repeats: 1 }, inner: { folds: 2 } }
                """)));
    }

    @Test
    void givenImputersAndPipelines_whenRun_thenEveryUnitCountedOnce() {
        Experiment ex = experiment();
        Seen seen = new Seen();
        new Runner(ex, 2, seen).run();
        // 3 folds x (2 imputers + 3 pipelines)
        assertEquals(15, new Runner(ex, 1, Progress.NONE).units());
        assertEquals(15, seen.updates.size());
        assertEquals(15, seen.last()[0]);
        assertEquals(15, seen.last()[1]);
    }

    @Test
    void givenAShard_whenRun_thenItCountsItsOwnShareToTheEnd() throws IOException {
        Experiment ex = experiment();
        Seen seen = new Seen();
        Runner runner = new Runner(ex, 2, seen);
        Shard shard = new Shard(1, 2);
        int share = runner.unitKeys(shard).size();
        assertTrue(share > 0 && share < 15, "share " + share);
        try (Journal j = Journal.create(dir.resolve("journal.jsonl"), Map.of("spec", "x"))) {
            runner.journal(j).runShard(shard);
        }
        assertEquals(share, seen.last()[0]);
        assertEquals(share, seen.last()[1]);
    }

    @Test
    void givenFinalPipelines_whenCountingModelFits_thenOneMoreOuterFoldOfWork() {
        TestCohorts.synthetic(dir, 30, 5, 4, 0.5, 0.2, 9);
        String body = """
                imputers: [ { name: ridge, method: ridge, grid: { alpha: [1, 10] } } ]
                feature-sets: [source, source+imputed]
                classifiers: [ { name: lin, method: svm-linear, grid: { C: [0.1, 1] } } ]
                validation: { outer: { folds: 3, repeats: 1 }, inner: { folds: 2 } }
                """;
        long cv = Setup.prepare(SpecLoader.load(TestCohorts.spec(dir, body))).modelFits();
        long withFinal = Setup.prepare(SpecLoader.load(TestCohorts.spec(dir, body + "bundle: true\n"))).modelFits();
        // per outer fold: ridge 2 x 2 tuning + 1 final; each pipeline 2 x 2 tuning + 1 final fit, and source+imputed's
        // nested imputations 2 x (2 x 2 + 1): 5 + 5 + 5 + 10 = 25 per fold, 3 folds, then the final pipelines
        assertEquals(75, cv);
        assertEquals(100, withFinal);
    }
}
