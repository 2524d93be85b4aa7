package org.viewgain.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class McNemarTest {
    // Agresti 1990, p. 350, presidential approval [[794, 150], [86, 570]]: discordant 150 and 86
    private static final McNemar.Discordant AGRESTI = new McNemar.Discordant(150, 86);

    @Test
    void givenAgrestiTable_whenChiSquare_thenPublishedStatisticAndP() {
        TestResult plain = McNemar.chiSquare(AGRESTI, false);
        // published 17.3559 (4 decimals; tolerance half a last digit); p 3.099e-05 (R mcnemar.test docs)
        assertEquals(17.3559, plain.statistic(), 5e-5);
        assertEquals(3.099e-05, plain.p(), 5e-9);
        TestResult corrected = McNemar.chiSquare(AGRESTI, true);
        // Agresti 1990, Categorical Data Analysis p. 350, continuity-corrected: recomputed 16.8178, p 4.1146e-05;
        // tolerance half a last digit
        assertEquals(16.8178, corrected.statistic(), 5e-5);
        assertEquals(4.1146e-05, corrected.p(), 5e-10);
    }

    @Test
    void givenFagerlandDiscordantCounts_whenExact_thenExactAndMidP() {
        // Fagerland, Lydersen & Laake 2013, Table 1: discordant 1 and 7; exact 0.0703125 and mid-p 0.0390625
        // (recomputed, exact binary fractions 18/256 and 10/256; tolerance 1e-12)
        McNemar.Discordant d = new McNemar.Discordant(1, 7);
        assertEquals(0.0703125, McNemar.exactP(d), 1e-12);
        assertEquals(0.0390625, McNemar.midP(d), 1e-12);
        // symmetric in the two classifiers
        McNemar.Discordant swapped = new McNemar.Discordant(7, 1);
        assertEquals(McNemar.exactP(d), McNemar.exactP(swapped), 0);
        assertEquals(McNemar.midP(d), McNemar.midP(swapped), 0);
    }

    @Test
    void givenPredictions_whenDiscordant_thenCountsOnlyPairsWhereExactlyOneIsRight() {
        int[] truth = {0, 1, 1, 0, 1, 0};
        int[] a = {0, 1, 0, 0, 1, 1};
        int[] b = {1, 1, 1, 0, 0, 1};
        // row 0: A only; row 2: B only; row 4: A only; row 5: both wrong
        assertEquals(new McNemar.Discordant(2, 1), McNemar.discordant(truth, a, b));
    }

    @Test
    void givenNoOrBalancedDiscordance_whenTested_thenUndefinedChiSquareAndExactOne() {
        McNemar.Discordant none = new McNemar.Discordant(0, 0);
        assertTrue(Double.isNaN(McNemar.chiSquare(none, false).p()));
        assertEquals(1.0, McNemar.exactP(none), 0);
        McNemar.Discordant balanced = new McNemar.Discordant(4, 4);
        assertEquals(0.0, McNemar.chiSquare(balanced, true).statistic(), 0);
        assertEquals(1.0, McNemar.exactP(balanced), 0);
        assertThrows(IllegalArgumentException.class, () -> new McNemar.Discordant(-1, 2));
    }
}
