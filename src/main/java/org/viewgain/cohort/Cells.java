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
    private static final Pattern DECIMAL = Pattern.compile("[+-]?(\\d+\\.?\\d*|\\.\\d+)([eE][+-]?\\d+)?");
    private static final Set<String> NON_FINITE = Set.of("nan", "-nan", "+nan", "na", "n/a", "inf", "+inf", "-inf",
            "infinity", "+infinity", "-infinity", "null", "none");

    private Cells() {
    }

    /** True when the cell is text such as a region name: not empty, not a number, not a spelling of NaN/Inf/NA. */
    static boolean isName(String cell) {
        return !cell.isEmpty() && !DECIMAL.matcher(cell).matches()
                && !NON_FINITE.contains(cell.toLowerCase(Locale.ROOT));
    }

    /** The finite value of the cell, or NaN when the cell is empty, not a number or not finite. */
    static double finiteOrNaN(String cell) {
        if (!DECIMAL.matcher(cell).matches()) {
            return Double.NaN;
        }
        double v = Double.parseDouble(cell);
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
