package org.viewgain.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class FreemanHaltonTest {
    @Test
    void givenSmallTable_whenTested_thenHandEnumeration() {
        // By hand (Freeman & Halton 1951): rows (1, 0, 2) and (0, 2, 0); column totals 1, 2, 2, first row 3, n = 5,
        // C(5, 3) = 10 tables weighted: (1,2,0) 1, (1,0,2) 1, (1,1,1) 4, (0,2,1) 2, (0,1,2) 2 (sum 10). The observed
        // table has probability 1/10; the tables no more likely are (1,2,0) and (1,0,2): p = 2/10.
        assertEquals(0.2, FreemanHalton.p(new long[] {1, 0, 2}, new long[] {0, 2, 0}), 1e-12);
        // the most likely table: every table counts, p = 1
        assertEquals(1.0, FreemanHalton.p(new long[] {1, 1, 1}, new long[] {0, 1, 1}), 1e-12);
    }

    @Test
    void givenTwoByTwo_whenTested_thenEqualsFishersTwoSidedTest() {
        // for two columns the test is Fisher's: Agresti 2002 tea tasting, two-sided 34/70 (see FisherExactTest)
        assertEquals(34 / 70.0, FreemanHalton.p(new long[] {3, 1}, new long[] {1, 3}), 1e-12);
        assertEquals(FisherExact.twoSided(1, 9, 11, 3), FreemanHalton.p(new long[] {1, 9}, new long[] {11, 3}),
                1e-12);
    }

    @Test
    void givenHugeTable_whenTested_thenRefused() {
        long[] big = {400, 400, 400, 400, 400};
        assertTrue(Double.isNaN(FreemanHalton.p(big, big)));
    }
}
