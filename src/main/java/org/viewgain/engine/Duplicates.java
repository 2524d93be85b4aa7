package org.viewgain.engine;

import java.util.ArrayList;
import java.util.List;
import java.util.stream.IntStream;

/**
 * Possible duplicate scans: pairs of subjects whose vectors (the source view's base vectors) have a Pearson
 * correlation above a threshold. Rows are centred and scaled to unit length once and kept as floats; their dot
 * products (= correlations) are computed four rows against four rows at a time, in float over chunks of
 * {@value #CHUNK} columns and in double across chunks. The float error is below 3.1e-5 (chunk length times the float
 * unit roundoff, by the Cauchy-Schwarz inequality summed over chunks), so every pair within {@value #MARGIN} of the
 * threshold is recomputed exactly in double precision and no reported value depends on the float copy. Row blocks
 * run in parallel; each pair's value is computed the same way on any thread. A constant row has no correlation and
 * is never reported.
 */
public final class Duplicates {
    static final int CHUNK = 512;
    static final double MARGIN = 1e-4;
    private static final int TILE = 4;

    private Duplicates() {
    }

    /**
     * Two subjects and the correlation of their vectors: positions {@code a < b} in one cohort ({@link #find}), or a
     * position in each of two cohorts ({@link #across}).
     */
    public record Pair(int a, int b, double correlation) {
    }

    /**
     * Fewest features for which a correlation says anything about identity (two points always correlate +-1);
     * common practice, no source.
     */
    public static final int MIN_FEATURES = 10;

    /**
     * All pairs with correlation strictly above {@code threshold}, ordered by {@code a} then {@code b}; none when
     * the vectors have fewer than {@link #MIN_FEATURES} entries.
     *
     * @param rows one vector per subject, all of the same length (read only)
     */
    public static List<Pair> find(double[][] rows, double threshold) {
        int n = rows.length;
        if (n < 2 || rows[0].length < MIN_FEATURES) {
            return List.of();
        }
        boolean[] constant = new boolean[n];
        float[][] z = units(rows, constant);
        int tiles = (n + TILE - 1) / TILE;
        List<List<Pair>> perTile = IntStream.range(0, tiles).parallel()
                .mapToObj(t -> tile(rows, z, constant, t * TILE, Math.min(n, t * TILE + TILE), t * TILE,
                        threshold)).toList();
        List<Pair> out = new ArrayList<>();
        perTile.forEach(out::addAll);
        return out;
    }

    /**
     * Pairs of one subject of {@code a} and one of {@code b} (two cohorts) with correlation strictly above
     * {@code threshold}, computed as {@link #find} computes them; {@code Pair.a} indexes {@code a}, {@code Pair.b}
     * indexes {@code b}; ordered by {@code a} then {@code b}. None when the vectors have fewer than
     * {@link #MIN_FEATURES} entries.
     */
    public static List<Pair> across(double[][] a, double[][] b, double threshold) {
        if (a.length == 0 || b.length == 0 || a[0].length < MIN_FEATURES) {
            return List.of();
        }
        double[][] rows = new double[a.length + b.length][];
        System.arraycopy(a, 0, rows, 0, a.length);
        System.arraycopy(b, 0, rows, a.length, b.length);
        boolean[] constant = new boolean[rows.length];
        float[][] z = units(rows, constant);
        int tiles = (a.length + TILE - 1) / TILE;
        List<List<Pair>> perTile = IntStream.range(0, tiles).parallel()
                .mapToObj(t -> tile(rows, z, constant, t * TILE, Math.min(a.length, t * TILE + TILE), a.length,
                        threshold)).toList();
        List<Pair> out = new ArrayList<>();
        perTile.forEach(t -> t.forEach(p -> out.add(new Pair(p.a(), p.b() - a.length, p.correlation()))));
        return out;
    }

    /** Every row centred and scaled to unit length as floats; a constant row is marked and left all zero. */
    private static float[][] units(double[][] rows, boolean[] constant) {
        float[][] z = new float[rows.length][];
        for (int i = 0; i < rows.length; i++) {
            z[i] = unit(rows[i]);
            constant[i] = z[i] == null;
            if (constant[i]) {
                z[i] = new float[rows[i].length];
            }
        }
        return z;
    }

