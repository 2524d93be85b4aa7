package org.viewgain.report;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.StandardXYBarPainter;
import org.jfree.chart.renderer.xy.XYBarRenderer;
import org.jfree.data.statistics.HistogramDataset;

/** Permutation null distributions per pipeline (permutation_null.csv) with the observed value marked. */
final class NullHistograms {
    private NullHistograms() {
    }

    static String html(ReportData d) {
        if (d.permutationNull == null) {
            return Html.notComputed("permutation null distributions", "permutation_null.csv");
        }
        Map<String, List<Double>> nulls = new LinkedHashMap<>();
        Map<String, String> labels = new LinkedHashMap<>();
        for (CsvRows.Row r : d.permutationNull.rows()) {
            double v = r.d("estimate");
            if (Double.isFinite(v)) {
                String k = Names.key(r) + "|" + r.s("metric");
                nulls.computeIfAbsent(k, x -> new ArrayList<>()).add(v);
                labels.put(k, Names.pipeline(r.s("imputer"), r.s("feature_set"), r.s("classifier")) + ", "
                        + Names.metric(r.s("metric")));
            }
        }
        Map<String, CsvRows.Row> observed = new LinkedHashMap<>();
        if (d.permutations != null) {
            d.permutations.rows().forEach(r -> observed.put(Names.key(r) + "|" + r.s("metric"), r));
        }
        StringBuilder b = new StringBuilder("<div class=\"grid\">");
        nulls.forEach((k, values) -> {
            CsvRows.Row obs = observed.get(k);
            double o = obs == null ? Double.NaN : obs.d("observed");
            String caption = labels.get(k) + ": " + values.size() + " permutations"
                    + (obs == null ? "" : "; observed " + Html.f3(o) + " (line), p = " + Html.p(obs.d("p_value")));
            b.append(Charts.figure(() -> chart(values, o), 380, 260, caption, d.redact));
        });
        return b.append("</div>\n").toString();
    }

    private static JFreeChart chart(List<Double> values, double observed) {
        HistogramDataset data = new HistogramDataset();
        double[] v = values.stream().mapToDouble(Double::doubleValue).toArray();
        double lo = Math.min(values.stream().mapToDouble(x -> x).min().orElse(0), Double.isFinite(observed)
                ? observed : Double.POSITIVE_INFINITY);
        double hi = Math.max(values.stream().mapToDouble(x -> x).max().orElse(1), Double.isFinite(observed)
                ? observed : Double.NEGATIVE_INFINITY);
        if (!(hi > lo)) {
            hi = lo + 1e-6;
        }
        data.addSeries("null", v, 20, lo, hi);
        XYBarRenderer r = new XYBarRenderer(0.08);
        r.setBarPainter(new StandardXYBarPainter());
        r.setShadowVisible(false);
        r.setSeriesPaint(0, Charts.PALETTE[3]);
        NumberAxis x = new NumberAxis("value under permuted labels");
        x.setAutoRangeIncludesZero(false);
        XYPlot plot = new XYPlot(data, x, new NumberAxis("permutations"), r);
        if (Double.isFinite(observed)) {
            ValueMarker m = new ValueMarker(observed, Charts.PALETTE[4], Charts.stroke(2.5f));
            m.setLabel("observed");
            m.setLabelFont(Charts.TICK);
            m.setLabelAnchor(org.jfree.chart.ui.RectangleAnchor.TOP_LEFT);
            m.setLabelTextAnchor(org.jfree.chart.ui.TextAnchor.TOP_RIGHT);
            plot.addDomainMarker(m);
        }
        return new JFreeChart(null, Charts.LABEL, plot, false);
    }
}
