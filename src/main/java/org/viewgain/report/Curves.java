package org.viewgain.report;

import java.util.Arrays;
import java.util.Comparator;

/**
 * Curves computed from pooled out-of-fold scores: the empirical ROC curve (tied scores move together, so its area
 * equals the Mann-Whitney AUC with ties counted one half; Hanley &amp; McNeil 1982); the reliability diagram's bins
 * and the Brier score are {@link org.viewgain.stats.Calibration}'s.
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
}
