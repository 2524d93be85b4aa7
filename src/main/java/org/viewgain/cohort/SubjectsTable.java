package org.viewgain.cohort;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.viewgain.spec.BadInputException;

/**
 * Loads the subjects table: a comma-separated file with a header row and one row per subject. Every problem with
 * the file is a {@link BadInputException} whose one-line message names the file, the line or cell and the subject.
 */
public final class SubjectsTable {
    private static final String ROLE = "subjects table";

    private SubjectsTable() {
    }

    /**
     * The subjects in file order. Cells are stripped of surrounding whitespace and otherwise kept as text; ids must
     * be unique and non-empty, groups non-empty and (when {@code allowedGroups} is non-empty) one of the allowed
     * ones, the site non-empty when a site column is named, and covariates finite numbers.
     *
     * @param groupColumn      the group column, or {@code null} for a cohort without labels (groups are then empty)
     * @param siteColumn       the site column, or {@code null} when there is none
     * @param allowedGroups    the group labels accepted; {@code null} or empty accepts any label
     */
    public static List<Subject> load(Path csv, String idColumn, String groupColumn, String siteColumn,
                                     List<String> covariateColumns, List<String> allowedGroups) {
        List<CsvText.Row> rows = CsvText.read(csv, ROLE);
        if (rows.isEmpty()) {
            throw new BadInputException(ROLE + " " + csv + " is empty: expected a header row naming the columns "
                    + "and one row per subject");
        }
        CsvText.Row header = rows.get(0);
        String separator = LikelyCause.separatorOfHeader(header);
        if (separator != null) {
            throw new BadInputException(ROLE + " " + csv + ", line " + header.line() + ": " + separator);
        }
        Map<String, Integer> columns = columnIndex(csv, header);
        int idCol = column(csv, columns, idColumn, "id");
        // without a group column (an unlabelled independent cohort) every subject's group is empty
        int groupCol = groupColumn == null ? -1 : column(csv, columns, groupColumn, "group");
        int siteCol = siteColumn == null ? -1 : column(csv, columns, siteColumn, "site");
        List<String> covNames = covariateColumns == null ? List.of() : covariateColumns;
        int[] covCols = new int[covNames.size()];
        for (int k = 0; k < covCols.length; k++) {
            covCols[k] = column(csv, columns, covNames.get(k), "covariate");
        }
        if (rows.size() == 1) {
            throw new BadInputException(ROLE + " " + csv + " has a header but no subjects");
        }
        List<Subject> subjects = new ArrayList<>();
        Map<String, Integer> lineOfId = new HashMap<>();
        for (CsvText.Row row : rows.subList(1, rows.size())) {
            String where = ROLE + " " + csv + ", line " + row.line();
            if (row.size() != header.size()) {
                throw new BadInputException(where + ": expected " + header.size() + " cells as in the header, found "
                        + row.size() + LikelyCause.extraCells(row, header.size()));
            }
            String id = row.cell(idCol);
            if (id.isEmpty()) {
                throw new BadInputException(where + ": empty subject id in column " + CsvText.show(idColumn));
            }
            if (id.chars().anyMatch(Character::isISOControl)) {
                // an id is used in file names and in every message about the subject
                throw new BadInputException(where + ": subject id " + CsvText.show(id) + " holds a line break, tab"
                        + " or other control character (a quote left open?)");
            }
            Integer earlier = lineOfId.putIfAbsent(id, row.line());
            if (earlier != null) {
                throw new BadInputException(ROLE + " " + csv + ": subject " + id + " appears twice, on lines "
                        + earlier + " and " + row.line() + "; ids must be unique");
            }
            where = where + " (subject " + id + ")";
            String group = groupCol < 0 ? "" : row.cell(groupCol);
            if (groupCol >= 0 && group.isEmpty()) {
                throw new BadInputException(where + ": empty group in column " + CsvText.show(groupColumn));
            }
            if (groupCol >= 0 && allowedGroups != null && !allowedGroups.isEmpty() && !allowedGroups.contains(group)) {
                throw new BadInputException(where + ": group " + CsvText.show(group) + " in column "
                        + CsvText.show(groupColumn) + " is not one of " + allowedGroups);
            }
            String site = null;
            if (siteCol >= 0) {
                site = row.cell(siteCol);
                if (site.isEmpty()) {
                    throw new BadInputException(where + ": empty site in column " + CsvText.show(siteColumn));
                }
            }
            Map<String, Double> cov = new LinkedHashMap<>();
            for (int k = 0; k < covCols.length; k++) {
                String cell = row.cell(covCols[k]);
                double v = Cells.finiteOrNaN(cell);
                if (!Double.isFinite(v)) {
                    throw new BadInputException(where + ", column " + CsvText.show(covNames.get(k)) + ": covariate "
                            + Cells.problem(cell));
                }
                cov.put(covNames.get(k), v);
            }
            subjects.add(new Subject(id, group, site, cov, row.line()));
        }
        return List.copyOf(subjects);
    }

    private static Map<String, Integer> columnIndex(Path csv, CsvText.Row header) {
        Map<String, Integer> columns = new LinkedHashMap<>();
        for (int c = 0; c < header.size(); c++) {
            Integer earlier = columns.putIfAbsent(header.cell(c), c);
            if (earlier != null) {
                throw new BadInputException(ROLE + " " + csv + ", line " + header.line() + ": column name "
                        + CsvText.show(header.cell(c)) + " appears twice (columns " + (earlier + 1) + " and "
                        + (c + 1) + ")");
            }
        }
        return columns;
    }

    private static int column(Path csv, Map<String, Integer> columns, String name, String what) {
        Integer c = name == null ? null : columns.get(name);
        if (c == null) {
            throw new BadInputException(ROLE + " " + csv + ": no " + what + " column " + CsvText.show(String.valueOf(name))
                    + "; the header has columns " + CsvText.oneLine(columns.keySet().toString()));
        }
        return c;
    }
}
