package org.viewgain.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The verdict sentence rests on the corrected t-test; when it is not significant on fewer than the 10 x 10
 * resamples that Bouckaert &amp; Frank (2004) recommend, it must say "not shown", never "no clear difference".
 */
class VerdictTest {
    static CsvRows.Row row(String test, double p, double difference) {
        return CsvRows.of("comparisons.csv", List.of("test", "p_value", "p_adjusted", "difference"),
                List.<String[]>of(new String[] {test, String.valueOf(p), String.valueOf(p),
                    String.valueOf(difference)})).rows().get(0);
    }

    @Test
    void givenNotSignificantOnFiveByTwo_whenVerdict_thenNotShownAndNotEvidenceOfNoDifference() {
        String v = AnswerSection.verdict(row("corrected-t", 0.2, 0.05), 0.05, "A", "B", Power.of(5, 2, true));
        assertTrue(v.startsWith("Not shown at level 0.05: 5 folds x 2 repeats leave the corrected t-test little"),
                v);
        assertTrue(v.contains("not evidence of no difference"), v);
    }

    @Test
    void givenNotSignificantOnTenByTen_whenVerdict_thenNoClearDifference() {
        assertEquals("No clear difference at level 0.05.",
                AnswerSection.verdict(row("corrected-t", 0.2, 0.05), 0.05, "A", "B", Power.of(10, 10, true)));
        // leave-site-out plans cannot be repeated; no power clause there
        assertEquals("No clear difference at level 0.05.",
                AnswerSection.verdict(row("corrected-t", 0.2, 0.05), 0.05, "A", "B", Power.of(3, 1, false)));
    }

    @Test
    void givenSignificantOnFiveByTwo_whenVerdict_thenDirectionStated() {
        assertEquals("A is better than B (p \u2264 0.05).",
                AnswerSection.verdict(row("corrected-t", 0.01, 0.05), 0.05, "A", "B", Power.of(5, 2, true)));
        assertEquals("A is worse than B (p \u2264 0.05).",
                AnswerSection.verdict(row("corrected-t", 0.01, -0.05), 0.05, "A", "B", Power.of(5, 2, true)));
    }
}
