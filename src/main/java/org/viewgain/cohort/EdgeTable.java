package org.viewgain.cohort;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.viewgain.spec.BadInputException;

/** Reads an edge table into a tabular {@link View}; see {@link ViewLoader#edgeTable}. */
final class EdgeTable {
    private static final int LIST_AT_MOST = 5;

    private EdgeTable() {
    }

    static View read(String view, Path csv, String idColumn, List<String> subjectIds, boolean missingAllowed) {
        String file = "view " + view + ", edge table " + csv;
        List<CsvText.Row> rows = CsvText.read(csv, "view " + view + " edge table");
        if (rows.isEmpty()) {
            throw new BadInputException(file + " is empty: expected a header row and one row per subject");
        }
        CsvText.Row header = rows.get(0);
        String separator = LikelyCause.separatorOfHeader(header);
        if (separator != null) {
            throw new BadInputException(file + ", line " + header.line() + ": " + separator);
        }
        int idCol = idColumn == null ? 0 : header.cells().indexOf(idColumn);
        if (idCol < 0) {
            throw new BadInputException(file + ": no id column " + CsvText.show(idColumn)
                    + "; the header has columns " + CsvText.oneLine(header.cells().toString()));
        }
        List<String> names = new ArrayList<>();
        Set<String> seenNames = new HashSet<>();
        for (int c = 0; c < header.size(); c++) {
            if (c == idCol) {
                continue;
            }
            String name = header.cell(c);
            if (name.isEmpty()) {
                throw new BadInputException(file + ", line " + header.line() + ": column " + (c + 1)
                        + " has no name; every feature column needs one");
            }
            if (!seenNames.add(name)) {
                throw new BadInputException(file + ", line " + header.line() + ": column name "
                        + CsvText.show(name) + " appears twice");
            }
            names.add(name);
        }
        if (names.isEmpty()) {
            throw new BadInputException(file + ": no feature columns besides the id column");
        }
        Set<String> known = new HashSet<>(subjectIds);
        Map<String, double[]> byId = new HashMap<>();
        Map<String, Integer> lineOf = new HashMap<>();
        for (CsvText.Row row : rows.subList(1, rows.size())) {
            String where = file + ", line " + row.line();
            if (row.size() != header.size()) {
                throw new BadInputException(where + ": expected " + header.size() + " cells as in the header, found "
                        + row.size() + LikelyCause.extraCells(row, header.size()));
            }
            String id = row.cell(idCol);
            if (id.isEmpty()) {
                throw new BadInputException(where + ": empty subject id");
            }
            if (!known.contains(id)) {
                throw new BadInputException(where + ": subject " + CsvText.show(id)
                        + " is not in the subjects table");
            }
            Integer earlier = lineOf.putIfAbsent(id, row.line());
            if (earlier != null) {
                throw new BadInputException(file + ": subject " + id + " appears twice, on lines " + earlier + " and "
                        + row.line());
            }
            double[] v = new double[names.size()];
            int k = 0;
            for (int c = 0; c < row.size(); c++) {
                if (c == idCol) {
                    continue;
                }
                String cell = row.cell(c);
                double x = Cells.finiteOrNaN(cell);
                if (!Double.isFinite(x)) {
                    throw new BadInputException(where + ", column " + CsvText.show(header.cell(c)) + " (subject " + id
                            + "): " + Cells.problem(cell));
                }
                v[k++] = x;
            }
            byId.put(id, v);
        }
        Map<String, double[]> ordered = new LinkedHashMap<>();
        List<String> absent = new ArrayList<>();
        for (String id : subjectIds) {
            double[] v = byId.get(id);
            if (v != null) {
                ordered.put(id, v);
            } else {
                absent.add(id);
            }
        }
        if (ordered.isEmpty()) {
            throw new BadInputException(file + ": no rows for any of the " + subjectIds.size() + " subjects");
        }
        if (!absent.isEmpty() && !missingAllowed) {
            String shown = String.join(", ", absent.subList(0, Math.min(LIST_AT_MOST, absent.size())));
            String more = absent.size() > LIST_AT_MOST ? " and " + (absent.size() - LIST_AT_MOST) + " more" : "";
            throw new BadInputException(file + ": no row for subject " + shown + more
                    + " (this view may not be missing)");
        }
        return View.tabular(view, names, ordered);
    }
}
