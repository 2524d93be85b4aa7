package org.viewgain.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The report's reading of availability.csv: the smallest level whose balanced-accuracy gain is no more than the
 * margin below the full data's, and the careful wording (an estimate, not a guarantee; nothing claimed without a
 * full-data gain). Hand-made rows.
 */
class AvailabilityChartTest {
    private static final List<String> HEADER = List.of("level", "fraction", "count", "full_data", "targets_mean",
            "targets_min", "targets_max", "imputer", "classifier", "measure", "estimate", "ci_low", "ci_high",
            "ci_method", "n");

    private static String[] gain(int level, String fraction, boolean full, double targets, String imputer,
                                 double estimate) {
        return new String[] {Integer.toString(level), fraction, "", Boolean.toString(full), Double.toString(targets),
            "0", "0", imputer, "lr", "balanced_accuracy_gain", Double.toString(estimate),
            Double.toString(estimate - 0.1), Double.toString(estimate + 0.1), "corrected-t", "60"};
    }

    private static List<CsvRows.Row> rows() {
        List<String[]> cells = new ArrayList<>();
        // ridge: 0.01, 0.045, 0.07, full 0.06 -> level 2 is the first within 0.02 of 0.06 (0.045 >= 0.04)
        cells.add(gain(1, "0.1", false, 6, "ridge", 0.01));
        cells.add(gain(2, "0.25", false, 15, "ridge", 0.045));
        cells.add(gain(3, "0.5", false, 30, "ridge", 0.07));
        cells.add(gain(4, "1", true, 60, "ridge", 0.06));
        // knn: no gain with all scans
        cells.add(gain(1, "0.1", false, 6, "knn", 0.02));
        cells.add(gain(4, "1", true, 60, "knn", -0.01));
        return CsvRows.of("availability.csv", HEADER, cells).rows();
    }

    @Test
    void givenGains_whenRead_thenSmallestLevelWithinTheMarginOfTheFullDataGain() {
        List<AvailabilityChart.Finding> found = AvailabilityChart.find(rows(), 0.02);
        assertEquals(2, found.size());
        assertEquals("ridge", found.get(0).imputer());
        assertEquals("2", found.get(0).smallest().s("level"));
        assertEquals("4", found.get(0).full().s("level"));
        // a wider margin reaches down to level 1, a zero margin needs level 3 (0.07 >= 0.06)
        assertEquals("1", AvailabilityChart.find(rows(), 0.05).get(0).smallest().s("level"));
        assertEquals("3", AvailabilityChart.find(rows(), 0).get(0).smallest().s("level"));
        assertNull(AvailabilityChart.find(rows().subList(0, 3), 0.02).get(0).full(), "no full-data row, no finding");
    }

    @Test
    void givenGains_whenWorded_thenAnEstimateNotAGuaranteeAndNoClaimWithoutAFullDataGain() {
        String html = AvailabilityChart.findings(rows(), 0.02);
        assertTrue(html.contains("25% ("), html);
        assertTrue(html.contains("no gain at full data"), html);
        assertTrue(html.contains("an estimate from this cohort, not a guarantee"), html);
        assertTrue(html.contains("The permutation test was not run per level"), html);
    }
}
