package org.viewgain.classify;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.folds.Seeds;
import org.viewgain.spec.ParamDef;
import org.viewgain.spec.Params;

/**
 * {@code random-forest}: Breiman's random forest (Breiman 2001, Machine Learning 45:5-32), written for the many
 * refits of nested cross-validation and permutation tests on wide edge-level views. Each tree grows on a bootstrap
 * sample; at every node {@code features-per-split} features are drawn afresh and the split with the largest Gini
 * impurity decrease among them is taken (drawing stops early at a split into two pure children, which none of the
 * remaining features could beat); trees grow until a node is pure, reaches {@code max-depth}, or cannot be
 * split into two children of at least {@code min-node-size} rows (bootstrap copies counted); a tree's scores are its
 * leaf's class fractions, and the forest averages them over trees.
 *
 * <p>Split candidates: every feature is binned once per fit on its training values (label-free). A feature with at
 * most {@value #MAX_BINS} distinct values gets every midpoint between consecutive distinct values as a candidate, as
 * in CART; a feature with more gets {@value #MAX_BINS} quantile bins, and thresholds are the midpoints at the bin
 * edges (the histogram approach of gradient-boosting libraries). Rows are coded once as bytes, feature-major, so
 * finding a node's best split reads one contiguous array per feature and allocates nothing.
 *
 * <p>The bins are label-free: the points of a grid fitted together ({@link #fitGrid}) share one binning.
 *
 * <p>Every tree has its own seed derived from {@link FitContext#seed()}; trees are grown in order on the calling
 * thread (the engine runs fits in parallel), so a fit is the same on any number of threads. Importance: the Gini
 * decrease of every split on a feature, weighted by the rows in the node and summed over trees, kind {@code impurity}.
 */
public final class BinnedForest implements ClassifierMethod {
    /** Largest number of bins per feature (codes fit an unsigned byte). */
    static final int MAX_BINS = 255;

    /** The parameters of every random forest method (this one and Smile's). */
    static final List<ParamDef> PARAMETERS = List.of(
            ParamDef.integer("trees", 1, 100_000, 500, "number of trees"),
            ParamDef.numberOrChoice("features-per-split", Double.MIN_VALUE, 1, List.of("sqrt", "log2"), "sqrt",
                    "features tried at each split: a fraction of the features in (0,1], sqrt or log2 of their count"),
            ParamDef.integer("max-depth", 1, 10_000, 20, "maximum depth of a tree"),
            ParamDef.integer("min-node-size", 1, 100_000, 2, "smallest number of training rows in a leaf"));

    @Override
    public String method() {
        return "random-forest";
    }

    @Override
    public List<ParamDef> parameters() {
        return PARAMETERS;
    }

    @Override
    public boolean producesScores() {
        return true;
    }

    /** Features tried at each split: sqrt and log2 round down (at least 1); a fraction rounds to nearest (1..p). */
    static int featuresPerSplit(Object setting, int p) {
        double m;
        if ("sqrt".equals(setting)) {
            m = Math.floor(Math.sqrt(p));
        } else if ("log2".equals(setting)) {
            m = Math.floor(Math.log(p) / Math.log(2));
        } else {
            m = Math.rint(((Number) setting).doubleValue() * p);
        }
        return (int) Math.max(1, Math.min(p, m));
    }

    /** Bins the training rows (a seam for tests that count how often it happens). */
    interface Binner {
        Bins bin(double[][] x);
    }

    private final Binner binner;

    public BinnedForest() {
        this(Bins::of);
    }

    BinnedForest(Binner binner) {
        this.binner = binner;
    }

    @Override
    public boolean freezable() {
        return true;
    }

    @Override
    public Model fit(FitContext ctx, Rows x, int[] y, int classes, Params params) {
        return fitGrid(List.of(ctx), x, y, classes, List.of(params)).get(0);
    }

    /** Bins the rows once (label-free) and grows one forest per grid point on them. */
    @Override
    public List<Model> fitGrid(List<FitContext> contexts, Rows x, int[] y, int classes, List<Params> grid) {
        TrainingLabels.check(method(), x, y, classes);
        Bins bins = binner.bin(x.x());
        List<Model> out = new ArrayList<>(grid.size());
        for (int g = 0; g < grid.size(); g++) {
            out.add(grow(contexts.get(g), bins, y, classes, grid.get(g), x.p()));
        }
        return out;
    }

