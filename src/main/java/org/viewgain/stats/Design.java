package org.viewgain.stats;

import java.util.LinkedHashMap;
import java.util.Map;

/** A checked PERMANOVA design: squared distances, group labels recoded to 0..a-1, and the pseudo-F of a labelling. */
final class Design {
    private static final double SYMMETRY_TOLERANCE = 1e-9;
    final double[][] squared;
    final int[] labels;
    final int groupCount;
    private final double totalSs;

    private Design(double[][] squared, int[] labels, int groupCount, double totalSs) {
        this.squared = squared;
        this.labels = labels;
        this.groupCount = groupCount;
        this.totalSs = totalSs;
    }

    static Design of(double[][] d, int[] groups) {
        int n = d.length;
        if (groups.length != n) {
            throw new IllegalArgumentException("distance matrix has " + n + " rows but there are " + groups.length
                    + " group labels");
        }
        double[][] sq = new double[n][n];
        double total = 0;
        for (int i = 0; i < n; i++) {
            if (d[i].length != n) {
                throw new IllegalArgumentException("distance matrix is not square at row " + i);
            }
            if (!(d[i][i] == 0)) {
                throw new IllegalArgumentException("distance matrix diagonal is not 0 at " + i);
            }
            for (int j = i + 1; j < n; j++) {
                double v = d[i][j];
                if (!(v >= 0 && Double.isFinite(v)
                        && Math.abs(v - d[j][i]) <= SYMMETRY_TOLERANCE * Math.max(1, Math.abs(v)))) {
                    throw new IllegalArgumentException("distance (" + i + ", " + j + ") is negative, non-finite "
                            + "or not symmetric: " + v + " vs " + d[j][i]);
                }
                sq[i][j] = v * v;
                sq[j][i] = v * v;
                total += v * v;
            }
        }
        Map<Integer, Integer> codes = new LinkedHashMap<>();
        int[] labels = new int[n];
        for (int i = 0; i < n; i++) {
            labels[i] = codes.computeIfAbsent(groups[i], g -> codes.size());
        }
        int a = codes.size();
        if (!(a >= 2 && n > a)) {
            throw new IllegalArgumentException("need at least 2 groups and more objects than groups, got " + a
                    + " groups of " + n + " objects");
        }
        return new Design(sq, labels, a, total / n);
    }

    /** Anderson's pseudo-F for a labelling with the same group sizes as the observed one. */
    double pseudoF(int[] labelling) {
        int n = labelling.length;
        double[] within = new double[groupCount];
        int[] size = new int[groupCount];
        for (int i = 0; i < n; i++) {
            size[labelling[i]]++;
            double[] row = squared[i];
            for (int j = i + 1; j < n; j++) {
                if (labelling[i] == labelling[j]) {
                    within[labelling[i]] += row[j];
                }
            }
        }
        double ssW = 0;
        for (int g = 0; g < groupCount; g++) {
            ssW += within[g] / size[g];
        }
        double ssA = totalSs - ssW;
        if (!(ssW > 0)) {
            return ssA > 0 ? Double.POSITIVE_INFINITY : Double.NaN;
        }
        return (ssA / (groupCount - 1)) / (ssW / (n - groupCount));
    }

    /** Number of distinct arrangements of the labels, N! / prod n_g!, or -1 on overflow. */
    long arrangements() {
        int[] size = new int[groupCount];
        for (int l : labels) {
            size[l]++;
        }
        // multiply binomial coefficients C(placed + n_g, n_g); each step stays an integer
        long result = 1;
        int placed = 0;
        for (int g = 0; g < groupCount; g++) {
            for (int k = 1; k <= size[g]; k++) {
                placed++;
                long next;
                try {
                    next = Math.multiplyExact(result, placed);
                } catch (ArithmeticException e) {
                    return -1;
                }
                result = next / k;
            }
        }
        return result;
    }
}
