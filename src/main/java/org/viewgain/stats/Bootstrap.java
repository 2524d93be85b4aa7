package org.viewgain.stats;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;
import java.util.function.Function;
import java.util.function.ToDoubleFunction;

/**
 * Stratified percentile bootstrap (Efron &amp; Tibshirani 1993, ch. 13) at the level of units such as subjects:
 * each replicate draws, within every stratum, as many units with replacement as the stratum holds, so class sizes
 * stay fixed and metrics like sensitivity or AUC stay defined. Deterministic for a given seed.
 */
public final class Bootstrap {
    private Bootstrap() {
    }

    /**
     * Percentile interval of {@code statistic} over {@code replicates} stratified resamples of the units.
     * The statistic receives the resampled unit indices (with repeats; map them to rows with
     * {@link #rowsOf(int[], int[][])} when a unit has several rows). Replicates giving NaN are left out; the
     * interval is undefined when none is finite. Quantiles interpolate linearly between order statistics (R type 7).
     *
     * @param stratumOfUnit stratum (e.g. group) of each unit; units are 0..length-1
     * @param statistic     metric of a resample
     * @param replicates    number of resamples, at least 1
     * @param confidence    two-sided level, e.g. 0.95
     * @param seed          seed of the resampling
     */
    public static Interval percentile(int[] stratumOfUnit, ToDoubleFunction<int[]> statistic, int replicates,
            double confidence, long seed) {
        return percentiles(stratumOfUnit, units -> new double[] {statistic.applyAsDouble(units)}, 1, replicates,
                confidence, seed).get(0);
    }

    /**
     * Percentile intervals of several statistics of the same resamples (drawn as {@link #percentile} draws them, so
     * a single statistic gets the same interval from either): one interval per component of the statistic's value,
     * each leaving out the replicates where that component is NaN, undefined when none is finite.
     *
     * @param components the length of every value the statistic returns
     */
    public static List<Interval> percentiles(int[] stratumOfUnit, Function<int[], double[]> statistic, int components,
            int replicates, double confidence, long seed) {
        Normal.checkConfidence(confidence);
        if (replicates < 1) {
            throw new IllegalArgumentException("replicates must be at least 1, got " + replicates);
        }
        int[][] strata = strata(stratumOfUnit);
        SplittableRandom random = new SplittableRandom(seed);
        double[][] values = new double[components][replicates];
        int[] finite = new int[components];
        int[] sample = new int[stratumOfUnit.length];
        for (int r = 0; r < replicates; r++) {
            int at = 0;
            for (int[] members : strata) {
                for (int i = 0; i < members.length; i++) {
                    sample[at++] = members[random.nextInt(members.length)];
                }
            }
            double[] v = statistic.apply(sample.clone());
            for (int c = 0; c < components; c++) {
                if (!Double.isNaN(v[c])) {
                    values[c][finite[c]++] = v[c];
                }
            }
        }
        List<Interval> out = new ArrayList<>(components);
        double tail = (1 - confidence) / 2;
        for (int c = 0; c < components; c++) {
            if (finite[c] == 0) {
                out.add(Interval.undefined());
                continue;
            }
            double[] sorted = Arrays.copyOf(values[c], finite[c]);
            Arrays.sort(sorted);
            out.add(new Interval(quantile(sorted, tail), quantile(sorted, 1 - tail)));
        }
        return out;
    }

    /** The rows of the given units, concatenated in unit order (a unit drawn twice contributes its rows twice). */
    public static int[] rowsOf(int[] units, int[][] rowsByUnit) {
        int total = 0;
        for (int u : units) {
            total += rowsByUnit[u].length;
        }
        int[] rows = new int[total];
        int at = 0;
        for (int u : units) {
            System.arraycopy(rowsByUnit[u], 0, rows, at, rowsByUnit[u].length);
            at += rowsByUnit[u].length;
        }
        return rows;
    }

    /** R type 7 quantile of sorted values. */
    static double quantile(double[] sorted, double probability) {
        double h = (sorted.length - 1) * probability;
        int lo = (int) Math.floor(h);
        int hi = Math.min(lo + 1, sorted.length - 1);
        return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
    }

    /** Unit indices per stratum, strata in order of first appearance, so the draw order is fixed. */
    private static int[][] strata(int[] stratumOfUnit) {
        List<Integer> labels = new ArrayList<>();
        List<List<Integer>> members = new ArrayList<>();
        for (int i = 0; i < stratumOfUnit.length; i++) {
            int k = labels.indexOf(stratumOfUnit[i]);
            if (k < 0) {
                labels.add(stratumOfUnit[i]);
                members.add(new ArrayList<>());
                k = labels.size() - 1;
            }
            members.get(k).add(i);
        }
        int[][] out = new int[members.size()][];
        for (int k = 0; k < out.length; k++) {
            out[k] = members.get(k).stream().mapToInt(Integer::intValue).toArray();
        }
        return out;
    }
}
