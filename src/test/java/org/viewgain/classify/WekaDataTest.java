package org.viewgain.classify;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.junit.jupiter.api.Test;
import org.viewgain.cohort.Rows;
import weka.core.DenseInstance;
import weka.core.Instance;
import weka.core.Instances;

/**
 * Weka rows: the seed text used by Weka's random trees is a cheap hash, every copy Weka makes keeps it, and nothing
 * else about the rows changes (their printed form is DenseInstance's).
 */
class WekaDataTest {

    static Instances data() {
        double[][] x = {{0.5, 1.25, -3}, {0.5, 1.25, -3.0000001}, {7, 8, 9}, {-1, 0, 1}};
        String[] ids = {"a", "b", "c", "d"};
        return WekaData.instances(new Rows(java.util.List.of(ids), x, java.util.List.of("f0", "f1", "f2")), new int[] {0, 1, 0, 1}, 2);
    }

    @Test
    void givenRows_whenWekaCopiesAndResamplesThem_thenTheCopiesKeepTheCheapSeedTextAndShareValues() {
        Instances data = data();
        Instances copied = new Instances(data);                       // what RandomTree.buildClassifier does first
        Instances bag = data.resampleWithWeights(new Random(3), new boolean[4], false, 100); // Bagging's bag
        for (Instances set : new Instances[] {copied, bag}) {
            for (Instance row : set) {
                assertInstanceOf(WekaData.Row.class, row);
                assertTrue(row.toStringNoWeight().matches("[0-9a-f]{1,16}"), row.toStringNoWeight());
            }
        }
        // DenseInstance's copy shares the value array; ours must too (no extra copy per tree)
        assertSame(((WekaData.Row) data.instance(0)).values(), ((WekaData.Row) copied.instance(0)).values());
        assertEquals(data.instance(2).toStringNoWeight(), copied.instance(2).toStringNoWeight());
    }

    @Test
    void givenRowsThatDifferInTheSeventhDigit_whenHashed_thenTheSeedTextsDiffer() {
        Instances data = data();
        assertNotEquals(data.instance(0).toStringNoWeight(), data.instance(1).toStringNoWeight());
        // the class value is part of the row, as in Weka's own text
        Instance relabelled = (Instance) data.instance(0).copy();
        relabelled.setClassValue(1);
        assertNotEquals(data.instance(0).toStringNoWeight(), relabelled.toStringNoWeight());
        // the same values give the same text, so the same seed: fits stay deterministic
        assertEquals(data.instance(2).toStringNoWeight(), ((Instance) data.instance(2).copy()).toStringNoWeight());
    }

    @Test
    void givenRows_whenPrinted_thenTheTextIsDenseInstancesText() {
        Instances data = data();
        for (Instance row : data) {
            DenseInstance plain = new DenseInstance(row.weight(), row.toDoubleArray());
            plain.setDataset(data);
            assertEquals(plain.toString(), row.toString());
            assertEquals(plain.toStringNoWeight(8), row.toStringNoWeight(8));
        }
        assertEquals("0.5,1.25,-3,0", data.instance(0).toString());
    }

    @Test
    void givenOwnedRows_whenAForestIsFitted_thenTheRowsAreReleasedAndTheForestIsTheSame() throws Exception {
        java.util.SplittableRandom rnd = new java.util.SplittableRandom(2);
        int n = 40;
        double[][] x = new double[n][6];
        int[] y = new int[n];
        java.util.List<String> ids = new java.util.ArrayList<>();
        for (int i = 0; i < n; i++) {
            y[i] = i % 2;
            ids.add("s" + i);
            for (int j = 0; j < 6; j++) {
                x[i][j] = rnd.nextGaussian() + (j == 0 ? y[i] : 0);
            }
        }
        java.util.List<String> names = java.util.List.of("a", "b", "c", "d", "e", "f");
        WekaClassifier forest = new WekaClassifier("weka.classifiers.trees.RandomForest", "-I 20");
        org.viewgain.spec.Params params = forest.resolve(java.util.Map.of());
        org.viewgain.folds.FitContext ctx = new org.viewgain.folds.FitContext(0, 0, 0,
                org.viewgain.folds.FitContext.WHOLE, org.viewgain.folds.FitContext.Role.FINAL, 7L);
        double[][] copy = new double[n][];
        for (int i = 0; i < n; i++) {
            copy[i] = x[i].clone();
        }
        Rows kept = new Rows(ids, x, names);
        Rows owned = new Rows(ids, copy, names);
        ClassifierMethod.Model a = forest.fit(ctx, kept, y, 2, params);
        ClassifierMethod.Model b = forest.fitOwned(ctx, owned, y, 2, params);
        for (double[] r : owned.x()) {
            assertEquals(null, r);
        }
        for (double[] r : kept.x()) {
            assertEquals(6, r.length); // fit() leaves the caller's rows alone
        }
        Predictions pa = a.predict(kept);
        Predictions pb = b.predict(kept);
        for (int i = 0; i < n; i++) {
            org.junit.jupiter.api.Assertions.assertArrayEquals(pa.scores()[i], pb.scores()[i], 0.0);
        }
    }
}
