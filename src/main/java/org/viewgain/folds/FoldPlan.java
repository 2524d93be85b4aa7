package org.viewgain.folds;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;
import java.util.TreeMap;
import java.util.TreeSet;

/**
 * The outer partition of a cohort: for every repeat, the test fold of every subject. One plan serves every pipeline,
 * so all comparisons are paired on identical subjects and folds. Subjects are positions 0..n-1 in cohort order.
 */
public final class FoldPlan {
    private final int[][] foldOf;
    private final int[] foldsPerRepeat;
    private final String scheme;

    private FoldPlan(int[][] foldOf, String scheme) {
        this.foldOf = foldOf;
        this.scheme = scheme;
        this.foldsPerRepeat = new int[foldOf.length];
        for (int r = 0; r < foldOf.length; r++) {
            foldsPerRepeat[r] = Arrays.stream(foldOf[r]).max().orElse(-1) + 1;
        }
    }

    /**
     * Stratified k-fold, repeated: within each stratum subjects are shuffled (seeded per repeat) and dealt to folds
     * in turn, the turn carrying over from one stratum to the next so that fold sizes differ by at most one.
     *
     * @param strata stratum of each subject (e.g. group, or group x site)
     */
    public static FoldPlan stratifiedKFold(int[] strata, int k, int repeats, long seed) {
        int[][] f = new int[repeats][];
        for (int r = 0; r < repeats; r++) {
            f[r] = stratifiedAssignment(strata, k, Seeds.derive(seed, "outer-folds", r));
        }
        return new FoldPlan(f, "stratified-k-fold");
    }

    /** Leave-one-out: subject i is the test fold i. */
    public static FoldPlan leaveOneOut(int n) {
        int[] f = new int[n];
        for (int i = 0; i < n; i++) {
            f[i] = i;
        }
        return new FoldPlan(new int[][] {f}, "leave-one-out");
    }

    /** Leave-site-out: one fold per site, folds in the sorted order of site names. */
    public static FoldPlan leaveSiteOut(String[] sites) {
        List<String> names = new ArrayList<>(new TreeSet<>(Arrays.asList(sites)));
        int[] f = new int[sites.length];
        for (int i = 0; i < sites.length; i++) {
            f[i] = names.indexOf(sites[i]);
        }
        return new FoldPlan(new int[][] {f}, "leave-site-out");
    }

    /**
     * Stratified fold labels 0..k-1 for the given strata (used for inner folds and cross-fitting too).
     */
    public static int[] stratifiedAssignment(int[] strata, int k, long seed) {
        TreeMap<Integer, List<Integer>> byStratum = new TreeMap<>();
        for (int i = 0; i < strata.length; i++) {
            byStratum.computeIfAbsent(strata[i], s -> new ArrayList<>()).add(i);
        }
        SplittableRandom rng = new SplittableRandom(seed);
        int[] fold = new int[strata.length];
        int turn = 0;
        for (List<Integer> members : byStratum.values()) {
            int[] m = members.stream().mapToInt(Integer::intValue).toArray();
            for (int i = m.length - 1; i > 0; i--) {
                int j = rng.nextInt(i + 1);
                int t = m[i];
                m[i] = m[j];
                m[j] = t;
            }
            for (int v : m) {
                fold[v] = turn % k;
                turn++;
            }
        }
        return fold;
    }

    public String scheme() {
        return scheme;
    }

    public int repeats() {
        return foldOf.length;
    }

    public int folds(int repeat) {
        return foldsPerRepeat[repeat];
    }

    /** How many outer folds the plan has over all repeats: the one count of them. */
    public int outerFolds() {
        int n = 0;
        for (int f : foldsPerRepeat) {
            n += f;
        }
        return n;
    }

    public int size() {
        return foldOf[0].length;
    }

    /** The test fold of subject {@code i} in a repeat. */
    public int foldOf(int repeat, int i) {
        return foldOf[repeat][i];
    }

    /** Positions of the test subjects of a fold, ascending. */
    public int[] test(int repeat, int fold) {
        return positions(repeat, fold, true);
    }

    /** Positions of the training subjects of a fold, ascending. */
    public int[] train(int repeat, int fold) {
        return positions(repeat, fold, false);
    }

    private int[] positions(int repeat, int fold, boolean inFold) {
        int[] f = foldOf[repeat];
        return java.util.stream.IntStream.range(0, f.length).filter(i -> (f[i] == fold) == inFold).toArray();
    }
}
