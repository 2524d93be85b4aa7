package org.viewgain.imputation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.viewgain.cohort.Rows;

/**
 * The run's table of source inner products (issue 12: label-free work computed once and shared). Invented rows far
 * from the origin (mean 40, sd 1: where centring by subtraction loses digits); the reference is the definition, the
 * training rows centred on their own mean and multiplied out in plain double loops.
 */
class SourceGramTest {

    private static final int N = 23;
    private static final int P = 4100; // more than two column blocks of 2,048
    private final Map<String, float[]> views = new HashMap<>();
    private final List<String> ids = new ArrayList<>();

    SourceGramTest() {
        SplittableRandom rnd = new SplittableRandom(8);
        for (int i = 0; i < N; i++) {
            float[] v = new float[P];
            for (int j = 0; j < P; j++) {
                v[j] = (float) (40 + rnd.nextGaussian());
            }
            views.put("s" + i, v);
            ids.add("s" + i);
        }
    }

    private Rows rows(int[] at) {
        List<String> names = new ArrayList<>();
        double[][] x = new double[at.length][P];
        for (int t = 0; t < at.length; t++) {
            names.add(ids.get(at[t]));
            float[] v = views.get(ids.get(at[t]));
            for (int j = 0; j < P; j++) {
                x[t][j] = v[j];
            }
        }
        return new Rows(names, x, java.util.Collections.nCopies(P, "f"));
    }

    /** (x_a - m) . (x_b - m) for a in {@code left}, b in {@code train}, m the mean of the training rows. */
    private double[][] byDefinition(int[] left, int[] train) {
        double[][] x = rows(train).x();
        double[] m = Centring.columnMeans(x, P);
        double[][] l = rows(left).x();
        double[][] out = new double[left.length][train.length];
        for (int a = 0; a < left.length; a++) {
            for (int b = 0; b < train.length; b++) {
                double s = 0;
                for (int j = 0; j < P; j++) {
                    s += (l[a][j] - m[j]) * (x[b][j] - m[j]);
                }
                out[a][b] = s;
            }
        }
        return out;
    }

    /** Largest absolute difference relative to the largest entry of the reference. */
    private static double relative(double[][] expected, double[][] actual) {
        double scale = 0;
        double diff = 0;
        for (int i = 0; i < expected.length; i++) {
            for (int j = 0; j < expected[i].length; j++) {
                scale = Math.max(scale, Math.abs(expected[i][j]));
                diff = Math.max(diff, Math.abs(expected[i][j] - actual[i][j]));
            }
        }
        return diff / scale;
    }

    @Test
    void givenTable_whenATrainingSetReadsItsCentredProducts_thenTheyAreItsOwnToRounding_andTheTableIsMadeOnce() {
        SourceGram table = SourceGram.of(ids, views::get);
        assertEquals(0, table.computed(), "nothing computed before the first request");
        int[] train = {1, 2, 4, 5, 7, 8, 10, 11, 13, 14, 16, 17, 19, 20, 22};
        int[] queries = {0, 3, 6, 9, 21, 1};
        double[][] k = table.centred(train);
        double[][] cross = table.centredCross(queries, train);
        // about 30 times the products' rounding (4,100 terms of size ~1): far below any ridge penalty
        assertEquals(0, relative(byDefinition(train, train), k), 1e-12, "centred Gram matrix");
        assertEquals(0, relative(byDefinition(queries, train), cross), 1e-12, "queries against training rows");
        for (int a = 0; a < k.length; a++) {
            for (int b = 0; b < k.length; b++) {
                assertEquals(k[a][b], k[b][a], 0.0, "exactly symmetric");
            }
        }
        int[] other = {0, 3, 6, 9, 12, 15, 18, 21};
        assertEquals(0, relative(byDefinition(other, other), table.centred(other)), 1e-12, "another set");
        assertEquals(1, table.computed(), "one table for every request");
    }

    @Test
    void givenRowsNotAsTheTableHoldsThem_whenPositionsAsked_thenNullSoTheFitComputesItself() {
        SourceGram table = SourceGram.of(ids, views::get);
        assertNotNull(table.positions(rows(new int[] {3, 1})));
        assertEquals(List.of(3, 1), java.util.Arrays.stream(table.positions(rows(new int[] {3, 1}))).boxed().toList());
        Rows changed = rows(new int[] {3});
        changed.x()[0][17] += 1e-3; // another cohort's subject with the same id
        assertNull(table.positions(changed));
        assertNull(table.positions(new Rows(List.of("elsewhere"), rows(new int[] {3}).x(), rows(new int[] {3})
                .featureNames())));
        assertEquals(0, table.computed(), "checking rows computes nothing");
        assertNull(SourceGram.of(java.util.Collections.nCopies(6000, "x"), views::get), "288 MB: above the budget");
    }
}
