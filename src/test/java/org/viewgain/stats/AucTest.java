package org.viewgain.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;

class AucTest {
    @Test
    void givenHanleyMcNeilRatings_whenAuc_thenPublishedAreaAndStandardError() {
        double[] ratings = ReferenceData.hanleyMcNeilRatings();
        boolean[] abnormal = ReferenceData.hanleyMcNeilAbnormal();
        double auc = Auc.of(ratings, abnormal);
        // Hanley & McNeil 1982, Table I: published 0.893 (3 decimals); recomputed 0.8931711
        assertEquals(0.893, auc, 5e-4);
        assertEquals(0.8931711, auc, 1e-7);
        double se = Auc.hanleyMcNeilSe(ratings, abnormal);
        // Hanley & McNeil 1982, Table I: published SE 0.032; recomputed 0.031990, tolerance half a
        // last digit
        assertEquals(0.032, se, 5e-4);
        assertEquals(0.031990, se, 5e-7);
    }

    @Test
    void givenAreaAndCounts_whenApproximateHanleyMcNeilSe_thenEquationOneWithExponentialQs() {
        // hand computation of Hanley & McNeil 1982 eq. 1 with Q1 = A/(2-A), Q2 = 2A^2/(1+A): A = 0.9, 51 and 58
        double a = 0.9;
        double q1 = 0.9 / 1.1;
        double q2 = 2 * 0.81 / 1.9;
        double expected = Math.sqrt((a * (1 - a) + 50 * (q1 - 0.81) + 57 * (q2 - 0.81)) / (51.0 * 58));
        assertEquals(expected, Auc.hanleyMcNeilSe(0.9, 51, 58), 1e-15);
        // and close to the data-based 0.032 of Table I (approximation; tolerance 1e-3, common practice, no source)
        assertEquals(0.032, Auc.hanleyMcNeilSe(0.8931711, 51, 58), 1e-3);
    }

    @Test
    void givenAsahMarkers_whenAuc_thenMatchesPRoc() {
        List<CSVRecord> rows = ReferenceData.read("asah.csv");
        boolean[] poor = ReferenceData.asahPoor(rows);
        // R package pROC 1.18.0 (Robin et al. 2011) on aSAH (Turck et al. 2010), outcome Poor positive; tolerance
        // 1e-12, both are exact rationals
        assertEquals(0.823678861788618, Auc.of(ReferenceData.column(rows, "wfns"), poor), 1e-12);
        assertEquals(0.731368563685637, Auc.of(ReferenceData.column(rows, "s100b"), poor), 1e-12);
        assertEquals(0.611957994579946, Auc.of(ReferenceData.column(rows, "ndka"), poor), 1e-12);
    }

    @Test
    void givenTiesAndReversal_whenAuc_thenHalfCreditAndComplement() {
        // one positive tied with one of two negatives: (1 + 0.5) / 2 by the Mann-Whitney definition
        assertEquals(0.75, Auc.of(new double[] {1, 1, 0}, new boolean[] {true, false, false}), 0);
        double[] s = {0.3, 0.9, 0.1, 0.5, 0.5, 0.7};
        boolean[] y = {false, true, false, true, false, true};
        double[] negated = new double[s.length];
        for (int i = 0; i < s.length; i++) {
            negated[i] = -s[i];
        }
        assertEquals(1.0, Auc.of(s, y) + Auc.of(negated, y), 1e-15);
    }

    @Test
    void givenOneClassOrNaNScore_whenAuc_thenNaN() {
        assertTrue(Double.isNaN(Auc.of(new double[] {1, 2}, new boolean[] {true, true})));
        assertTrue(Double.isNaN(Auc.of(new double[] {1, Double.NaN}, new boolean[] {true, false})));
        assertTrue(Double.isNaN(Auc.hanleyMcNeilSe(0.8, 0, 5)));
        assertThrows(IllegalArgumentException.class, () -> Auc.of(new double[] {1}, new boolean[] {true, false}));
    }
}
