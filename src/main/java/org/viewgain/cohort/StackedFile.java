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

/** Reads a whole cohort stacked in one .npy or .mat array; see {@link ViewLoader#stacked}. */
final class StackedFile {
    private static final int LIST_AT_MOST = 5;

    private StackedFile() {
    }

    static View read(String view, Path file, String variable, Path orderFile, Path labelsFile, boolean subjectLast,
                     List<String> subjectIds, boolean missingAllowed, double tolerance) {
        String where = "view " + view + ", stacked file " + file;
        String orderRole = "view " + view + " subject-order list";
        LineLists.Entries order = LineLists.read(orderFile, orderRole);
        Set<String> known = new HashSet<>(subjectIds);
        for (int k = 0; k < order.values().size(); k++) {
            if (!known.contains(order.values().get(k))) {
                throw new BadInputException(orderRole + " " + orderFile + ", line " + order.lines().get(k)
                        + ": subject " + CsvText.show(order.values().get(k)) + " is not in the subjects table");
            }
        }
        NumericArray a = ArrayMatrices.open(file, view, variable, where);
        int[] shape = a.shape();
        int axis = subjectLast ? 2 : 0;
        String axisName = subjectLast ? "last" : "first";
        if (shape.length != 3) {
            throw new BadInputException(where + ": expected 3 dimensions (subjects x regions x regions), found shape "
                    + NumericArray.describe(shape));
        }
        int r1 = shape[subjectLast ? 0 : 1];
        int r2 = shape[subjectLast ? 1 : 2];
        if (r1 != r2) {
            throw new BadInputException(where + ": shape " + NumericArray.describe(shape) + " does not hold square"
                    + " matrices along the other two axes (subject axis: " + axisName + ")"
                    + (!subjectLast && shape[0] == shape[1] ? "; with subjects on the last axis, set subject-axis: last"
                    : ""));
        }
        if (shape[axis] != order.values().size()) {
            throw new BadInputException(where + ": " + shape[axis] + " subjects along the " + axisName + " axis (shape "
                    + NumericArray.describe(shape) + "), but " + orderRole + " " + orderFile + " lists "
                    + order.values().size());
        }
        List<String> names = labelsFile == null ? null : LineLists.labels(labelsFile, view, r1);
        Map<String, double[]> bySubject = new HashMap<>();
        for (int k = 0; k < shape[axis]; k++) {
            String id = order.values().get(k);
            double[][] m = ArrayMatrices.slice(a, axis, k, r1);
            if (ArrayMatrices.allMissing(m)) {
                continue;
            }
            ArrayMatrices.check(where + ", subject " + id + " (slice " + (k + 1) + ", line " + order.lines().get(k)
                    + " of the subject-order list)", m, tolerance, names);
            bySubject.put(id, new MatrixFile.Parsed(file, id, null, m).upper());
        }
        Map<String, double[]> ordered = new LinkedHashMap<>();
        List<String> absent = new ArrayList<>();
        for (String id : subjectIds) {
            double[] u = bySubject.get(id);
            if (u != null) {
                ordered.put(id, u);
            } else {
                absent.add(id);
            }
        }
        if (ordered.isEmpty()) {
            throw new BadInputException(where + ": no matrix for any of the " + subjectIds.size() + " subjects");
        }
        if (!absent.isEmpty() && !missingAllowed) {
            String shown = String.join(", ", absent.subList(0, Math.min(LIST_AT_MOST, absent.size())));
            String more = absent.size() > LIST_AT_MOST ? " and " + (absent.size() - LIST_AT_MOST) + " more" : "";
            throw new BadInputException(where + ": no matrix for subject " + shown + more + " (not in " + orderFile
                    + ", or all NaN; this view may not be missing)");
        }
        return View.graph(view, names == null ? View.defaultRegionNames(r1) : names, ordered);
    }
}
