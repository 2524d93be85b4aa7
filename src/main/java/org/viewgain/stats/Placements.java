package org.viewgain.stats;

import java.util.Arrays;

/**
 * DeLong placement values of one score vector: for each positive the fraction of negatives it beats, for each
 * negative the fraction of positives that beat it (ties one half), found from mid-ranks in O(n log n).
 */
final class Placements {
    /** Per positive: fraction of negatives scored below it (ties one half). */
    final double[] ofPositives;
    /** Per negative: fraction of positives scored above it (ties one half). */
    final double[] ofNegatives;

    /** Per negative: (positives above, positives tied); per positive: (negatives below, negatives tied). */
    private final int[][] negativeCounts;
    private final int[][] positiveCounts;

    private Placements(double[] ofPositives, double[] ofNegatives, int[][] positiveCounts, int[][] negativeCounts) {
        this.ofPositives = ofPositives;
        this.ofNegatives = ofNegatives;
        this.positiveCounts = positiveCounts;
        this.negativeCounts = negativeCounts;
    }

    /** Placements of the scores, or null when a class is empty or a score is NaN. */
    static Placements of(double[] scores, boolean[] positive) {
        if (scores.length != positive.length) {
            throw new IllegalArgumentException("scores and labels differ in length: " + scores.length + " vs "
                    + positive.length);
        }
        int nPos = 0;
        for (int i = 0; i < scores.length; i++) {
            if (Double.isNaN(scores[i])) {
                return null;
            }
            if (positive[i]) {
                nPos++;
            }
        }
        int nNeg = scores.length - nPos;
        if (nPos == 0 || nNeg == 0) {
            return null;
        }
        double[] pos = new double[nPos];
        double[] neg = new double[nNeg];
        for (int i = 0, a = 0, b = 0; i < scores.length; i++) {
            if (positive[i]) {
                pos[a++] = scores[i];
            } else {
                neg[b++] = scores[i];
            }
        }
        double[] sortedPos = pos.clone();
        double[] sortedNeg = neg.clone();
        Arrays.sort(sortedPos);
        Arrays.sort(sortedNeg);
        double[] v10 = new double[nPos];
        int[][] posCounts = new int[nPos][];
        for (int i = 0; i < nPos; i++) {
            // negatives strictly below plus half of those tied
            posCounts[i] = new int[] {countBelow(sortedNeg, pos[i]), countEqual(sortedNeg, pos[i])};
            v10[i] = (posCounts[i][0] + 0.5 * posCounts[i][1]) / nNeg;
        }
        double[] v01 = new double[nNeg];
        int[][] negCounts = new int[nNeg][];
        for (int j = 0; j < nNeg; j++) {
            int tied = countEqual(sortedPos, neg[j]);
            negCounts[j] = new int[] {nPos - countBelow(sortedPos, neg[j]) - tied, tied};
            v01[j] = (negCounts[j][0] + 0.5 * negCounts[j][1]) / nPos;
        }
        return new Placements(v10, v01, posCounts, negCounts);
    }

    double auc() {
        double sum = 0;
        for (double v : ofPositives) {
            sum += v;
        }
        return sum / ofPositives.length;
    }

    /** Hanley &amp; McNeil's Q1: two positives both outrank a negative (one tie 1/2, two ties 1/3). */
    double pairMomentOfNegatives() {
        return pairMoment(negativeCounts, ofPositives.length);
    }

    /** Hanley &amp; McNeil's Q2: a positive outranks two negatives (one tie 1/2, two ties 1/3). */
    double pairMomentOfPositives() {
        return pairMoment(positiveCounts, ofNegatives.length);
    }

    private static double pairMoment(int[][] counts, int others) {
        double sum = 0;
        for (int[] c : counts) {
            double beaten = c[0];
            double tied = c[1];
            sum += beaten * beaten + beaten * tied + tied * tied / 3;
        }
        return sum / ((double) counts.length * others * others);
    }

    /** How many of the sorted values are strictly below {@code x} (binary search). */
    static int countBelow(double[] sorted, double x) {
        int lo = 0;
        int hi = sorted.length;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (sorted[mid] < x) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }

    private static int countEqual(double[] sorted, double x) {
        int lo = 0;
        int hi = sorted.length;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (sorted[mid] <= x) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo - countBelow(sorted, x);
    }
}
