package org.viewgain.engine;

import java.util.ArrayList;
import java.util.List;

/**
 * Possible duplicate scans: pairs of subjects whose vectors (the source view's base vectors) have a Pearson
 * correlation above a threshold. Rows are centred and scaled to unit length once, kept as floats, and compared by
 * blocked dot products (a cache-sized block of rows against another, a chunk of columns at a time); pairs near the
 * threshold are recomputed exactly in double precision, so the float copy changes no reported value. A constant
 * row has no correlation and is never reported.
 */
public final class Duplicates {
    /** Rows per block; two blocks of one column chunk stay in a core's cache. */
    static final int BLOCK = 32;
    /** Columns per chunk. */
    static final int CHUNK = 2048;
    /** Float rounding moves a correlation by far less than this; candidates within it are recomputed exactly. */
    static final double MARGIN = 1e-4;

    private Duplicates() {
    }

    /** Two subjects (positions, {@code a < b}) and the correlation of their vectors. */
    public record Pair(int a, int b, double correlation) {
    }

    /**
     * All pairs with correlation strictly above {@code threshold}, ordered by {@code a} then {@code b}.
     *
     * @param rows one vector per subject, all of the same length (read only)
     */
    public static List<Pair> find(double[][] rows, double threshold) {
        int n = rows.length;
        if (n < 2) {
            return List.of();
        }
        int p = rows[0].length;
        float[][] z = new float[n][];
        for (int i = 0; i < n; i++) {
            z[i] = unit(rows[i]);
        }
        List<Pair> out = new ArrayList<>();
        double[][] dot = new double[BLOCK][BLOCK];
        for (int i0 = 0; i0 < n; i0 += BLOCK) {
            int i1 = Math.min(n, i0 + BLOCK);
            for (int j0 = i0; j0 < n; j0 += BLOCK) {
                int j1 = Math.min(n, j0 + BLOCK);
                for (double[] r : dot) {
                    java.util.Arrays.fill(r, 0);
                }
                for (int c0 = 0; c0 < p; c0 += CHUNK) {
                    int c1 = Math.min(p, c0 + CHUNK);
                    for (int i = i0; i < i1; i++) {
                        float[] a = z[i];
                        if (a == null) {
                            continue;
                        }
                        for (int j = Math.max(j0, i + 1); j < j1; j++) {
                            float[] b = z[j];
                            if (b != null) {
                                dot[i - i0][j - j0] += dot(a, b, c0, c1);
                            }
                        }
                    }
                }
                for (int i = i0; i < i1; i++) {
                    for (int j = Math.max(j0, i + 1); j < j1; j++) {
                        if (z[i] != null && z[j] != null && dot[i - i0][j - j0] > threshold - MARGIN) {
                            double r = correlation(rows[i], rows[j]);
                            if (r > threshold) {
                                out.add(new Pair(i, j, r));
                            }
                        }
                    }
                }
            }
        }
        out.sort(java.util.Comparator.comparingInt(Pair::a).thenComparingInt(Pair::b));
        return out;
    }

    /** Four partial sums keep the floating-point pipeline busy; accumulated in double. */
    private static double dot(float[] a, float[] b, int from, int to) {
        double s0 = 0;
        double s1 = 0;
        double s2 = 0;
        double s3 = 0;
        int k = from;
        for (; k + 3 < to; k += 4) {
            s0 += a[k] * b[k];
            s1 += a[k + 1] * b[k + 1];
            s2 += a[k + 2] * b[k + 2];
            s3 += a[k + 3] * b[k + 3];
        }
        for (; k < to; k++) {
            s0 += a[k] * b[k];
        }
        return (s0 + s1) + (s2 + s3);
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

    /** Pearson correlation in double precision. */
    static double correlation(double[] x, double[] y) {
        int p = x.length;
        double mx = 0;
        double my = 0;
        for (int k = 0; k < p; k++) {
            mx += x[k];
            my += y[k];
        }
        mx /= p;
        my /= p;
        double sxy = 0;
        double sxx = 0;
        double syy = 0;
        for (int k = 0; k < p; k++) {
            double dx = x[k] - mx;
            double dy = y[k] - my;
            sxy += dx * dy;
            sxx += dx * dx;
            syy += dy * dy;
        }
        return sxy / Math.sqrt(sxx * syy);
    }
}
