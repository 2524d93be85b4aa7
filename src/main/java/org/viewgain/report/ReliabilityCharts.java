package org.viewgain.report;

import java.awt.geom.Ellipse2D;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import org.viewgain.stats.Calibration;

/**
 * The calibration block of the charts: per classifier whose scores are probabilities, a reliability diagram of the
 * pooled out-of-fold predictions (predictions.csv), and the Brier score, calibration intercept and slope of every
 * such pipeline as metrics.csv gives them (mean over repeats, with intervals).
 */
final class ReliabilityCharts {
    static final int BINS = 10;
    /** The feature sets drawn in the diagram when the run has source+imputed: the comparison the tool is for. */
    private static final List<String> DRAWN = List.of("source", "source+imputed");
    private static final List<String> METRICS = List.of("brier", "calibration_intercept", "calibration_slope");

    private ReliabilityCharts() {
    }

    static String html(ReportData d) {
        if (d.predictions == null) {
            return Html.notComputed("calibration curves", "predictions.csv");
        }
        if (d.spec.path("cohort").path("groups").size() > 2) {
            return "<p class=\"absent\">Calibration is computed for two groups only (the probability of the "
                    + "positive group); this run has " + d.spec.path("cohort").path("groups").size()
                    + " groups, so its calibration rows in metrics.csv are blank.</p>\n";
        }
        Map<String, Map<String, PredictionCharts.Pooled>> pooled = PredictionCharts.pool(d);
        StringBuilder charts = new StringBuilder("<div class=\"grid\">");
        List<String> probabilityClassifiers = new ArrayList<>();
        List<String> notProb = new ArrayList<>();
        pooled.forEach((c, pipes) -> {
            // predictions.csv says what the scores are; runs written before it did are judged by the scores' range
            // (and a score outside [0, 1] is no probability, whatever the table says)
            boolean all = (!d.predictions.has("score_kind")
                    || d.predictions.rows().stream().filter(r -> r.s("classifier").equals(c))
                            .allMatch(r -> r.s("score_kind").equals("probability")))
                    && pipes.values().stream().allMatch(p -> Curves.probabilities(p.scores()));
            if (!all) {
                double lo = pipes.values().stream().flatMap(p -> p.score.stream()).mapToDouble(x -> x).min()
                        .orElse(Double.NaN);
                double hi = pipes.values().stream().flatMap(p -> p.score.stream()).mapToDouble(x -> x).max()
                        .orElse(Double.NaN);
                notProb.add(String.format(Locale.ROOT, "%s (scores from %.3g to %.3g)", c, lo, hi));
                return;
            }
            probabilityClassifiers.add(c);
            Map<String, PredictionCharts.Pooled> drawn = drawn(pipes);
            int smallest = Integer.MAX_VALUE;
            for (PredictionCharts.Pooled p : drawn.values()) {
                for (Calibration.ReliabilityBin b : Calibration.reliability(p.positives(), p.scores(), BINS)) {
                    smallest = b.n() > 0 ? Math.min(smallest, b.n()) : smallest;
                }
            }
            boolean some = drawn.size() < pipes.size();
            charts.append(Charts.figure(() -> chart(drawn), 480, 420, "Reliability of " + c + (some
                    ? " (source and source+imputed pipelines; every pipeline's numbers are in the table below)" : "")
                    + ": the out-of-fold probabilities of group " + d.positive() + " from every outer fold and repeat, "
                    + "pooled (each subject once per repeat), in " + BINS + " equal-width bins of [0, 1]; each point "
                    + "is a bin's mean predicted probability against the observed fraction in group " + d.positive()
                    + ", empty bins left out. On the dashed diagonal the predictions are calibrated; above it they "
                    + "are too low, below it too high. Limits: a bin of few subjects moves a lot by chance (the "
                    + "smallest drawn bin holds " + smallest + " predictions); pooling mixes the models of different "
                    + "folds; calibration says nothing about how well the groups are told apart (AUC).", d.redact));
        });
        StringBuilder b = new StringBuilder();
        if (!probabilityClassifiers.isEmpty()) {
            b.append(charts).append("</div>\n").append(table(d, probabilityClassifiers));
        }
        if (!notProb.isEmpty()) {
            b.append("<p class=\"absent\">No calibration for ").append(Html.esc(String.join("; ", notProb)))
                    .append(": their scores are not probabilities in [0, 1] but decision values (distances to a "
                            + "separating hyperplane). viewgain does not fit a mapping to probabilities (such as "
                            + "Platt scaling) inside the training folds, so its calibration rows in metrics.csv are "
                            + "blank.</p>\n");
        }
        if (pooled.isEmpty()) {
            b.append("<p class=\"absent\">No classifier in this run produced scores, so calibration cannot be "
                    + "shown.</p>\n");
        }
        return b.toString();
    }

