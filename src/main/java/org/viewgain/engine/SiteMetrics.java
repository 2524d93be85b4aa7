package org.viewgain.engine;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.viewgain.stats.ClassificationMetrics;

/**
 * Metrics of each pipeline within each site: per repeat on the pooled out-of-fold predictions of the site's subjects,
 * then the mean over repeats. A metric undefined within a site (e.g. balanced accuracy when a group is absent there)
 * is NaN.
 */
public final class SiteMetrics {
    private SiteMetrics() {
    }

    /** A metric of one pipeline on one site's subjects; {@code n} subjects predicted per repeat. */
    public record Row(Pipeline pipeline, String site, String metric, double estimate, int n) {
    }

    /** Rows in pipeline order, sites in text order, metrics in {@link ClassificationMetrics#NAMES} order. */
    public static List<Row> rows(RunResults res) {
        Experiment ex = res.experiment();
        List<Row> out = new ArrayList<>();
        if (ex.spec().cohort().site() == null) {
            return out;
        }
        int classes = ex.spec().cohort().groups().size();
        for (Pipeline p : ex.pipelines()) {
            // site -> repeat -> predictions
            Map<String, List<List<RunResults.Prediction>>> bySite = new TreeMap<>();
            for (RunResults.Prediction pr : res.predictions()) {
                if (pr.pipeline().equals(p)) {
                    List<List<RunResults.Prediction>> perRepeat = bySite.computeIfAbsent(
                            ex.data().subjects().get(pr.subject()).site(), s -> newRepeats(res.plan().repeats()));
                    perRepeat.get(pr.repeat()).add(pr);
                }
            }
            bySite.forEach((site, perRepeat) -> {
                double[][] values = new double[ClassificationMetrics.NAMES.size()][perRepeat.size()];
                for (int r = 0; r < perRepeat.size(); r++) {
                    Map<String, Double> m = compute(ex, perRepeat.get(r), classes);
                    for (int k = 0; k < values.length; k++) {
                        values[k][r] = m.get(ClassificationMetrics.NAMES.get(k));
                    }
                }
                for (int k = 0; k < values.length; k++) {
                    double mean = java.util.Arrays.stream(values[k]).average().orElse(Double.NaN);
                    out.add(new Row(p, site, ClassificationMetrics.NAMES.get(k), mean, perRepeat.get(0).size()));
                }
            });
        }
        return out;
    }

    private static List<List<RunResults.Prediction>> newRepeats(int repeats) {
        List<List<RunResults.Prediction>> out = new ArrayList<>();
        for (int r = 0; r < repeats; r++) {
            out.add(new ArrayList<>());
        }
        return out;
    }

    private static Map<String, Double> compute(Experiment ex, List<RunResults.Prediction> ps, int classes) {
        int n = ps.size();
        int[] truth = new int[n];
        int[] pred = new int[n];
        double[][] scores = new double[n][];
        boolean all = n > 0;
        for (int i = 0; i < n; i++) {
            truth[i] = ps.get(i).truth();
            pred[i] = ps.get(i).predicted();
            scores[i] = ps.get(i).scores();
            all &= scores[i] != null;
        }
        return Evaluation.of(ex, truth, pred, all ? scores : null);
    }
}
