package org.viewgain.report;

import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Predicate;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;

/**
 * A results table read back as text: every cell is a string (ids are never read as numbers), a missing column reads
 * as an empty cell, and the apostrophe that {@link CsvTable} puts before formula-like text is removed again.
 */
final class CsvRows {
    private final String name;
    private final List<String> header;
    private final Map<String, Integer> index = new HashMap<>();
    private final List<Row> rows;

    private CsvRows(String name, List<String> header, List<Row> rows) {
        this.name = name;
        this.header = List.copyOf(header);
        for (int c = 0; c < header.size(); c++) {
            index.putIfAbsent(header.get(c), c);
        }
        this.rows = rows;
    }

    /** Reads {@code dir/name}, or returns null when the file does not exist. */
    static CsvRows readIfPresent(Path dir, String name) throws IOException {
        Path f = dir.resolve(name);
        if (!Files.isRegularFile(f)) {
            return null;
        }
        CSVFormat format = CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true)
                .setIgnoreEmptyLines(true).get();
        try (Reader r = Files.newBufferedReader(f, StandardCharsets.UTF_8); CSVParser p = CSVParser.parse(r, format)) {
            List<String> header = new ArrayList<>(p.getHeaderNames());
            if (!header.isEmpty() && header.get(0).startsWith("\uFEFF")) {
                header.set(0, header.get(0).substring(1));
            }
            CsvRows table = new CsvRows(name, header, new ArrayList<>());
            for (CSVRecord rec : p) {
                String[] cells = new String[header.size()];
                for (int c = 0; c < cells.length; c++) {
                    cells[c] = c < rec.size() ? unquote(rec.get(c)) : "";
                }
                table.rows.add(table.new Row(cells));
            }
            return table;
        }
    }

    /** A table built in memory (tests and derived tables). */
    static CsvRows of(String name, List<String> header, List<String[]> cells) {
        CsvRows t = new CsvRows(name, header, new ArrayList<>());
        for (String[] c : cells) {
            t.rows.add(t.new Row(c.clone()));
        }
        return t;
    }

    String name() {
        return name;
    }

    boolean has(String column) {
        return index.containsKey(column);
    }

    List<Row> rows() {
        return rows;
    }

    List<Row> where(Predicate<Row> keep) {
        List<Row> out = new ArrayList<>();
        for (Row r : rows) {
            if (keep.test(r)) {
                out.add(r);
            }
        }
        return out;
    }

    List<String> header() {
        return header;
    }

    /** One row; cells of absent columns read as empty text. */
    final class Row {
        private final String[] cells;

        private Row(String[] cells) {
            this.cells = cells;
        }

        /** The cell as text; empty when the column is absent. */
        String s(String column) {
            Integer c = index.get(column);
            if (c == null) {
                // names of runs written before the tables were made consistent
                String old = column.equals("repetition") ? "repeat" : column.equals("estimate") ? "value" : null;
                c = old == null ? null : index.get(old);
            }
            return c == null ? "" : cells[c];
        }

        /** The cell as a number; NaN when empty, absent or not a number. */
        double d(String column) {
            return number(s(column));
        }

        /** The cell as a whole number, or {@code fallback}. */
        int i(String column, int fallback) {
            double v = d(column);
            return v == Math.rint(v) && Math.abs(v) < Integer.MAX_VALUE ? (int) v : fallback;
        }
    }

    /** Reads a number written by {@link CsvTable#formatNumber}; anything else is NaN. */
    static double number(String s) {
        if (s == null || s.isBlank()) {
            return Double.NaN;
        }
        String t = s.strip();
        if (t.equals("Inf")) {
            return Double.POSITIVE_INFINITY;
        }
        if (t.equals("-Inf")) {
            return Double.NEGATIVE_INFINITY;
        }
        try {
            return Double.parseDouble(t);
        } catch (NumberFormatException e) {
            return Double.NaN;
        }
    }

    private static String unquote(String s) {
        if (s.length() >= 2 && s.charAt(0) == '\'' && "=+-@\t\r".indexOf(s.charAt(1)) >= 0) {
            return s.substring(1);
        }
        return s;
    }
}
