package org.viewgain.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;

class DeLongTest {
    // pROC 1.18.0 prints 15 significant digits; the brief asks for ~1e-6, we hold 1e-9
    private static final double PROC_TOL = 1e-9;

    @Test
    void givenHanleyMcNeilRatings_whenDeLong_thenRecomputedSeAndStataInterval() {
        DeLong.Estimate e = DeLong.estimate(ReferenceData.hanleyMcNeilRatings(), ReferenceData.hanleyMcNeilAbnormal());
        // Hanley & McNeil 1982, Radiology 143:29-36, Table I data: DeLong (DeLong, DeLong & Clarke-Pearson 1988) SE
        // recomputed 0.0307244 (Stata prints 0.0307); tolerance half a last digit
        assertEquals(0.0307244, e.se(), 5e-8);
        Interval ci = e.interval(0.95);
        // Stata's 95% CI 0.83295-0.95339 on the same data, tolerance half a last digit
        assertEquals(0.83295, ci.low(), 5e-6);
        assertEquals(0.95339, ci.high(), 5e-6);
    }

    @Test
    void givenAsahWfns_whenDeLongInterval_thenMatchesPRoc() {
        List<CSVRecord> rows = ReferenceData.read("asah.csv");
        DeLong.Estimate e = DeLong.estimate(ReferenceData.column(rows, "wfns"), ReferenceData.asahPoor(rows));
        assertEquals(0.823678861788618, e.auc(), PROC_TOL);
        // pROC 1.18.0 ci.auc(method = "delong") on aSAH, printed to 7 digits: tolerance 5e-8
        Interval ci = e.interval(0.95);
        assertEquals(0.7485349, ci.low(), 5e-8);
        assertEquals(0.8988228, ci.high(), 5e-8);
        assertEquals(41, e.positives());
        assertEquals(72, e.negatives());
    }

    @Test
    void givenAsahMarkerPairs_whenDeLongCompare_thenZAndPMatchPRoc() {
        List<CSVRecord> rows = ReferenceData.read("asah.csv");
        boolean[] poor = ReferenceData.asahPoor(rows);
        double[] wfns = ReferenceData.column(rows, "wfns");
        double[] s100b = ReferenceData.column(rows, "s100b");
        double[] ndka = ReferenceData.column(rows, "ndka");
        // R package pROC 1.18.0 (Robin et al. 2011, BMC Bioinformatics 12:77) roc.test(method = "delong", paired) on
        // its aSAH data set (Turck et al. 2010, Intensive Care Med 36:107-115)
        DeLong.Comparison ws = DeLong.compare(wfns, s100b, poor);
        assertEquals(2.20898359144091, ws.z(), PROC_TOL);
        assertEquals(0.0271757822291882, ws.p(), PROC_TOL);
        Interval diff = ws.interval(0.95);
        assertEquals(0.0104061769564846, diff.low(), PROC_TOL);
        assertEquals(0.174214419249478, diff.high(), PROC_TOL);
        DeLong.Comparison wn = DeLong.compare(wfns, ndka, poor);
        assertEquals(2.79777591868904, wn.z(), PROC_TOL);
        assertEquals(0.00514557970691098, wn.p(), PROC_TOL);
        DeLong.Comparison ns = DeLong.compare(ndka, s100b, poor);
        assertEquals(-1.39077002573558, ns.z(), PROC_TOL);
        assertEquals(0.164295175223054, ns.p(), PROC_TOL);
        assertEquals(0.611957994579946 - 0.731368563685637, ns.difference(), PROC_TOL);
    }

    @Test
    void givenIdenticalScoresOrOneClass_whenDeLong_thenUndefinedNotFaked() {
        double[] s = {0.1, 0.4, 0.35, 0.8};
        boolean[] y = {false, false, true, true};
        DeLong.Comparison same = DeLong.compare(s, s, y);
        assertEquals(0.0, same.difference(), 0);
        assertTrue(Double.isNaN(same.z()));
        assertTrue(Double.isNaN(same.p()));
        DeLong.Estimate oneClass = DeLong.estimate(s, new boolean[] {true, true, true, true});
        assertTrue(Double.isNaN(oneClass.auc()));
        assertTrue(!oneClass.interval(0.95).isDefined());
    }
}
