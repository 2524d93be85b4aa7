package org.viewgain.cohort;

import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.viewgain.spec.BadInputException;

/**
 * Square matrices from binary arrays (.npy, .mat): one matrix per file, or one slice of a stacked cohort array.
 * Values off the diagonal must be finite and the matrix symmetric within the tolerance, as for text matrices;
 * messages name the cell by its 1-based row and column.
 */
final class ArrayMatrices {
    private ArrayMatrices() {
    }

    /** True when the file is read as a binary array (by its extension) rather than as text. */
    static boolean isArrayFile(Path file) {
        return kind(file) != null;
    }

    private static String kind(Path file) {
        String name = file.getFileName() == null ? "" : file.getFileName().toString().toLowerCase(Locale.ROOT);
        return name.endsWith(".npy") ? "npy" : name.endsWith(".mat") ? "mat" : null;
    }

    /** Opens a .npy or .mat file; {@code variable} picks a MATLAB variable (null: the only numeric one). */
    static NumericArray open(Path file, String view, String variable, String where) {
        String kind = kind(file);
        if ("npy".equals(kind)) {
            if (variable != null) {
                throw new BadInputException(where + ": views." + view + ".variable is for .mat files; a .npy file"
                        + " holds one array");
            }
            return NpyFile.read(file, where);
        }
        if ("mat".equals(kind)) {
            return MatlabFile.read(file, variable, where, "views." + view + ".variable");
        }
        throw new BadInputException(where + ": expected a .npy or .mat file");
    }

    /** One subject's matrix file (.npy or .mat) as a parsed matrix without region names. */
    static MatrixFile.Parsed subject(String view, String subject, Path file, String variable, double tolerance) {
        String where = "view " + view + ", subject " + subject + ", file " + file;
        NumericArray a = open(file, view, variable, where);
        int[] shape = a.shape();
        if (shape.length != 2 || shape[0] != shape[1]) {
            throw new BadInputException(where + ": expected a square matrix (regions x regions), found shape "
                    + NumericArray.describe(shape) + (shape.length == 3 ? "; a whole cohort in one file is a"
                    + " 'stacked' view" : ""));
        }
        double[][] m = slice(a, -1, 0, shape[0]);
        check(where, m, tolerance, null);
        return new MatrixFile.Parsed(file, subject, null, m);
    }

    /**
     * The {@code k}-th matrix of an array: the whole 2-D array ({@code subjectAxis} -1), or slice {@code k} along
     * the first (0) or last (2) axis of a 3-D one.
     */
    static double[][] slice(NumericArray a, int subjectAxis, int k, int n) {
        double[][] m = new double[n][n];
        int[] idx = new int[subjectAxis < 0 ? 2 : 3];
        int row = subjectAxis == 0 ? 1 : 0;
        if (subjectAxis >= 0) {
            idx[subjectAxis] = k;
        }
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                idx[row] = i;
                idx[row + 1] = j;
                m[i][j] = a.get(idx);
            }
        }
        return m;
    }

    /** True when every value off the diagonal is NaN (how a stacked array marks a subject without this view). */
    static boolean allMissing(double[][] m) {
        for (int i = 0; i < m.length; i++) {
            for (int j = 0; j < m.length; j++) {
                if (i != j && !Double.isNaN(m[i][j])) {
                    return false;
                }
            }
        }
        return true;
    }

    /** Finite off the diagonal and symmetric within {@code tol}; names (may be null) only enrich messages. */
    static void check(String where, double[][] m, double tol, List<String> names) {
        int n = m.length;
        if (n < 2) {
            throw new BadInputException(where + ": a matrix needs at least 2 regions, found " + n);
        }
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                if (i != j && !Double.isFinite(m[i][j])) {
                    throw new BadInputException(where + ": row " + (i + 1) + ", column " + (j + 1)
                            + ": expected a finite number, found " + m[i][j]);
                }
            }
        }
        for (int i = 0; i < n; i++) {
            for (int j = i + 1; j < n; j++) {
                if (Math.abs(m[i][j] - m[j][i]) <= tol) {
                    continue;
                }
                String pair = names == null ? "" : " (" + names.get(i) + "~" + names.get(j) + ")";
                throw new BadInputException(where + ": not symmetric: cell (" + (i + 1) + "," + (j + 1) + ") is "
                        + m[i][j] + " but cell (" + (j + 1) + "," + (i + 1) + ") is " + m[j][i] + pair
                        + "; tolerance " + tol);
            }
        }
    }
}
