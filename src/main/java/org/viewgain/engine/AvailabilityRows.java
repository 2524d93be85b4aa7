package org.viewgain.engine;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.viewgain.folds.Seeds;
import org.viewgain.spec.FeatureSet;
import org.viewgain.spec.Specs;
import org.viewgain.stats.Bootstrap;
import org.viewgain.stats.ClassificationMetrics;
import org.viewgain.stats.Interval;

/**
 * The availability curve's table: per level and imputer, the imputation error and skill on the outer-test subjects
 * with an observed target; per level, imputer and classifier, the balanced accuracy and AUC of source+imputed and
 * their differences from source, each with its interval. Every number is computed as the run's own tables compute it
 * (metrics as {@code metrics.csv}, with {@link MetricIntervals}; differences as {@code comparisons.csv}: the corrected
 * repeated cross-validation t-test's for balanced accuracy, DeLong's for AUC), so the full-data level reproduces the
 * run's rows. Imputation measures are averaged over every outer-test subject and repeat (as
 * {@code imputation_summary.csv}) with a seeded subject-level percentile bootstrap interval (subjects resampled,
 * each carrying its repeats).
 */
public final class AvailabilityRows {
    private AvailabilityRows() {
    }

    /**
     * One measure at one level.
     *
     * @param level       from 1, in curve order (the full data last)
     * @param targetsMean the training subjects with a target the level kept, averaged over outer folds
     * @param classifier  empty for the imputation measures, which do not depend on the classifier
     * @param measure     {@code imputation_mae}, {@code imputation_skill}, {@code balanced_accuracy}, {@code auc},
     *                    {@code balanced_accuracy_gain} or {@code auc_gain}
     */
    public record Row(int level, String label, double fraction, int count, boolean full, double targetsMean,
                      int targetsMin, int targetsMax, String imputer, String classifier, String measure,
                      double estimate, double ciLow, double ciHigh, String ciMethod, int n) {
    }

    public static List<Row> of(RunResults res) {
        List<Row> out = new ArrayList<>();
        Experiment ex = res.experiment();
        List<RunResults.AvailabilityLevel> levels = res.availability();
        for (int l = 0; l < levels.size(); l++) {
            RunResults.AvailabilityLevel lv = levels.get(l);
            List<RunResults.Prediction> predictions = new ArrayList<>(lv.predictions());
            res.predictions().stream().filter(p -> p.pipeline().featureSet() == FeatureSet.SOURCE)
                    .forEach(predictions::add);
            RunResults at = new RunResults(ex, res.plan(), predictions, List.of(), lv.quality(), List.of(),
                    List.of(), List.of(), Map.of());
            double mean = lv.targets().stream().mapToInt(Integer::intValue).average().orElse(Double.NaN);
            int min = lv.targets().stream().mapToInt(Integer::intValue).min().orElse(0);
            int max = lv.targets().stream().mapToInt(Integer::intValue).max().orElse(0);
            Prefix head = new Prefix(l + 1, lv, mean, min, max);
            for (Resolved.Imputer imp : ex.imputers()) {
                out.addAll(imputation(ex, head, imp.name(), lv.quality()));
                for (Resolved.Classifier cl : ex.classifiers()) {
                    Pipeline withImputed = new Pipeline(imp.name(), FeatureSet.SOURCE_IMPUTED, cl.name());
                    Pipeline source = new Pipeline(Pipeline.NO_IMPUTER, FeatureSet.SOURCE, cl.name());
                    out.addAll(classification(at, head, withImputed, source));
                }
            }
        }
        return out;
    }

    private record Prefix(int level, RunResults.AvailabilityLevel lv, double mean, int min, int max) {
        Row row(String imputer, String classifier, String measure, double estimate, double low, double high,
                String method, int n) {
            return new Row(level, lv.label(), lv.fraction(), lv.count(), lv.full(), mean, min, max, imputer,
                    classifier, measure, estimate, low, high, method, n);
        }
    }

