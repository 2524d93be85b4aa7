package org.viewgain.engine;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.viewgain.stats.ClassificationMetrics;

/**
 * Metrics from out-of-fold predictions: per pipeline and repeat on the pooled predictions of that repeat, then the
 * mean and standard deviation over repeats (with calibration, {@link CalibrationMetrics}); and per outer fold (for
 * paired fold-wise tests; without calibration, whose slope is rarely defined in a fold of a few subjects).
 */
public final class Evaluation {
    private Evaluation() {
    }

    /** Names of the calibration rows of {@link #metrics}: Brier score, calibration intercept and slope. */
    public static final List<String> CALIBRATION = CalibrationMetrics.NAMES;

    /** A metric of one pipeline: mean over repeats, its spread, and n subjects per repeat. */
    public record MetricRow(Pipeline pipeline, String metric, double estimate, double sdOverRepeats, double ciLow,
                            double ciHigh, String ciMethod, int repeats, int n) {
    }

    /** A metric of one pipeline in one outer fold (or one whole repeat when fold is -1). */
    public record FoldMetricRow(Pipeline pipeline, int repeat, int fold, String metric, double value, int n) {
    }

    /**
     * Metrics per pipeline, averaged over repeats, in pipeline order then metric order: those of
     * {@link ClassificationMetrics#NAMES}, then the calibration rows ({@link #CALIBRATION}; blank unless the scores are
     * probabilities of one of two groups).
     */
    public static List<MetricRow> metrics(RunResults res) {
        List<MetricRow> out = new ArrayList<>();
        Experiment ex = res.experiment();
        for (Pipeline p : ex.pipelines()) {
            List<Map<String, Double>> perRepeat = new ArrayList<>();
            List<List<RunResults.Prediction>> predictions = new ArrayList<>();
            int n = 0;
            for (int r = 0; r < res.plan().repeats(); r++) {
                List<RunResults.Prediction> ps = select(res, p, r, -1);
                n = ps.size();
                predictions.add(ps);
                perRepeat.add(compute(ex, ps));
            }
            Map<String, Double> estimates = new LinkedHashMap<>();
            for (String m : ClassificationMetrics.NAMES) {
                estimates.put(m, mean(perRepeat.stream().mapToDouble(x -> x.get(m)).toArray()));
            }
            Map<String, MetricIntervals.Ci> ci = MetricIntervals.of(ex, p, predictions, estimates);
            for (String m : ClassificationMetrics.NAMES) {
                double[] v = perRepeat.stream().mapToDouble(x -> x.get(m)).toArray();
                MetricIntervals.Ci c = ci.get(m);
                out.add(new MetricRow(p, m, mean(v), sd(v), c.low(), c.high(), c.method(), v.length, n));
            }
            out.addAll(CalibrationMetrics.rows(ex, p, predictions, n));
        }
        return out;
    }

    /** Metrics per pipeline, repeat and outer fold; folds where the pipeline tested nobody have no rows. */
    public static List<FoldMetricRow> foldMetrics(RunResults res) {
        List<FoldMetricRow> out = new ArrayList<>();
        Experiment ex = res.experiment();
        for (Pipeline p : ex.pipelines()) {
            for (int r = 0; r < res.plan().repeats(); r++) {
                for (int f = 0; f < res.plan().folds(r); f++) {
                    List<RunResults.Prediction> ps = select(res, p, r, f);
                    if (ps.isEmpty()) {
                        continue; // no test subject of this pipeline's population in the fold (leave-one-out)
                    }
                    Map<String, Double> m = compute(ex, ps);
                    for (String name : ClassificationMetrics.NAMES) {
                        out.add(new FoldMetricRow(p, r, f, name, m.get(name), ps.size()));
                    }
                }
            }
        }
        return out;
    }

    static List<RunResults.Prediction> select(RunResults res, Pipeline p, int repeat, int fold) {
        List<RunResults.Prediction> out = new ArrayList<>();
        for (RunResults.Prediction pr : res.predictions()) {
            if (pr.pipeline().equals(p) && pr.repeat() == repeat && (fold < 0 || pr.fold() == fold)) {
                out.add(pr);
            }
        }
        return out;
    }

    /** The metrics of a set of predictions (all NaN for none); scores count only when every prediction has them. */
    static Map<String, Double> compute(Experiment ex, List<RunResults.Prediction> ps) {
        int n = ps.size();
        if (n == 0) {
            Map<String, Double> empty = new LinkedHashMap<>();
            ClassificationMetrics.NAMES.forEach(m -> empty.put(m, Double.NaN));
            return empty;
        }
        int[] truth = new int[n];
        int[] pred = new int[n];
        boolean scores = true;
        for (int i = 0; i < n; i++) {
            truth[i] = ps.get(i).truth();
            pred[i] = ps.get(i).predicted();
            scores &= ps.get(i).scores() != null;
        }
        double[][] all = scores ? ps.stream().map(RunResults.Prediction::scores).toArray(double[][]::new) : null;
        return of(ex, truth, pred, all);
    }

    /**
     * The one computation of metrics from predictions, for the inner folds' tuning, the tables, the permutations and
     * the sites: two-group metrics for the positive group (its column of {@code scores}), macro metrics for more.
     *
     * @param scores scores per subject and class, or null when the classifier gives none
     */
    static Map<String, Double> of(Experiment ex, int[] truth, int[] pred, double[][] scores) {
        int classes = ex.spec().cohort().groups().size();
        int positive = ex.spec().cohort().positiveIndex();
        if (classes == 2) {
            double[] s = null;
            if (scores != null) {
                s = new double[truth.length];
                for (int i = 0; i < s.length; i++) {
                    s[i] = scores[i][positive];
                }
            }
            return ClassificationMetrics.binary(truth, pred, s, positive);
        }
        return ClassificationMetrics.multiclass(truth, pred, scores, classes);
    }

    /**
     * The statistic of the permutation test, for the run's labels and for each permutation's alike: the metric of
     * each repeat's pooled out-of-fold predictions, averaged over the repeats.
     *
     * @param ofRepeat the out-of-fold predictions of repeat r
     */
    static double pooled(Experiment ex, int repeats, java.util.function.IntFunction<List<RunResults.Prediction>> ofRepeat,
                         String metric) {
        double sum = 0;
        for (int r = 0; r < repeats; r++) {
            sum += compute(ex, ofRepeat.apply(r)).get(metric);
        }
        return sum / repeats;
    }

    static double mean(double[] v) {
        double s = 0;
        for (double x : v) {
            s += x;
        }
        return s / v.length;
    }

    static double sd(double[] v) {
        if (v.length < 2) {
            return Double.NaN;
        }
        double m = mean(v);
        double s = 0;
        for (double x : v) {
            s += (x - m) * (x - m);
        }
        return Math.sqrt(s / (v.length - 1));
    }
}
