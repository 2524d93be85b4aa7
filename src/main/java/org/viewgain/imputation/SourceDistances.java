package org.viewgain.imputation;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.atomic.AtomicLong;
import java.util.concurrent.atomic.AtomicReferenceArray;
import java.util.function.Function;

/**
 * Squared Euclidean distances between the source views of a cohort's subjects, each computed once per run and shared
 * by every {@code nearest-neighbours} fit: outer fits, cross-fits, nested fits for tuning, and every permutation.
 *
 * <p>Why this is leak-free and exact: a distance depends on two subjects' source views alone (no label, no fold,
 * nothing fitted), and a fit only reads the distances between the subjects it imputes and the training subjects it
 * was given, the same numbers it would compute itself. Each distance is the same sum in the same order as
 * {@link NearestNeighboursImputer}'s own (the columns in order, one running sum), so imputations are bit for bit
 * those of computing in the fit, whichever thread asks first (SourceDistancesTest, NearestNeighboursImputerTest).
 *
 * <p>Layout and memory: a row per subject that a fit imputes, computed on first request, over the subjects that can
 * train an imputer (those with an observed target): at most {@code n x m x 8} bytes. A cohort above
 * {@link #BUDGET_BYTES} gets no table ({@link #of} returns null) and its fits compute their own distances.
 * Rows are computed in blocks of queries against column chunks of the training subjects' views, so each view is read
 * once per block rather than once per query (the fit's own loop reads every training view for every query).
 *
 * <p>The same subjects' inner products, which {@code ridge} reads, come with it ({@link #products}).
 */
public final class SourceDistances {
    /** The largest table kept: 256 MiB, e.g. 5,790 subjects all with a target. */
    public static final long BUDGET_BYTES = 256L << 20;
    private static final int BLOCK = 8;
    private static final int CHUNK = 2048;

    private final Map<String, Integer> rowOf = new HashMap<>();
    private final Map<String, Integer> columnOf = new HashMap<>();
    private final List<String> rowIds;
    private final float[][] columns;
    private final Function<String, float[]> view;
    private final AtomicReferenceArray<double[]> rows;
    private final AtomicLong computed = new AtomicLong();
    private SourceGram products;
    private boolean productsMade;

    private SourceDistances(List<String> subjects, List<String> trainable, Function<String, float[]> view) {
        this.rowIds = List.copyOf(subjects);
        this.view = view;
        for (int i = 0; i < subjects.size(); i++) {
            rowOf.put(subjects.get(i), i);
        }
        columns = new float[trainable.size()][];
        for (int t = 0; t < trainable.size(); t++) {
            columnOf.put(trainable.get(t), t);
            columns[t] = view.apply(trainable.get(t));
        }
        rows = new AtomicReferenceArray<>(subjects.size());
    }

    /**
     * A table for the given subjects (every one that may be imputed) against those that may train (with an observed
     * target), reading their source views (shared, never written); null when it would exceed the budget.
     */
    public static SourceDistances of(List<String> subjects, List<String> trainable, Function<String, float[]> view) {
        if ((long) subjects.size() * trainable.size() * Double.BYTES > BUDGET_BYTES) {
            return null;
        }
        return new SourceDistances(subjects, trainable, view);
    }

    /**
     * The squared distances from each query row to each training row ({@code out[q][t]}), or null when a row is not
     * a subject's source view as the table holds it (another cohort's subject with the same id, transformed rows):
     * the caller then computes them itself. Checking the rows costs one pass over them, a small part of the
     * distances it saves.
     */
    public double[][] squared(org.viewgain.cohort.Rows queries, org.viewgain.cohort.Rows train) {
        if (!holds(queries) || !holds(train)) {
            return null;
        }
        return squared(queries.ids(), train.ids());
    }

    private boolean holds(org.viewgain.cohort.Rows rows) {
        for (int r = 0; r < rows.n(); r++) {
            String id = rows.ids().get(r);
            if (!rowOf.containsKey(id) || !SourceGram.sameValues(rows.x()[r], view.apply(id))) {
                return false;
            }
        }
        return true;
    }

