package org.viewgain.stats;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.csv.CSVRecord;
import org.apache.commons.math3.stat.inference.OneWayAnova;
import org.junit.jupiter.api.Test;

class PermanovaTest {
    // Anderson 2001, Austral Ecology 26:32-46 (method); matrices and F from the scikit-bio PERMANOVA test suite,
    // verified there against R vegan; groups A, A, B, B
    private static final double[][] D_TIES = {{0, 1, 1, 4}, {1, 0, 3, 2}, {1, 3, 0, 3}, {4, 2, 3, 0}};
    private static final double[][] D_NO_TIES = {{0, 1, 5, 4}, {1, 0, 3, 2}, {5, 3, 0, 3}, {4, 2, 3, 0}};
    private static final int[] AABB = {0, 0, 1, 1};

    @Test
    void givenSkbioMatrices_whenPseudoF_thenReferenceValues() {
        // reference library values F = 2.0 and 4.4; tolerance 1e-12 (exact fractions)
        assertEquals(2.0, Permanova.pseudoF(D_TIES, AABB), 1e-12);
        assertEquals(4.4, Permanova.pseudoF(D_NO_TIES, AABB), 1e-12);
    }

    @Test
    void givenSkbioMatrices_whenExact_thenRecomputedEnumerationP() {
        // exact full-enumeration p 0.6667 (4 of 6 arrangements) and 0.3333 (2 of 6), recomputed from Anderson 2001
        Permanova.Result ties = Permanova.exact(D_TIES, new int[] {7, 7, 3, 3});
        assertEquals(4.0 / 6, ties.p(), 1e-12);
        assertEquals(6, ties.permutations());
        assertTrue(ties.exact());
        assertEquals(2.0 / 6, Permanova.exact(D_NO_TIES, AABB).p(), 1e-12);
    }

    @Test
    void givenTinyDesign_whenMonteCarlo_thenNearExactP_andSeedDeterministic() {
        Permanova.Result a = Permanova.monteCarlo(D_TIES, AABB, 999, 5);
        assertEquals(a, Permanova.monteCarlo(D_TIES, AABB, 999, 5));
        assertEquals(2.0, a.pseudoF(), 1e-12);
        // Monte Carlo SE of p near 2/3 with 999 draws is about 0.015; tolerance 0.06 (4 SE)
        assertEquals(4.0 / 6, a.p(), 0.06);
    }

    @Test
    void givenIrisSepalLengthDistances_whenPseudoF_thenEqualsOneWayAnovaF() {
        // Anderson 2001: with Euclidean distances on one variable the pseudo-F is Fisher's F; reference library
        // commons-math3 3.6.1 OneWayAnova; tolerance 1e-9 relative (rounding of sums)
        List<CSVRecord> rows = ReferenceData.read("iris.csv");
        double[] length = ReferenceData.column(rows, "sepal_length");
        List<String> species = List.of("setosa", "versicolor", "virginica");
        double[][] features = new double[length.length][];
        int[] groups = new int[length.length];
        List<List<Double>> byGroup = List.of(new ArrayList<>(), new ArrayList<>(), new ArrayList<>());
        for (int i = 0; i < length.length; i++) {
            features[i] = new double[] {length[i]};
            groups[i] = species.indexOf(rows.get(i).get("species"));
            byGroup.get(groups[i]).add(length[i]);
        }
        List<double[]> samples = byGroup.stream().map(g -> g.stream().mapToDouble(Double::doubleValue).toArray())
                .toList();
        double fisherF = new OneWayAnova().anovaFValue(samples);
        double f = Permanova.pseudoF(Distances.euclidean(features), groups);
        assertEquals(fisherF, f, 1e-9 * fisherF);
        // the same through the rows' Gram matrix (native BLAS), as the separation test computes it
        double viaGram = Permanova.pseudoF(Distances.euclideanFromGram(SmileMatrices.rowGram(features)), groups);
        assertEquals(fisherF, viaGram, 1e-9 * fisherF);
        Permanova.Result r = Permanova.monteCarlo(Distances.euclidean(features), groups, 99, 1);
        // species differ strongly (F about 119): no relabelling reaches it, p = 1/(99 + 1)
        assertEquals(0.01, r.p(), 1e-15);
    }

    @Test
    void givenNullData_whenMonteCarloWithTwoSeeds_thenDifferentButValidP() {
        double[][] rows = new double[30][];
        int[] groups = new int[30];
        java.util.SplittableRandom random = new java.util.SplittableRandom(3);
        for (int i = 0; i < rows.length; i++) {
            rows[i] = new double[] {random.nextGaussian(), random.nextGaussian()};
            groups[i] = i % 2;
        }
        double[][] d = Distances.euclidean(rows);
        Permanova.Result a = Permanova.monteCarlo(d, groups, 199, 1);
        Permanova.Result b = Permanova.monteCarlo(d, groups, 199, 2);
        assertNotEquals(a.p(), b.p());
        assertTrue(a.p() > 0 && a.p() <= 1);
    }

