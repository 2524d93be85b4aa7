package org.viewgain.classify;

import java.util.Arrays;
import java.util.SplittableRandom;

/**
 * Grows the trees of a {@link BinnedForest} on one set of binned training rows. Its work arrays are allocated once
 * per fit and reused by every tree and node: the bootstrap counts, the in-bag rows (partitioned in place, each node
 * owning a contiguous range), the class histogram of one feature with its bitmap of occupied bins, and the growing
 * tree.
 */
final class Grower {
    private final BinnedForest.Bins bins;
    private final int[] y;
    private final int classes;
    private final int mtry;
    private final int maxDepth;
    private final int minLeaf;
    private final int n;
    private final int p;

    private final byte[] codes;
    // features with at least two bins in the training rows (the others are constant there)
    private final boolean[] splittable;
    private final int[] count;
    private final int[] rows;
    private final int[] features;
    private final long[] hist;
    // two-class work arrays: per-bin counts and the node's rows' counts in row order, each packed as total count
    // (low 32 bits) and class-1 count (high 32 bits)
    private final long[] binCounts = new long[BinnedForest.MAX_BINS];
    private final long[] nodeCounts;
    private final long[] occupied = new long[(BinnedForest.MAX_BINS + 63) / 64];
    private final long[] parent;
    private final long[] leftCounts;

    // the tree being grown
    private int[] feature = new int[64];
    private double[] threshold = new double[64];
    private int[] left = new int[64];
    private int[] right = new int[64];
    private double[] probabilities = new double[64];
    private int nodes;
    private int leaves;
    // stack of nodes to split: node, first row, end row, depth
    private int[] stack = new int[64];

    Grower(BinnedForest.Bins bins, int[] y, int classes, int mtry, int maxDepth, int minLeaf) {
        this.bins = bins;
        this.y = y;
        this.classes = classes;
        this.mtry = mtry;
        this.maxDepth = maxDepth;
        this.minLeaf = minLeaf;
        this.n = bins.n();
        this.p = bins.p();
        codes = bins.codes();
        splittable = new boolean[p];
        for (int j = 0; j < p; j++) {
            splittable[j] = bins.bins(j) >= 2;
        }
        count = new int[n];
        rows = new int[n];
        features = new int[p];
        hist = new long[BinnedForest.MAX_BINS * classes];
        nodeCounts = new long[n];
        parent = new long[classes];
        leftCounts = new long[classes];
    }

    /** Grows one tree from its own generator, adding the Gini decrease of each split to {@code importance}. */
    BinnedForest.Tree grow(SplittableRandom rng, double[] importance) {
        return grow(rng, importance, true);
    }

    /** As {@link #grow(SplittableRandom, double[])}; without bootstrap every row counts once (for hand checks). */
    BinnedForest.Tree grow(SplittableRandom rng, double[] importance, boolean bootstrap) {
        Arrays.fill(count, bootstrap ? 0 : 1);
        for (int i = 0; bootstrap && i < n; i++) {
            count[rng.nextInt(n)]++;
        }
        int inBag = 0;
        for (int i = 0; i < n; i++) {
            if (count[i] > 0) {
                rows[inBag++] = i;
            }
        }
        for (int j = 0; j < p; j++) {
            features[j] = j;
        }
        nodes = 0;
        leaves = 0;
        int top = 0;
        newNode();
        stack = ensure(stack, 4);
        stack[top++] = 0;
        stack[top++] = 0;
        stack[top++] = inBag;
        stack[top++] = 0;
        while (top > 0) {
            int depth = stack[--top];
            int hi = stack[--top];
            int lo = stack[--top];
            int node = stack[--top];
            long w = classCounts(lo, hi, parent);
            int split = depth < maxDepth && w >= 2L * minLeaf && !pure(parent) ? split(lo, hi, w, rng) : -1;
            if (split < 0) {
                leaf(node, w);
                continue;
            }
            int f = bestFeature;
            int b = bestBin;
            importance[f] += bestDecrease;
            int at = f * n;
            // partition [lo, hi) in place: rows with bin <= b first
            int i = lo;
            int j = hi - 1;
            while (i <= j) {
                if ((codes[at + rows[i]] & 0xff) <= b) {
                    i++;
                } else {
                    int t = rows[i];
                    rows[i] = rows[j];
                    rows[j--] = t;
                }
            }
            int l = newNode();
            int r = newNode();
            feature[node] = f;
            threshold[node] = bins.edges()[f][b];
            left[node] = l;
            right[node] = r;
            stack = ensure(stack, top + 8);
            // right child pushed first so the left one is grown first (node numbering is then depth-first)
            stack[top++] = r;
            stack[top++] = i;
            stack[top++] = hi;
            stack[top++] = depth + 1;
            stack[top++] = l;
            stack[top++] = lo;
            stack[top++] = i;
            stack[top++] = depth + 1;
        }
        return new BinnedForest.Tree(Arrays.copyOf(feature, nodes), Arrays.copyOf(threshold, nodes),
                Arrays.copyOf(left, nodes), Arrays.copyOf(right, nodes),
                Arrays.copyOf(probabilities, leaves * classes), classes);
    }

