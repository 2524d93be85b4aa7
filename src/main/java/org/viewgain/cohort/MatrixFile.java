package org.viewgain.cohort;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.viewgain.spec.BadInputException;

/**
 * Parses one subject's matrix file: comma separated when the file contains a comma, otherwise whitespace separated;
 * an optional header row of region names (detected by non-numeric cells, with or without a corner cell) and an
 * optional first column of region names. The diagonal is not part of any feature, so NaN or infinite values there
 * are accepted (e.g. Fisher-z of a correlation of one); everywhere else values must be finite.
 */
final class MatrixFile {

    /** A parsed square matrix and the region names it carried ({@code null} when it carried none). */
    record Parsed(Path file, String subject, List<String> names, double[][] values) {
        int regions() {
            return values.length;
        }

        /** The upper triangle {@code i<j} in row-major order. */
        double[] upper() {
            int n = values.length;
            double[] u = new double[n * (n - 1) / 2];
            int k = 0;
            for (int i = 0; i < n; i++) {
                for (int j = i + 1; j < n; j++) {
                    u[k++] = values[i][j];
                }
            }
            return u;
        }
    }

    private MatrixFile() {
    }

    static Parsed read(String view, String subject, Path file, double symmetryTolerance) {
        return read(view, subject, file, null, symmetryTolerance);
    }

    /** Reads a text matrix, or a .npy or .mat file by its extension ({@code variable}: the .mat variable or null). */
    static Parsed read(String view, String subject, Path file, String variable, double symmetryTolerance) {
        if (ArrayMatrices.isArrayFile(file)) {
            return ArrayMatrices.subject(view, subject, file, variable, symmetryTolerance);
        }
        if (variable != null) {
            throw new BadInputException("view " + view + ", subject " + subject + ", file " + file + ": views." + view
                    + ".variable is for .mat files, but this is a text matrix");
        }
        String where = "view " + view + ", subject " + subject + ", file " + file;
        String text = CsvText.text(file, "view " + view + " matrix file for subject " + subject);
        try {
            return parse(where, view, subject, file, text, symmetryTolerance);
        } catch (BadInputException e) {
            String cause = LikelyCause.ofMatrix(text);
            throw cause == null ? e : new BadInputException(where + ", " + cause, e);
        }
    }

    private static Parsed parse(String where, String view, String subject, Path file, String text,
                                double symmetryTolerance) {
        Parsed fast = text.indexOf(',') >= 0 && text.indexOf('"') < 0
                ? commaSeparated(where, subject, file, text, symmetryTolerance) : null;
        return fast != null ? fast : general(where, view, subject, file, text, symmetryTolerance);
    }

    /**
     * The common case without a String per cell: comma-separated text without quotes, every data cell a finite
     * number in plain notation, rows as wide as there are rows, symmetric within the tolerance. Rows, cells and
     * blank lines are those of {@link CsvText#splitCommas}. Anything else returns null, and {@link #general} reads
     * the file and words the error: for every text the two give the same result (checked in tests).
     */
    static Parsed commaSeparated(String where, String subject, Path file, String text, double symmetryTolerance) {
        int n = text.length();
        int start = 0;
        int line = 1;
        CsvText.Row header = null;
        List<String> firstCells = null;
        int skip = 0;
        int width = -1;
        List<double[]> rows = new ArrayList<>();
        List<String> rowNames = null;
        while (start <= n) {
            int end = CsvText.lineEnd(text, start);
            if (!CsvText.blank(text, start, end)) {
                if (firstCells == null) {
                    firstCells = CsvText.cells(text, start, end);
                    CsvText.Row r = new CsvText.Row(line, firstCells);
                    if (isHeader(r)) {
                        header = r;
                        start = end < n ? CsvText.nextLine(text, end) : n + 1;
                        line++;
                        continue;
                    }
                }
                if (width < 0) {
                    List<String> cells = header == null ? firstCells : CsvText.cells(text, start, end);
                    skip = Cells.isName(cells.get(0)) ? 1 : 0;
                    width = cells.size() - skip;
                    rowNames = skip == 1 ? new ArrayList<>() : null;
                }
                double[] values = new double[Math.max(width, 0)];
                int col = 0;
                int from = start;
                for (int c = start; c <= end; c++) {
                    if (c == end || text.charAt(c) == ',') {
                        if (col < skip) {
                            rowNames.add(text.substring(from, c).strip());
                        } else {
                            if (col - skip >= width) {
                                return null;
                            }
                            double v = Cells.finiteOrNaN(text, from, c);
                            if (Double.isNaN(v)) {
                                return null;
                            }
                            values[col - skip] = v;
                        }
                        col++;
                        from = c + 1;
                    }
                }
                if (col - skip != width) {
                    return null;
                }
                rows.add(values);
            }
            if (end >= n) {
                break;
            }
            start = CsvText.nextLine(text, end);
            line++;
        }
        int size = rows.size();
        if (size < 2 || width != size) {
            return null;
        }
        double[][] m = rows.toArray(new double[0][]);
        for (int i = 0; i < size; i++) {
            for (int j = i + 1; j < size; j++) {
                if (!(Math.abs(m[i][j] - m[j][i]) <= symmetryTolerance)) {
                    return null;
                }
            }
        }
        return new Parsed(file, subject, names(where, header, rowNames, size), m);
    }

