package org.viewgain.imputation;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.viewgain.cohort.Rows;
import org.viewgain.spec.Params;

/**
 * The shared table of source distances (issue 12: label-free work computed once and shared). Invented rows; the
 * reference is the imputer's own per-fit computation, which the table must reproduce bit for bit.
 */
class SourceDistancesTest {

    private static final int N = 23;
    private static final int P = 4100; // more than two column chunks, and a block that is not a multiple of four
    private final Map<String, float[]> views = new HashMap<>();
    private final List<String> ids = new ArrayList<>();
    private final List<String> trainable = new ArrayList<>();

    SourceDistancesTest() {
        SplittableRandom rnd = new SplittableRandom(5);
        for (int i = 0; i < N; i++) {
            float[] v = new float[P];
            for (int j = 0; j < P; j++) {
                v[j] = (float) rnd.nextGaussian();
            }
            String id = "s" + i;
            views.put(id, v);
            ids.add(id);
            if (i % 3 != 0) {
                trainable.add(id);
            }
        }
    }

    private double[] widen(String id) {
        float[] v = views.get(id);
        double[] out = new double[v.length];
        for (int j = 0; j < v.length; j++) {
            out[j] = v[j];
        }
        return out;
    }

    @Test
    void givenTable_whenAsked_thenEveryDistanceIsBitForBitTheImputersOwnAndComputedOnce() {
        SourceDistances table = SourceDistances.of(ids, trainable, views::get);
        double[][] got = table.squared(ids, trainable);
        for (int q = 0; q < N; q++) {
            for (int t = 0; t < trainable.size(); t++) {
                double own = NearestNeighboursImputer.squaredDistance(widen(ids.get(q)), widen(trainable.get(t)));
                assertEquals(Double.doubleToRawLongBits(own), Double.doubleToRawLongBits(got[q][t]),
                        ids.get(q) + " to " + trainable.get(t));
            }
        }
        long once = (long) N * trainable.size();
        assertEquals(once, table.computed());
        table.squared(ids.subList(3, 9), trainable.subList(2, 5)); // asked again: read, not recomputed
        assertEquals(once, table.computed());
    }

    @Test
    void givenSubjectOutsideTable_whenAsked_thenNullSoTheFitComputesItself() {
        SourceDistances table = SourceDistances.of(ids, trainable, views::get);
        assertNull(table.squared(List.of("s1"), List.of("s0"))); // s0 has no target: not a column
        assertNull(table.squared(List.of("elsewhere"), List.of("s1")));
        Rows trainRows = new Rows(trainable.subList(0, 2), new double[][] {widen(trainable.get(0)),
                widen(trainable.get(1))}, names(P));
        double[] other = widen("s1");
        other[7] += 1; // another cohort's subject with the same id
        assertNull(table.squared(new Rows(List.of("s1"), new double[][] {other}, names(P)), trainRows));
        assertEquals(1, table.squared(new Rows(List.of("s1"), new double[][] {widen("s1")}, names(P)),
                trainRows).length);
        assertNull(SourceDistances.of(java.util.Collections.nCopies(6000, "x"),
                java.util.Collections.nCopies(6000, "x"), views::get)); // 288 MB: above the budget
    }

    @Test
    void givenTable_whenNearestNeighboursImpute_thenSameImputationsAsWithoutIt() {
        SourceDistances table = SourceDistances.of(ids, trainable, views::get);
        double[][] src = trainable.stream().map(this::widen).toArray(double[][]::new);
        double[][] tgt = new double[src.length][];
        for (int i = 0; i < src.length; i++) {
            tgt[i] = new double[] {src[i][0] * 2 + src[i][1], src[i][2]};
        }
        Rows source = new Rows(trainable, src, names(P));
        Rows target = new Rows(trainable, tgt, names(2));
        List<String> queries = ids.subList(0, 10);
        Rows query = new Rows(queries, queries.stream().map(this::widen).toArray(double[][]::new), names(P));
        NearestNeighboursImputer knn = new NearestNeighboursImputer();
        for (Params p : List.of(knn.resolve(Params.of("k", 3).values()),
                knn.resolve(Params.of("k", 5, "weights", "distance").values()))) {
            double[][] own = knn.fit(Fixtures.CTX, source, target, p).impute(Fixtures.CTX, query);
            double[][] shared = knn.fit(Fixtures.CTX, source, target, p, table).impute(Fixtures.CTX, query);
            for (int r = 0; r < own.length; r++) {
                assertArrayEquals(own[r], shared[r], 0.0);
            }
        }
    }

    private static List<String> names(int p) {
        List<String> out = new ArrayList<>(p);
        for (int j = 0; j < p; j++) {
            out.add("f" + j);
        }
        return out;
    }
}
