package org.viewgain.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;

class BayesCorrelatedTTestTest {
    private static final double[] D = CorrectedTTestTest.D;
    /** 10-fold: n_test/n_train = 1/9, so rho = 1/10 (Corani & Benavoli 2015). */
    private static final double RHO = BayesCorrelatedTTest.rho(1, 9);

    @Test
    void givenTenFoldDifferences_whenPosterior_thenMatchesHandComputation() {
        // hand computation (Benavoli et al. 2017, section 4): location 0.019, scale^2 = (1/10 + 0.1/0.9) * 4.1e-4,
        // df 9; probabilities of t(9, 0.019, 0.0093035238) from scipy 1.17.1 (reference library) for rope 0.01
        BayesCorrelatedTTest.Posterior p = BayesCorrelatedTTest.of(D, RHO, 0.01);
        assertEquals(0.1, RHO, 1e-15);
        assertEquals(0.019, p.mean(), 1e-15);
        assertEquals(0.009303523824635243, p.scale(), 1e-15);
        assertEquals(9, p.df(), 0);
        assertEquals(0.006188190859614135, p.left(), 1e-10);
        assertEquals(0.1731274912936445, p.rope(), 1e-10);
        assertEquals(0.8206843178467413, p.right(), 1e-10);
    }

    @Test
    void givenAnyDifferences_whenPosterior_thenProbabilitiesSumToOneAndMirrorUnderNegation() {
        double[] negated = new double[D.length];
        for (int i = 0; i < D.length; i++) {
            negated[i] = -D[i];
        }
        for (double rope : new double[] {0, 0.005, 0.02, 0.1}) {
            BayesCorrelatedTTest.Posterior p = BayesCorrelatedTTest.of(D, RHO, rope);
            BayesCorrelatedTTest.Posterior q = BayesCorrelatedTTest.of(negated, RHO, rope);
            assertEquals(1.0, p.left() + p.rope() + p.right(), 1e-12);
            assertEquals(p.left(), q.right(), 1e-14);
            assertEquals(p.right(), q.left(), 1e-14);
            assertEquals(p.rope(), q.rope(), 1e-14);
        }
    }

    @Test
    void givenLimitingRopes_whenPosterior_thenFrequentistTailsAndCertainEquivalence() {
        // rope 0: the posterior tails are the one-sided p-values of the corrected t-test (same t, same df), so
        // 2 * min(left, right) is its two-sided p (property of the Student posterior under the flat prior)
        BayesCorrelatedTTest.Posterior zero = BayesCorrelatedTTest.of(D, RHO, 0);
        assertEquals(0.0, zero.rope(), 0);
        assertEquals(CorrectedTTest.kFold(D, 10).p(), 2 * Math.min(zero.left(), zero.right()), 1e-12);
        // a very wide rope holds all posterior mass
        assertEquals(1.0, BayesCorrelatedTTest.of(D, RHO, 10).rope(), 1e-12);
        // zero variance: point mass at the mean
        BayesCorrelatedTTest.Posterior point = BayesCorrelatedTTest.of(new double[] {0.03, 0.03, 0.03}, RHO, 0.01);
        assertEquals(1.0, point.right(), 0);
        assertEquals(0.0, point.rope() + point.left(), 0);
    }

    @Test
    void givenBadArguments_whenPosterior_thenRejected() {
        assertThrows(IllegalArgumentException.class, () -> BayesCorrelatedTTest.of(D, 1.0, 0.01));
        assertThrows(IllegalArgumentException.class, () -> BayesCorrelatedTTest.of(D, RHO, -0.01));
        assertThrows(IllegalArgumentException.class, () -> BayesCorrelatedTTest.of(new double[] {1}, RHO, 0.01));
    }
}
