package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.Arrays;
import java.util.HashSet;
import java.util.Set;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.viewgain.folds.FitContext;
import org.viewgain.spec.SpecLoader;
import org.viewgain.testing.TestCohorts;

/**
 * Leakage canary for the availability curve (recording stand-ins, {@link Recording}): every imputer fit of an outer
 * fold learns only from that fold's training subjects with a target, the final imputer fits of an outer fold are
 * exactly the run's (all targets) and one per re-fitted level on that level's subset, and no classifier fit sees a
 * test subject, in both {@code imputed-for-training} modes.
 */
class AvailabilityCanaryTest {
    @TempDir
    Path dir;

    @ParameterizedTest
    @ValueSource(strings = {"cross-fitted", "observed"})
    void givenCurve_whenRun_thenImputersSeeOnlyTheLevelsTrainingTargetsAndNoFitSeesATestSubject(String mode) {
        TestCohorts.synthetic(dir, 60, 5, 4, 1.0, 0.2, 41);
        Recording rec = new Recording();
        Experiment ex = Setup.prepare(SpecLoader.load(TestCohorts.spec(dir, """
                imputers: [ { name: ridge, method: ridge, grid: { alpha: [1, 10] } } ]
                imputed-for-training: %s
                feature-sets: [source, source+imputed]
                classifiers: [ { name: lr, method: logistic, grid: { lambda: [0.1, 1.0] } } ]
                validation: { outer: { folds: 3, repeats: 1 }, inner: { folds: 2 } }
                availability-curve: { fractions: [0.4, 0.7] }
                """.formatted(mode))), rec);
        new Runner(ex, 2, Progress.NONE).run();
        for (int f = 0; f < ex.plan().folds(0); f++) {
            final int ff = f;
            Set<String> trainTargets = ids(ex, Arrays.stream(ex.plan().train(0, f)).filter(ex.data()::hasTarget)
                    .toArray());
            Set<String> test = ids(ex, ex.plan().test(0, f));
            Set<Set<String>> expected = new HashSet<>();
            expected.add(trainTargets);
            expected.add(ids(ex, Availability.subset(ex, 0, 0, f)));
            expected.add(ids(ex, Availability.subset(ex, 1, 0, f)));
            assertEquals(3, expected.size(), "two levels below the full data, each its own subset");
            Set<Set<String>> finals = new HashSet<>();
            int imputerFits = 0;
            for (Recording.Fit fit : rec.fits) {
                if (fit.ctx().repeat() != 0 || fit.ctx().outerFold() != ff) {
                    continue;
                }
                Set<String> seen = new HashSet<>(fit.ids());
                assertTrue(seen.stream().noneMatch(test::contains), fit.kind() + " fit saw a test subject");
                if (fit.kind().equals("imputer")) {
                    imputerFits++;
                    assertTrue(trainTargets.containsAll(seen), "an imputer learned from a subject outside the "
                            + "training targets");
                    if (fit.ctx().role() == FitContext.Role.FINAL && fit.ctx().innerFold() == FitContext.WHOLE) {
                        finals.add(seen);
                    }
                }
            }
            assertTrue(imputerFits > 3);
            assertEquals(expected, finals, "outer fold " + (f + 1));
        }
    }

    private static Set<String> ids(Experiment ex, int[] positions) {
        Set<String> out = new HashSet<>();
        for (int i : positions) {
            out.add(ex.data().id(i));
        }
        return out;
    }

}