    /** Any matrix text: rows of cells first, then the checks, each problem worded with its line and column. */
    static Parsed general(String where, String view, String subject, Path file, String text,
                          double symmetryTolerance) {
        List<CsvText.Row> rows = text.indexOf(',') >= 0
                ? CsvText.parse(text, file, "view " + view + " matrix file for subject " + subject)
                : CsvText.splitWhitespace(text);
        if (rows.isEmpty()) {
            throw new BadInputException(where + ": the file is empty, expected a square matrix");
        }
        boolean header = isHeader(rows.get(0));
        List<CsvText.Row> data = rows.subList(header ? 1 : 0, rows.size());
        if (data.isEmpty()) {
            throw new BadInputException(where + ": only a header row, expected a square matrix below it");
        }
        boolean labelled = Cells.isName(data.get(0).cell(0));
        int skip = labelled ? 1 : 0;
        int n = data.size();
        int width0 = data.get(0).size() - skip;
        for (CsvText.Row r : data) {
            int w = r.size() - skip;
            if (w != width0) {
                throw new BadInputException(where + ", line " + r.line() + ": " + w + " values, but line "
                        + data.get(0).line() + " has " + width0 + "; every row must have the same length");
            }
        }
        if (width0 != n) {
            throw new BadInputException(where + ": not square: " + n + " rows of " + width0 + " values"
                    + " (region names, if any, must not be numbers)");
        }
        if (n < 2) {
            throw new BadInputException(where + ": a matrix needs at least 2 regions, found " + n);
        }
        double[][] m = new double[n][n];
        List<String> rowNames = labelled ? new ArrayList<>() : null;
        for (int i = 0; i < n; i++) {
            CsvText.Row r = data.get(i);
            if (labelled) {
                rowNames.add(r.cell(0));
            }
            for (int j = 0; j < n; j++) {
                String cell = r.cell(j + skip);
                double v = Cells.finiteOrNaN(cell);
                boolean diagonal = i == j && !Cells.isName(cell) && !cell.isEmpty();
                if (!Double.isFinite(v) && !diagonal) {
                    throw new BadInputException(where + ", line " + r.line() + ", column " + (j + skip + 1) + ": "
                            + Cells.problem(cell));
                }
                m[i][j] = v;
            }
        }
        List<String> names = names(where, header ? rows.get(0) : null, rowNames, n);
        checkSymmetric(where, data, m, names, symmetryTolerance);
        return new Parsed(file, subject, names, m);
    }

    /** A first row is a header when every cell after the first (the first may be a corner cell) is a name. */
    private static boolean isHeader(CsvText.Row first) {
        if (first.size() == 1) {
            return Cells.isName(first.cell(0));
        }
        for (int c = 1; c < first.size(); c++) {
            if (!Cells.isName(first.cell(c))) {
                return false;
            }
        }
        return true;
    }

    private static List<String> names(String where, CsvText.Row header, List<String> rowNames, int n) {
        List<String> names = null;
        if (header != null) {
            List<String> h = header.cells();
            if (h.size() == n + 1 && rowNames != null) {
                h = h.subList(1, h.size());
            }
            if (h.size() != n) {
                throw new BadInputException(where + ", line " + header.line() + ": the header has " + h.size()
                        + " names but the matrix has " + n + " columns");
            }
            names = h;
        }
        if (rowNames != null) {
            if (names != null && !names.equals(rowNames)) {
                int k = firstDifference(names, rowNames);
                throw new BadInputException(where + ": row and column region names differ at position " + (k + 1)
                        + ": column " + CsvText.show(names.get(k)) + ", row " + CsvText.show(rowNames.get(k)));
            }
            names = rowNames;
        }
        if (names != null) {
            for (int i = 0; i < n; i++) {
                int j = names.indexOf(names.get(i));
                if (j != i) {
                    throw new BadInputException(where + ": region name " + CsvText.show(names.get(i))
                            + " appears twice (positions " + (j + 1) + " and " + (i + 1) + ")");
                }
            }
        }
        return names == null ? null : List.copyOf(names);
    }

    static int firstDifference(List<String> a, List<String> b) {
        int k = 0;
        while (k < a.size() && k < b.size() && a.get(k).equals(b.get(k))) {
            k++;
        }
        return k;
    }

    private static void checkSymmetric(String where, List<CsvText.Row> data, double[][] m, List<String> names,
                                       double tol) {
        for (int i = 0; i < m.length; i++) {
            for (int j = i + 1; j < m.length; j++) {
                if (Math.abs(m[i][j] - m[j][i]) <= tol) {
                    continue;
                }
                String pair = names == null ? "" : " (" + names.get(i) + "~" + names.get(j) + ")";
                throw new BadInputException(where + ": not symmetric: cell (" + (i + 1) + "," + (j + 1) + ") on line "
                        + data.get(i).line() + " is " + m[i][j] + " but cell (" + (j + 1) + "," + (i + 1)
                        + ") on line " + data.get(j).line() + " is " + m[j][i] + pair + "; tolerance " + tol);
            }
        }
    }
}
