package org.viewgain.report;

import java.awt.Color;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.Map;
import java.util.Set;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.SymbolAxis;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;

/** Per-fold paired lines: each outer fold's balanced accuracy with source alone and with source+imputed. */
final class FoldLines {
    static final String METRIC = "balanced_accuracy";

    private FoldLines() {
    }

    static String html(ReportData d) {
        if (d.foldMetrics == null) {
            return Html.notComputed("per-fold metrics", "fold_metrics.csv");
        }
        Map<String, Double> value = new LinkedHashMap<>();
        Set<String> pairs = new LinkedHashSet<>();
        for (CsvRows.Row r : d.foldMetrics.rows()) {
            if (r.s("metric").equals(METRIC)) {
                value.put(Names.key(r) + "|" + r.s("repetition") + "|" + r.s("fold"), r.d("estimate"));
                if (r.s("feature_set").equals("source+imputed")) {
                    pairs.add(r.s("classifier") + "|" + r.s("imputer"));
                }
            }
        }
        if (pairs.isEmpty()) {
            return "<p class=\"absent\">No source+imputed pipeline in this run, so there are no paired folds to "
                    + "draw.</p>\n";
        }
        StringBuilder b = new StringBuilder("<div class=\"grid\">");
        for (String pair : pairs) {
            String[] ci = pair.split("\\|", 2);
            String keyA = Names.key("none", "source", ci[0]);
            String keyB = Names.key(ci[1], "source+imputed", ci[0]);
            Map<String, double[]> folds = new LinkedHashMap<>();
            value.forEach((k, v) -> {
                if (k.startsWith(keyA + "|")) {
                    String rf = k.substring(keyA.length() + 1);
                    Double w = value.get(keyB + "|" + rf);
                    if (w != null && Double.isFinite(v) && Double.isFinite(w)) {
                        folds.put(rf, new double[] {v, w});
                    }
                }
            });
            if (folds.isEmpty()) {
                continue;
            }
            long up = folds.values().stream().filter(x -> x[1] > x[0]).count();
            long down = folds.values().stream().filter(x -> x[1] < x[0]).count();
            String caption = "Balanced accuracy per outer fold, " + ci[0] + ": source against source+imputed ("
                    + ci[1] + "). Higher with the imputed view in " + up + ", lower in " + down + ", equal in "
                    + (folds.size() - up - down) + " of " + folds.size() + " folds; the thick line joins the means.";
            b.append(Charts.figure(() -> chart(folds, ci[1]), 380, 360, caption, d.redact));
        }
        return b.append("</div>\n").toString();
    }

    private static JFreeChart chart(Map<String, double[]> folds, String imputer) {
        XYSeriesCollection data = new XYSeriesCollection();
        double[] mean = new double[2];
        int i = 0;
        for (Map.Entry<String, double[]> e : folds.entrySet()) {
            XYSeries s = new XYSeries("fold " + e.getKey() + " #" + i++, false, true);
            s.add(0, e.getValue()[0]);
            s.add(1, e.getValue()[1]);
            mean[0] += e.getValue()[0] / folds.size();
            mean[1] += e.getValue()[1] / folds.size();
            data.addSeries(s);
        }
        XYSeries m = new XYSeries("mean", false, true);
        m.add(0, mean[0]);
        m.add(1, mean[1]);
        data.addSeries(m);
        XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(true, true);
        Color thin = new Color(0x1F, 0x7A, 0x72, 110);
        for (int k = 0; k < folds.size(); k++) {
            r.setSeriesPaint(k, thin);
            r.setSeriesStroke(k, Charts.stroke(1.2f));
            r.setSeriesShape(k, new java.awt.geom.Ellipse2D.Double(-2.5, -2.5, 5, 5));
        }
        r.setSeriesPaint(folds.size(), Charts.PALETTE[1]);
        r.setSeriesStroke(folds.size(), Charts.stroke(3.5f));
        SymbolAxis x = new SymbolAxis(null, new String[] {"source", "source+imputed (" + imputer + ")"});
        x.setGridBandsVisible(false);
        x.setRange(-0.3, 1.3);
        NumberAxis y = new NumberAxis("balanced accuracy");
        y.setAutoRangeIncludesZero(false);
        XYPlot plot = new XYPlot(data, x, y, r);
        return new JFreeChart(null, Charts.LABEL, plot, false);
    }
}
