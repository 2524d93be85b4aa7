package org.viewgain.stats;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;
import java.util.function.ToDoubleFunction;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;

class BootstrapTest {
    @Test
    void givenSeveralStatistics_whenPercentiles_thenEachEqualsItsOwnPercentileOnTheSameResamples() {
        List<CSVRecord> rows = ReferenceData.read("asah.csv");
        double[] wfns = ReferenceData.column(rows, "wfns");
        double[] s100b = ReferenceData.column(rows, "s100b");
        boolean[] poor = ReferenceData.asahPoor(rows);
        int[] strata = new int[poor.length];
        for (int i = 0; i < poor.length; i++) {
            strata[i] = poor[i] ? 1 : 0;
        }
        ToDoubleFunction<int[]> meanWfns = units -> Arrays.stream(units).mapToDouble(u -> wfns[u]).average()
                .orElseThrow();
        ToDoubleFunction<int[]> meanS100b = units -> Arrays.stream(units).mapToDouble(u -> s100b[u]).average()
                .orElseThrow();
        List<Interval> both = Bootstrap.percentiles(strata, units -> new double[] {meanWfns.applyAsDouble(units),
            meanS100b.applyAsDouble(units), Double.NaN}, 3, 300, 0.9, 11);
        // the same seed draws the same resamples, so each component equals the one-statistic interval exactly
        assertEquals(Bootstrap.percentile(strata, meanWfns, 300, 0.9, 11), both.get(0));
        assertEquals(Bootstrap.percentile(strata, meanS100b, 300, 0.9, 11), both.get(1));
        assertNotEquals(both.get(0), both.get(1));
        assertFalse(both.get(2).isDefined());
    }

    @Test
    void givenSameSeed_whenBootstrapped_thenIdentical_andOtherSeedDiffers() {
        List<CSVRecord> rows = ReferenceData.read("asah.csv");
        double[] wfns = ReferenceData.column(rows, "wfns");
        boolean[] poor = ReferenceData.asahPoor(rows);
        int[] strata = new int[poor.length];
        for (int i = 0; i < poor.length; i++) {
            strata[i] = poor[i] ? 1 : 0;
        }
        ToDoubleFunction<int[]> auc = units -> {
            double[] s = new double[units.length];
            boolean[] y = new boolean[units.length];
            for (int i = 0; i < units.length; i++) {
                s[i] = wfns[units[i]];
                y[i] = poor[units[i]];
            }
            return Auc.of(s, y);
        };
        Interval a = Bootstrap.percentile(strata, auc, 500, 0.95, 7);
        Interval b = Bootstrap.percentile(strata, auc, 500, 0.95, 7);
        Interval c = Bootstrap.percentile(strata, auc, 500, 0.95, 8);
        assertEquals(a, b);
        assertNotEquals(a, c);
        // the bootstrap interval should resemble the DeLong one, 0.7485-0.8988 (pROC): both estimate the same
        // sampling spread; tolerance 0.03 for Monte Carlo error of 500 replicates and method difference (common
        // practice, no source)
        assertEquals(0.7485, a.low(), 0.03);
        assertEquals(0.8988, a.high(), 0.03);
    }

    @Test
    void givenStrata_whenResampled_thenEveryReplicateKeepsStratumSizes() {
        int[] strata = {0, 0, 1, 1, 1, 2, 0, 1};
        ToDoubleFunction<int[]> check = units -> {
            int[] count = new int[3];
            for (int u : units) {
                count[strata[u]]++;
            }
            return Arrays.equals(count, new int[] {3, 4, 1}) ? 1 : 0;
        };
        assertEquals(new Interval(1, 1), Bootstrap.percentile(strata, check, 200, 0.9, 1));
    }

    @Test
    void givenNormalSample_whenBootstrapMean_thenCloseToNormalTheoryInterval() {
        SplittableRandom random = new SplittableRandom(2026);
        int n = 200;
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = random.nextGaussian() * 2 + 5;
        }
        double mean = Arrays.stream(x).average().orElseThrow();
        double sd = Math.sqrt(Arrays.stream(x).map(v -> (v - mean) * (v - mean)).sum() / n);
        double se = sd / Math.sqrt(n);
        Interval ci = Bootstrap.percentile(new int[n], u -> Arrays.stream(u).mapToDouble(i -> x[i]).average()
                .orElseThrow(), 2000, 0.95, 11);
        // Monte Carlo SE of a 2.5% quantile from 2000 replicates is about 0.06 bootstrap SEs; allow 0.25 SE
        assertEquals(mean - 1.959964 * se, ci.low(), 0.25 * se);
        assertEquals(mean + 1.959964 * se, ci.high(), 0.25 * se);
    }

    @Test
    void givenUnitsWithSeveralRows_whenRowsOf_thenRowsRepeatWithTheirUnit_andAllNaNGivesUndefined() {
        int[][] rowsByUnit = {{0, 3}, {1}, {2, 4, 5}};
        assertArrayEquals(new int[] {2, 4, 5, 0, 3, 2, 4, 5}, Bootstrap.rowsOf(new int[] {2, 0, 2}, rowsByUnit));
        assertFalse(Bootstrap.percentile(new int[] {0, 1}, u -> Double.NaN, 10, 0.95, 1).isDefined());
        assertTrue(Bootstrap.quantile(new double[] {1, 2, 3, 4}, 0.5) == 2.5);
    }
}
