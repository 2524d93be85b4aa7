package org.viewgain.classify;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.Map;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.viewgain.spec.Params;

/**
 * The project's own random forest ({@code random-forest}, Breiman 2001): splits and impurity decreases checked by hand
 * on tiny tables, binning (reproducibility: ForestContractTest), and agreement with Weka's RandomForest (Weka
 * 3.8.6, the reference implementation in test scope) on iris (Fisher 1936) and breast-cancer-wisconsin (Wolberg, Street
 * &amp; Mangasarian 1995), both from the UCI repository.
 */
class BinnedForestTest {
    private static final ReferenceTable CANCER = ReferenceTable.load("breast-cancer-wisconsin.csv");
    private static final ReferenceTable IRIS = ReferenceTable.load("iris.csv");
    private final ClassifierMethod forest = ClassifierRegistry.create("random-forest");

    /** One tree grown on every row once (no bootstrap), all features tried, leaves of one row allowed. */
    private static BinnedForest.Tree tree(double[][] x, int[] y, double[] importance) {
        Grower g = new Grower(BinnedForest.Bins.of(x), y, 2, x[0].length, 20, 1);
        return g.grow(new SplittableRandom(1), importance, false);
    }

    private static double[][] column(double... v) {
        return Arrays.stream(v).mapToObj(a -> new double[] {a}).toArray(double[][]::new);
    }

    @Test
    void givenASeparableColumn_whenGrown_thenOnePureSplitAtTheMidpointWithTheHandComputedDecrease() {
        double[] importance = new double[1];
        BinnedForest.Tree t = tree(column(1, 2, 3, 4, 5, 6), new int[] {0, 0, 0, 1, 1, 1}, importance);
        // root, two leaves; threshold halfway between 3 and 4
        assertEquals(3, t.nodes());
        assertEquals(0, t.feature()[0]);
        assertEquals(3.5, t.threshold()[0], 0.0);
        // Gini decrease weighted by rows: 6 * (1 - 0.5^2 - 0.5^2) - 0 - 0 = 3 (by hand)
        assertEquals(3.0, importance[0], 1e-12);
        double[] left = new double[2];
        double[] right = new double[2];
        t.addProbabilities(new double[] {2.0}, left);
        t.addProbabilities(new double[] {5.0}, right);
        assertArrayEquals(new double[] {1, 0}, left, 0.0);
        assertArrayEquals(new double[] {0, 1}, right, 0.0);
    }

    @Test
    void givenTiedSplits_whenGrown_thenTheLowerThresholdWinsWithTheHandComputedDecrease() {
        double[] importance = new double[1];
        // y = 0 0 1 0 1 1: by hand, sum(l^2)/wl + sum(r^2)/wr - sum(c^2)/w for x <= 1.5 .. 5.5 is
        // 0.6, 1.5, 0.333, 1.5, 0.6; the tie between 2.5 and 4.5 goes to the first
        BinnedForest.Tree t = tree(column(1, 2, 3, 4, 5, 6), new int[] {0, 0, 1, 0, 1, 1}, importance);
        assertEquals(2.5, t.threshold()[0], 0.0);
        // the root's decrease is 1.5; the right child {1, 0, 1, 1} then splits at 4.5 or 3.5 and so on, each adding
        // its own positive decrease: the total is the root's plus the children's, at most the root's impurity 3
        assertTrue(importance[0] > 1.5 && importance[0] <= 3.0 + 1e-12, "importance " + importance[0]);
    }

    @Test
    void givenTwoFeatures_whenOnlyTheSecondSeparates_thenTheRootSplitsOnIt() {
        double[][] x = {{5, 1}, {1, 2}, {4, 3}, {2, 10}, {6, 11}, {3, 12}};
        int[] y = {0, 0, 0, 1, 1, 1};
        double[] importance = new double[2];
        BinnedForest.Tree t = tree(x, y, importance);
        assertEquals(1, t.feature()[0]);
        assertEquals(6.5, t.threshold()[0], 0.0);
        assertEquals(0.0, importance[0], 0.0);
        assertEquals(3.0, importance[1], 1e-12);
    }

