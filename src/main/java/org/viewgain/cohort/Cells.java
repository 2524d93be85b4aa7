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
        int n = cell.length();
        int i = sign(cell, 0);
        int afterInt = digits(cell, i);
        int afterFrac = afterInt < n && cell.charAt(afterInt) == '.' ? digits(cell, afterInt + 1) : afterInt;
        boolean mantissa = afterInt > i || afterFrac > afterInt + 1;
        if (!mantissa) {
            return false;
        }
        if (afterFrac < n && (cell.charAt(afterFrac) == 'e' || cell.charAt(afterFrac) == 'E')) {
            int e = sign(cell, afterFrac + 1);
            int afterExp = digits(cell, e);
            return afterExp > e && afterExp == n;
        }
        return afterFrac == n;
    }

    /** The position after an optional sign at {@code i}. */
    private static int sign(String s, int i) {
        return i < s.length() && (s.charAt(i) == '+' || s.charAt(i) == '-') ? i + 1 : i;
    }

    /** The position after the ASCII digits from {@code i} ({@code \d} of {@link #DECIMAL} is ASCII). */
    private static int digits(String s, int i) {
        while (i < s.length() && s.charAt(i) >= '0' && s.charAt(i) <= '9') {
            i++;
        }
        return i;
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
