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
 * Sequential stopping (Besag &amp; Clifford 1991) gives the same decisions at alpha as the full permutation run, with
 * far fewer permutations for a pipeline that is clearly not significant, and the same answer on 1 and 4 threads.
 */
class SequentialStoppingTest {
    @TempDir
    Path dir;

    static final String BODY = """
            feature-sets: [source, target]
            classifiers: [ { name: lr, method: logistic, fixed: { lambda: 1.0 } } ]
            validation: { outer: { folds: 4, repeats: 1 }, inner: { folds: 2 } }
            significance: { permutations: 99, early-stop: %d, metric: auc, bootstrap: 0 }
            """;

    List<PermutationResult> run(int h, int threads) {
        // the source view carries no group effect at all; the target view carries the planted one
        TestCohorts.synthetic(dir, 60, 5, 4, 2.0, 0.0, 0.2, 77);
        Experiment ex = Setup.prepare(SpecLoader.load(TestCohorts.spec(dir, BODY.formatted(h))));
        return new Runner(ex, threads, Progress.NONE).run().permutations();
    }

    @Test
    void givenEarlyStop_whenComparedWithFullRun_thenSameDecisionsWithFewerPermutations() {
        List<PermutationResult> full = run(0, 2);
        List<PermutationResult> seq = run(5, 2);
        List<PermutationResult> seq4 = run(5, 4);
        assertEquals(2, full.size());
        for (int p = 0; p < 2; p++) {
            assertEquals(full.get(p).pValue() <= 0.05, seq.get(p).pValue() <= 0.05, full.get(p).pipeline().label());
            assertEquals(seq.get(p).pValue(), seq4.get(p).pValue());
            assertEquals(seq.get(p).null_().length, seq4.get(p).null_().length);
        }
        PermutationResult noSignal = seq.get(0);
        PermutationResult signal = seq.get(1);
        assertEquals(99, full.get(0).null_().length);
        // with h = 5 the expected number of draws is about h / p (Besag & Clifford 1991); this pipeline's full-run p
        // is 0.10, so about 50 of the 99 are expected (here 31): it must stop before the planned 99
        assertTrue(noSignal.stoppedEarly() && noSignal.null_().length < 99,
                "stopped after " + noSignal.null_().length + ", full-run p " + full.get(0).pValue());
        assertTrue(full.get(0).pValue() > 0.05 && full.get(1).pValue() <= 0.05);
        assertTrue(!signal.stoppedEarly() && signal.null_().length == 99);
        // Besag & Clifford 1991: stopped early after l draws with h exceedances, p = h / l
        assertEquals(5.0 / noSignal.null_().length, noSignal.pValue(), 1e-12);
        // Ojala & Garriga 2010: p = (C + 1) / (N + 1)
        assertEquals((signal.exceedances() + 1) / 100.0, signal.pValue(), 1e-12);
    }
}
