package org.viewgain.imputation;

import java.util.Arrays;
import java.util.Comparator;
import java.util.stream.IntStream;

/** Picking the k smallest (or largest) scores, ties broken by position, and averaging targets over them. */
final class Neighbours {
    private Neighbours() {
    }

    /** Positions of the k smallest values, nearest first; ties go to the lower position. */
    static int[] smallest(double[] values, int k) {
        int m = Math.min(k, values.length);
        if (m <= 64) {
            return smallestByInsertion(values, m);
        }
        Integer[] order = IntStream.range(0, values.length).boxed().toArray(Integer[]::new);
        Arrays.sort(order, Comparator.<Integer>comparingDouble(i -> values[i]).thenComparingInt(i -> i));
        int[] out = new int[m];
        for (int h = 0; h < m; h++) {
            out[h] = order[h];
        }
        return out;
    }

    /** O(n m) selection for small m; scanning in position order keeps ties in position order. */
    private static int[] smallestByInsertion(double[] values, int m) {
        int[] idx = new int[m];
        double[] best = new double[m];
        int filled = 0;
        for (int i = 0; i < values.length; i++) {
            double v = values[i];
            if (filled == m && Double.compare(v, best[m - 1]) >= 0) {
                continue;
            }
            int pos = filled < m ? filled : m - 1;
            while (pos > 0 && Double.compare(best[pos - 1], v) > 0) {
                if (pos < m) {
                    best[pos] = best[pos - 1];
                    idx[pos] = idx[pos - 1];
                }
                pos--;
            }
            best[pos] = v;
            idx[pos] = i;
            if (filled < m) {
                filled++;
            }
        }
        return idx;
    }

    /** Positions of the k largest values, largest first; ties go to the lower position. */
    static int[] largest(double[] values, int k) {
        double[] negated = new double[values.length];
        for (int i = 0; i < values.length; i++) {
            negated[i] = -values[i];
        }
        return smallest(negated, k);
    }

    /** The weighted mean of the target rows at the given positions; equal weights when all weights are zero. */
    static double[] weightedMean(int[] positions, double[] weights, double[][] y, int q) {
        double total = 0;
        for (double w : weights) {
            total += w;
        }
        boolean usable = total > 0 && Double.isFinite(total);
        double[] out = new double[q];
        for (int h = 0; h < positions.length; h++) {
            double w = usable ? weights[h] / total : 1.0 / positions.length;
            double[] row = y[positions[h]];
            for (int j = 0; j < q; j++) {
                out[j] += w * row[j];
            }
        }
        return out;
    }
}