    /**
     * With every feature tried at the root (no bootstrap), the root's decrease is the largest over all features and
     * midpoints, found by brute force (the textbook sum over every threshold): also when the search stops early at a
     * split into two pure children, which several planted features offer in some tables. Random small tables, two
     * and three classes (invented, seeded).
     */
    @Test
    void givenRandomTables_whenTheRootIsSplitWithAllFeatures_thenItsDecreaseIsTheBruteForceMaximum() {
        SplittableRandom rnd = new SplittableRandom(23);
        int perfectTables = 0;
        for (int table = 0; table < 400; table++) {
            int classes = table % 2 == 0 ? 2 : 3;
            int n = 4 + rnd.nextInt(20);
            int p = 1 + rnd.nextInt(8);
            int[] y = new int[n];
            double[][] x = new double[n][p];
            for (int i = 0; i < n; i++) {
                y[i] = rnd.nextInt(classes);
                for (int j = 0; j < p; j++) {
                    x[i][j] = rnd.nextInt(6);
                }
            }
            if (table % 3 == 0) { // plant separating features: class 0 low, the rest high
                for (int j = 0; j < p; j += 2) {
                    for (int i = 0; i < n; i++) {
                        x[i][j] = y[i] == 0 ? rnd.nextInt(3) : 10 + rnd.nextInt(3);
                    }
                }
            }
            double best = bruteForceBestDecrease(x, y, classes);
            double[] importance = new double[p];
            Grower g = new Grower(BinnedForest.Bins.of(x), y, classes, p, 1, 1);
            g.grow(new SplittableRandom(table), importance, false);
            double found = Arrays.stream(importance).sum();
            assertEquals(best, found, 1e-9, "table " + table);
            int[] counts = new int[classes];
            for (int c : y) {
                counts[c]++;
            }
            double parent = 0;
            for (int c : counts) {
                parent += (double) c * c / n;
            }
            perfectTables += classes == 2 && best > 0 && Math.abs(best - (n - parent)) < 1e-9 ? 1 : 0;
        }
        assertTrue(perfectTables > 40, "two-class tables with a perfect split: " + perfectTables);
    }

    /** The largest {@code sum(l^2)/wl + sum(r^2)/wr - sum(c^2)/w} over features and midpoints (0 when none). */
    private static double bruteForceBestDecrease(double[][] x, int[] y, int classes) {
        int n = x.length;
        double parent = 0;
        int[] all = new int[classes];
        for (int c : y) {
            all[c]++;
        }
        for (int c : all) {
            parent += (double) c * c / n;
        }
        double best = 0;
        for (int j = 0; j < x[0].length; j++) {
            for (int i = 0; i < n; i++) {
                double t = x[i][j];
                int[] left = new int[classes];
                int wl = 0;
                for (int k = 0; k < n; k++) {
                    if (x[k][j] <= t) {
                        left[y[k]]++;
                        wl++;
                    }
                }
                int wr = n - wl;
                if (wl == 0 || wr == 0) {
                    continue;
                }
                double sl = 0;
                double sr = 0;
                for (int c = 0; c < classes; c++) {
                    sl += (double) left[c] * left[c];
                    sr += (double) (all[c] - left[c]) * (all[c] - left[c]);
                }
                best = Math.max(best, sl / wl + sr / wr - parent);
            }
        }
        return best;
    }

    @Test
    void givenManyDistinctValues_whenBinned_thenAtMost255BinsOrderedAndEqualValuesShareABin() {
        double[] sorted = new double[2_000];
        for (int i = 0; i < sorted.length; i++) {
            sorted[i] = Math.floor(i / 3.0); // 667 distinct values, each three times
        }
        double[] edges = BinnedForest.Bins.edges(sorted);
        assertTrue(edges.length <= BinnedForest.MAX_BINS - 1 && edges.length > 200, "edges " + edges.length);
        for (int b = 1; b < edges.length; b++) {
            assertTrue(edges[b] > edges[b - 1]);
        }
        for (double e : edges) {
            // every edge lies halfway between two consecutive distinct values, never on a value
            assertEquals(0.5, e - Math.floor(e), 0.0);
        }
        assertEquals(BinnedForest.Bins.bin(edges, 100.0), BinnedForest.Bins.bin(edges, 100.0));
        // few distinct values: every midpoint is a candidate, as in CART
        assertArrayEquals(new double[] {1.5, 2.5}, BinnedForest.Bins.edges(new double[] {1, 1, 2, 3, 3}), 0.0);
    }

