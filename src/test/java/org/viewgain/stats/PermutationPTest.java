package org.viewgain.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class PermutationPTest {
    @Test
    void givenCounts_whenOjalaGarriga_thenPlusOneFormula() {
        // Ojala & Garriga 2010: p = (C + 1) / (N + 1)
        assertEquals(1.0 / 1001, PermutationP.ojalaGarriga(0, 1000), 1e-15);
        assertEquals(51.0 / 1001, PermutationP.ojalaGarriga(50, 1000), 1e-15);
        assertEquals(1.0, PermutationP.ojalaGarriga(99, 99), 0);
        assertThrows(IllegalArgumentException.class, () -> PermutationP.ojalaGarriga(5, 4));
    }

    @Test
    void givenManyPermutedScoresReachObserved_whenSequential_thenStopsEarlyWithHOverL() {
        // Besag & Clifford 1991: stop when h = 3 exceedances are reached after l draws, p = h / l
        SequentialStop s = SequentialStop.start(0.70, 3, 100);
        double[] permuted = {0.72, 0.50, 0.70, 0.60, 0.81, 0.99};
        int fed = 0;
        while (!s.stopped()) {
            s = s.next(permuted[fed++]);
        }
        assertEquals(5, fed);
        assertTrue(s.stoppedEarly());
        assertEquals(3, s.exceedances());
        assertEquals(3.0 / 5, s.pValue(), 1e-15);
    }

    @Test
    void givenFewExceedances_whenSequentialRunsOut_thenPlusOneOverMaxPlusOne() {
        // Besag & Clifford 1991: no early stop, g = 1 < h = 5 after N_max = 20 draws, p = (g + 1) / (N_max + 1)
        SequentialStop s = SequentialStop.start(0.9, 5, 20);
        for (int i = 0; i < 20; i++) {
            assertFalse(s.stopped());
            s = s.next(i == 7 ? 0.95 : 0.5);
        }
        assertTrue(s.stopped());
        assertFalse(s.stoppedEarly());
        assertEquals(2.0 / 21, s.pValue(), 1e-15);
        SequentialStop done = s;
        assertThrows(IllegalStateException.class, () -> done.next(0.1));
    }

    @Test
    void givenUnfinishedOrBadSetup_whenAsked_thenErrors_andStateIsImmutable() {
        SequentialStop s0 = SequentialStop.start(0.5, 2, 10);
        SequentialStop s1 = s0.next(0.9);
        assertEquals(0, s0.draws());
        assertEquals(1, s1.draws());
        assertThrows(IllegalStateException.class, s1::pValue);
        assertEquals(1, SequentialStop.start(0.5, 2, 10).next(Double.NaN).exceedances());
        assertThrows(IllegalArgumentException.class, () -> SequentialStop.start(0.5, 0, 10));
        assertThrows(IllegalArgumentException.class, () -> SequentialStop.start(0.5, 11, 10));
    }
}
