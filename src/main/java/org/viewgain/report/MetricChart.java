package org.viewgain.report;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.SymbolAxis;
import org.jfree.chart.plot.PlotOrientation;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYErrorRenderer;
import org.jfree.data.xy.YIntervalSeries;
import org.jfree.data.xy.YIntervalSeriesCollection;

/** Balanced accuracy and AUC of every pipeline with their intervals (or spread over repeats), chance marked. */
final class MetricChart {
    private MetricChart() {
    }

    /** True when metrics.csv carries confidence intervals rather than only the spread over repeats. */
    static boolean hasIntervals(CsvRows metrics) {
        return metrics.has("ci_low") && metrics.rows().stream().anyMatch(r -> Double.isFinite(r.d("ci_low")));
    }

    static String html(ReportData d) {
        if (d.metrics == null) {
            return Html.notComputed("metrics per pipeline", "metrics.csv");
        }
        Map<String, Map<String, CsvRows.Row>> by = new LinkedHashMap<>();
        for (CsvRows.Row r : d.metrics.rows()) {
            by.computeIfAbsent(Names.key(r), k -> new LinkedHashMap<>()).put(r.s("metric"), r);
        }
        boolean ci = hasIntervals(d.metrics);
        String caption = "Balanced accuracy and AUC per pipeline (mean over repeats) with "
                + (ci ? "their intervals from metrics.csv" : "\u00b1 one standard deviation over repeats (not a "
                + "confidence interval; this run wrote none)") + "; the grey line is chance (0.5).";
        int height = 90 + 30 * by.size();
        return Charts.figure(() -> chart(by, ci), 860, height, caption, d.redact);
    }

    private static double minLow(YIntervalSeries s) {
        double m = Double.POSITIVE_INFINITY;
        for (int i = 0; i < s.getItemCount(); i++) {
            m = Math.min(m, s.getYLowValue(i));
        }
        return Double.isFinite(m) ? m : 0.4;
    }

    private static JFreeChart chart(Map<String, Map<String, CsvRows.Row>> by, boolean ci) {
        List<String> labels = new ArrayList<>();
        YIntervalSeriesCollection data = new YIntervalSeriesCollection();
        String[] metrics = {"balanced_accuracy", "auc"};
        YIntervalSeries[] series = {new YIntervalSeries(Names.metric(metrics[0])),
            new YIntervalSeries(Names.metric(metrics[1]))};
        int i = 0;
        for (Map<String, CsvRows.Row> m : by.values()) {
            CsvRows.Row any = m.values().iterator().next();
            labels.add(Names.pipeline(any.s("imputer"), any.s("feature_set"), any.s("classifier")));
            for (int k = 0; k < metrics.length; k++) {
                CsvRows.Row r = m.get(metrics[k]);
                if (r != null && Double.isFinite(r.d("estimate"))) {
                    double est = r.d("estimate");
                    double lo = ci ? r.d("ci_low") : est - r.d("sd_over_repeats");
                    double hi = ci ? r.d("ci_high") : est + r.d("sd_over_repeats");
                    series[k].add(i + (k == 0 ? -0.14 : 0.14), est, Double.isFinite(lo) ? lo : est,
                            Double.isFinite(hi) ? hi : est);
                }
            }
            i++;
        }
        data.addSeries(series[0]);
        data.addSeries(series[1]);
        SymbolAxis pipelines = new SymbolAxis(null, labels.toArray(new String[0]));
        pipelines.setInverted(true);
        pipelines.setGridBandsVisible(false);
        NumberAxis value = new NumberAxis("balanced accuracy, AUC");
        double low = Math.min(series[0].getItemCount() > 0 ? minLow(series[0]) : 0.4,
                series[1].getItemCount() > 0 ? minLow(series[1]) : 0.4);
        value.setRange(Math.max(0, Math.min(0.4, Math.floor(10 * (low - 0.02)) / 10)), 1.0);
        XYErrorRenderer renderer = new XYErrorRenderer();
        renderer.setDrawXError(false);
        renderer.setDrawYError(true);
        renderer.setErrorStroke(Charts.stroke(1.6f));
        renderer.setCapLength(5);
        renderer.setDefaultLinesVisible(false);
        for (int k = 0; k < 2; k++) {
            renderer.setSeriesPaint(k, Charts.color(k));
            // a circle and a square, so the two series read without colour
            renderer.setSeriesShape(k, k == 0 ? new java.awt.geom.Ellipse2D.Double(-4, -4, 8, 8)
                    : new java.awt.geom.Rectangle2D.Double(-4, -4, 8, 8));
        }
        XYPlot plot = new XYPlot(data, pipelines, value, renderer);
        plot.setOrientation(PlotOrientation.HORIZONTAL);
        ValueMarker chance = new ValueMarker(0.5, Charts.CHANCE, Charts.dashed(1.2f));
        plot.addRangeMarker(chance);
        return new JFreeChart(null, Charts.LABEL, plot, true);
    }
}
