package org.viewgain.cohort;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.file.Path;
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
 * The fast reader of quote-free text, {@link CsvText#splitCommas}, gives the same rows, cells and line numbers as
 * Apache Commons CSV 1.14 (RFC 4180, the reference) through {@link CsvText#parseQuoted}.
 */
@StatisticsReport(StatisticsReport.StatisticsReportMode.OFF)
class CsvTextTest {
    private static final Path FILE = Path.of("t.csv");

    @Provide
    Arbitrary<String> texts() {
        // every line-break spelling, commas, blanks and cell text; no quote character
        return Arbitraries.strings().withChars("1,.\r\n \ta").ofMinLength(0).ofMaxLength(30);
    }

    @Property(tries = 20000, seed = "1502", edgeCases = EdgeCasesMode.NONE)
    void givenQuoteFreeText_whenSplit_thenRowsEqualCommonsCsvs(@ForAll("texts") String text) {
        List<CsvText.Row> expected = CsvText.parseQuoted(text, FILE, "test file");
        Statistics.label("rows").collect(Math.min(expected.size(), 3));
        // texts with several rows are common, so line numbering is exercised (common practice, no source)
        Statistics.label("rows").coverage(c -> c.check(3).percentage(p -> p > 10));
        assertEquals(expected, CsvText.splitCommas(text), () -> "text " + CsvText.show(text));
    }

    @Test
    void givenAMatrixFileWithWindowsLineEndsAndBlankLines_whenParsed_thenLinesAreThoseOfTheFile() {
        String text = "a,b\r\n\r\n 1 , 2\r\n\n3,4\n";
        List<CsvText.Row> rows = CsvText.parse(text, FILE, "test file");
        assertEquals(List.of(new CsvText.Row(1, List.of("a", "b")), new CsvText.Row(3, List.of("1", "2")),
                new CsvText.Row(5, List.of("3", "4"))), rows);
        assertEquals(CsvText.parseQuoted(text, FILE, "test file"), rows);
    }
}
