package org.viewgain.cohort;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.EdgeCasesMode;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.statistics.Statistics;
import net.jqwik.api.statistics.StatisticsReport;
import org.junit.jupiter.api.Test;

/**
 * The hand-written number scanner {@link Cells#isDecimal} accepts exactly what Java's regular-expression engine
 * ({@code java.util.regex}, the reference) accepts for the pattern {@link Cells#DECIMAL}.
 */
@StatisticsReport(StatisticsReport.StatisticsReportMode.OFF)
class CellsTest {

    @Provide
    Arbitrary<String> cells() {
        // the characters the grammar turns on, plus an Arabic-Indic digit and a space that it must refuse
        return Arbitraries.strings().withChars("0123456789+-.eE \u0663x").ofMinLength(0).ofMaxLength(8);
    }

    @Property(tries = 20000, seed = "1501", edgeCases = EdgeCasesMode.NONE)
    void givenShortStringsOfNumberCharacters_whenScanned_thenTheScannerAgreesWithTheRegex(
            @ForAll("cells") String cell) {
        boolean expected = Cells.DECIMAL.matcher(cell).matches();
        Statistics.label("number").collect(expected);
        // numbers are a fair share of the tries, so the agreement is not only on refusals (common practice, no source)
        Statistics.label("number").coverage(c -> c.check(true).percentage(p -> p > 3));
        assertEquals(expected, Cells.isDecimal(cell), () -> "cell '" + cell + "'");
    }

    @Test
    void givenTheSpellingsOfAViewFile_whenScanned_thenTheScannerAgreesWithTheRegex() {
        List<String> cells = List.of("0", "-0.5", "+.5", "5.", ".", "1e5", "1E-5", "1e", "e5", "-", "+-1", "0.12345",
                "1.5e+300", "1,5", " 1", "1 ", "", "NaN", "inf", "1d", "0x1p3", "\u0663", "12.34.5", "1e5.0");
        int numbers = 0;
        for (String c : cells) {
            boolean expected = Cells.DECIMAL.matcher(c).matches();
            assertEquals(expected, Cells.isDecimal(c), c);
            numbers += expected ? 1 : 0;
        }
        // both outcomes occur, so the comparison is not degenerate
        assertTrue(numbers >= 8 && numbers <= cells.size() - 8, "numbers among the cells: " + numbers);
    }
}