    private int bestFeature;
    private int bestBin;
    private double bestDecrease;

    /**
     * Looks for the best split of the rows {@code [lo, hi)} among {@code mtry} features drawn without replacement
     * (two classes: {@link #splitTwoClasses}; more: a class histogram per feature, below). A split into two pure
     * children decreases impurity by {@code w - parentScore} (each child's {@code sum(c^2)/w} is its row count, exactly
     * in floating point), which no split exceeds and the first one found wins ties; so the drawing stops there, and
     * the split is the one all {@code mtry} draws would give (only the generator's later draws differ);
     * sets {@link #bestFeature}, {@link #bestBin} and {@link #bestDecrease} and returns 0, or -1 when no drawn
     * feature splits the node into two children of at least {@code minLeaf} rows with a positive decrease.
     */
    private int split(int lo, int hi, long w, SplittableRandom rng) {
        if (classes == 2) {
            return splitTwoClasses(lo, hi, w, rng);
        }
        double parentScore = sumSquares(parent) / (double) w;
        // a split must decrease impurity by more than rounding error (an uninformative split computes to about 0)
        double best = 1e-12 * w;
        bestFeature = -1;
        double perfect = (double) w - parentScore;
        for (int k = 0; k < mtry && best < perfect; k++) {
            int r = k + rng.nextInt(p - k);
            int f = features[r];
            features[r] = features[k];
            features[k] = f;
            if (!splittable[f]) {
                continue; // constant in the training rows
            }
            int at = f * n;
            // a class histogram over the bins the node's rows occupy, with a bitmap of those bins, so that the scan
            // visits occupied bins only (at most as many as rows, in bin order) and clears them as it goes; the
            // histogram and the bitmap are all zeros between uses
            for (int t = lo; t < hi; t++) {
                int row = rows[t];
                int bin = codes[at + row] & 0xff;
                hist[bin * classes + y[row]] += count[row];
                occupied[bin >>> 6] |= 1L << bin;
            }
            Arrays.fill(leftCounts, 0);
            long wl = 0;
            for (int word = 0; word < occupied.length; word++) {
                long bits = occupied[word];
                occupied[word] = 0;
                while (bits != 0) {
                    int bin = (word << 6) | Long.numberOfTrailingZeros(bits);
                    bits &= bits - 1;
                    for (int c = 0; c < classes; c++) {
                        long h = hist[bin * classes + c];
                        hist[bin * classes + c] = 0;
                        leftCounts[c] += h;
                        wl += h;
                    }
                    if (wl == w) {
                        continue; // the last occupied bin: no rows would go right
                    }
                    double d = decrease(wl, w, parentScore);
                    if (d > best) {
                        best = d;
                        keep(f, bin, d);
                    }
                }
            }
        }
        return bestFeature < 0 ? -1 : 0;
    }

    /**
     * The Gini impurity decrease of the split whose left child holds {@link #leftCounts} ({@code wl} rows), weighted
     * by rows: {@code w * gini(parent) - wl * gini(left) - wr * gini(right)} = {@code sum(l^2)/wl + sum(r^2)/wr -
     * sum(c^2)/w}; 0 when a child is smaller than {@code minLeaf}.
     */
    private double decrease(long wl, long w, double parentScore) {
        long wr = w - wl;
        if (wl < minLeaf || wr < minLeaf) {
            return 0;
        }
        double sl = 0;
        double sr = 0;
        for (int c = 0; c < classes; c++) {
            long l = leftCounts[c];
            long r = parent[c] - l;
            sl += (double) l * l;
            sr += (double) r * r;
        }
        return sl / wl + sr / wr - parentScore;
    }

