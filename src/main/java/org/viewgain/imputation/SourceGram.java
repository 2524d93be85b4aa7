package org.viewgain.imputation;

import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.Function;
import org.viewgain.cohort.Rows;
import org.viewgain.stats.SmileMatrices;

/**
 * Inner products between the source views of a cohort's subjects, computed once per run (on first use) and shared
 * by every {@code ridge} fit in the dual form: outer fits, cross-fits, nested fits for tuning, every permutation and
 * the whole-cohort fit. A fit on training subjects S reads the products of its rows centred on their own mean,
 * {@code (x_a - m_S) . (x_b - m_S)}, and of the rows it imputes with them, each from the table in O(1).
 *
 * <p>Why this is leak-free: an entry depends on two subjects' source views alone (no label, no target, no fold,
 * nothing fitted). The table holds {@code (x_a - mu) . (x_b - mu)}, with {@code mu} the mean source view of all its
 * subjects; a fit's centred products follow from it by the identity {@code (x_a - m) . (x_b - m) = G_ab - t_a - t_b
 * + c} with {@code m} the mean of S, {@code t_a} the mean of {@code G_ak} over {@code k} in S and {@code c} the mean of
 * {@code G_kl} over S x S, in which {@code mu} cancels exactly. So a fit reads the numbers it would compute from its
 * own training rows, up to rounding; {@code mu} only keeps the entries small (rows far from the origin would
 * otherwise lose digits to cancellation). No fit reads the view of a subject it neither trains on nor imputes.
 *
 * <p>Cost and memory: {@code n^2 p / 2} multiply-adds once, by native BLAS ({@code dsyrk}) a block of columns at a
 * time, so no double-precision copy of all the views is made; {@code n x n x 8} bytes kept (8 MB at 1,000 subjects). A
 * cohort above {@link #BUDGET_BYTES} gets no table ({@link #of} returns null) and its fits compute their own products.
 */
public final class SourceGram {
    /** The largest table kept: 256 MiB, about 5,790 subjects. */
    public static final long BUDGET_BYTES = 256L << 20;

    private final Map<String, Integer> index = new HashMap<>();
    private final List<String> ids;
    private final Function<String, float[]> view;
    private final AtomicInteger computed = new AtomicInteger();
    private final java.util.concurrent.atomic.AtomicLong reads = new java.util.concurrent.atomic.AtomicLong();
    private volatile double[][] table;

    private SourceGram(List<String> subjects, Function<String, float[]> view) {
        this.ids = List.copyOf(subjects);
        this.view = view;
        for (int i = 0; i < ids.size(); i++) {
            index.put(ids.get(i), i);
        }
    }

    /** A table over the given subjects' source views (shared, never written); null when it would exceed the budget. */
    public static SourceGram of(List<String> subjects, Function<String, float[]> view) {
        if (subjects.isEmpty() || (long) subjects.size() * subjects.size() * Double.BYTES > BUDGET_BYTES) {
            return null;
        }
        return new SourceGram(subjects, view);
    }

    /** How many times the table has been computed (for tests that check it is computed once per run). */
    public int computed() {
        return computed.get();
    }

    /** How many training sets have read their centred products (for tests that check fits read the table). */
    public long reads() {
        return reads.get();
    }

    /**
     * The rows' positions in the table, or null unless every row is a subject of the table with its source view
     * exactly as the table holds it (another cohort's subject with the same id, transformed rows): the caller then
     * computes the products itself. The check reads every value once, a small part of the products it saves.
     */
    public int[] positions(Rows rows) {
        int[] at = new int[rows.n()];
        for (int r = 0; r < at.length; r++) {
            Integer i = index.get(rows.ids().get(r));
            if (i == null || !sameValues(rows.x()[r], view.apply(ids.get(i)))) {
                return null;
            }
            at[r] = i;
        }
        return at;
    }

    /** Whether a row holds exactly a stored view's values (widened from single precision). */
    static boolean sameValues(double[] x, float[] v) {
        if (v.length != x.length) {
            return false;
        }
        for (int j = 0; j < v.length; j++) {
            if (x[j] != v[j]) {
                return false;
            }
        }
        return true;
    }

    /** The products of the training rows centred on their mean: {@code K[a][b] = (x_a - m) . (x_b - m)}. */
    public double[][] centred(int[] train) {
        reads.incrementAndGet();
        double[][] g = table();
        double[] t = rowMeans(g, train, train);
        double c = mean(t);
        int n = train.length;
        double[][] k = new double[n][n];
        for (int a = 0; a < n; a++) {
            double[] ga = g[train[a]];
            for (int b = 0; b <= a; b++) {
                double v = ga[train[b]] - t[a] - t[b] + c;
                k[a][b] = v;
                k[b][a] = v;
            }
        }
        return k;
    }

    /**
     * The products of the query rows with the training rows, both centred on the training rows' mean:
     * {@code C[q][a] = (x_q - m) . (x_a - m)}.
     */
    public double[][] centredCross(int[] queries, int[] train) {
        double[][] g = table();
        double[] t = rowMeans(g, train, train);
        double c = mean(t);
        double[] tq = rowMeans(g, queries, train);
        double[][] out = new double[queries.length][train.length];
        for (int q = 0; q < queries.length; q++) {
            double[] gq = g[queries[q]];
            double[] row = out[q];
            for (int a = 0; a < train.length; a++) {
                row[a] = gq[train[a]] - tq[q] - t[a] + c;
            }
        }
        return out;
    }

    /** For each row r of {@code rows}, the mean of {@code g[r][k]} over k in {@code over}. */
    private static double[] rowMeans(double[][] g, int[] rows, int[] over) {
        double[] out = new double[rows.length];
        for (int a = 0; a < rows.length; a++) {
            double[] ga = g[rows[a]];
            double s = 0;
            for (int k : over) {
                s += ga[k];
            }
            out[a] = s / over.length;
        }
        return out;
    }

    private static double mean(double[] v) {
        double s = 0;
        for (double x : v) {
            s += x;
        }
        return s / v.length;
    }

    /** The table, computed by the first caller (the others wait for it). */
    private double[][] table() {
        double[][] g = table;
        if (g == null) {
            synchronized (this) {
                g = table;
                if (g == null) {
                    g = compute();
                    table = g;
                }
            }
        }
        return g;
    }

    private double[][] compute() {
        int n = ids.size();
        float[][] rows = new float[n][];
        for (int i = 0; i < n; i++) {
            rows[i] = view.apply(ids.get(i));
        }
        int p = rows[0].length;
        double[] mu = new double[p];
        for (float[] row : rows) {
            for (int j = 0; j < p; j++) {
                mu[j] += row[j];
            }
        }
        for (int j = 0; j < p; j++) {
            mu[j] /= n;
        }
        double[][] g = SmileMatrices.lowerGram(n, p, (i, from, width, dest, at) -> {
            float[] row = rows[i];
            for (int j = 0; j < width; j++) {
                dest[at + j] = row[from + j] - mu[from + j];
            }
        });
        computed.incrementAndGet();
        return g;
    }
}
