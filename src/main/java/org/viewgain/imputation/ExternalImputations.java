package org.viewgain.imputation;

import java.io.IOException;
import java.io.Reader;
import java.io.UncheckedIOException;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.viewgain.spec.BadInputException;

/**
 * The parsed file of an outside program's imputations: columns {@code repeat,fold,task,inner,subject} and then one
 * column per target feature; one row per (repeat, fold, task, inner fold, subject). Checks that need no knowledge of
 * the folds (header, cell counts, numbers, duplicates) are done while reading; every problem is a one-line
 * {@link BadInputException} naming the file and line.
 */
final class ExternalImputations {
    static final List<String> KEY_COLUMNS = List.of("repetition", "fold", "task", "inner", "subject");
    static final String FINAL = "final";
    static final String CROSS_FIT = "cross-fit";

    /** A task as numbered in the file: repeat and fold from 1, inner 0 for the final task and from 1 otherwise. */
    record Key(int repeat, int fold, String task, int inner) {
        @Override
        public String toString() {
            return "repeat " + repeat + ", fold " + fold + ", task " + task + (inner > 0 ? " " + inner : "");
        }
    }

    /** One subject's imputed target and the line it was read from. */
    record Entry(int line, double[] values) {
    }

    private final Path file;
    private final List<String> features;
    private final Map<Key, Map<String, Entry>> tasks;

    private ExternalImputations(Path file, List<String> features, Map<Key, Map<String, Entry>> tasks) {
        this.file = file;
        this.features = List.copyOf(features);
        this.tasks = tasks;
    }

    Path file() {
        return file;
    }

    List<String> features() {
        return features;
    }

    /** The rows of one task by subject id (empty when the file has none). */
    Map<String, Entry> task(Key key) {
        return tasks.getOrDefault(key, Map.of());
    }

    /** Reads and checks the whole file. */
    static ExternalImputations read(Path file) {
        if (!Files.isRegularFile(file)) {
            throw new BadInputException("external imputations file not found: " + file);
        }
        Map<Key, Map<String, Entry>> tasks = new HashMap<>();
        CSVFormat format = CSVFormat.RFC4180.builder().setIgnoreEmptyLines(true).get();
        long linesBefore = 0;
        try (Reader r = Files.newBufferedReader(file, StandardCharsets.UTF_8);
             CSVParser parser = CSVParser.parse(r, format)) {
            List<String> header = null;
            for (CSVRecord rec : parser) {
                int line = (int) linesBefore + 1;
                linesBefore = parser.getCurrentLineNumber();
                if (header == null) {
                    header = header(file, rec);
                    continue;
                }
                if (rec.size() != header.size()) {
                    throw new BadInputException(file + ":" + line + ": " + rec.size() + " cells, expected "
                            + header.size() + " (the header's " + KEY_COLUMNS.size() + " key columns and "
                            + (header.size() - KEY_COLUMNS.size()) + " target features)");
                }
                String subject = rec.get(4).strip();
                if (subject.isEmpty()) {
                    throw new BadInputException(file + ":" + line + ": empty subject");
                }
                Key key = key(file, line, rec);
                double[] v = new double[header.size() - KEY_COLUMNS.size()];
                for (int c = 0; c < v.length; c++) {
                    v[c] = number(file, line, subject, header.get(c + KEY_COLUMNS.size()), rec.get(c + 5));
                }
                Entry old = tasks.computeIfAbsent(key, k -> new HashMap<>()).putIfAbsent(subject, new Entry(line, v));
                if (old != null) {
                    throw new BadInputException(file + ":" + line + ": duplicate row for " + key + ", subject '"
                            + subject + "' (first on line " + old.line() + ")");
                }
            }
            if (header == null) {
                throw new BadInputException("external imputations file " + file + " is empty");
            }
            Map<Key, Map<String, Entry>> frozen = new HashMap<>();
            tasks.forEach((k, m) -> frozen.put(k, Collections.unmodifiableMap(m)));
            return new ExternalImputations(file, header.subList(KEY_COLUMNS.size(), header.size()),
                    Collections.unmodifiableMap(frozen));
        } catch (CharacterCodingException e) {
            throw new BadInputException("external imputations file " + file + " is not UTF-8 text", e);
        } catch (IOException | UncheckedIOException | IllegalStateException e) {
            throw new BadInputException(file + ": malformed CSV near line " + (linesBefore + 1) + ": "
                    + oneLine(e.getMessage()).replaceAll("(?:[a-z_$][\\w$]*\\.)+[A-Z][\\w$]*(?:Exception|Error):\\s*", ""), e);
        }
    }