    /**
     * {@link #split} for two classes, the common case: the same candidates in the same order and the same
     * arithmetic for each decrease. The node's bootstrap counts are gathered once into a contiguous array (total and
     * class-1 count per row, packed in one long) and each drawn feature's histogram is one packed array, so the inner
     * loop reads one byte per row at random, the rest in order, and updates one histogram cell per row.
     */
    private int splitTwoClasses(int lo, int hi, long w, SplittableRandom rng) {
        double parentScore = sumSquares(parent) / (double) w;
        double best = 1e-12 * w;
        bestFeature = -1;
        int m = hi - lo;
        for (int t = 0; t < m; t++) {
            int row = rows[lo + t];
            // total count in the low 32 bits, class-1 count in the high 32: one add updates both
            nodeCounts[t] = count[row] | (y[row] == 1 ? (long) count[row] << 32 : 0L);
        }
        long p0 = parent[0];
        double perfect = (double) w - parentScore;
        for (int k = 0; k < mtry && best < perfect; k++) {
            int r = k + rng.nextInt(p - k);
            int f = features[r];
            features[r] = features[k];
            features[k] = f;
            if (!splittable[f]) {
                continue; // constant in the training rows
            }
            int at = f * n;
            for (int t = 0; t < m; t++) {
                int bin = codes[at + rows[lo + t]] & 0xff;
                binCounts[bin] += nodeCounts[t];
                occupied[bin >>> 6] |= 1L << bin;
            }
            long wl = 0;
            long l1 = 0;
            for (int word = 0; word < occupied.length; word++) {
                long bits = occupied[word];
                occupied[word] = 0;
                while (bits != 0) {
                    int bin = (word << 6) | Long.numberOfTrailingZeros(bits);
                    bits &= bits - 1;
                    long packed = binCounts[bin];
                    binCounts[bin] = 0;
                    wl += packed & 0xffffffffL;
                    l1 += packed >>> 32;
                    long wr = w - wl;
                    if (wr == 0 || wl < minLeaf || wr < minLeaf) {
                        continue; // the last occupied bin, or a child too small
                    }
                    long l0 = wl - l1;
                    long r0 = p0 - l0;
                    long r1 = wr - r0;
                    long sl = l0 * l0 + l1 * l1;
                    long sr = r0 * r0 + r1 * r1;
                    // a division-free screen (sum(l^2) wr + sum(r^2) wl against (best + parentScore) wl wr, with a
                    // margin far above rounding error) rejects candidates that cannot win; then the exact decrease
                    if (!((double) sl * wr + (double) sr * wl > (best + parentScore) * wl * wr * (1 - 1e-9))) {
                        continue;
                    }
                    double d = (double) sl / wl + (double) sr / wr - parentScore;
                    if (d > best) {
                        best = d;
                        keep(f, bin, d);
                    }
                }
            }
        }
        return bestFeature < 0 ? -1 : 0;
    }

    private void keep(int f, int bin, double d) {
        bestFeature = f;
        bestBin = bin;
        bestDecrease = d;
    }

    private long classCounts(int lo, int hi, long[] into) {
        Arrays.fill(into, 0);
        long w = 0;
        for (int t = lo; t < hi; t++) {
            int row = rows[t];
            into[y[row]] += count[row];
            w += count[row];
        }
        return w;
    }

    private boolean pure(long[] counts) {
        int nonZero = 0;
        for (long c : counts) {
            nonZero += c > 0 ? 1 : 0;
        }
        return nonZero <= 1;
    }

    private static double sumSquares(long[] counts) {
        double s = 0;
        for (long c : counts) {
            s += (double) c * c;
        }
        return s;
    }

    private int newNode() {
        if (nodes == feature.length) {
            int cap = nodes * 2;
            feature = Arrays.copyOf(feature, cap);
            threshold = Arrays.copyOf(threshold, cap);
            left = Arrays.copyOf(left, cap);
            right = Arrays.copyOf(right, cap);
        }
        feature[nodes] = -1;
        return nodes++;
    }

    private void leaf(int node, long w) {
        probabilities = ensure(probabilities, (leaves + 1) * classes);
        for (int c = 0; c < classes; c++) {
            probabilities[leaves * classes + c] = parent[c] / (double) w;
        }
        feature[node] = -1;
        left[node] = leaves++;
        right[node] = -1;
    }

    private static int[] ensure(int[] a, int size) {
        return a.length >= size ? a : Arrays.copyOf(a, Math.max(size, a.length * 2));
    }

    private static double[] ensure(double[] a, int size) {
        return a.length >= size ? a : Arrays.copyOf(a, Math.max(size, a.length * 2));
    }
}
