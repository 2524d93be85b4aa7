package org.viewgain.engine;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.viewgain.imputation.ImputationQuality;
import org.viewgain.spec.FeatureSet;
import org.viewgain.spec.Specs;
import org.viewgain.stats.ClassificationMetrics;
import org.viewgain.stats.DeLong;
import org.viewgain.stats.McNemar;

/**
 * What the frozen pipelines give on an independent cohort: every subject's prediction; with labels, the metrics
 * with intervals and the paired comparisons of source+imputed against source (DeLong for AUC, exact McNemar for
 * correctness, on the same subjects) and, for probabilities of two groups, calibration (Brier score, calibration
 * intercept and slope); where some targets were observed, imputation quality. The corrected
 * repeated-CV t-test does not apply: one test set has no folds to vary over.
 */
public record IndependentResults(String cohort, List<Row> predictions, List<Metric> metrics,
                                 List<Comparison> comparisons, List<Quality> quality) {
    public IndependentResults {
        predictions = List.copyOf(predictions);
        metrics = List.copyOf(metrics);
        comparisons = List.copyOf(comparisons);
        quality = List.copyOf(quality);
    }

    /**
     * The settings the results need: groups, intervals, the seed of the bootstrap, and the classifiers (by name)
     * whose scores are probabilities, which the calibration rows apply to.
     */
    public record Settings(List<String> groups, String positive, Specs.Significance significance, long seed,
                           java.util.Set<String> probabilityClassifiers) {
        public Settings {
            groups = List.copyOf(groups);
            probabilityClassifiers = java.util.Set.copyOf(probabilityClassifiers);
        }

        public static Settings of(Experiment ex) {
            java.util.Set<String> probability = new java.util.TreeSet<>();
            ex.classifiers().stream().filter(c -> "probability".equals(c.method().scoreKind()))
                    .forEach(c -> probability.add(c.name()));
            return new Settings(ex.spec().cohort().groups(), ex.spec().cohort().positive(),
                    ex.spec().significance(), ex.spec().seed(), probability);
        }

        int positiveIndex() {
            return positive == null ? -1 : groups.indexOf(positive);
        }
    }

    /** One subject's prediction by one pipeline; {@code truth} null without labels. */
    public record Row(Pipeline pipeline, String subject, String truth, String predicted, double score) {
    }

    /** One metric of one pipeline with its interval. */
    public record Metric(Pipeline pipeline, String metric, double estimate, double low, double high, String method,
                         int n) {
    }

    /** A paired test of two pipelines on the same subjects. */
    public record Comparison(Pipeline a, Pipeline b, String test, double estimateA, double estimateB,
                             double statistic, double p, int n) {
    }

    /** Imputation quality of one subject with an observed target. */
    public record Quality(String imputer, String subject, double mae, double rmse, double pearsonR) {
    }

    /** Applies every pipeline to the cohort and computes what its labels and targets allow. */
    public static IndependentResults of(List<FrozenPipeline> pipelines, IndependentData d, Settings s) {
        List<Row> rows = new ArrayList<>();
        List<Metric> metrics = new ArrayList<>();
        Map<Pipeline, List<FrozenPipeline.Prediction>> byPipeline = new LinkedHashMap<>();
        // pipelines sharing an imputer (by name: one fit in a run, one part in a bundle) impute the cohort once
        Map<String, double[][]> imputations = new java.util.HashMap<>();
        for (FrozenPipeline fp : pipelines) {
            double[][] imputed = !fp.pipeline().featureSet().needsImputer() ? null
                    : imputations.computeIfAbsent(fp.pipeline().imputer(),
                            name -> fp.impute(d, FrozenPipeline.everyone(d)));
            List<FrozenPipeline.Prediction> pr = fp.predict(d, imputed);
            byPipeline.put(fp.pipeline(), pr);
            for (FrozenPipeline.Prediction x : pr) {
                rows.add(new Row(fp.pipeline(), d.id(x.subject()), d.y() == null ? null : s.groups().get(d.y()[x.subject()]),
                        s.groups().get(x.predicted()), x.score()));
            }
            if (d.y() != null && !pr.isEmpty()) {
                metrics.addAll(metrics(fp.pipeline(), pr, d, s));
            }
        }
        List<Comparison> comparisons = d.y() == null ? List.of() : comparisons(byPipeline, d, s);
        return new IndependentResults(d.spec().name(), rows, metrics, comparisons, quality(pipelines, d));
    }

    private static List<Metric> metrics(Pipeline p, List<FrozenPipeline.Prediction> pr, IndependentData d,
                                        Settings s) {
        int n = pr.size();
        int[] truth = new int[n];
        int[] pred = new int[n];
        double[][] scores = pr.get(0).scores() == null ? null : new double[n][];
        List<RunResults.Prediction> asRun = new ArrayList<>(n);
        for (int t = 0; t < n; t++) {
            FrozenPipeline.Prediction x = pr.get(t);
            truth[t] = d.y()[x.subject()];
            pred[t] = x.predicted();
            if (scores != null) {
                scores[t] = x.scores();
            }
            asRun.add(new RunResults.Prediction(p, 0, 0, x.subject(), truth[t], x.predicted(), x.score(),
                    x.scores()));
        }
        int classes = s.groups().size();
        Map<String, Double> est;
        if (classes == 2) {
            double[] pos = null;
            if (scores != null) {
                pos = new double[n];
                for (int t = 0; t < n; t++) {
                    pos[t] = scores[t][s.positiveIndex()];
                }
            }
            est = ClassificationMetrics.binary(truth, pred, pos, s.positiveIndex());
        } else {
            est = ClassificationMetrics.multiclass(truth, pred, scores, classes);
        }
        Map<String, MetricIntervals.Ci> init = new LinkedHashMap<>();
        ClassificationMetrics.NAMES.forEach(m -> init.put(m, MetricIntervals.Ci.NONE));
        Map<String, MetricIntervals.Ci> ci = MetricIntervals.of(s.significance(), classes, s.positiveIndex(),
                s.seed(), "independent/" + p.label(), List.of(asRun), init, est);
        List<Metric> out = new ArrayList<>();
        for (String m : ClassificationMetrics.NAMES) {
            MetricIntervals.Ci c = ci.get(m);
            out.add(new Metric(p, m, est.get(m), c.low(), c.high(), c.method(), n));
        }
        // the positive group's probabilities, or null when the scores are not probabilities of two groups
        double[] pos = classes == 2 && scores != null && s.probabilityClassifiers().contains(p.classifier())
                ? java.util.Arrays.stream(scores).mapToDouble(x -> x[s.positiveIndex()]).toArray() : null;
        out.addAll(CalibrationMetrics.external(p, truth, pos, s, n));
        return out;
    }

    /** source+imputed against source with the same classifier, on every subject (both use everyone). */
    private static List<Comparison> comparisons(Map<Pipeline, List<FrozenPipeline.Prediction>> byPipeline,
                                                IndependentData d, Settings s) {
        List<Comparison> out = new ArrayList<>();
        for (Pipeline a : byPipeline.keySet()) {
            if (a.featureSet() != FeatureSet.SOURCE_IMPUTED) {
                continue;
            }
            Pipeline b = new Pipeline(Pipeline.NO_IMPUTER, FeatureSet.SOURCE, a.classifier());
            if (!byPipeline.containsKey(b)) {
                continue;
            }
            List<FrozenPipeline.Prediction> pa = byPipeline.get(a);
            List<FrozenPipeline.Prediction> pb = byPipeline.get(b);
            int n = pa.size();
            int[] truth = new int[n];
            int[] qa = new int[n];
            int[] qb = new int[n];
            double[] sa = new double[n];
            double[] sb = new double[n];
            boolean[] positive = new boolean[n];
            for (int t = 0; t < n; t++) {
                truth[t] = d.y()[pa.get(t).subject()];
                qa[t] = pa.get(t).predicted();
                qb[t] = pb.get(t).predicted();
                sa[t] = pa.get(t).score();
                sb[t] = pb.get(t).score();
                positive[t] = truth[t] == s.positiveIndex();
            }
            McNemar.Discordant dis = McNemar.discordant(truth, qa, qb);
            double accA = accuracy(truth, qa);
            double accB = accuracy(truth, qb);
            out.add(new Comparison(a, b, "mcnemar_exact", accA, accB, dis.onlyACorrect() - dis.onlyBCorrect(),
                    McNemar.exactP(dis), n));
            boolean scored = s.groups().size() == 2 && !Double.isNaN(sa[0]) && !Double.isNaN(sb[0]);
            boolean bothGroups = scored && java.util.stream.IntStream.range(0, n).anyMatch(t -> positive[t])
                    && java.util.stream.IntStream.range(0, n).anyMatch(t -> !positive[t]);
            if (bothGroups) {
                DeLong.Comparison c = DeLong.compare(sa, sb, positive);
                out.add(new Comparison(a, b, "delong_auc", c.aucA(), c.aucB(), c.z(), c.p(), n));
            }
        }
        return out;
    }

    private static double accuracy(int[] truth, int[] pred) {
        int k = 0;
        for (int t = 0; t < truth.length; t++) {
            k += truth[t] == pred[t] ? 1 : 0;
        }
        return (double) k / truth.length;
    }

    /** Per imputer (once), quality on the subjects with an observed target. */
    private static List<Quality> quality(List<FrozenPipeline> pipelines, IndependentData d) {
        List<Quality> out = new ArrayList<>();
        if (d.target() == null || d.withTarget() == 0) {
            return out;
        }
        int[] who = java.util.stream.IntStream.range(0, d.n()).filter(d::hasTarget).toArray();
        java.util.Set<String> done = new java.util.HashSet<>();
        for (FrozenPipeline fp : pipelines) {
            if (fp.imputer() == null || !done.add(fp.pipeline().imputer())) {
                continue;
            }
            double[][] imp = fp.impute(d, who);
            for (int t = 0; t < who.length; t++) {
                double[] obs = d.target().base(d.id(who[t]));
                out.add(new Quality(fp.pipeline().imputer(), d.id(who[t]), ImputationQuality.mae(obs, imp[t]),
                        ImputationQuality.rmse(obs, imp[t]), ImputationQuality.pearsonR(obs, imp[t])));
            }
        }
        return out;
    }
}
