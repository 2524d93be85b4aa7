package org.viewgain.imputation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.apache.commons.math3.stat.correlation.PearsonsCorrelation;
import org.junit.jupiter.api.Test;

class ImputationQualityTest {

    @Test
    void givenHandWorkedRows_whenScored_thenMaeAndRmseMatchHandComputation() {
        // hand computation: differences 1, -2, 0, 3 -> MAE 6/4 = 1.5, RMSE sqrt(14/4)
        double[] obs = {1, 2, 3, 4};
        double[] imp = {0, 4, 3, 1};
        assertEquals(1.5, ImputationQuality.mae(obs, imp), 1e-15);
        assertEquals(Math.sqrt(3.5), ImputationQuality.rmse(obs, imp), 1e-15);
    }

    @Test
    void givenRandomRows_whenCorrelated_thenPearsonAgreesWithCommonsMath() {
        // reference library: commons-math3 3.6.1 PearsonsCorrelation; tolerance 1e-12 (rounding only)
        Random rnd = new Random(7);
        double[] a = new double[50];
        double[] b = new double[50];
        for (int i = 0; i < a.length; i++) {
            a[i] = rnd.nextGaussian();
            b[i] = 0.5 * a[i] + rnd.nextGaussian();
        }
        assertEquals(new PearsonsCorrelation().correlation(a, b), ImputationQuality.pearsonR(a, b), 1e-12);
    }

    @Test
    void givenConstantImputation_whenCorrelated_thenNaN() {
        assertTrue(Double.isNaN(ImputationQuality.pearsonR(new double[] {1, 2, 3}, new double[] {5, 5, 5})));
    }

    @Test
    void givenThreeRegionNetwork_whenNodeStrengthScored_thenMatchesHandComputation() {
        // edges (0,1),(0,2),(1,2). observed strengths: 1+2=3, 1+4=5, 2+4=6; imputed edges 1,1,1 -> 2,2,2.
        // |3-2|+|5-2|+|6-2| = 8 -> MAE 8/3 (hand computation)
        double[] obs = {1, 2, 4};
        double[] imp = {1, 1, 1};
        assertEquals(8.0 / 3, ImputationQuality.nodeStrengthMae(obs, imp, 3), 1e-15);
    }

    @Test
    void givenEdgeCountNotATriangle_whenNodeStrengthScored_thenRejected() {
        assertThrows(IllegalArgumentException.class,
                () -> ImputationQuality.nodeStrengthMae(new double[4], new double[4], 3));
    }

    @Test
    void givenMaes_whenSkillComputed_thenOneMinusRatio() {
        assertEquals(0.75, ImputationQuality.skill(1, 4), 1e-15);
        assertEquals(0.0, ImputationQuality.skill(2, 2), 1e-15);
        assertTrue(ImputationQuality.skill(3, 2) < 0);
    }
}
