package org.viewgain.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class CorrectedTTestTest {
    /** Ten per-fold differences of one 10-fold cross-validation (invented for the hand computation). */
    static final double[] D = {0.01, 0.03, -0.02, 0.04, 0.02, 0.00, 0.05, 0.01, 0.03, 0.02};

    @Test
    void givenTenFoldDifferences_whenCorrectedTTest_thenMatchesHandComputation() {
        // No published numeric example was found; hand computation of Nadeau & Bengio 2003 (Machine Learning
        // 52:239-281) as given by Bouckaert & Frank 2004 (PAKDD, LNCS 3056:3-12):
        //   mean = 0.19 / 10 = 0.019
        //   squared deviations (x1e-6): 81, 121, 1521, 441, 1, 361, 961, 81, 121, 1 -> sum 3690e-6
        //   s^2 = 3690e-6 / 9 = 4.1e-4
        //   se^2 = (1/10 + 1/9) * 4.1e-4 = 8.655556e-5, se = 0.009303524
        //   t = 0.019 / 0.009303524 = 2.042237, df = 9
        // two-sided p of t(9) from scipy 1.17.1 (reference library): 0.0715059996767739
        CorrectedTTest.Result r = CorrectedTTest.kFold(D, 10);
        assertEquals(0.019, r.meanDifference(), 1e-15);
        assertEquals(Math.sqrt((0.1 + 1.0 / 9) * 4.1e-4), r.se(), 1e-15);
        assertEquals(2.042237, r.t(), 5e-7);
        assertEquals(9, r.df(), 0);
        assertEquals(0.0715059996767739, r.p(), 1e-9);
        // scipy 1.17.1: mean +/- t_{0.975, 9} * se = -0.00204603305916, 0.04004603305916
        Interval ci = r.interval(0.95);
        assertEquals(-0.00204603305916, ci.low(), 1e-10);
        assertEquals(0.04004603305916, ci.high(), 1e-10);
    }

    @Test
    void givenNoCorrection_whenTested_thenEqualsOrdinaryPairedT_andCorrectionWidens() {
        CorrectedTTest.Result plain = CorrectedTTest.test(D, 0);
        // ordinary one-sample t: mean / (s / sqrt(n)) = 0.019 / sqrt(4.1e-5) (hand computation)
        assertEquals(0.019 / Math.sqrt(4.1e-5), plain.t(), 1e-12);
        assertTrue(CorrectedTTest.kFold(D, 10).p() > plain.p());
    }

    @Test
    void givenConstantDifferences_whenTested_thenUndefined_andBadRatioRejected() {
        CorrectedTTest.Result r = CorrectedTTest.kFold(new double[] {0.02, 0.02, 0.02}, 3);
        assertEquals(0.02, r.meanDifference(), 1e-15);
        assertTrue(Double.isNaN(r.t()));
        assertTrue(Double.isNaN(r.p()));
        assertThrows(IllegalArgumentException.class, () -> CorrectedTTest.test(D, Double.NaN));
        assertThrows(IllegalArgumentException.class, () -> CorrectedTTest.kFold(D, 1));
    }
}
