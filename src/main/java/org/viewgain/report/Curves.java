package org.viewgain.report;

import java.util.Arrays;
import java.util.Comparator;

/**
 * Curves computed from pooled out-of-fold scores: the empirical ROC curve (tied scores move together, so its area
 * equals the Mann-Whitney AUC with ties counted one half; Hanley &amp; McNeil 1982), and the reliability curve with
 * the Brier score (Brier 1950) for scores that are probabilities.
 */
final class Curves {
    private Curves() {
    }

    /** ROC points from (0,0) to (1,1): {fpr, tpr}; higher score means more likely positive. */
    static double[][] roc(double[] score, boolean[] positive) {
        Integer[] order = new Integer[score.length];
        for (int i = 0; i < order.length; i++) {
            order[i] = i;
        }
        Arrays.sort(order, Comparator.comparingDouble((Integer i) -> score[i]).reversed());
        int pos = 0;
        for (boolean p : positive) {
            pos += p ? 1 : 0;
        }
        int neg = score.length - pos;
        double[] fpr = new double[score.length + 1];
        double[] tpr = new double[score.length + 1];
        int k = 1;
        int tp = 0;
        int fp = 0;
        for (int i = 0; i < order.length; ) {
            int j = i;
            while (j < order.length && score[order[j]] == score[order[i]]) {
                if (positive[order[j]]) {
                    tp++;
                } else {
                    fp++;
                }
                j++;
            }
            fpr[k] = neg == 0 ? 0 : (double) fp / neg;
            tpr[k] = pos == 0 ? 0 : (double) tp / pos;
            k++;
            i = j;
        }
        return new double[][] {Arrays.copyOf(fpr, k), Arrays.copyOf(tpr, k)};
    }

    /** The area under a curve given as {x, y} (trapezoids). */
    static double area(double[][] curve) {
        double a = 0;
        for (int i = 1; i < curve[0].length; i++) {
            a += (curve[0][i] - curve[0][i - 1]) * (curve[1][i] + curve[1][i - 1]) / 2;
        }
        return a;
    }

    /** True when every score is a probability in [0, 1] (NaN fails). */
    static boolean probabilities(double[] score) {
        for (double s : score) {
            if (!(s >= 0 && s <= 1)) {
                return false;
            }
        }
        return score.length > 0;
    }

    /** Mean squared difference between the score and the 0/1 outcome. */
    static double brier(double[] score, boolean[] positive) {
        double s = 0;
        for (int i = 0; i < score.length; i++) {
            double e = score[i] - (positive[i] ? 1 : 0);
            s += e * e;
        }
        return s / score.length;
    }

    /**
     * Reliability curve over {@code bins} equal-width bins of [0, 1]: {mean score, fraction positive, count} for each
     * non-empty bin (a score of exactly 1 falls in the last bin).
     */
    static double[][] reliability(double[] score, boolean[] positive, int bins) {
        double[] sum = new double[bins];
        double[] hits = new double[bins];
        double[] count = new double[bins];
        for (int i = 0; i < score.length; i++) {
            int b = Math.min(bins - 1, (int) Math.floor(score[i] * bins));
            sum[b] += score[i];
            hits[b] += positive[i] ? 1 : 0;
            count[b]++;
        }
        int used = 0;
        double[][] out = new double[3][bins];
        for (int b = 0; b < bins; b++) {
            if (count[b] > 0) {
                out[0][used] = sum[b] / count[b];
                out[1][used] = hits[b] / count[b];
                out[2][used] = count[b];
                used++;
            }
        }
        return new double[][] {Arrays.copyOf(out[0], used), Arrays.copyOf(out[1], used), Arrays.copyOf(out[2], used)};
    }
}
