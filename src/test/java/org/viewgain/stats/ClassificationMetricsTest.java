package org.viewgain.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

class ClassificationMetricsTest {
    @Test
    void givenSmallBinaryTable_whenBinary_thenHandComputedValuesInNameOrder() {
        // TP 3, FN 1, FP 2, TN 4 (hand computation, exact fractions)
        int[] truth = {1, 1, 1, 1, 0, 0, 0, 0, 0, 0};
        int[] pred = {1, 1, 1, 0, 1, 1, 0, 0, 0, 0};
        Map<String, Double> m = ClassificationMetrics.binary(truth, pred, null, 1);
        assertEquals(ClassificationMetrics.NAMES, List.copyOf(m.keySet()));
        assertEquals(0.7, m.get("accuracy"), 1e-15);
        assertEquals(0.75, m.get("sensitivity"), 1e-15);
        assertEquals(4.0 / 6, m.get("specificity"), 1e-15);
        assertEquals((0.75 + 4.0 / 6) / 2, m.get("balanced_accuracy"), 1e-15);
        assertEquals(6.0 / 9, m.get("f1"), 1e-15);
        assertEquals((3.0 * 4 - 2.0 * 1) / Math.sqrt(5.0 * 4 * 6 * 5), m.get("mcc"), 1e-15);
        assertTrue(m.get("auc").isNaN());
    }

    @Test
    void givenNoPositivesAndConstantPrediction_whenBinary_thenUndefinedValuesAreNaN() {
        Map<String, Double> m = ClassificationMetrics.binary(new int[] {0, 0, 0}, new int[] {0, 0, 0},
                new double[] {0.1, 0.2, 0.3}, 1);
        assertEquals(1.0, m.get("accuracy"), 0);
        assertEquals(1.0, m.get("specificity"), 0);
        assertTrue(m.get("sensitivity").isNaN());
        assertTrue(m.get("balanced_accuracy").isNaN());
        assertTrue(m.get("f1").isNaN());
        assertTrue(m.get("mcc").isNaN());
        assertTrue(m.get("auc").isNaN());
    }

    @Test
    void givenThreeClassTable_whenMulticlass_thenHandComputedGorodkinAndMacroValues() {
        // confusion (rows truth, columns predicted): [[3,1,0],[1,2,1],[0,1,1]], n = 10 (hand computation)
        int[] truth = {0, 0, 0, 0, 1, 1, 1, 1, 2, 2};
        int[] pred = {0, 0, 0, 1, 0, 1, 1, 2, 1, 2};
        Map<String, Double> m = ClassificationMetrics.multiclass(truth, pred, null, 3);
        assertEquals(0.6, m.get("accuracy"), 1e-15);
        double recall = (3.0 / 4 + 2.0 / 4 + 1.0 / 2) / 3;
        assertEquals(recall, m.get("balanced_accuracy"), 1e-15);
        assertEquals(recall, m.get("sensitivity"), 1e-15);
        // specificities: class0 5/6, class1 4/6, class2 7/8
        assertEquals((5.0 / 6 + 4.0 / 6 + 7.0 / 8) / 3, m.get("specificity"), 1e-15);
        // F1: class0 6/8, class1 4/8, class2 2/4
        assertEquals((6.0 / 8 + 4.0 / 8 + 2.0 / 4) / 3, m.get("f1"), 1e-15);
        // Gorodkin 2004: (c*s - sum p_k t_k) / sqrt((s^2 - sum p_k^2)(s^2 - sum t_k^2)); t = (4,4,2), p = (4,4,2)
        double expected = (6.0 * 10 - (16 + 16 + 4)) / Math.sqrt((100.0 - 36) * (100.0 - 36));
        assertEquals(expected, m.get("mcc"), 1e-15);
        assertTrue(m.get("auc").isNaN());
    }

    @Test
    void givenTwoClasses_whenMulticlass_thenMccEqualsBinaryPhiAndBalancedAccuracyAgrees() {
        int[] truth = {1, 1, 1, 1, 0, 0, 0, 0, 0, 0};
        int[] pred = {1, 1, 1, 0, 1, 1, 0, 0, 0, 0};
        double[][] scores = new double[truth.length][];
        double[] positive = new double[truth.length];
        for (int i = 0; i < truth.length; i++) {
            positive[i] = (i * 7 % 10) / 10.0;
            scores[i] = new double[] {1 - positive[i], positive[i]};
        }
        Map<String, Double> multi = ClassificationMetrics.multiclass(truth, pred, scores, 2);
        Map<String, Double> bin = ClassificationMetrics.binary(truth, pred, positive, 1);
        // Gorodkin 2004: R_K reduces to Matthews' coefficient for K = 2
        assertEquals(bin.get("mcc"), multi.get("mcc"), 1e-14);
        assertEquals(bin.get("balanced_accuracy"), multi.get("balanced_accuracy"), 1e-14);
        // both one-vs-rest AUCs of a two-class problem equal the binary AUC
        assertEquals(bin.get("auc"), multi.get("auc"), 1e-14);
    }

    @Test
    void givenAbsentClassOrBadIndex_whenMulticlass_thenNaNMacroOrError() {
        Map<String, Double> m = ClassificationMetrics.multiclass(new int[] {0, 1, 0}, new int[] {0, 1, 1}, null, 3);
        assertTrue(m.get("balanced_accuracy").isNaN());
        assertEquals(2.0 / 3, m.get("accuracy"), 1e-15);
        assertThrows(IllegalArgumentException.class,
                () -> ClassificationMetrics.multiclass(new int[] {0, 3}, new int[] {0, 1}, null, 3));
        assertThrows(IllegalArgumentException.class,
                () -> ClassificationMetrics.binary(new int[] {0, 1}, new int[] {0}, null, 1));
    }
}