    /**
     * Pairs whose first subject is in rows i0..i1-1 (at most four) and whose second is a later row from
     * {@code jStart} on, in (a, b) order.
     */
    private static List<Pair> tile(double[][] rows, float[][] z, boolean[] constant, int i0, int i1, int jStart,
                                   double threshold) {
        int n = z.length;
        double[][] dot = new double[TILE][TILE];
        List<Pair> found = new ArrayList<>();
        for (int j0 = jStart; j0 < n; j0 += TILE) {
            int j1 = Math.min(n, j0 + TILE);
            for (double[] r : dot) {
                java.util.Arrays.fill(r, 0);
            }
            if (i1 - i0 == TILE && j1 - j0 == TILE) {
                kernel(z, i0, j0, dot);
            } else {
                for (int i = i0; i < i1; i++) {
                    for (int j = j0; j < j1; j++) {
                        dot[i - i0][j - j0] = dot(z[i], z[j]);
                    }
                }
            }
            for (int i = i0; i < i1; i++) {
                for (int j = Math.max(j0, i + 1); j < j1; j++) {
                    if (!constant[i] && !constant[j] && dot[i - i0][j - j0] > threshold - MARGIN) {
                        double r = correlation(rows[i], rows[j]);
                        if (r > threshold) {
                            found.add(new Pair(i, j, r));
                        }
                    }
                }
            }
        }
        found.sort(java.util.Comparator.comparingInt(Pair::a).thenComparingInt(Pair::b));
        return found;
    }

    /** Dot products of rows i..i+3 with rows j..j+3: sixteen float sums per chunk, added up in double. */
    private static void kernel(float[][] z, int i, int j, double[][] out) {
        float[] a0 = z[i];
        float[] a1 = z[i + 1];
        float[] a2 = z[i + 2];
        float[] a3 = z[i + 3];
        float[] b0 = z[j];
        float[] b1 = z[j + 1];
        float[] b2 = z[j + 2];
        float[] b3 = z[j + 3];
        int p = a0.length;
        for (int c0 = 0; c0 < p; c0 += CHUNK) {
            int c1 = Math.min(p, c0 + CHUNK);
            float s00 = 0, s01 = 0, s02 = 0, s03 = 0, s10 = 0, s11 = 0, s12 = 0, s13 = 0;
            float s20 = 0, s21 = 0, s22 = 0, s23 = 0, s30 = 0, s31 = 0, s32 = 0, s33 = 0;
            for (int k = c0; k < c1; k++) {
                float x0 = a0[k];
                float x1 = a1[k];
                float x2 = a2[k];
                float x3 = a3[k];
                float y0 = b0[k];
                float y1 = b1[k];
                float y2 = b2[k];
                float y3 = b3[k];
                s00 += x0 * y0;
                s01 += x0 * y1;
                s02 += x0 * y2;
                s03 += x0 * y3;
                s10 += x1 * y0;
                s11 += x1 * y1;
                s12 += x1 * y2;
                s13 += x1 * y3;
                s20 += x2 * y0;
                s21 += x2 * y1;
                s22 += x2 * y2;
                s23 += x2 * y3;
                s30 += x3 * y0;
                s31 += x3 * y1;
                s32 += x3 * y2;
                s33 += x3 * y3;
            }
            add(out[0], s00, s01, s02, s03);
            add(out[1], s10, s11, s12, s13);
            add(out[2], s20, s21, s22, s23);
            add(out[3], s30, s31, s32, s33);
        }
    }

    private static void add(double[] row, float a, float b, float c, float d) {
        row[0] += a;
        row[1] += b;
        row[2] += c;
        row[3] += d;
    }

    /** The same chunked float sum for one pair (edge tiles). */
    private static double dot(float[] a, float[] b) {
        double total = 0;
        for (int c0 = 0; c0 < a.length; c0 += CHUNK) {
            int c1 = Math.min(a.length, c0 + CHUNK);
            float s = 0;
            for (int k = c0; k < c1; k++) {
                s += a[k] * b[k];
            }
            total += s;
        }
        return total;
    }

    /** The row centred and scaled to unit length, or null when it is constant. */
    private static float[] unit(double[] x) {
        double mean = 0;
        for (double v : x) {
            mean += v;
        }
        mean /= x.length;
        double ss = 0;
        for (double v : x) {
            ss += (v - mean) * (v - mean);
        }
        if (!(ss > 0)) {
            return null;
        }
        double inv = 1 / Math.sqrt(ss);
        float[] z = new float[x.length];
        for (int k = 0; k < x.length; k++) {
            z[k] = (float) ((x[k] - mean) * inv);
        }
        return z;
    }

    /** Pearson correlation in double precision (NaN for a constant vector). */
    static double correlation(double[] x, double[] y) {
        return org.viewgain.imputation.ImputationQuality.pearsonR(x, y);
    }
}