    @Test
    void givenFeatureSettings_whenCountingFeaturesPerSplit_thenRoundedWithinOneToP() {
        assertEquals(5, BinnedForest.featuresPerSplit("sqrt", 30));
        assertEquals(4, BinnedForest.featuresPerSplit("log2", 30));
        assertEquals(6, BinnedForest.featuresPerSplit(0.2, 30));
        assertEquals(1, BinnedForest.featuresPerSplit(0.001, 30));
        assertEquals(30, BinnedForest.featuresPerSplit(1.0, 30));
    }

    @Test
    void givenIrisAndBreastCancer_whenCrossValidatedOnWekasFolds_thenAccuracyWithinWekasRepeatSpread() {
        // Weka's RandomForest (100 trees, sqrt(p) features per split, leaves of one row, no depth limit) against ours
        // with the same settings, on five repeats of 5-fold cross-validation with shared folds: our mean accuracy must
        // lie within Weka's mean +- 2 repeat-to-repeat standard deviations, widened to +- 0.01 when Weka's spread is
        // tiny (common practice, no source).
        for (ReferenceTable table : new ReferenceTable[] {IRIS, CANCER}) {
            int mtry = (int) Math.floor(Math.sqrt(table.rows().p()));
            ClassifierMethod weka = ClassifierRegistry.create("weka", WekaClassifier.settings("weka.classifiers.trees.RandomForest", "-I 100 -K " + mtry));
            Params ours = forest.resolve(Map.of("trees", 100, "min-node-size", 1, "max-depth", 1000));
            double[] a = new double[5];
            double[] b = new double[5];
            for (int r = 0; r < 5; r++) {
                a[r] = Crossval.accuracy(forest, ours, table, 5, 100 + r);
                b[r] = Crossval.accuracy(weka, weka.resolve(Map.of()), table, 5, 100 + r);
            }
            double meanA = Arrays.stream(a).average().orElseThrow();
            double meanB = Arrays.stream(b).average().orElseThrow();
            double sdB = Math.sqrt(Arrays.stream(b).map(v -> (v - meanB) * (v - meanB)).sum() / 4);
            double tolerance = Math.max(2 * sdB, 0.01);
            assertEquals(meanB, meanA, tolerance, "ours " + Arrays.toString(a) + " weka " + Arrays.toString(b));
            assertTrue(meanA > 0.9, "accuracy " + meanA);
        }
    }

    @Test
    void givenAGrid_whenFittedTogether_thenTheRowsAreBinnedOnceAndTheModelsEqualSeparateFits() {
        ReferenceTable cancer = ReferenceTable.load("breast-cancer-wisconsin.csv");
        int[] binned = {0};
        BinnedForest counting = new BinnedForest(x -> {
            binned[0]++;
            return BinnedForest.Bins.of(x);
        });
        java.util.List<org.viewgain.spec.Params> grid = new java.util.ArrayList<>();
        java.util.List<org.viewgain.folds.FitContext> contexts = new java.util.ArrayList<>();
        for (Object m : java.util.List.of("sqrt", "log2", 0.5)) {
            grid.add(counting.resolve(java.util.Map.of("trees", 20, "features-per-split", m)));
            contexts.add(new org.viewgain.folds.FitContext(0, 0, 0, 1, org.viewgain.folds.FitContext.Role.TUNE,
                    17L * grid.size()));
        }
        java.util.List<ClassifierMethod.Model> together = counting.fitGrid(contexts, cancer.rows(), cancer.y(), 2,
                grid);
        assertEquals(1, binned[0], "one binning for three grid points");
        for (int g = 0; g < grid.size(); g++) {
            Predictions a = together.get(g).predict(cancer.rows());
            Predictions b = new BinnedForest().fit(contexts.get(g), cancer.rows(), cancer.y(), 2, grid.get(g))
                    .predict(cancer.rows());
            assertTrue(java.util.Arrays.deepEquals(a.scores(), b.scores()), "grid point " + g);
        }
    }