    private static Model grow(FitContext ctx, Bins bins, int[] y, int classes, Params params, int p) {
        int trees = params.getInt("trees");
        Grower grower = new Grower(bins, y, classes, featuresPerSplit(params.get("features-per-split"), p),
                params.getInt("max-depth"), params.getInt("min-node-size"));
        Tree[] forest = new Tree[trees];
        double[] importance = new double[p];
        for (int t = 0; t < trees; t++) {
            forest[t] = grower.grow(new SplittableRandom(Seeds.derive(ctx.seed(), "forest-tree", t)), importance);
        }
        ClassifierMethod.Model model = new FrozenModels.Forest(forest, classes);
        return new Explained(model, importance, Explained.IMPURITY);
    }

    /**
     * The training rows coded by bin, feature-major in one array ({@code codes[j * n + i]}, unsigned: one object, so
     * that reaching a drawn feature's codes costs no reference to follow), with each feature's thresholds: a value
     * goes left of threshold {@code b} when it is at most {@code edges[j][b]}, so its bin is the number of edges below
     * it.
     */
    record Bins(byte[] codes, double[][] edges, int n) {
        /** Columns copied out of the rows together. */
        private static final int COLUMN_BLOCK = 64;

        static Bins of(double[][] x) {
            int n = x.length;
            int p = n == 0 ? 0 : x[0].length;
            if ((long) p * n > Integer.MAX_VALUE - 16) {
                throw new IllegalArgumentException("random-forest: " + n + " training rows x " + p + " features is"
                        + " more than one array of bin codes holds (2^31 bytes); use fewer features (e.g. a"
                        + " features.select step) or method weka with class weka.classifiers.trees.RandomForest");
            }
            byte[] codes = new byte[p * n];
            double[][] edges = new double[p][];
            double[] sorted = new double[n];
            int[] order = new int[n];
            long[] keys = new long[n];
            long[] spare = new long[n];
            int[] count = new int[RADIX + 1];
            // columns are copied out of the rows a block at a time, so that each row's stretch of the block is read
            // from memory once rather than once per column (a cache miss per value on wide rows)
            double[][] block = new double[Math.min(p, COLUMN_BLOCK)][n];
            for (int j = 0; j < p; j++) {
                int inBlock = j % COLUMN_BLOCK;
                if (inBlock == 0) {
                    int width = Math.min(COLUMN_BLOCK, p - j);
                    for (int i = 0; i < n; i++) {
                        double[] row = x[i];
                        for (int b = 0; b < width; b++) {
                            block[b][i] = row[j + b];
                        }
                    }
                }
                double[] column = block[inBlock];
                sortByValue(column, order, keys, spare, count);
                for (int k = 0; k < n; k++) {
                    sorted[k] = column[order[k]];
                }
                double[] e = edges(sorted);
                edges[j] = e;
                // the bin of a value is the number of edges strictly below it: one walk up the sorted values
                // gives every row's bin (as bin() would, without a search per value)
                int at = j * n;
                int b = 0;
                for (int k = 0; k < n; k++) {
                    double v = sorted[k];
                    while (b < e.length && e[b] < v) {
                        b++;
                    }
                    codes[at + order[k]] = (byte) b;
                }
            }
            return new Bins(codes, edges, n);
        }

        /**
         * Puts into {@code order[0, n)} the positions of {@code value[0, n)} sorted by value ascending. Each value is
         * mapped to a long that orders as the value does, its lowest bits replaced by the position, and the longs
         * are sorted as primitives (no comparison through an index; by radix from {@link #RADIX_FROM} rows on, on
         * the bits above the position); values that differ only in those lowest bits
         * may then be out of order, so one insertion pass by the values themselves puts them right (it moves nothing
         * otherwise). Equal values may come in any order: the edges and bins depend on the values only.
         */
        static void sortByValue(double[] value, int[] order, long[] keys, long[] spare, int[] count) {
            int n = order.length;
            int shift = 32 - Integer.numberOfLeadingZeros(Math.max(1, n - 1));
            long low = (1L << shift) - 1;
            for (int i = 0; i < n; i++) {
                long bits = Double.doubleToRawLongBits(value[i]);
                // negative values: flip the magnitude bits so that signed order is numeric order
                long ordered = bits ^ ((bits >> 63) & Long.MAX_VALUE);
                keys[i] = (ordered & ~low) | i;
            }
            if (n >= RADIX_FROM) {
                radixSort(keys, spare, count, n, shift);
            } else {
                Arrays.sort(keys, 0, n);
            }
            for (int k = 0; k < n; k++) {
                order[k] = (int) (keys[k] & low);
            }
            for (int k = 1; k < n; k++) {
                int o = order[k];
                double v = value[o];
                int at = k - 1;
                while (at >= 0 && value[order[at]] > v) {
                    order[at + 1] = order[at];
                    at--;
                }
                order[at + 1] = o;
            }
        }

