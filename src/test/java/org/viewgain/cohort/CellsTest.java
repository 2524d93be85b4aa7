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

    /** Decimal numbers of 1 to 25 significant digits with exponents from -350 to 350, some with whitespace. */
    @Provide
    Arbitrary<String> decimals() {
        Arbitrary<String> digits = Arbitraries.strings().withChars("0123456789").ofMinLength(1).ofMaxLength(25);
        Arbitrary<String> sign = Arbitraries.of("", "-", "+");
        Arbitrary<String> exponent = Arbitraries.oneOf(Arbitraries.just(""),
                Arbitraries.integers().between(-350, 350).map(e -> "e" + e));
        Arbitrary<String> pad = Arbitraries.of("", "", " ", "\t", " \u2003");
        return net.jqwik.api.Combinators.combine(sign, digits, Arbitraries.integers().between(0, 25), exponent, pad)
                .as((sg, d, dot, e, p) -> p + sg + (dot >= d.length() ? d : d.substring(0, dot) + "." + d.substring(dot))
                        + e + p);
    }

    /**
     * The allocation-free value of a cell inside a longer text (fastdoubleparser) equals {@code Double.parseDouble}
     * of the stripped cell bit for bit (the reference: Java's own correctly rounded parser), including values that
     * overflow or underflow.
     */
    @Property(tries = 20000, seed = "1502", edgeCases = EdgeCasesMode.NONE)
    void givenDecimalText_whenParsedInPlace_thenTheSameDoubleAsJavasParser(@ForAll("decimals") String cell) {
        String stripped = cell.strip();
        double expected = Cells.DECIMAL.matcher(stripped).matches() ? Double.parseDouble(stripped) : Double.NaN;
        expected = Double.isFinite(expected) ? expected : Double.NaN;
        Statistics.label("finite").collect(!Double.isNaN(expected));
        Statistics.label("finite").coverage(c -> c.check(true).percentage(p -> p > 50));
        String text = "1.5," + cell + ",x";
        double got = Cells.finiteOrNaN(text, 4, 4 + cell.length());
        assertEquals(Double.doubleToRawLongBits(expected), Double.doubleToRawLongBits(got), () -> "cell '" + cell
                + "'");
        assertEquals(Double.doubleToRawLongBits(Cells.finiteOrNaN(stripped)), Double.doubleToRawLongBits(got));
    }
}
