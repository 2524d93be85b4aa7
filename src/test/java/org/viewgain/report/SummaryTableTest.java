package org.viewgain.report;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

/** The terminal table's footnote names the interval level the run used, not the default. */
class SummaryTableTest {
    @Test
    void givenConfidence90_whenPrinted_thenTheFootnoteSays90PercentAndUnadjusted() {
        String t = SummaryTable.text(List.of(), 0.9);
        assertTrue(t.contains("[90% interval, unadjusted:"), t);
        assertFalse(t.contains("95%"), t);
        assertTrue(SummaryTable.text(List.of(), 0.95).contains("[95% interval, unadjusted:"));
    }
}
