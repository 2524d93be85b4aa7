package org.viewgain.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.viewgain.stats.Auc;

/** ROC curves against published worked examples and the project's own AUC. */
class CurvesTest {
    @Test
    void givenTheFourPointExample_whenRocComputed_thenPointsAndAreaMatchThePublishedOnes() {
        // scikit-learn documentation, sklearn.metrics.roc_curve example (from memory; checked by hand):
        // y = [1, 1, 2, 2] with 2 positive, scores [0.1, 0.4, 0.35, 0.8] -> fpr [0, 0, .5, .5, 1],
        // tpr [0, .5, .5, 1, 1], roc_auc_score 0.75. Exact to 1e-12.
        double[][] c = Curves.roc(new double[] {0.1, 0.4, 0.35, 0.8}, new boolean[] {false, false, true, true});
        assertArrayEquals(new double[] {0, 0, 0.5, 0.5, 1}, c[0], 1e-12);
        assertArrayEquals(new double[] {0, 0.5, 0.5, 1, 1}, c[1], 1e-12);
        assertEquals(0.75, Curves.area(c), 1e-12);
    }

    @Test
    void givenTiedScores_whenAreaComputed_thenItEqualsTheMannWhitneyAucOfTheStatsPackage() {
        // Ties count one half (Hanley & McNeil 1982); org.viewgain.stats.Auc is checked against that paper's Table I.
        SplittableRandom rng = new SplittableRandom(5);
        double[] s = new double[200];
        boolean[] y = new boolean[200];
        for (int i = 0; i < s.length; i++) {
            y[i] = rng.nextBoolean();
            s[i] = Math.round(4 * (rng.nextDouble() + (y[i] ? 0.3 : 0))) / 4.0;
        }
        assertEquals(Auc.of(s, y), Curves.area(Curves.roc(s, y)), 1e-12);
    }

    @Test
    void givenDecisionValuesOrNaN_whenAskedIfProbabilities_thenNo() {
        assertTrue(Curves.probabilities(new double[] {0, 0.5, 1}));
        assertFalse(Curves.probabilities(new double[] {0.2, 1.7}));
        assertFalse(Curves.probabilities(new double[] {0.2, Double.NaN}));
        assertFalse(Curves.probabilities(new double[0]));
    }
}
