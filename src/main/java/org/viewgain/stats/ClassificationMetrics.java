package org.viewgain.stats;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Classification metrics of one set of predictions, by name in {@link #NAMES} order. A value that is undefined for
 * the data (e.g. sensitivity without positives, AUC without scores) is NaN, never replaced by a convention such as 0.
 */
public final class ClassificationMetrics {
    /** Metric names, in the order of the returned maps. */
    public static final List<String> NAMES =
            List.of("accuracy", "balanced_accuracy", "sensitivity", "specificity", "auc", "f1", "mcc");

    private ClassificationMetrics() {
    }

    /**
     * Metrics of a two-class problem for class {@code positive} against all other class indices.
     * balanced_accuracy = (sensitivity + specificity) / 2; f1 of the positive class; mcc is the phi coefficient
     * (Matthews 1975); auc from {@code positiveScore} (higher = more likely positive) or NaN when it is null.
     *
     * @param truth         true class index per row
     * @param predicted     predicted class index per row
     * @param positiveScore score of the positive class per row, or null
     * @param positive      the class index counted as positive
     * @return a new map in {@link #NAMES} order
     */
    public static Map<String, Double> binary(int[] truth, int[] predicted, double[] positiveScore, int positive) {
        checkLengths(truth, predicted);
        if (positiveScore != null && positiveScore.length != truth.length) {
            throw new IllegalArgumentException("scores and truth differ in length");
        }
        long tp = 0;
        long fp = 0;
        long tn = 0;
        long fn = 0;
        for (int i = 0; i < truth.length; i++) {
            boolean actual = truth[i] == positive;
            boolean called = predicted[i] == positive;
            if (actual && called) {
                tp++;
            } else if (actual) {
                fn++;
            } else if (called) {
                fp++;
            } else {
                tn++;
            }
        }
        double sensitivity = ratio(tp, tp + fn);
        double specificity = ratio(tn, tn + fp);
        double auc = Double.NaN;
        if (positiveScore != null) {
            boolean[] isPositive = new boolean[truth.length];
            for (int i = 0; i < truth.length; i++) {
                isPositive[i] = truth[i] == positive;
            }
            auc = Auc.of(positiveScore, isPositive);
        }
        double mccDenominator = Math.sqrt((double) (tp + fp) * (tp + fn) * (tn + fp) * (tn + fn));
        double mcc = mccDenominator > 0 ? ((double) tp * tn - (double) fp * fn) / mccDenominator : Double.NaN;
        return ordered(ratio(tp + tn, truth.length), (sensitivity + specificity) / 2, sensitivity, specificity, auc,
                ratio(2 * tp, 2 * tp + fp + fn), mcc);
    }

    /**
     * Metrics of a problem with {@code classes} classes (indices 0..classes-1). accuracy is the fraction correct;
     * balanced_accuracy, sensitivity (= mean per-class recall, the same number) and specificity are unweighted
     * (macro) means over classes of the one-vs-rest values; f1 is the macro F1; auc the macro one-vs-rest AUC from
     * {@code scores[i][k]} (NaN when scores are null); mcc the multiclass Matthews coefficient of Gorodkin (2004,
     * Comput Biol Chem 28:367-374). A macro mean is NaN when any class's value is undefined (e.g. a class absent
     * from {@code truth}).
     *
     * @return a new map in {@link #NAMES} order
     */
    public static Map<String, Double> multiclass(int[] truth, int[] predicted, double[][] scores, int classes) {
        checkLengths(truth, predicted);
        if (classes < 2) {
            throw new IllegalArgumentException("need at least 2 classes, got " + classes);
        }
        if (scores != null && scores.length != truth.length) {
            throw new IllegalArgumentException("scores and truth differ in length");
        }
        long[][] confusion = new long[classes][classes];
        for (int i = 0; i < truth.length; i++) {
            if (truth[i] < 0 || truth[i] >= classes || predicted[i] < 0 || predicted[i] >= classes) {
                throw new IllegalArgumentException("class index out of 0.." + (classes - 1) + " at row " + i);
            }
            if (scores != null && scores[i].length != classes) {
                throw new IllegalArgumentException("row " + i + " has " + scores[i].length + " scores, expected "
                        + classes);
            }
            confusion[truth[i]][predicted[i]]++;
        }
        long n = truth.length;
        long[] trueCount = new long[classes];
        long[] predCount = new long[classes];
        long correct = 0;
        for (int a = 0; a < classes; a++) {
            for (int b = 0; b < classes; b++) {
                trueCount[a] += confusion[a][b];
                predCount[b] += confusion[a][b];
            }
            correct += confusion[a][a];
        }
        double recall = 0;
        double specificity = 0;
        double f1 = 0;
        double auc = 0;
        for (int k = 0; k < classes; k++) {
            long tp = confusion[k][k];
            long fn = trueCount[k] - tp;
            long fp = predCount[k] - tp;
            long tn = n - tp - fn - fp;
            recall += ratio(tp, tp + fn) / classes;
            specificity += ratio(tn, tn + fp) / classes;
            f1 += ratio(2 * tp, 2 * tp + fp + fn) / classes;
            if (scores != null) {
                double[] column = new double[truth.length];
                boolean[] isK = new boolean[truth.length];
                for (int i = 0; i < truth.length; i++) {
                    column[i] = scores[i][k];
                    isK[i] = truth[i] == k;
                }
                auc += Auc.of(column, isK) / classes;
            }
        }
        return ordered(ratio(correct, n), recall, recall, specificity, scores == null ? Double.NaN : auc, f1,
                gorodkin(correct, n, trueCount, predCount));
    }

    /** Gorodkin's R_K from the diagonal sum, total and marginal counts; NaN when a marginal is degenerate. */
    private static double gorodkin(long correct, long n, long[] trueCount, long[] predCount) {
        double sumPt = 0;
        double sumP2 = 0;
        double sumT2 = 0;
        for (int k = 0; k < trueCount.length; k++) {
            sumPt += (double) predCount[k] * trueCount[k];
            sumP2 += (double) predCount[k] * predCount[k];
            sumT2 += (double) trueCount[k] * trueCount[k];
        }
        double nn = (double) n * n;
        double denominator = Math.sqrt((nn - sumP2) * (nn - sumT2));
        return denominator > 0 ? ((double) correct * n - sumPt) / denominator : Double.NaN;
    }

    private static Map<String, Double> ordered(double... values) {
        Map<String, Double> map = new LinkedHashMap<>();
        for (int i = 0; i < NAMES.size(); i++) {
            map.put(NAMES.get(i), values[i]);
        }
        return map;
    }

    private static double ratio(long numerator, long denominator) {
        return denominator > 0 ? (double) numerator / denominator : Double.NaN;
    }

    private static void checkLengths(int[] truth, int[] predicted) {
        if (truth.length != predicted.length) {
            throw new IllegalArgumentException("truth and predicted differ in length: " + truth.length + " vs "
                    + predicted.length);
        }
    }
}
