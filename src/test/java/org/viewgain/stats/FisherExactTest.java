package org.viewgain.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

class FisherExactTest {
    @Test
    void givenTeaTasting_whenTested_thenAgrestiValues() {
        // Fisher's tea-tasting experiment as in Agresti 2002, Categorical Data Analysis 2nd ed., section 3.5,
        // [[3, 1], [1, 3]]. By hand: the hypergeometric probabilities of n11 = 0..4 are 1, 16, 36, 16, 1 over 70
        // (C(4,k) C(4,4-k) / C(8,4)); one-sided P(n11 >= 3) = 17/70; two-sided = the tables no more likely than the
        // observed one = 34/70. Published: R's fisher.test printed p = 0.2429 (alternative "greater") and 0.4857
        // (two-sided) for this table in Penn State STAT 504 course notes (lesson 3, TeaLady.out); Agresti's own
        // 0.243 one-sided is from memory. So 0.4857 is the two-sided value, not the one-sided one.
        assertEquals(17 / 70.0, FisherExact.greater(3, 1, 1, 3), 1e-12);
        assertEquals(34 / 70.0, FisherExact.twoSided(3, 1, 1, 3), 1e-12);
        assertEquals(0.2429, FisherExact.greater(3, 1, 1, 3), 5e-5);
        assertEquals(0.4857, FisherExact.twoSided(3, 1, 1, 3), 5e-5);
    }

    @Test
    void givenUnbalancedTable_whenTested_thenReferenceLibraryValue_andSymmetric() {
        // scipy 1.17.1 fisher_exact([[1, 9], [11, 3]]) = 0.0027594561852200836 (reference library)
        assertEquals(0.0027594561852200836, FisherExact.twoSided(1, 9, 11, 3), 1e-12);
        // transposing or swapping rows does not change the two-sided p (the test depends on the table only)
        assertEquals(FisherExact.twoSided(1, 9, 11, 3), FisherExact.twoSided(1, 11, 9, 3), 1e-12);
        assertEquals(FisherExact.twoSided(1, 9, 11, 3), FisherExact.twoSided(11, 3, 1, 9), 1e-12);
        // a table with an empty margin has one possible table: p = 1
        assertEquals(1.0, FisherExact.twoSided(0, 0, 4, 6), 1e-12);
    }
}