    @Test
    void givenRows_whenEuclidean_thenPythagoreanDistances_andBadInputRejected() {
        double[][] d = Distances.euclidean(new double[][] {{0, 0}, {3, 4}, {6, 8}});
        assertArrayEquals(new double[] {0, 5, 10}, d[0], 1e-15);
        assertArrayEquals(new double[] {5, 0, 5}, d[1], 1e-15);
        assertThrows(IllegalArgumentException.class, () -> Distances.euclidean(new double[][] {{0}, {1, 2}}));
        assertThrows(IllegalArgumentException.class, () -> Permanova.pseudoF(D_TIES, new int[] {0, 0, 0, 0}));
        double[][] asymmetric = {{0, 1, 1, 4}, {2, 0, 3, 2}, {1, 3, 0, 3}, {4, 2, 3, 0}};
        assertThrows(IllegalArgumentException.class, () -> Permanova.pseudoF(asymmetric, AABB));
        int[] halves = new int[60];
        for (int i = 30; i < 60; i++) {
            halves[i] = 1;
        }
        // C(60, 30) arrangements, far beyond the enumeration limit
        assertThrows(IllegalArgumentException.class, () -> Permanova.exact(new double[60][60], halves));
        assertTrue(Double.isNaN(Permanova.pseudoF(new double[60][60], halves)));
    }

    @Test
    void givenWideRows_whenDistancesFromTheGramMatrix_thenTheTextbookSumToRounding() {
        // 40 rows x 5,001 columns (two full blocks of 2,048 columns and a ragged rest), random values, one row
        // repeated (distance 0 up to the rounding of the Gram matrix)
        java.util.SplittableRandom rnd = new java.util.SplittableRandom(9);
        double[][] x = new double[40][5001];
        for (double[] r : x) {
            for (int k = 0; k < r.length; k++) {
                r[k] = rnd.nextGaussian();
            }
        }
        x[39] = x[3].clone();
        double[][] g = SmileMatrices.rowGram(x);
        double[][] d = Distances.euclideanFromGram(g);
        for (int i = 0; i < x.length; i++) {
            assertEquals(0.0, d[i][i], 0.0);
            for (int j = 0; j < x.length; j++) {
                double s = 0;
                double dot = 0;
                for (int k = 0; k < x[i].length; k++) {
                    s += (x[i][k] - x[j][k]) * (x[i][k] - x[j][k]);
                    dot += x[i][k] * x[j][k];
                }
                assertEquals(dot, g[i][j], 1e-10 * x[i].length, "Gram " + i + "," + j);
                assertEquals(g[i][j], g[j][i], 0.0, "symmetric " + i + "," + j);
                // squared distances to rounding relative to the squared lengths (about 5,000 each)
                assertEquals(s, d[i][j] * d[i][j], 1e-10 * x[i].length, i + "," + j);
            }
        }
        assertEquals(0.0, d[3][39], 1e-5);
        // a non-finite value is refused, as the scalar distances refuse it
        x[5][17] = Double.NaN;
        double[][] bad = SmileMatrices.rowGram(x);
        assertThrows(IllegalArgumentException.class, () -> Distances.euclideanFromGram(bad));
        assertThrows(IllegalArgumentException.class, () -> Distances.euclidean(x));
    }

    @Test
    void givenRowsSpanningSeveralTilesAndChunks_whenEuclidean_thenTheTextbookSumToRounding() {
        // 70 rows (three tiles of 32) x 3,001 columns (two full chunks of 1,024 and a ragged rest), random values
        java.util.SplittableRandom rnd = new java.util.SplittableRandom(8);
        double[][] x = new double[70][3001];
        for (double[] r : x) {
            for (int k = 0; k < r.length; k++) {
                r[k] = rnd.nextGaussian();
            }
        }
        double[][] d = Distances.euclidean(x);
        for (int i = 0; i < x.length; i++) {
            assertEquals(0.0, d[i][i], 0.0);
            for (int j = 0; j < x.length; j++) {
                double s = 0;
                for (int k = 0; k < x[i].length; k++) {
                    s += (x[i][k] - x[j][k]) * (x[i][k] - x[j][k]);
                }
                assertEquals(Math.sqrt(s), d[i][j], 1e-12 * Math.sqrt(s), i + "," + j);
            }
        }
    }
}
