package org.viewgain.engine;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.viewgain.folds.Seeds;
import org.viewgain.spec.Specs;
import org.viewgain.stats.Bootstrap;
import org.viewgain.stats.Calibration;
import org.viewgain.stats.Interval;

/**
 * The calibration rows of metrics.csv, computed as AUC is: per repeat on the pooled out-of-fold predictions of that
 * repeat (every subject once), then the mean and standard deviation over repeats. Defined for two groups and a
 * classifier whose scores are probabilities ({@code score_kind} {@code probability}); for decision values (the SVMs),
 * label-only methods and three or more groups the rows are there with blank values, since no probability was
 * predicted (the SVMs' margins are not calibrated inside the folds). Intervals: the subject-level stratified
 * bootstrap of {@link MetricIntervals}, with the mean over repeats recomputed in every resample; no interval when a
 * resample leaves a value undefined (the slope under separation), since leaving such resamples out would narrow it.
 */
final class CalibrationMetrics {
    /** Metric names, in the order of the rows. */
    static final List<String> NAMES = List.of("brier", "calibration_intercept", "calibration_slope");

    private CalibrationMetrics() {
    }

    /** Whether the pipeline's scores are probabilities of the positive group in a two-group problem. */
    static boolean applies(Experiment ex, Pipeline p) {
        return ex.spec().cohort().groups().size() == 2
                && "probability".equals(ex.classifier(p.classifier()).method().scoreKind());
    }

    /**
     * The three rows of one pipeline.
     *
     * @param perRepeat the pooled out-of-fold predictions of each repeat; every repeat holds the same subjects
     * @param n         subjects predicted per repeat
     */
    static List<Evaluation.MetricRow> rows(Experiment ex, Pipeline p, List<List<RunResults.Prediction>> perRepeat,
                                           int n) {
        int reps = perRepeat.size();
        List<Evaluation.MetricRow> out = new ArrayList<>();
        if (!applies(ex, p) || reps == 0 || n == 0) {
            NAMES.forEach(m -> out.add(new Evaluation.MetricRow(p, m, Double.NaN, Double.NaN, Double.NaN, Double.NaN,
                    "", reps, n)));
            return out;
        }
        int positive = ex.spec().cohort().positiveIndex();
        // align repeats by subject, as MetricIntervals does
        Map<Integer, Integer> unitOf = new LinkedHashMap<>();
        for (RunResults.Prediction pr : perRepeat.get(0)) {
            unitOf.put(pr.subject(), unitOf.size());
        }
        int units = unitOf.size();
        int[] truth = new int[units];
        double[][] score = new double[reps][units];
        double[][] values = new double[NAMES.size()][reps];
        for (int r = 0; r < reps; r++) {
            for (RunResults.Prediction pr : perRepeat.get(r)) {
                int u = unitOf.get(pr.subject());
                truth[u] = pr.truth();
                score[r][u] = pr.score();
            }
            double[] v = values(Calibration.of(positives(truth, positive), score[r]));
            for (int k = 0; k < v.length; k++) {
                values[k][r] = v[k];
            }
        }
        double[] estimate = new double[NAMES.size()];
        for (int k = 0; k < estimate.length; k++) {
            estimate[k] = Evaluation.mean(values[k]);
        }
        List<Interval> ci = bootstrap(ex, p, truth, score, positive);
        for (int k = 0; k < NAMES.size(); k++) {
            Interval c = Double.isNaN(estimate[k]) ? Interval.undefined() : ci.get(k);
            out.add(new Evaluation.MetricRow(p, NAMES.get(k), estimate[k], Evaluation.sd(values[k]),
                    c.isDefined() ? c.low() : Double.NaN, c.isDefined() ? c.high() : Double.NaN,
                    c.isDefined() ? "bootstrap" : "", reps, n));
        }
        return out;
    }

    /**
     * The three rows of one pipeline on an independent cohort (one test set, every subject once): the values on its
     * predictions and the subject-level stratified bootstrap intervals, seeded as its other metrics' are; blank rows
     * when {@code probability} is null (decision values, labels only, three or more groups).
     *
     * @param truth       each subject's class index
     * @param probability each subject's probability of the positive group, or null
     */
    static List<IndependentResults.Metric> external(Pipeline p, int[] truth, double[] probability,
                                                    IndependentResults.Settings s, int n) {
        List<IndependentResults.Metric> out = new ArrayList<>();
        if (probability == null) {
            NAMES.forEach(m -> out.add(new IndependentResults.Metric(p, m, Double.NaN, Double.NaN, Double.NaN, "",
                    n)));
            return out;
        }
        int positive = s.positiveIndex();
        double[] v = values(Calibration.of(positives(truth, positive), probability));
        List<Interval> ci = intervals(s.significance(), truth, new double[][] {probability}, positive,
                Seeds.derive(s.seed(), "bootstrap", "independent/" + p.label(), "calibration"));
        for (int k = 0; k < NAMES.size(); k++) {
            Interval c = Double.isNaN(v[k]) ? Interval.undefined() : ci.get(k);
            out.add(new IndependentResults.Metric(p, NAMES.get(k), v[k], c.isDefined() ? c.low() : Double.NaN,
                    c.isDefined() ? c.high() : Double.NaN, c.isDefined() ? "bootstrap" : "", n));
        }
        return out;
    }

    /** The three intervals from one set of resamples; undefined for a value that any resample leaves undefined. */
    private static List<Interval> bootstrap(Experiment ex, Pipeline p, int[] truth, double[][] score, int positive) {
        return intervals(ex.spec().significance(), truth, score, positive,
                Seeds.derive(ex.spec().seed(), "bootstrap", p.label(), "calibration"));
    }

    /**
     * The three intervals of the mean over the rows of {@code score} (one row per repeat, or one row for a single
     * test set) from one set of stratified subject-level resamples.
     */
    private static List<Interval> intervals(Specs.Significance sig, int[] truth, double[][] score, int positive,
                                            long seed) {
        if (sig.bootstrap() == 0) {
            return java.util.Collections.nCopies(NAMES.size(), Interval.undefined());
        }
        int[] undefined = new int[NAMES.size()];
        List<Interval> ci = Bootstrap.percentiles(truth, units -> {
            boolean[] pos = new boolean[units.length];
            double[] prob = new double[units.length];
            for (int i = 0; i < units.length; i++) {
                pos[i] = truth[units[i]] == positive;
            }
            double[] sum = new double[NAMES.size()];
            for (double[] s : score) {
                for (int i = 0; i < units.length; i++) {
                    prob[i] = s[units[i]];
                }
                double[] v = values(Calibration.of(pos, prob));
                for (int k = 0; k < sum.length; k++) {
                    sum[k] += v[k] / score.length;
                }
            }
            for (int k = 0; k < sum.length; k++) {
                undefined[k] += Double.isNaN(sum[k]) ? 1 : 0;
            }
            return sum;
        }, NAMES.size(), sig.bootstrap(), sig.confidence(), seed);
        List<Interval> out = new ArrayList<>();
        for (int k = 0; k < NAMES.size(); k++) {
            out.add(undefined[k] > 0 ? Interval.undefined() : ci.get(k));
        }
        return out;
    }

    private static double[] values(Calibration c) {
        return new double[] {c.brier(), c.intercept(), c.slope()};
    }

    private static boolean[] positives(int[] truth, int positive) {
        boolean[] out = new boolean[truth.length];
        for (int i = 0; i < truth.length; i++) {
            out[i] = truth[i] == positive;
        }
        return out;
    }
}