    /**
     * The run's inner products between the same subjects' source views, for {@code ridge} ({@link SourceGram}; made
     * on first use, computed on a fit's first request), or null above its budget.
     */
    public synchronized SourceGram products() {
        if (!productsMade) {
            productsMade = true;
            products = SourceGram.of(rowIds, view);
        }
        return products;
    }

    /**
     * The squared distances from each query subject to each training subject ({@code out[q][t]}), or null when a
     * subject is not in the table (the caller computes them itself).
     */
    public double[][] squared(List<String> queries, List<String> train) {
        int[] cols = new int[train.size()];
        for (int t = 0; t < cols.length; t++) {
            Integer c = columnOf.get(train.get(t));
            if (c == null) {
                return null;
            }
            cols[t] = c;
        }
        int[] at = new int[queries.size()];
        List<Integer> missing = new ArrayList<>();
        java.util.BitSet seen = new java.util.BitSet(rowIds.size());
        for (int q = 0; q < at.length; q++) {
            Integer r = rowOf.get(queries.get(q));
            if (r == null) {
                return null;
            }
            at[q] = r;
            if (rows.get(r) == null && !seen.get(r)) {
                seen.set(r);
                missing.add(r);
            }
        }
        compute(missing);
        double[][] out = new double[at.length][cols.length];
        for (int q = 0; q < at.length; q++) {
            double[] row = rows.get(at[q]);
            for (int t = 0; t < cols.length; t++) {
                out[q][t] = row[cols[t]];
            }
        }
        return out;
    }

    /** How many distances have been computed so far (for tests that check each is computed once). */
    public long computed() {
        return computed.get();
    }

    private void compute(List<Integer> missing) {
        int m = columns.length;
        for (int b = 0; b < missing.size(); b += BLOCK) {
            int size = Math.min(BLOCK, missing.size() - b);
            double[][] q = new double[size][];
            for (int h = 0; h < size; h++) {
                float[] v = view.apply(rowIds.get(missing.get(b + h)));
                q[h] = new double[v.length];
                for (int j = 0; j < v.length; j++) {
                    q[h][j] = v[j];
                }
            }
            int p = q[0].length;
            double[][] acc = new double[size][m];
            for (int c0 = 0; c0 < p; c0 += CHUNK) {
                int c1 = Math.min(p, c0 + CHUNK);
                for (int t = 0; t < m; t++) {
                    float[] tv = columns[t];
                    int h = 0;
                    for (; h + 3 < size; h += 4) {
                        accumulate4(q[h], q[h + 1], q[h + 2], q[h + 3], tv, c0, c1, acc, h, t);
                    }
                    for (; h < size; h++) {
                        double s = acc[h][t];
                        double[] a = q[h];
                        for (int j = c0; j < c1; j++) {
                            double d = a[j] - tv[j];
                            s += d * d;
                        }
                        acc[h][t] = s;
                    }
                }
            }
            for (int h = 0; h < size; h++) {
                // another thread may have computed the same row meanwhile: the values are identical, keep the first
                rows.compareAndSet(missing.get(b + h), null, acc[h]);
            }
            computed.addAndGet((long) size * m);
        }
    }

    /**
     * Continues four queries' running sums over columns {@code [c0, c1)}: four independent chains, each in column
     * order, so every sum is the one a single query's loop gives.
     */
    private static void accumulate4(double[] a0, double[] a1, double[] a2, double[] a3, float[] tv, int c0, int c1,
                                    double[][] acc, int h, int t) {
        double s0 = acc[h][t];
        double s1 = acc[h + 1][t];
        double s2 = acc[h + 2][t];
        double s3 = acc[h + 3][t];
        for (int j = c0; j < c1; j++) {
            double v = tv[j];
            double d0 = a0[j] - v;
            double d1 = a1[j] - v;
            double d2 = a2[j] - v;
            double d3 = a3[j] - v;
            s0 += d0 * d0;
            s1 += d1 * d1;
            s2 += d2 * d2;
            s3 += d3 * d3;
        }
        acc[h][t] = s0;
        acc[h + 1][t] = s1;
        acc[h + 2][t] = s2;
        acc[h + 3][t] = s3;
    }
}
