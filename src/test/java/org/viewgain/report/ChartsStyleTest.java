package org.viewgain.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.BasicStroke;
import java.awt.Color;
import java.util.Arrays;
import java.util.HashSet;
import java.util.Set;
import org.junit.jupiter.api.Test;

/** Charts read without colour, and their axes say their unit. */
class ChartsStyleTest {

    @Test
    void givenEightLineSeries_whenStyled_thenEachHasItsOwnDashPatternAndAColourOfTheSafePalette() {
        Set<String> dashes = new HashSet<>();
        for (int i = 0; i < 8; i++) {
            BasicStroke s = Charts.line(i, 2f);
            dashes.add(Arrays.toString(s.getDashArray()));
        }
        assertEquals(8, dashes.size(), "distinct line patterns: " + dashes);
        // Okabe & Ito (2008), "Color universal design": blue, vermillion, bluish green, reddish purple, orange,
        // sky blue and black, as sRGB hex values (from memory of their published table)
        int[] okabeIto = {0x0072B2, 0xD55E00, 0x009E73, 0xCC79A7, 0xE69F00, 0x56B4E9, 0x000000};
        for (int i = 0; i < okabeIto.length; i++) {
            assertEquals(new Color(okabeIto[i]), Charts.PALETTE[i]);
        }
    }

    @Test
    void givenEachImportanceKind_whenCharted_thenTheAxisNamesItsUnit() {
        assertTrue(ImportanceChart.axis("impurity").startsWith("Gini impurity decrease"));
        assertTrue(ImportanceChart.axis("abs_weight").contains("standardized units"));
        assertTrue(ImportanceChart.axis("selection_frequency").contains("(0-1)"));
    }

    /**
     * The importance chart's features: the 15 of largest |estimate|, largest first, equal sizes in the file's order
     * (as the stable sort it replaced ordered them); hand-made rows with a tie and negative weights.
     */
    @Test
    void givenImportanceRows_whenTheTopIsTaken_thenLargestMagnitudesFirstAndTiesInFileOrder() {
        java.util.List<String[]> cells = new java.util.ArrayList<>();
        double[] estimates = {0.5, -2.0, 1.0, 3.0, -1.0, 0.25};
        for (int i = 0; i < estimates.length; i++) {
            cells.add(new String[] {"f" + i, Double.toString(estimates[i])});
        }
        for (int i = 0; i < 20; i++) {
            cells.add(new String[] {"small" + i, "0.001"});
        }
        CsvRows t = CsvRows.of("importance.csv", java.util.List.of("feature", "estimate"), cells);
        java.util.List<String> top = ImportanceChart.top(t.rows()).stream().map(r -> r.s("feature")).toList();
        assertEquals(ImportanceChart.TOP, top.size());
        // 3.0, |-2.0|, then the tie 1.0 (f2) and |-1.0| (f4) in file order, 0.5, 0.25, then the first nine of the
        // equal small ones in file order
        assertEquals(java.util.List.of("f3", "f1", "f2", "f4", "f0", "f5", "small0", "small1", "small2", "small3",
                "small4", "small5", "small6", "small7", "small8"), top);
    }
}
