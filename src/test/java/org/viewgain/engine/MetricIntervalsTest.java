package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Direct tests of {@link MetricIntervals} on hand-made predictions of invented subjects ({@link PairedRuns}). */
class MetricIntervalsTest {
    /** z_{0.975}, scipy 1.17.1 (reference library). */
    static final double Z = 1.959963984540054;

    @TempDir
    Path dir;

    private static List<List<RunResults.Prediction>> byRepeat(Experiment ex, List<RunResults.Prediction> ps) {
        List<List<RunResults.Prediction>> out = new ArrayList<>();
        for (int r = 0; r < ex.plan().repeats(); r++) {
            final int rr = r;
            out.add(ps.stream().filter(p -> p.repeat() == rr).toList());
        }
        return out;
    }

    @Test
    void givenAllRightOverTwoRepeats_whenIntervals_thenWilsonAtSubjectsNotSubjectsTimesRepeats() {
        // 29 subjects: 15 controls, 14 patients; bootstrap with 200 replicates
        Experiment ex = PairedRuns.experiment(dir, 29, 1, 5, 2, "{ compare: [], bootstrap: 200 }");
        Pipeline p = PairedRuns.pipeline(1);
        List<List<RunResults.Prediction>> reps = byRepeat(ex, PairedRuns.predictions(ex, p,
                (r, f, i, t) -> PairedRuns.right(t)));
        assertEquals(29, reps.get(0).size());
        Map<String, MetricIntervals.Ci> ci = MetricIntervals.of(ex, p, reps, Map.of("accuracy", 1.0,
                "sensitivity", 1.0, "specificity", 1.0, "auc", 1.0, "balanced_accuracy", 1.0, "f1", 1.0, "mcc", 1.0));
        // Newcombe 1998, Table I (published): Wilson score interval of 29/29 is 0.8830-1.0000. At 58 trials (subjects
        // x repeats) it would start at 58/(58 + z^2) = 0.938.
        assertEquals("wilson", ci.get("accuracy").method());
        assertEquals(0.8830, ci.get("accuracy").low(), 5e-5);
        assertEquals(1.0, ci.get("accuracy").high(), 1e-12);
        // sensitivity at the 14 patients, specificity at the 15 controls: with every trial a success the Wilson lower
        // end reduces to n / (n + z^2) (Wilson 1927, by hand from Newcombe 1998, method 3)
        assertEquals(14 / (14 + Z * Z), ci.get("sensitivity").low(), 1e-9);
        assertEquals(15 / (15 + Z * Z), ci.get("specificity").low(), 1e-9);
        // every bootstrap resample of all-right predictions scores 1
        for (String m : List.of("balanced_accuracy", "f1", "mcc")) {
            assertEquals("bootstrap", ci.get(m).method(), m);
            assertEquals(1.0, ci.get(m).low(), 1e-12, m);
            assertEquals(1.0, ci.get(m).high(), 1e-12, m);
        }
    }

    @Test
    void givenAucThatDiffersByRepeat_whenIntervals_thenDeLongVarianceIsAveragedOverRepeats() {
        Experiment ex = PairedRuns.experiment(dir, 16, 1, 4, 2, "{ compare: [], bootstrap: 0 }");
        Pipeline p = PairedRuns.pipeline(1);
        // repeat 1: patients 0.6, controls 0.4, control p01 (index 0) 0.8; repeat 2: patients 0.6, controls 0.4
        List<List<RunResults.Prediction>> reps = byRepeat(ex, PairedRuns.predictions(ex, p, (r, f, i, t) -> {
            double s = r == 0 && i == 0 ? 0.8 : t == 1 ? 0.6 : 0.4;
            return new double[] {s > 0.5 ? 1 : 0, s};
        }));
        Map<String, MetricIntervals.Ci> ci = MetricIntervals.of(ex, p, reps, Map.of("accuracy", 0.96875,
                "sensitivity", 1.0, "specificity", 0.9375, "auc", 0.9375, "balanced_accuracy", 0.96875, "f1", 1.0,
                "mcc", 1.0));
        // DeLong et al. 1988, by hand: repeat 1 has AUC 0.875 with variance S10/8 + S01/8 = 0 + 0.125/8 = 0.015625
        // (positive placements all 7/8; negative placements 0 once, 1 seven times); repeat 2 has AUC 1 and variance 0.
        // The mean variance 0.0078125 gives 0.9375 +/- z sqrt(0.0078125), clipped at 1.
        assertEquals("delong", ci.get("auc").method());
        assertEquals(0.9375 - Z * Math.sqrt(0.0078125), ci.get("auc").low(), 1e-9);
        assertEquals(1.0, ci.get("auc").high(), 0);
        // no bootstrap replicates: no interval for the bootstrapped metrics
        for (String m : List.of("balanced_accuracy", "f1", "mcc")) {
            assertTrue(Double.isNaN(ci.get(m).low()) && ci.get(m).method().isEmpty(), m);
        }
    }
}
