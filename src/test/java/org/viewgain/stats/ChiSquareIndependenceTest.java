package org.viewgain.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class ChiSquareIndependenceTest {
    @Test
    void givenTables_whenTested_thenPearsonStatisticAndReferenceP() {
        // [[10, 20], [20, 10]]: expected 15 in every cell, X^2 = 4 * 25 / 15 = 6.6667 (by hand, Agresti 2002
        // section 3.2); p = 0.009823274507519235 on 1 df (scipy 1.17.1 chi2_contingency, correction=False)
        TestResult r = ChiSquareIndependence.test(new long[][] {{10, 20}, {20, 10}});
        assertEquals(20 / 3.0, r.statistic(), 1e-12);
        assertEquals(0.009823274507519235, r.p(), 1e-12);
        // [[10, 20, 30], [20, 20, 20]]: X^2 = 5.3333 on 2 df, p = 0.0694834512228015 (scipy 1.17.1)
        TestResult s = ChiSquareIndependence.test(new long[][] {{10, 20, 30}, {20, 20, 20}});
        assertEquals(16 / 3.0, s.statistic(), 1e-12);
        assertEquals(0.0694834512228015, s.p(), 1e-12);
        // an empty column is dropped: the same as the 2 x 2 table
        TestResult e = ChiSquareIndependence.test(new long[][] {{10, 0, 20}, {20, 0, 10}});
        assertEquals(r.p(), e.p(), 1e-15);
        assertTrue(Double.isNaN(ChiSquareIndependence.test(new long[][] {{3, 4}, {0, 0}}).p()));
    }

    @Test
    void givenSmallCounts_whenChecked_thenFlagged() {
        // expected counts below 5 flagged (Cochran 1954's rule of thumb): [[1, 3], [11, 9]] expects 2, 2, 10, 10 (by
        // hand: row totals 4 and 20, column totals 12 and 12, n = 24); [[1, 9], [11, 3]] expects 5, 5, 7, 7
        assertTrue(ChiSquareIndependence.smallExpected(new long[][] {{1, 3}, {11, 9}}));
        assertFalse(ChiSquareIndependence.smallExpected(new long[][] {{1, 9}, {11, 3}}));
        assertFalse(ChiSquareIndependence.smallExpected(new long[][] {{10, 20}, {20, 10}}));
    }
}
