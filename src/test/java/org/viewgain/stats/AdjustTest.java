package org.viewgain.stats;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import org.junit.jupiter.api.Test;

class AdjustTest {
    // Benjamini & Hochberg 1995, worked example (15 p-values, sorted)
    private static final double[] BH_EXAMPLE = {0.0001, 0.0004, 0.0019, 0.0095, 0.0201, 0.0278, 0.0298, 0.0344,
        0.0459, 0.3240, 0.4262, 0.5719, 0.6528, 0.7590, 1.000};

    @Test
    void givenBenjaminiHochbergExample_whenAdjusted_thenPublishedAndRecomputedRejections() {
        // Benjamini & Hochberg 1995, JRSS-B 57:289-300, worked example: BH at q = 0.05 rejects 4 (published); Holm and
        // Bonferroni reject 3 (recomputed)
        assertEquals(4, rejected(Adjust.benjaminiHochberg(BH_EXAMPLE), 0.05));
        assertEquals(3, rejected(Adjust.holm(BH_EXAMPLE), 0.05));
        assertEquals(3, rejected(Adjust.bonferroni(BH_EXAMPLE), 0.05));
    }

    @Test
    void givenBenjaminiHochbergExample_whenAdjusted_thenHandComputedValues() {
        // hand computation from the definitions, m = 15; tolerance 1e-12 (floating point only)
        double[] bh = Adjust.benjaminiHochberg(BH_EXAMPLE);
        assertEquals(0.0015, bh[0], 1e-12); // 15 * 0.0001 / 1
        assertEquals(0.003, bh[1], 1e-12); // 15 * 0.0004 / 2
        assertEquals(0.0095, bh[2], 1e-12); // 15 * 0.0019 / 3
        assertEquals(0.035625, bh[3], 1e-12); // 15 * 0.0095 / 4
        assertEquals(0.0603, bh[4], 1e-12); // 15 * 0.0201 / 5, below the later 0.0639, 0.0645, 0.0695, 0.0765
        assertEquals(1.0, bh[14], 1e-12);
        double[] holm = Adjust.holm(BH_EXAMPLE);
        assertEquals(0.0015, holm[0], 1e-12); // 15 * 0.0001
        assertEquals(0.0056, holm[1], 1e-12); // 14 * 0.0004
        assertEquals(0.0247, holm[2], 1e-12); // 13 * 0.0019
        assertEquals(0.114, holm[3], 1e-12); // 12 * 0.0095
        assertEquals(0.2211, holm[4], 1e-12); // 11 * 0.0201
        assertEquals(0.0015, Adjust.bonferroni(BH_EXAMPLE)[0], 1e-12);
    }

    @Test
    void givenShuffledInput_whenAdjusted_thenValuesFollowTheirHypotheses() {
        int[] perm = {14, 3, 0, 9, 7, 1, 12, 5, 2, 11, 6, 13, 4, 10, 8};
        double[] shuffled = new double[perm.length];
        for (int i = 0; i < perm.length; i++) {
            shuffled[i] = BH_EXAMPLE[perm[i]];
        }
        double[] sortedBh = Adjust.benjaminiHochberg(BH_EXAMPLE);
        double[] sortedHolm = Adjust.holm(BH_EXAMPLE);
        double[] bh = Adjust.benjaminiHochberg(shuffled);
        double[] holm = Adjust.holm(shuffled);
        for (int i = 0; i < perm.length; i++) {
            assertEquals(sortedBh[perm[i]], bh[i], 1e-15);
            assertEquals(sortedHolm[perm[i]], holm[i], 1e-15);
        }
    }

    @Test
    void givenNaNOrInvalid_whenAdjusted_thenNaNKeptOutOfCountOrError() {
        double[] out = Adjust.bonferroni(new double[] {0.01, Double.NaN, 0.02});
        assertTrue(Double.isNaN(out[1]));
        assertArrayEquals(new double[] {0.02, 0.04}, new double[] {out[0], out[2]}, 1e-15);
        assertTrue(Double.isNaN(Adjust.holm(new double[] {Double.NaN, 0.5})[0]));
        assertThrows(IllegalArgumentException.class, () -> Adjust.holm(new double[] {1.5}));
        assertEquals(0, Adjust.benjaminiHochberg(new double[0]).length);
    }

    private static long rejected(double[] adjusted, double alpha) {
        return Arrays.stream(adjusted).filter(p -> p <= alpha).count();
    }
}