    private static List<String> header(Path file, CSVRecord rec) {
        List<String> h = new ArrayList<>(rec.size());
        for (String s : rec) {
            h.add(s.strip());
        }
        if (!h.isEmpty() && h.get(0).startsWith("\uFEFF")) {
            h.set(0, h.get(0).substring(1));
        }
        for (int c = 0; c < KEY_COLUMNS.size(); c++) {
            // the first column was called 'repeat' before it was renamed; files written then are still read
            if (c >= h.size() || !(h.get(c).equals(KEY_COLUMNS.get(c)) || c == 0 && h.get(c).equals("repeat"))) {
                throw new BadInputException(file + ":1: column " + (c + 1) + " must be '" + KEY_COLUMNS.get(c)
                        + "', found " + (c < h.size() ? "'" + h.get(c) + "'" : "none") + "; the header is "
                        + String.join(",", KEY_COLUMNS) + ", then one column per target feature");
            }
        }
        if (h.size() == KEY_COLUMNS.size()) {
            throw new BadInputException(file + ":1: no target feature columns after "
                    + String.join(",", KEY_COLUMNS));
        }
        Set<String> seen = new HashSet<>();
        for (int c = KEY_COLUMNS.size(); c < h.size(); c++) {
            if (h.get(c).isEmpty() || !seen.add(h.get(c))) {
                throw new BadInputException(file + ":1: column " + (c + 1) + " has " + (h.get(c).isEmpty()
                        ? "an empty name" : "the repeated name '" + h.get(c) + "'"));
            }
        }
        return h;
    }

    private static Key key(Path file, int line, CSVRecord rec) {
        int repeat = positive(file, line, "repetition", rec.get(0));
        int fold = positive(file, line, "fold", rec.get(1));
        String task = rec.get(2).strip();
        String inner = rec.get(3).strip();
        if (FINAL.equals(task)) {
            if (!(inner.isEmpty() || inner.equals("0"))) {
                throw new BadInputException(file + ":" + line + ": task final has inner '" + inner
                        + "'; expected 0 or an empty cell");
            }
            return new Key(repeat, fold, FINAL, 0);
        }
        if (CROSS_FIT.equals(task)) {
            return new Key(repeat, fold, CROSS_FIT, positive(file, line, "inner", inner));
        }
        throw new BadInputException(file + ":" + line + ": task '" + task + "'; expected final or cross-fit");
    }

    private static int positive(Path file, int line, String column, String cell) {
        String s = cell.strip();
        if (s.matches("[0-9]{1,9}")) {
            int v = Integer.parseInt(s);
            if (v >= 1) {
                return v;
            }
        }
        throw new BadInputException(file + ":" + line + ": column " + column + " is '" + s
                + "'; expected a whole number from 1");
    }

    /** A finite number in plain decimal notation (no NaN, Infinity, hex floats or type suffixes). */
    private static double number(Path file, int line, String subject, String column, String cell) {
        String s = cell.strip();
        boolean plain = !s.isEmpty();
        for (int i = 0; i < s.length() && plain; i++) {
            plain = "0123456789+-.eE".indexOf(s.charAt(i)) >= 0;
        }
        if (plain) {
            try {
                double v = Double.parseDouble(s);
                if (Double.isFinite(v)) {
                    return v;
                }
            } catch (NumberFormatException e) {
                // reported below
            }
        }
        String shown = s.length() > 40 ? s.substring(0, 37) + "..." : s;
        throw new BadInputException(file + ":" + line + ": subject '" + subject + "', column '" + column
                + "': expected a finite number, found '" + shown + "'");
    }

    private static String oneLine(String message) {
        return message == null ? "(no detail)" : message.replaceAll("\\s*[\\r\\n]+\\s*", " ");
    }
}