    /**
     * The calibration part of the independent-cohort section: per classifier whose external_metrics.csv rows have a
     * Brier score (probabilities of two groups), a reliability diagram of its predictions on the independent cohort
     * and a table of Brier score, calibration intercept and slope there beside the cross-validated values; a line
     * saying why for the others. Empty when the table has no calibration rows (older runs).
     */
    static String external(ReportData d, CsvRows preds, CsvRows ext, String cohort) {
        if (ext.rows().stream().noneMatch(r -> r.s("metric").equals("brier"))) {
            return "";
        }
        List<String> calibrated = ext.rows().stream().filter(r -> r.s("metric").equals("brier")
                && !Double.isNaN(r.d("estimate"))).map(r -> r.s("classifier")).distinct().toList();
        Map<String, Map<String, PredictionCharts.Pooled>> pooled = PredictionCharts.pool(preds, d.positive());
        StringBuilder b = new StringBuilder("<h3>Calibration on the independent cohort</h3>\n<div class=\"grid\">");
        for (String c : calibrated) {
            Map<String, PredictionCharts.Pooled> drawn = drawn(pooled.getOrDefault(c, Map.of()));
            if (drawn.isEmpty()) {
                continue;
            }
            b.append(Charts.figure(() -> chart(drawn), 480, 420, "Reliability of " + c + " on " + cohort + ": the "
                    + "final pipelines' probabilities of group " + d.positive() + ", one per subject, in " + BINS
                    + " equal-width bins of [0, 1]; each point is a bin's mean predicted probability against the "
                    + "observed fraction in group " + d.positive() + ", empty bins left out. On the dashed diagonal "
                    + "the predictions are calibrated for this cohort; a shift of prevalence or of the scanner between "
                    + "the cohorts shows here as a curve off the diagonal.", d.redact));
        }
        b.append("</div>\n");
        Map<String, String> cv = new java.util.HashMap<>();
        if (d.metrics != null) {
            d.metrics.rows().forEach(r -> cv.put(Names.key(r) + "|" + r.s("metric"), r.s("estimate")));
        }
        List<List<String>> rows = new ArrayList<>();
        Map<String, Map<String, CsvRows.Row>> by = new LinkedHashMap<>();
        for (CsvRows.Row r : ext.rows()) {
            if (METRICS.contains(r.s("metric")) && calibrated.contains(r.s("classifier"))) {
                by.computeIfAbsent(Names.key(r), k -> new LinkedHashMap<>()).put(r.s("metric"), r);
            }
        }
        by.forEach((key, m) -> {
            CsvRows.Row any = m.values().iterator().next();
            List<String> cells = new ArrayList<>(List.of(Html.esc(Names.pipeline(any.s("imputer"),
                    any.s("feature_set"), any.s("classifier"))), Html.esc(any.s("n"))));
            for (String metric : METRICS) {
                CsvRows.Row r = m.get(metric);
                String inCv = cv.get(key + "|" + metric);
                cells.add(r == null || Double.isNaN(r.d("estimate")) ? "\u2013"
                        : Html.esc(Html.f3(r.d("estimate"))) + "<br>" + MetricPairs.interval(r, "", ""));
                cells.add(inCv == null || inCv.isEmpty() ? "\u2013" : Html.esc(Html.f3(Double.parseDouble(inCv))));
            }
            rows.add(cells);
        });
        b.append(Html.table("independent-calibration", List.of("pipeline", "n", "Brier score", "cross-validated",
                "calibration intercept", "cross-validated", "calibration slope", "cross-validated"), rows));
        List<String> blank = ext.rows().stream().filter(r -> r.s("metric").equals("brier")
                && Double.isNaN(r.d("estimate"))).map(r -> r.s("classifier")).distinct().toList();
        if (!blank.isEmpty()) {
            b.append("<p class=\"absent\">No calibration for ").append(Html.esc(String.join(", ", blank)))
                    .append(": its scores are decision values or labels, not probabilities.</p>\n");
        }
        return b.toString();
    }

    /** The source and source+imputed pipelines when the run has source+imputed; otherwise all of them. */
    private static Map<String, PredictionCharts.Pooled> drawn(Map<String, PredictionCharts.Pooled> pipes) {
        Map<String, PredictionCharts.Pooled> out = new LinkedHashMap<>();
        pipes.forEach((key, p) -> {
            if (DRAWN.contains(key.split("\\|", -1)[1])) {
                out.put(key, p);
            }
        });
        boolean imputed = out.keySet().stream().anyMatch(k -> k.split("\\|", -1)[1].equals("source+imputed"));
        return imputed ? out : pipes;
    }

