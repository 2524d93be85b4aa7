package org.viewgain.cohort;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.viewgain.spec.BadInputException;
import org.viewgain.spec.Specs;

/**
 * Loads a view in one of its layouts: a matrix directory (one file per subject, found by a path pattern containing
 * {@code {subject}}; text, .npy or .mat), a stacked array (the whole cohort in one .npy or .mat file) or an edge
 * table (one CSV row per subject). Every problem with user data is a
 * {@link BadInputException} with a one-line message naming the view, file, line or cell and subject.
 */
public final class ViewLoader {
    /** The placeholder a matrix path pattern must contain. */
    public static final String SUBJECT_PLACEHOLDER = "{subject}";

    private ViewLoader() {
    }

    /**
     * A graph view from one matrix file per subject. Region names come from the files (header row and/or first
     * column) and must agree between subjects; files without names get R1..Rn. All matrices must have the size of
     * the first one found and be symmetric within {@code symmetryTolerance} (absolute difference).
     *
     * @param patternWithSubject a path containing {@code {subject}}, replaced by each subject id
     * @param subjectIds         the subjects of the subjects table, in its order
     * @param missingAllowed     whether a subject may lack a file (the view is then missing for that subject)
     */
    public static View matrices(String viewName, Path patternWithSubject, List<String> subjectIds,
                                boolean missingAllowed, double symmetryTolerance) {
        return matrices(viewName, patternWithSubject, null, null, subjectIds, missingAllowed, symmetryTolerance);
    }

    /**
     * As {@link #matrices(String, Path, List, boolean, double)}, for text, .npy or .mat files (by extension).
     *
     * @param variable the variable of .mat files, or null for each file's only numeric variable
     * @param labels   a file of region names, one per line, or null; names carried by the files must agree with it
     */
    public static View matrices(String viewName, Path patternWithSubject, String variable, Path labels,
                                List<String> subjectIds, boolean missingAllowed, double symmetryTolerance) {
        String pattern = patternWithSubject.toString();
        if (!pattern.contains(SUBJECT_PLACEHOLDER)) {
            throw new BadInputException("view " + viewName + ": matrix path " + pattern + " must contain "
                    + SUBJECT_PLACEHOLDER + ", which is replaced by each subject id");
        }
        if (!(symmetryTolerance >= 0)) {
            throw new IllegalArgumentException("symmetry tolerance must be >= 0, got " + symmetryTolerance);
        }
        Map<String, double[]> upper = new LinkedHashMap<>();
        MatrixFile.Parsed first = null;
        MatrixFile.Parsed firstNamed = null;
        List<Read> reads = List.of();
        for (int s = 0; s < subjectIds.size(); s++) {
            if (s % READ_BATCH == 0) {
                reads = readBatch(viewName, pattern, subjectIds.subList(s, Math.min(subjectIds.size(),
                        s + READ_BATCH)), variable, symmetryTolerance);
            }
            Read read = reads.get(s % READ_BATCH);
            String id = subjectIds.get(s);
            Path file = read.file();
            if (read.absent()) {
                if (missingAllowed) {
                    continue;
                }
                throw new BadInputException("view " + viewName + ": no matrix file for subject " + id
                        + ": expected " + file + " (this view may not be missing)");
            }
            if (read.failure() != null) {
                throw read.failure();
            }
            MatrixFile.Parsed p = read.parsed();
            if (first == null) {
                first = p;
            } else if (p.regions() != first.regions()) {
                throw new BadInputException("view " + viewName + ", subject " + id + ", file " + file + ": "
                        + p.regions() + " regions, but subject " + first.subject() + " (" + first.file() + ") has "
                        + first.regions());
            }
            if (p.names() != null) {
                if (firstNamed == null) {
                    firstNamed = p;
                } else if (!p.names().equals(firstNamed.names())) {
                    int k = MatrixFile.firstDifference(p.names(), firstNamed.names());
                    throw new BadInputException("view " + viewName + ", subject " + id + ", file " + file
                            + ": region " + (k + 1) + " is named " + CsvText.show(p.names().get(k)) + " but "
                            + CsvText.show(firstNamed.names().get(k)) + " for subject " + firstNamed.subject()
                            + " (" + firstNamed.file() + "); region names must agree between subjects");
                }
            }
            upper.put(id, p.upper());
        }
        if (first == null) {
            throw new BadInputException("view " + viewName + ": no matrix file found for any of the "
                    + subjectIds.size() + " subjects (pattern " + pattern + ")");
        }
        List<String> names = firstNamed != null ? firstNamed.names() : View.defaultRegionNames(first.regions());
        if (labels != null) {
            List<String> listed = LineLists.labels(labels, viewName, first.regions());
            if (firstNamed != null && !listed.equals(names)) {
                int k = MatrixFile.firstDifference(listed, names);
                throw new BadInputException("view " + viewName + ", labels file " + labels + ": region " + (k + 1)
                        + " is named " + CsvText.show(listed.get(k)) + " but " + CsvText.show(names.get(k))
                        + " in " + firstNamed.file() + "; region names must agree");
            }
            names = listed;
        }
        return View.graph(viewName, names, upper);
    }