    /**
     * Binning sorts each column's row indices once and assigns bins in one walk; the result equals the
     * straightforward way (sort a copy with {@code Arrays.sort}, then {@code Bins.bin} by binary search for each
     * value): the same edges and the same code for every row, with ties, signed zeros, few and many (over 255)
     * distinct values, values that differ only in their last bits (the sort's packed keys cannot tell those apart,
     * its insertion pass must), and more columns than are copied out of the rows together (invented columns, seeded).
     */
    @Test
    void givenColumnsOfManyKinds_whenBinned_thenTheSameEdgesAndCodesAsSortAndSearch() {
        java.util.SplittableRandom rnd = new java.util.SplittableRandom(17);
        int checked = 0;
        for (int n : new int[] {1, 2, 7, 24, 25, 64, 300, 1000}) {
            for (int kind = 0; kind < 7; kind++) {
                int p = kind == 6 ? 67 : 3;
                double[][] x = new double[n][p];
                for (int i = 0; i < n; i++) {
                    for (int j = 0; j < p; j++) {
                        x[i][j] = switch (kind) {
                            case 0 -> rnd.nextGaussian();
                            case 1 -> rnd.nextInt(4);
                            case 2 -> rnd.nextBoolean() ? 0.0 : -0.0;
                            case 3 -> Math.round(rnd.nextGaussian() * 50) / 10.0;
                            case 4 -> rnd.nextInt(3) == 0 ? 1.5 : rnd.nextGaussian() * 1e-3;
                            case 5 -> (rnd.nextBoolean() ? 1 : -1) * (1.0 + rnd.nextInt(2000) * Math.ulp(1.0));
                            default -> rnd.nextGaussian() + j;
                        };
                    }
                }
                BinnedForest.Bins bins = BinnedForest.Bins.of(x);
                for (int j = 0; j < p; j++) {
                    double[] sorted = new double[n];
                    for (int i = 0; i < n; i++) {
                        sorted[i] = x[i][j];
                    }
                    java.util.Arrays.sort(sorted);
                    double[] edges = BinnedForest.Bins.edges(sorted);
                    org.junit.jupiter.api.Assertions.assertArrayEquals(edges, bins.edges()[j], 0.0,
                            "edges, n " + n + " kind " + kind);
                    for (int i = 0; i < n; i++) {
                        assertEquals(BinnedForest.Bins.bin(edges, x[i][j]), bins.code(j, i),
                                "code of row " + i + ", n " + n + " kind " + kind);
                        checked++;
                    }
                }
            }
        }
        assertTrue(checked > 4000, "rows checked: " + checked);
    }

    /**
     * The radix sort behind binning from {@value BinnedForest.Bins#RADIX_FROM} rows on sorts signed keys by their
     * bits from {@code from} up, stably, so keys whose lowest {@code from} bits hold their position (as binning makes
     * them) come out exactly as {@code Arrays.sort} puts them: negative and positive keys, digits all keys share
     * (skipped), keys equal above the position bits, and both parities of the number of passes (invented keys,
     * seeded).
     */
    @Test
    void givenSignedKeysWithTheirPositionsInTheLowBits_whenRadixSorted_thenAsArraysSort() {
        java.util.SplittableRandom rnd = new java.util.SplittableRandom(23);
        for (int n : new int[] {256, 300, 1000, 4096}) {
            int from = 32 - Integer.numberOfLeadingZeros(n - 1);
            for (int kind = 0; kind < 4; kind++) {
                long[] keys = new long[n];
                for (int i = 0; i < n; i++) {
                    long high = switch (kind) {
                        case 0 -> rnd.nextLong();
                        case 1 -> rnd.nextLong(-1000, 1000) << 40; // many digits shared by all keys
                        case 2 -> rnd.nextInt(3) - 1L << from;    // few distinct values: long runs of equal keys
                        default -> Double.doubleToRawLongBits(rnd.nextGaussian());
                    };
                    keys[i] = (high & -(1L << from)) | i;
                }
                long[] expected = keys.clone();
                java.util.Arrays.sort(expected);
                BinnedForest.Bins.radixSort(keys, new long[n], new int[257], n, from);
                org.junit.jupiter.api.Assertions.assertArrayEquals(expected, keys, "n " + n + " kind " + kind);
            }
        }
    }

    /**
     * A training block whose bin codes would not fit in one Java array (rows x features above 2^31 - 16) is refused
     * with a message that names the sizes and the ways out, before anything of that size is allocated: 65,536 rows
     * sharing one row of 32,769 features (2^31 + 65,536 codes) take 0.8 MB here.
     */
    @Test
    void givenABlockWhoseCodesExceedOneArray_whenBinned_thenRefusedWithTheSizesAndTheWaysOut() {
        double[] row = new double[32_769];
        double[][] x = new double[65_536][];
        Arrays.fill(x, row);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> BinnedForest.Bins.of(x));
        assertTrue(e.getMessage().contains("65536 training rows x 32769 features"), e.getMessage());
        assertTrue(e.getMessage().contains("weka.classifiers.trees.RandomForest"), e.getMessage());
    }
}
