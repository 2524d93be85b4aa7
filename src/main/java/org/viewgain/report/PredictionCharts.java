package org.viewgain.report;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;

/** ROC curves per feature set from the pooled rows of predictions.csv (reliability: {@link ReliabilityCharts}). */
final class PredictionCharts {
    private PredictionCharts() {
    }

    /** Pooled out-of-fold scores of one pipeline over all repeats. */
    static final class Pooled {
        final String label;
        final List<Double> score = new ArrayList<>();
        final List<Boolean> positive = new ArrayList<>();

        Pooled(String label) {
            this.label = label;
        }

        double[] scores() {
            return score.stream().mapToDouble(Double::doubleValue).toArray();
        }

        boolean[] positives() {
            boolean[] p = new boolean[positive.size()];
            for (int i = 0; i < p.length; i++) {
                p[i] = positive.get(i);
            }
            return p;
        }
    }

    /** Pipelines grouped by classifier; a pipeline without scores is left out. */
    static Map<String, Map<String, Pooled>> pool(ReportData d) {
        return pool(d.predictions, d.positive());
    }

    /** The same for any table of predictions with imputer, feature_set, classifier, truth and score columns. */
    static Map<String, Map<String, Pooled>> pool(CsvRows predictions, String positive) {
        Map<String, Map<String, Pooled>> out = new LinkedHashMap<>();
        for (CsvRows.Row r : predictions.rows()) {
            double s = r.d("score");
            if (Double.isNaN(s)) {
                continue;
            }
            Pooled p = out.computeIfAbsent(r.s("classifier"), k -> new LinkedHashMap<>()).computeIfAbsent(
                    Names.key(r), k -> new Pooled(Names.features(r.s("imputer"), r.s("feature_set"))));
            p.score.add(s);
            p.positive.add(r.s("truth").equals(positive));
        }
        return out;
    }

    static String roc(ReportData d) {
        if (d.predictions == null) {
            return Html.notComputed("ROC curves", "predictions.csv");
        }
        Map<String, Map<String, Pooled>> pooled = pool(d);
        if (pooled.isEmpty()) {
            return "<p class=\"absent\">No classifier in this run produced scores, so there are no ROC curves.</p>\n";
        }
        StringBuilder b = new StringBuilder("<div class=\"grid\">");
        pooled.forEach((c, pipes) -> b.append(Charts.figure(() -> rocChart(pipes), 480, 420, "ROC curves of "
                + c + " per feature set: out-of-fold scores of all repeats pooled (positive group: " + d.positive()
                + "); the area in the legend is that of the pooled curve, so it can differ slightly from metrics.csv "
                + "(each repeat's AUC, averaged) and from the answer's DeLong test (AUC of repeat-averaged scores); "
                + "each feature set has its own colour and line pattern.", d.redact)));
        return b.append("</div>\n").toString();
    }

    private static JFreeChart rocChart(Map<String, Pooled> pipes) {
        XYSeriesCollection data = new XYSeriesCollection();
        for (Pooled p : pipes.values()) {
            double[][] curve = Curves.roc(p.scores(), p.positives());
            XYSeries s = new XYSeries(String.format(Locale.ROOT, "%s (pooled AUC %.3f, %d scores)", p.label,
                    Curves.area(curve), p.score.size()), false, true);
            for (int i = 0; i < curve[0].length; i++) {
                s.add(curve[0][i], curve[1][i]);
            }
            data.addSeries(s);
        }
        XYSeries diagonal = new XYSeries("chance", false, true);
        diagonal.add(0, 0);
        diagonal.add(1, 1);
        data.addSeries(diagonal);
        XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(true, false);
        for (int i = 0; i < pipes.size(); i++) {
            r.setSeriesPaint(i, Charts.color(i));
            r.setSeriesStroke(i, Charts.line(i, 2f));
        }
        r.setSeriesPaint(pipes.size(), Charts.CHANCE);
        r.setSeriesStroke(pipes.size(), Charts.dashed(1.2f));
        XYPlot plot = new XYPlot(data, unit("false positive rate (1 \u2212 specificity)"),
                unit("true positive rate (sensitivity)"), r);
        return new JFreeChart(null, Charts.LABEL, plot, true);
    }

    static NumberAxis unit(String label) {
        NumberAxis a = new NumberAxis(label);
        a.setRange(0, 1);
        return a;
    }
}
