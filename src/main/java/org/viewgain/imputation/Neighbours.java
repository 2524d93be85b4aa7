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
        Integer[] order = IntStream.range(0, values.length).boxed().toArray(Integer[]::new);
        Arrays.sort(order, Comparator.<Integer>comparingDouble(i -> values[i]).thenComparingInt(i -> i));
        int[] out = new int[Math.min(k, values.length)];
        for (int h = 0; h < out.length; h++) {
            out[h] = order[h];
        }
        return out;
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