    /** Brier score, calibration intercept and slope of each probability pipeline, from metrics.csv. */
    private static String table(ReportData d, List<String> classifiers) {
        if (d.metrics == null || d.metrics.rows().stream().noneMatch(r -> r.s("metric").equals("brier"))) {
            return "<p class=\"absent\">This run's metrics.csv has no calibration rows (it was written by an older "
                    + "viewgain); run the experiment again for the Brier score, calibration intercept and slope.</p>\n";
        }
        Map<String, Map<String, CsvRows.Row>> by = new LinkedHashMap<>();
        for (CsvRows.Row r : d.metrics.rows()) {
            if (METRICS.contains(r.s("metric")) && classifiers.contains(r.s("classifier"))) {
                by.computeIfAbsent(Names.key(r), k -> new LinkedHashMap<>()).put(r.s("metric"), r);
            }
        }
        List<List<String>> rows = new ArrayList<>();
        by.forEach((key, m) -> {
            CsvRows.Row any = m.values().iterator().next();
            List<String> cells = new ArrayList<>(List.of(
                    Html.esc(Names.pipeline(any.s("imputer"), any.s("feature_set"), any.s("classifier"))),
                    Html.esc(any.s("n"))));
            for (String metric : METRICS) {
                CsvRows.Row r = m.get(metric);
                cells.add(r == null ? "\u2013" : Html.num(metric + ".estimate", r.s("estimate"),
                        Html.f3(r.d("estimate"))) + "<br>" + MetricPairs.interval(r, metric + ".", ""));
            }
            rows.add(cells);
        });
        return Html.table("calibration", List.of("pipeline", "n", "Brier score", "calibration intercept",
                "calibration slope"), rows)
                + "<p class=\"small\">Mean over repeats of each repeat's value on its pooled out-of-fold predictions "
                + "(as AUC in metrics.csv), with the interval metrics.csv gives. Brier score: mean squared difference "
                + "between the predicted probability and the outcome (Brier 1950; 0 is perfect, always predicting "
                + "the prevalence p scores p(1 \u2212 p)). Calibration intercept (calibration-in-the-large): the "
                + "logistic regression of the outcome with logit(prediction) as an offset, 0 when the predictions "
                + "are right on average, above 0 when they are too low. Calibration slope: the logistic regression "
                + "of the outcome on logit(prediction), 1 when calibrated, below 1 when the predictions are too "
                + "extreme (typical of overfitting), above 1 when too modest (Cox 1958; Van Calster et al. 2016, "
                + "J Clin Epidemiol 74:167-176). A dash: undefined, e.g. a slope when the predictions separate the "
                + "groups completely. Intervals are wide in small cohorts.</p>\n";
    }

    private static JFreeChart chart(Map<String, PredictionCharts.Pooled> pipes) {
        XYSeriesCollection data = new XYSeriesCollection();
        for (PredictionCharts.Pooled p : pipes.values()) {
            XYSeries s = new XYSeries(String.format(Locale.ROOT, "%s (%d predictions)", p.label, p.score.size()),
                    false, true);
            for (Calibration.ReliabilityBin b : Calibration.reliability(p.positives(), p.scores(), BINS)) {
                if (b.n() > 0) {
                    s.add(b.meanPredicted(), b.observedRate());
                }
            }
            data.addSeries(s);
        }
        XYSeries diagonal = new XYSeries("perfect calibration", false, true);
        diagonal.add(0, 0);
        diagonal.add(1, 1);
        data.addSeries(diagonal);
        XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(true, true);
        for (int i = 0; i < pipes.size(); i++) {
            r.setSeriesPaint(i, Charts.color(i));
            r.setSeriesStroke(i, Charts.line(i, 1.8f));
            r.setSeriesShape(i, new Ellipse2D.Double(-3, -3, 6, 6));
        }
        r.setSeriesPaint(pipes.size(), Charts.CHANCE);
        r.setSeriesStroke(pipes.size(), Charts.dashed(1.2f));
        r.setSeriesShapesVisible(pipes.size(), false);
        XYPlot plot = new XYPlot(data, PredictionCharts.unit("mean predicted probability"),
                PredictionCharts.unit("observed fraction"), r);
        return new JFreeChart(null, Charts.LABEL, plot, true);
    }
}
