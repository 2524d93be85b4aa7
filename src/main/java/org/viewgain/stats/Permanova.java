package org.viewgain.stats;

import java.util.Arrays;
import java.util.SplittableRandom;

/**
 * Permutational multivariate analysis of variance on a distance matrix (Anderson 2001, Austral Ecology 26:32-46):
 * pseudo-F = [(SS_T - SS_W)/(a - 1)] / [SS_W/(N - a)] with SS_T = (1/N) sum_{i&lt;j} d_ij^2 and SS_W = sum_g
 * (1/n_g) sum_{i&lt;j in g} d_ij^2, and its permutation p-value from shuffled group labels.
 */
public final class Permanova {
    /** Largest number of distinct label arrangements {@link #exact} will enumerate. */
    public static final long MAX_EXACT_ARRANGEMENTS = 2_000_000;
    // permuted F within this relative distance of the observed one counts as a tie (rounding of sums)
    private static final double TIE_TOLERANCE = 1e-10;

    private Permanova() {
    }

    /**
     * Observed pseudo-F with its permutation p-value.
     *
     * @param pseudoF      the observed statistic (NaN when all distances are 0)
     * @param p            permutation p-value (NaN when pseudoF is NaN)
     * @param permutations permutations drawn (Monte Carlo) or arrangements enumerated (exact)
     * @param exact        true for full enumeration
     */
    public record Result(double pseudoF, double p, long permutations, boolean exact) {
    }

    /** Anderson's pseudo-F of the groups (any integer labels, at least 2 groups, fewer groups than objects). */
    public static double pseudoF(double[][] distances, int[] groups) {
        Design design = Design.of(distances, groups);
        return design.pseudoF(design.labels);
    }

    /**
     * Monte Carlo permutation test: p = (C + 1) / (N + 1) over N random relabellings (Ojala &amp; Garriga 2010),
     * C counting permuted pseudo-F at least the observed one. Deterministic for a given seed.
     */
    public static Result monteCarlo(double[][] distances, int[] groups, int permutations, long seed) {
        if (permutations < 1) {
            throw new IllegalArgumentException("permutations must be at least 1, got " + permutations);
        }
        Design design = Design.of(distances, groups);
        double observed = design.pseudoF(design.labels);
        if (Double.isNaN(observed)) {
            return new Result(observed, Double.NaN, permutations, false);
        }
        SplittableRandom random = new SplittableRandom(seed);
        int[] labels = design.labels.clone();
        int count = 0;
        for (int r = 0; r < permutations; r++) {
            for (int i = labels.length - 1; i > 0; i--) {
                int j = random.nextInt(i + 1);
                int t = labels[i];
                labels[i] = labels[j];
                labels[j] = t;
            }
            if (reaches(design.pseudoF(labels), observed)) {
                count++;
            }
        }
        return new Result(observed, PermutationP.ojalaGarriga(count, permutations), permutations, false);
    }

    /**
     * Exact test by enumerating every distinct arrangement of the group labels (the observed one included):
     * p = (arrangements with pseudo-F at least the observed) / (all arrangements).
     *
     * @throws IllegalArgumentException when there are more than {@link #MAX_EXACT_ARRANGEMENTS} arrangements
     */
    public static Result exact(double[][] distances, int[] groups) {
        Design design = Design.of(distances, groups);
        long total = design.arrangements();
        if (!(total > 0 && total <= MAX_EXACT_ARRANGEMENTS)) {
            throw new IllegalArgumentException("too many label arrangements for an exact test (more than "
                    + MAX_EXACT_ARRANGEMENTS + "); use monteCarlo");
        }
        double observed = design.pseudoF(design.labels);
        if (Double.isNaN(observed)) {
            return new Result(observed, Double.NaN, total, true);
        }
        int[] labels = design.labels.clone();
        Arrays.sort(labels);
        long count = 0;
        long seen = 0;
        do {
            seen++;
            if (reaches(design.pseudoF(labels), observed)) {
                count++;
            }
        } while (nextArrangement(labels));
        return new Result(observed, count / (double) seen, seen, true);
    }

    private static boolean reaches(double f, double observed) {
        return f >= observed || Math.abs(f - observed) <= TIE_TOLERANCE * Math.abs(observed);
    }

    /** Next lexicographic permutation of a multiset; false after the last one. */
    static boolean nextArrangement(int[] a) {
        int i = a.length - 2;
        while (i >= 0 && a[i] >= a[i + 1]) {
            i--;
        }
        if (i < 0) {
            return false;
        }
        int j = a.length - 1;
        while (a[j] <= a[i]) {
            j--;
        }
        int t = a[i];
        a[i] = a[j];
        a[j] = t;
        for (int lo = i + 1, hi = a.length - 1; lo < hi; lo++, hi--) {
            t = a[lo];
            a[lo] = a[hi];
            a[hi] = t;
        }
        return true;
    }
}
