package org.viewgain.cohort;

import java.util.Locale;
import java.util.Set;
import java.util.regex.Pattern;

/**
 * Classifies and parses numeric cells. Only plain decimal notation counts as a number (Java's parser would also take
 * hex floats and type suffixes such as "1d"); common spellings of NaN, infinity and missing values are number-like
 * but rejected as values; anything else is a name (e.g. a region name in a header).
 */
final class Cells {
    /** The grammar of a number; {@link #isDecimal} is its hand-written scanner (checked against it in tests). */
    static final Pattern DECIMAL = Pattern.compile("[+-]?(\\d+\\.?\\d*|\\.\\d+)([eE][+-]?\\d+)?");
    private static final Set<String> NON_FINITE = Set.of("nan", "-nan", "+nan", "na", "n/a", "inf", "+inf", "-inf",
            "infinity", "+infinity", "-infinity", "null", "none");

    private Cells() {
    }

    /** True when the cell is text such as a region name: not empty, not a number, not a spelling of NaN/Inf/NA. */
    static boolean isName(String cell) {
        return !cell.isEmpty() && !isDecimal(cell)
                && !NON_FINITE.contains(cell.toLowerCase(Locale.ROOT));
    }

    /** The finite value of the cell, or NaN when the cell is empty, not a number or not finite. */
    static double finiteOrNaN(String cell) {
        if (!isDecimal(cell)) {
            return Double.NaN;
        }
        double v = Double.parseDouble(cell);
        return Double.isFinite(v) ? v : Double.NaN;
    }

    /**
     * Whether the cell matches {@link #DECIMAL}, without a regular expression: a view file of 268 regions has 71,824
     * cells per subject, and matching each with the pattern took most of the time of reading a cohort.
     */
    static boolean isDecimal(String cell) {
        return isDecimal(cell, 0, cell.length());
    }

    /** Whether the characters {@code from} (inclusive) to {@code to} (exclusive) of {@code s} match {@link #DECIMAL}. */
    static boolean isDecimal(CharSequence s, int from, int to) {
        int i = sign(s, from, to);
        int afterInt = digits(s, i, to);
        int afterFrac = afterInt < to && s.charAt(afterInt) == '.' ? digits(s, afterInt + 1, to) : afterInt;
        boolean mantissa = afterInt > i || afterFrac > afterInt + 1;
        if (!mantissa) {
            return false;
        }
        if (afterFrac < to && (s.charAt(afterFrac) == 'e' || s.charAt(afterFrac) == 'E')) {
            int e = sign(s, afterFrac + 1, to);
            int afterExp = digits(s, e, to);
            return afterExp > e && afterExp == to;
        }
        return afterFrac == to;
    }

    /** The position after an optional sign at {@code i}. */
    private static int sign(CharSequence s, int i, int to) {
        return i < to && (s.charAt(i) == '+' || s.charAt(i) == '-') ? i + 1 : i;
    }

    /** The position after the ASCII digits from {@code i} ({@code \d} of {@link #DECIMAL} is ASCII). */
    private static int digits(CharSequence s, int i, int to) {
        while (i < to && s.charAt(i) >= '0' && s.charAt(i) <= '9') {
            i++;
        }
        return i;
    }

    /**
     * The finite value of the characters {@code from} to {@code to} of {@code s}, surrounding whitespace removed as
     * {@link String#strip} does, or NaN when they are not a number or not finite: {@link #finiteOrNaN} without
     * making a String (the same value: both parsers round correctly; checked in tests).
     */
    static double finiteOrNaN(CharSequence s, int from, int to) {
        while (from < to && Character.isWhitespace(s.charAt(from))) {
            from++;
        }
        while (to > from && Character.isWhitespace(s.charAt(to - 1))) {
            to--;
        }
        if (!isDecimal(s, from, to)) {
            return Double.NaN;
        }
        double v = ch.randelshofer.fastdoubleparser.JavaDoubleParser.parseDouble(s, from, to - from);
        return Double.isFinite(v) ? v : Double.NaN;
    }

    /** What is wrong with a cell for which {@link #finiteOrNaN} gave NaN, for messages. */
    static String problem(String cell) {
        if (cell.isEmpty()) {
            return "expected a number, found an empty cell";
        }
        if (isName(cell)) {
            return "expected a number, found " + CsvText.show(cell) + LikelyCause.decimalComma(cell);
        }
        return "expected a finite number, found " + CsvText.show(cell);
    }
}
