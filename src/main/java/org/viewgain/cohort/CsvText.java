package org.viewgain.cohort;

import java.io.IOException;
import java.io.Reader;
import java.io.StringReader;
import java.io.UncheckedIOException;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.viewgain.spec.BadInputException;
import org.viewgain.spec.IoMessages;

/**
 * Reads a delimited text file into rows of stripped cells, each with the line on which it starts, so that every
 * message about user data can name the line. Blank lines are skipped.
 */
final class CsvText {

    /** One record: the 1-based line where it starts and its cells with surrounding whitespace removed. */
    record Row(int line, List<String> cells) {
        Row {
            cells = List.copyOf(cells);
        }

        int size() {
            return cells.size();
        }

        String cell(int i) {
            return cells.get(i);
        }
    }

    private CsvText() {
    }

    /** The whole file as text (UTF-8, a leading byte-order mark removed); errors name the file and its role. */
    static String text(Path file, String role) {
        if (!Files.exists(file)) {
            throw new BadInputException(role + " not found: " + file);
        }
        if (!Files.isRegularFile(file)) {
            throw new BadInputException(role + " is not a regular file: " + file);
        }
        try {
            String s = Files.readString(file, StandardCharsets.UTF_8);
            return s.startsWith("\uFEFF") ? s.substring(1) : s;
        } catch (NoSuchFileException e) {
            throw new BadInputException(role + " not found: " + file, e);
        } catch (CharacterCodingException e) {
            throw new BadInputException(role + " " + file + " is not UTF-8 text", e);
        } catch (IOException e) {
            throw new BadInputException("cannot read " + role + " " + file + ": " + IoMessages.ioProblem(e), e);
        }
    }

    /** Comma-separated records of a file (RFC 4180 quoting). */
    static List<Row> read(Path file, String role) {
        return parse(text(file, role), file, role);
    }

    /** Comma-separated records of already read text; {@code file} only names the source in messages. */
    static List<Row> parse(String text, Path file, String role) {
        return text.indexOf('"') < 0 ? splitCommas(text) : parseQuoted(text, file, role);
    }

    /**
     * Text without a quote character, which RFC 4180 then reads as lines of comma-separated cells: the same rows,
     * cells and line numbers as Apache Commons CSV gives (checked against it in tests), without its per-character
     * lexer, which took a third of the time of reading a cohort of 268-region matrices.
     */
    static List<Row> splitCommas(String text) {
        List<Row> rows = new ArrayList<>();
        int n = text.length();
        int line = 1;
        int start = 0;
        while (start <= n) {
            int end = lineEnd(text, start);
            if (!blank(text, start, end)) {
                rows.add(new Row(line, cells(text, start, end)));
            }
            if (end >= n) {
                break;
            }
            start = nextLine(text, end);
            line++;
        }
        return rows;
    }

    /** The end (exclusive) of the line that starts at {@code start}: the next CR or LF, or the end of the text. */
    static int lineEnd(String text, int start) {
        int end = start;
        while (end < text.length() && text.charAt(end) != '\n' && text.charAt(end) != '\r') {
            end++;
        }
        return end;
    }

    /** The start of the line after the line break at {@code end} (CR LF counts as one). */
    static int nextLine(String text, int end) {
        return end + (text.charAt(end) == '\r' && end + 1 < text.length() && text.charAt(end + 1) == '\n' ? 2 : 1);
    }

    /** Whether every cell of a quote-free line is empty after stripping (such lines are skipped). */
    static boolean blank(String text, int start, int end) {
        for (int c = start; c < end; c++) {
            char ch = text.charAt(c);
            if (ch != ',' && !Character.isWhitespace(ch)) {
                return false;
            }
        }
        return true;
    }

    /** The stripped comma-separated cells of a quote-free line. */
    static List<String> cells(String text, int start, int end) {
        List<String> cells = new ArrayList<>();
        int from = start;
        for (int c = start; c <= end; c++) {
            if (c == end || text.charAt(c) == ',') {
                cells.add(text.substring(from, c).strip());
                from = c + 1;
            }
        }
        return cells;
    }

    /** RFC 4180 records of text with quotes, by Apache Commons CSV. */
    static List<Row> parseQuoted(String text, Path file, String role) {
        CSVFormat format = CSVFormat.RFC4180.builder().setIgnoreEmptyLines(false).build();
        List<Row> rows = new ArrayList<>();
        long linesBefore = 0;
        try (Reader r = new StringReader(text); CSVParser parser = CSVParser.parse(r, format)) {
            for (CSVRecord rec : parser) {
                int line = (int) linesBefore + 1;
                linesBefore = parser.getCurrentLineNumber();
                List<String> cells = new ArrayList<>(rec.size());
                boolean blank = true;
                for (String v : rec) {
                    String s = v.strip();
                    blank &= s.isEmpty();
                    cells.add(s);
                }
                if (!blank) {
                    rows.add(new Row(line, cells));
                }
            }
        } catch (IOException | UncheckedIOException | IllegalStateException e) {
            throw new BadInputException(role + " " + file + ": malformed CSV near line " + (linesBefore + 1) + ": "
                    + oneLine(e.getMessage()).replaceAll("(?:[a-z_$][\\w$]*\\.)+[A-Z][\\w$]*(?:Exception|Error):\\s*", ""), e);
        }
        return rows;
    }

    /** Whitespace-separated records of already read text (no quoting). */
    static List<Row> splitWhitespace(String text) {
        List<Row> rows = new ArrayList<>();
        String[] lines = text.split("\r\n|\r|\n", -1);
        for (int i = 0; i < lines.length; i++) {
            String s = lines[i].strip();
            if (!s.isEmpty()) {
                rows.add(new Row(i + 1, List.of(s.split("\\s+"))));
            }
        }
        return rows;
    }

    /** A cell value quoted for a one-line message (control characters escaped, long values shortened). */
    static String show(String value) {
        String s = value.length() > 40 ? value.substring(0, 37) + "..." : value;
        return "'" + s.replace("\r", "\\r").replace("\n", "\\n").replace("\t", "\\t") + "'";
    }

    static String oneLine(String message) {
        return message == null ? "(no detail)" : message.replaceAll("\\s*[\\r\\n]+\\s*", " ");
    }
}
