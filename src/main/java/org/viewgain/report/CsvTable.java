package org.viewgain.report;

import java.io.IOException;
import java.io.Writer;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;

/**
 * A tidy CSV table built in memory and written atomically. Text cells that a spreadsheet would read as a formula
 * (starting with {@code = + - @}, tab or carriage return) are prefixed with an apostrophe; numbers are written as
 * numbers, NaN as an empty cell (read as missing by R and pandas).
 */
public final class CsvTable {
    private final List<String> header;
    private final List<List<String>> rows = new ArrayList<>();

    public CsvTable(String... header) {
        this.header = List.of(header);
    }

    /** Starts a new row; add exactly one cell per column. */
    public Row row() {
        Row r = new Row();
        rows.add(r.cells);
        return r;
    }

    /** One row being filled. */
    public final class Row {
        private final List<String> cells = new ArrayList<>(header.size());

        public Row text(String s) {
            cells.add(safeText(s));
            return this;
        }

        public Row integer(long v) {
            cells.add(Long.toString(v));
            return this;
        }

        public Row number(double v) {
            cells.add(formatNumber(v));
            return this;
        }
    }

    /** Writes the table; fails if a row has the wrong number of cells. */
    public void write(Writer out) throws IOException {
        try (CSVPrinter p = new CSVPrinter(out, CSVFormat.RFC4180.builder().setRecordSeparator("\n").get())) {
            p.printRecord(header);
            for (List<String> r : rows) {
                if (r.size() != header.size()) {
                    throw new IllegalStateException("row has " + r.size() + " cells, header " + header.size());
                }
                p.printRecord(r);
            }
        }
    }

    public int size() {
        return rows.size();
    }

    /** Neutralises spreadsheet formulas in text cells. */
    static String safeText(String s) {
        if (s == null) {
            return "";
        }
        if (!s.isEmpty() && "=+-@\t\r".indexOf(s.charAt(0)) >= 0) {
            return "'" + s;
        }
        return s;
    }

    /** Shortest text that reads back as the same double; NaN as empty. */
    public static String formatNumber(double v) {
        if (Double.isNaN(v)) {
            return "";
        }
        if (Double.isInfinite(v)) {
            return v > 0 ? "Inf" : "-Inf";
        }
        if (v == Math.rint(v) && Math.abs(v) < 1e15) {
            return Long.toString((long) v);
        }
        String s = Double.toString(v);
        return s.contains("E") ? String.format(Locale.ROOT, "%.17g", v).replaceAll("0+e", "e") : s;
    }
}
