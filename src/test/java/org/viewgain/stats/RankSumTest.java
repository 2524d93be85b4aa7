package org.viewgain.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class RankSumTest {
    @Test
    void givenTiedSamples_whenTested_thenHandComputationAndReferenceP() {
        // By hand (Wilcoxon 1945; Mann & Whitney 1947): x = 1..5, y = 3, 6..10. Mid-ranks of x: 1, 2, 3.5, 5, 6,
        // sum 17.5, W = 17.5 - 15 = 2.5; E[W] = 30/2 = 15; one tie of 2: Var = 30/12 (12 - 6/110) = 29.863636;
        // z = (2.5 - 15 + 0.5) / sqrt(29.863636) = -2.195890. Two-sided p = 0.02810006355731762 (scipy 1.17.1
        // mannwhitneyu, asymptotic, continuity correction: reference library).
        RankSum.Result r = RankSum.test(new double[] {1, 2, 3, 4, 5}, new double[] {3, 6, 7, 8, 9, 10});
        assertEquals(2.5, r.w(), 1e-12);
        assertEquals(-12.0 / Math.sqrt(2.5 * (12 - 6 / 110.0)), r.z(), 1e-12);
        assertEquals(0.02810006355731762, r.p(), 1e-10);
        // scipy 1.17.1: x = 40, 51, 38, 62, 47, 55, 47 against 44, 58, 63, 61, 70, 47 -> U = 11, p = 0.17235939896143682
        RankSum.Result s = RankSum.test(new double[] {40, 51, 38, 62, 47, 55, 47},
                new double[] {44, 58, 63, 61, 70, 47});
        assertEquals(11.0, s.w(), 1e-12);
        assertEquals(0.17235939896143682, s.p(), 1e-10);
    }

    @Test
    void givenAllTiedOrEmpty_whenTested_thenUndefined() {
        assertTrue(Double.isNaN(RankSum.test(new double[] {2, 2}, new double[] {2, 2, 2}).p()));
        assertTrue(Double.isNaN(RankSum.test(new double[] {}, new double[] {1, 2}).p()));
    }
}
