package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import org.apache.commons.math3.distribution.BinomialDistribution;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.spec.SpecLoader;
import org.viewgain.testing.TestCohorts;

/**
 * Calibration of the whole-pipeline permutation test (Ojala &amp; Garriga 2010, test 1; p = (C+1)/(N+1)): on cohorts
 * whose labels are independent of the features the test rejects at alpha = 0.05 at a rate inside the 99% binomial
 * interval around 0.05; with a planted effect it rejects in most cohorts. Small, fast settings (logistic regression,
 * 3 folds, 39 permutations) keep this near a minute.
 */
class PermutationCalibrationTest {
    @TempDir
    Path dir;

    static final int COHORTS = 200;
    static final String BODY = """
            feature-sets: [source]
            classifiers: [ { name: lr, method: logistic, fixed: { lambda: 1.0 } } ]
            validation: { outer: { folds: 3 }, inner: { folds: 2 } }
            significance: { permutations: 39, metric: auc, bootstrap: 0 }
            """;

    private double pValue(Path cohortDir, double effect, long seed) {
        TestCohorts.synthetic(cohortDir, 30, 4, 2, effect, 0.0, seed);
        Experiment ex = Setup.prepare(SpecLoader.load(TestCohorts.spec(cohortDir, BODY)));
        List<PermutationResult> perms = new Runner(ex, 2, Progress.NONE).run().permutations();
        assertEquals(1, perms.size());
        assertEquals(39, perms.get(0).null_().length);
        return perms.get(0).pValue();
    }

    @Test
    void givenNullCohorts_whenPermutationTested_thenRejectionRateIsNominal_andPlantedEffectsAreFound() {
        int rejections = 0;
        for (int c = 0; c < COHORTS; c++) {
            rejections += pValue(dir.resolve("null" + c), 0.0, 1000 + c) <= 0.05 ? 1 : 0;
        }
        // 99% interval of Binomial(200, 0.05), from the distribution itself (commons-math3)
        BinomialDistribution b = new BinomialDistribution(COHORTS, 0.05);
        int lo = b.inverseCumulativeProbability(0.005);
        int hi = b.inverseCumulativeProbability(0.995);
        assertTrue(rejections >= lo && rejections <= hi,
                "null rejections " + rejections + " of " + COHORTS + " outside [" + lo + ", " + hi + "]");
        // power: the source effect is effect/5 = 2.5 sd on 3 of 4 features (planted by TestCohorts)
        int found = 0;
        int powered = 20;
        for (int c = 0; c < powered; c++) {
            found += pValue(dir.resolve("effect" + c), 12.5, 5000 + c) <= 0.05 ? 1 : 0;
        }
        assertTrue(found >= 0.8 * powered, "power " + found + "/" + powered);
    }
}