    /** Subjects whose files are read at once, in parallel (a batch's matrices are held until they are checked). */
    private static final int READ_BATCH = 32;

    /** One subject's file: absent, read, or refused (the refusal is raised when its turn comes, in subject order). */
    private record Read(Path file, boolean absent, MatrixFile.Parsed parsed, RuntimeException failure) {
    }

    /**
     * Reads a batch of subjects' files in parallel (parsing numbers dominates reading a cohort). The results are
     * checked in subject order afterwards, so the first problem reported is the same on any number of threads.
     */
    private static List<Read> readBatch(String viewName, String pattern, List<String> ids, String variable,
                                        double symmetryTolerance) {
        return ids.parallelStream().map(id -> {
            Path file = Path.of(pattern.replace(SUBJECT_PLACEHOLDER, id));
            if (!Files.exists(file)) {
                return new Read(file, true, null, null);
            }
            try {
                return new Read(file, false, MatrixFile.read(viewName, id, file, variable, symmetryTolerance), null);
            } catch (RuntimeException e) {
                return new Read(file, false, null, e);
            }
        }).toList();
    }

    /**
     * A graph view from one array holding every subject's matrix (a .npy file, or a variable of a .mat file):
     * subjects x regions x regions, or regions x regions x subjects when {@code subjectLast}. The subject of each
     * slice is on the same line of {@code order} (one id per line; every id must be in the subjects table). A
     * subject the list does not name, or whose slice is NaN everywhere off the diagonal, has no matrix, which is
     * an error unless {@code missingAllowed}.
     *
     * @param labels a file of region names, one per line, or null for R1..Rn
     */
    public static View stacked(String viewName, Path file, String variable, Path order, Path labels,
                               boolean subjectLast, List<String> subjectIds, boolean missingAllowed,
                               double symmetryTolerance) {
        return StackedFile.read(viewName, file, variable, order, labels, subjectLast, subjectIds, missingAllowed,
                symmetryTolerance);
    }

    /** Loads a view as the spec describes it. */
    public static View load(Specs.View v, List<String> subjectIds) {
        return switch (v.layout()) {
            case MATRICES -> matrices(v.name(), v.location(), v.variable(), v.labels(), subjectIds,
                    v.missingAllowed(), v.tolerance());
            case STACKED -> stacked(v.name(), v.location(), v.variable(), v.subjectOrder(), v.labels(),
                    v.subjectAxisLast(), subjectIds, v.missingAllowed(), v.tolerance());
            case TABLE -> edgeTable(v.name(), v.location(), v.idColumn(), subjectIds, v.missingAllowed());
        };
    }

    /**
     * A tabular view from an edge table: a CSV with a header row, one row per subject, an id column and one
     * column per feature (every column but the id column). Every cell must be a finite number; a subject without
     * a row is missing from the view, which is an error unless {@code missingAllowed}.
     *
     * @param idColumn   the id column, or {@code null} for the first column
     * @param subjectIds the subjects of the subjects table; a row for any other id is an error
     */
    public static View edgeTable(String viewName, Path csv, String idColumn, List<String> subjectIds,
                                 boolean missingAllowed) {
        return EdgeTable.read(viewName, csv, idColumn, subjectIds, missingAllowed);
    }
}