        /**
         * Rows from which {@link #sortByValue} sorts by radix rather than by comparison: per column of Gaussian
         * values, Arrays.sort against {@link #radixSort} took 1.25 / 1.66 us at 64 rows, 2.80 / 2.75 at 128, 4.37 /
         * 2.69 at 192, 14.8 / 6.8 at 533 and 23.8 / 10.0 at 800 (one core, 2026-12-04).
         */
        static final int RADIX_FROM = 128;
        private static final int RADIX_BITS = 8;
        private static final int RADIX = 1 << RADIX_BITS;

        /**
         * Sorts {@code keys[0, n)}, compared as signed longs, by their bits from {@code from} up (a least significant
         * digit radix sort, one byte per pass, stable: keys equal in those bits keep their order, so with the
         * position in the bits below {@code from} the result is what sorting the whole keys gives). A digit that all
         * keys share is skipped. {@code spare} (n long) and {@code count} (257 int) are work arrays.
         */
        static void radixSort(long[] keys, long[] spare, int[] count, int n, int from) {
            long[] a = keys;
            long[] b = spare;
            for (int shift = from; shift < 64; shift += RADIX_BITS) {
                Arrays.fill(count, 0);
                for (int i = 0; i < n; i++) {
                    // the sign bit flipped, so that unsigned digits order as the signed keys do
                    count[(int) (((a[i] ^ Long.MIN_VALUE) >>> shift) & (RADIX - 1)) + 1]++;
                }
                if (count[(int) (((a[0] ^ Long.MIN_VALUE) >>> shift) & (RADIX - 1)) + 1] == n) {
                    continue;
                }
                for (int d = 0; d < RADIX; d++) {
                    count[d + 1] += count[d];
                }
                for (int i = 0; i < n; i++) {
                    long k = a[i];
                    b[count[(int) (((k ^ Long.MIN_VALUE) >>> shift) & (RADIX - 1))]++] = k;
                }
                long[] t = a;
                a = b;
                b = t;
            }
            if (a != keys) {
                System.arraycopy(a, 0, keys, 0, n);
            }
        }

        /** Midpoints between consecutive distinct values, or at quantile cuts when there are too many. */
        static double[] edges(double[] sorted) {
            int n = sorted.length;
            int distinct = 0;
            for (int i = 0; i < n; i++) {
                if (i == 0 || sorted[i] != sorted[i - 1]) {
                    distinct++;
                }
            }
            double[] out = new double[Math.max(0, Math.min(distinct, MAX_BINS) - 1)];
            int k = 0;
            if (distinct <= MAX_BINS) {
                for (int i = 1; i < n; i++) {
                    if (sorted[i] != sorted[i - 1]) {
                        out[k++] = sorted[i - 1] + (sorted[i] - sorted[i - 1]) / 2;
                    }
                }
                return out;
            }
            for (int b = 1; b < MAX_BINS; b++) {
                int cut = (int) ((long) b * n / MAX_BINS);
                // move the cut to the next change of value so that equal values share a bin
                while (cut < n && cut > 0 && sorted[cut] == sorted[cut - 1]) {
                    cut++;
                }
                if (cut <= 0 || cut >= n) {
                    continue;
                }
                double e = sorted[cut - 1] + (sorted[cut] - sorted[cut - 1]) / 2;
                if (k == 0 || e > out[k - 1]) {
                    out[k++] = e;
                }
            }
            return Arrays.copyOf(out, k);
        }

        /** The bin of a value: the number of edges strictly below it. */
        static int bin(double[] edges, double v) {
            int lo = 0;
            int hi = edges.length;
            while (lo < hi) {
                int mid = (lo + hi) >>> 1;
                if (edges[mid] < v) {
                    lo = mid + 1;
                } else {
                    hi = mid;
                }
            }
            return lo;
        }

        int bins(int j) {
            return edges[j].length + 1;
        }

        /** The bin of row i of feature j. */
        int code(int j, int i) {
            return codes[j * n + i] & 0xff;
        }

        int p() {
            return edges.length;
        }
    }

    /**
     * One grown tree in flat arrays: an inner node has a feature and a threshold and its children; a leaf (feature
     * -1) keeps its class fractions at {@code left[node] * classes} of {@code leafProbabilities}.
     */
    record Tree(int[] feature, double[] threshold, int[] left, int[] right, double[] leafProbabilities, int classes) {
        void addProbabilities(double[] row, double[] into) {
            int node = 0;
            while (feature[node] >= 0) {
                node = row[feature[node]] <= threshold[node] ? left[node] : right[node];
            }
            int at = left[node] * classes;
            for (int c = 0; c < classes; c++) {
                into[c] += leafProbabilities[at + c];
            }
        }

        int nodes() {
            return feature.length;
        }
    }
}
