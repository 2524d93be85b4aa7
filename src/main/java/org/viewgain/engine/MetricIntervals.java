package org.viewgain.engine;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.viewgain.folds.Seeds;
import org.viewgain.spec.Specs;
import org.viewgain.stats.Bootstrap;
import org.viewgain.stats.ClassificationMetrics;
import org.viewgain.stats.DeLong;
import org.viewgain.stats.Interval;
import org.viewgain.stats.Wilson;

/**
 * Intervals for the repeat-averaged metrics of one pipeline: Wilson score intervals for proportions (Newcombe 1998)
 * at the number of subjects counted, a DeLong interval for AUC (DeLong et al. 1988; variance averaged over repeats)
 * and a seeded subject-level stratified bootstrap for balanced accuracy, F1 and MCC (and for every metric of three or
 * more groups). Repeats reuse the same subjects, so n is the number of subjects, not subjects times repeats.
 */
final class MetricIntervals {
    private MetricIntervals() {
    }

    /** An interval and how it was computed. */
    record Ci(double low, double high, String method) {
        static final Ci NONE = new Ci(Double.NaN, Double.NaN, "");
    }

    /**
     * @param perRepeat predictions of each repeat; every repeat holds the same subjects
     * @param estimates the repeat-averaged metric values
     */
    static Map<String, Ci> of(Experiment ex, Pipeline p, List<List<RunResults.Prediction>> perRepeat,
                              Map<String, Double> estimates) {
        Map<String, Ci> out = new LinkedHashMap<>();
        ClassificationMetrics.NAMES.forEach(m -> out.put(m, Ci.NONE));
        if (perRepeat.isEmpty() || perRepeat.get(0).isEmpty()) {
            return out;
        }
        return of(ex.spec().significance(), ex.spec().cohort().groups().size(), ex.spec().cohort().positiveIndex(),
                ex.spec().seed(), p.label(), perRepeat, out, estimates);
    }

    /** The same for settings given one by one (a bundle applied to a later cohort has no experiment). */
    static Map<String, Ci> of(Specs.Significance sig, int classes, int positive, long runSeed, String label,
                              List<List<RunResults.Prediction>> perRepeat, Map<String, Ci> out,
                              Map<String, Double> estimates) {
        double conf = sig.confidence();
        // align repeats by subject
        List<RunResults.Prediction> first = perRepeat.get(0);
        int n = first.size();
        Map<Integer, Integer> unitOf = new LinkedHashMap<>();
        for (RunResults.Prediction pr : first) {
            unitOf.put(pr.subject(), unitOf.size());
        }
        int reps = perRepeat.size();
        int[] truth = new int[n];
        int[][] pred = new int[reps][n];
        double[][] score = new double[reps][n];
        for (int r = 0; r < reps; r++) {
            for (RunResults.Prediction pr : perRepeat.get(r)) {
                int u = unitOf.get(pr.subject());
                truth[u] = pr.truth();
                pred[r][u] = pr.predicted();
                score[r][u] = pr.score();
            }
        }
        if (classes == 2) {
            int pos = (int) Arrays.stream(truth).filter(t -> t == positive).count();
            out.put("accuracy", wilson(estimates.get("accuracy"), n, conf));
            out.put("sensitivity", wilson(estimates.get("sensitivity"), pos, conf));
            out.put("specificity", wilson(estimates.get("specificity"), n - pos, conf));
            out.put("auc", delong(estimates.get("auc"), truth, score, positive, conf));
        }
        if (sig.bootstrap() > 0) {
            List<String> boot = classes == 2 ? List.of("balanced_accuracy", "f1", "mcc")
                    : List.of("accuracy", "balanced_accuracy", "sensitivity", "specificity", "f1", "mcc");
            for (String m : boot) {
                long seed = Seeds.derive(runSeed, "bootstrap", label, m);
                Interval ci = Bootstrap.percentile(truth, units -> {
                    double sum = 0;
                    int[] t = new int[units.length];
                    int[] q = new int[units.length];
                    for (int r = 0; r < reps; r++) {
                        for (int k = 0; k < units.length; k++) {
                            t[k] = truth[units[k]];
                            q[k] = pred[r][units[k]];
                        }
                        Map<String, Double> v = classes == 2 ? ClassificationMetrics.binary(t, q, null, positive)
                                : ClassificationMetrics.multiclass(t, q, null, classes);
                        sum += v.get(m);
                    }
                    return sum / reps;
                }, sig.bootstrap(), conf, seed);
                out.put(m, ci.isDefined() ? new Ci(ci.low(), ci.high(), "bootstrap") : Ci.NONE);
            }
        }
        return out;
    }

    private static Ci wilson(double estimate, int trials, double conf) {
        if (Double.isNaN(estimate) || trials == 0) {
            return Ci.NONE;
        }
        Interval i = Wilson.interval(Math.round(estimate * trials), trials, conf);
        return new Ci(i.low(), i.high(), "wilson");
    }

    private static Ci delong(double estimate, int[] truth, double[][] score, int positive, double conf) {
        if (Double.isNaN(estimate)) {
            return Ci.NONE;
        }
        boolean[] pos = new boolean[truth.length];
        for (int i = 0; i < truth.length; i++) {
            pos[i] = truth[i] == positive;
        }
        List<Double> variances = new ArrayList<>();
        for (double[] s : score) {
            if (Arrays.stream(s).anyMatch(Double::isNaN)) {
                return Ci.NONE;
            }
            variances.add(DeLong.estimate(s, pos).variance());
        }
        double v = variances.stream().mapToDouble(Double::doubleValue).average().orElse(Double.NaN);
        double z = new org.apache.commons.math3.distribution.NormalDistribution().inverseCumulativeProbability(
                1 - (1 - conf) / 2);
        double half = z * Math.sqrt(v);
        return new Ci(Math.max(0, estimate - half), Math.min(1, estimate + half), "delong");
    }
}