    private static List<Row> classification(RunResults at, Prefix head, Pipeline p, Pipeline source) {
        Experiment ex = at.experiment();
        List<Row> out = new ArrayList<>();
        List<Map<String, Double>> perRepeat = new ArrayList<>();
        List<List<RunResults.Prediction>> predictions = new ArrayList<>();
        int n = 0;
        for (int r = 0; r < at.plan().repeats(); r++) {
            List<RunResults.Prediction> ps = Evaluation.select(at, p, r, -1);
            n = ps.size();
            predictions.add(ps);
            perRepeat.add(Evaluation.compute(ex, ps));
        }
        Map<String, Double> estimates = new LinkedHashMap<>();
        for (String m : ClassificationMetrics.NAMES) {
            estimates.put(m, Evaluation.mean(perRepeat.stream().mapToDouble(x -> x.get(m)).toArray()));
        }
        Map<String, MetricIntervals.Ci> ci = MetricIntervals.of(ex, p, predictions, estimates);
        for (String m : List.of("balanced_accuracy", "auc")) {
            MetricIntervals.Ci c = ci.get(m);
            out.add(head.row(p.imputer(), p.classifier(), m, estimates.get(m), c.low(), c.high(), c.method(), n));
        }
        Comparisons.Row ba = null;
        Comparisons.Row auc = null;
        for (Comparisons.Row r : Comparisons.unadjusted(at, p, source)) {
            if (r.test().equals("corrected-t")) {
                ba = r;
            } else if (r.test().equals("delong")) {
                auc = r;
            }
        }
        out.add(ba == null ? head.row(p.imputer(), p.classifier(), "balanced_accuracy_gain", Double.NaN, Double.NaN,
                Double.NaN, "", n) : head.row(p.imputer(), p.classifier(), "balanced_accuracy_gain", ba.difference(),
                ba.ciLow(), ba.ciHigh(), "corrected-t", ba.n()));
        out.add(auc == null ? head.row(p.imputer(), p.classifier(), "auc_gain", Double.NaN, Double.NaN, Double.NaN,
                "", n) : head.row(p.imputer(), p.classifier(), "auc_gain", auc.difference(), auc.ciLow(),
                auc.ciHigh(), "delong", auc.n()));
        return out;
    }

    private static List<Row> imputation(Experiment ex, Prefix head, String imputer,
                                        List<RunResults.ImputationRow> quality) {
        List<Row> out = new ArrayList<>();
        Specs.Significance sig = ex.spec().significance();
        for (String measure : List.of("imputation_mae", "imputation_skill")) {
            // per subject: the sum and count of its finite values over repeats
            Map<Integer, double[]> bySubject = new LinkedHashMap<>();
            double sum = 0;
            int count = 0;
            for (RunResults.ImputationRow q : quality) {
                double v = measure.equals("imputation_mae") ? q.mae() : q.skill();
                if (q.imputer().equals(imputer) && Double.isFinite(v)) {
                    double[] acc = bySubject.computeIfAbsent(q.subject(), k -> new double[2]);
                    acc[0] += v;
                    acc[1]++;
                    sum += v;
                    count++;
                }
            }
            double[][] units = bySubject.values().toArray(double[][]::new);
            // summed in row order, as imputation_summary.csv sums them, so the full-data level reproduces it
            double estimate = count == 0 ? Double.NaN : sum / count;
            Interval ci = Interval.undefined();
            if (units.length > 1 && sig.bootstrap() > 0) {
                ci = Bootstrap.percentile(new int[units.length], sample -> pooled(units, sample), sig.bootstrap(),
                        sig.confidence(), Seeds.derive(ex.spec().seed(), "bootstrap", "availability", imputer,
                                measure));
            }
            out.add(head.row(imputer, "", measure, estimate, ci.isDefined() ? ci.low() : Double.NaN,
                    ci.isDefined() ? ci.high() : Double.NaN, ci.isDefined() ? "bootstrap" : "", units.length));
        }
        return out;
    }

    /** The sum over the sampled units of their sums divided by the sum of their counts. */
    private static double pooled(double[][] units, int[] sample) {
        double sum = 0;
        double count = 0;
        for (int k : sample) {
            double[] u = units[k];
            sum += u[0];
            count += u[1];
        }
        return count == 0 ? Double.NaN : sum / count;
    }
}
