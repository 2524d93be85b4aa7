package org.viewgain.cohort;

import java.util.List;
import java.util.regex.Pattern;

/**
 * Names the likely cause when a data file does not parse the way viewgain reads it: semicolon- or tab-separated
 * files (a spreadsheet's "CSV" in a locale with decimal commas) and numbers written with a decimal comma.
 */
final class LikelyCause {
    private static final Pattern DECIMAL_COMMA = Pattern.compile("[+-]?\\d+,\\d+");
    private static final Pattern DIGIT_COMMA_DIGIT = Pattern.compile("\\d,\\d");
    private static final String SAVE_AS = "save it as CSV with ',' between values and '.' in numbers";

    private LikelyCause() {
    }

    /**
     * For a header row read as one column that holds ';' or a tab: the file's separator, said in words; else null.
     */
    static String separatorOfHeader(CsvText.Row header) {
        if (header.size() != 1) {
            return null;
        }
        String cell = header.cell(0);
        String sep = cell.contains(";") ? "semicolons (';')" : cell.contains("\t") ? "tabs" : null;
        return sep == null ? null : "the header " + CsvText.show(cell) + " is one column: the file seems separated by "
                + sep + ", but viewgain reads comma-separated files; " + SAVE_AS;
    }

    /** A hint for a row with more cells than the header when it holds a decimal comma, else "". */
    static String extraCells(CsvText.Row row, int expected) {
        if (row.size() <= expected) {
            return "";
        }
        for (int c = 0; c + 1 < row.size(); c++) {
            if (row.cell(c).matches("[+-]?\\d+") && row.cell(c + 1).matches("\\d+")) {
                return " (a decimal comma, as in " + row.cell(c) + "," + row.cell(c + 1) + ", splits a number into"
                        + " two cells; write " + row.cell(c) + "." + row.cell(c + 1) + ")";
            }
        }
        return "";
    }

    /** For a cell that is a number written with a decimal comma ("0,5"): the hint, else "". */
    static String decimalComma(String cell) {
        return DECIMAL_COMMA.matcher(cell).matches() ? " (a decimal comma? write " + cell.replace(',', '.') + ")" : "";
    }

    /**
     * For a matrix file that failed to parse: semicolon separators, or decimal commas in whitespace-separated
     * values, with the first line showing it; else null.
     */
    static String ofMatrix(String text) {
        List<String> lines = text.lines().filter(l -> !l.isBlank()).toList();
        if (lines.isEmpty()) {
            return null;
        }
        long semicolons = lines.stream().filter(l -> l.contains(";")).count();
        if (semicolons * 2 > lines.size()) {
            int at = firstLine(text, ";");
            boolean commas = DIGIT_COMMA_DIGIT.matcher(text).find();
            return "line " + at + ": the values seem separated by semicolons (';')" + (commas
                    ? " with decimal commas" : "") + ", but viewgain reads values separated by commas or whitespace,"
                    + " with '.' in numbers; " + SAVE_AS;
        }
        for (String l : lines) {
            String[] words = l.strip().split("\\s+");
            if (words.length > 1 && java.util.Arrays.stream(words).anyMatch(w -> DECIMAL_COMMA.matcher(w).matches())) {
                return "line " + firstLine(text, l) + ": the numbers seem written with decimal commas ("
                        + CsvText.show(l.strip()) + "), but viewgain reads '.' in numbers; write 0.5, not 0,5";
            }
        }
        return null;
    }

    private static int firstLine(String text, String fragment) {
        String[] lines = text.split("\r\n|\r|\n", -1);
        for (int i = 0; i < lines.length; i++) {
            if (lines[i].contains(fragment)) {
                return i + 1;
            }
        }
        return 1;
    }
}
