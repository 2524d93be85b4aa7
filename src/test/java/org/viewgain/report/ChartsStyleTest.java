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
}
