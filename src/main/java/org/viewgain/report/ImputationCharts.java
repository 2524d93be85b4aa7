package org.viewgain.report;

import java.awt.Color;
import java.awt.Paint;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.SymbolAxis;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.PaintScale;
import org.jfree.chart.renderer.xy.XYBlockRenderer;
import org.jfree.chart.title.PaintScaleLegend;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.data.xy.DefaultXYZDataset;

/** Imputation quality: a summary per imputer (imputation.csv) and the error per edge as a region-by-region map. */
final class ImputationCharts {
    private ImputationCharts() {
    }

    static String summary(ReportData d) {
        if (d.imputation == null) {
            return Html.notComputed("imputation quality per subject", "imputation.csv");
        }
        if (d.imputation.rows().isEmpty()) {
            return "<p class=\"absent\">No imputer in this run, so no imputation error.</p>\n";
        }
        Map<String, double[]> by = new LinkedHashMap<>();
        Map<String, Map<String, double[]>> perSubject = new LinkedHashMap<>();
        String[] cols = {"mae", "rmse", "pearson_r", "strength_mae", "skill"};
        for (CsvRows.Row r : d.imputation.rows()) {
            double[] s = by.computeIfAbsent(r.s("imputer"), k -> new double[2 * cols.length]);
            for (int c = 0; c < cols.length; c++) {
                double v = r.d(cols[c]);
                if (Double.isFinite(v)) {
                    s[2 * c] += v;
                    s[2 * c + 1]++;
                }
            }
            double[] m = perSubject.computeIfAbsent(r.s("imputer"), k -> new LinkedHashMap<>())
                    .computeIfAbsent(r.s("subject"), k -> new double[2]);
            if (Double.isFinite(r.d("mae"))) {
                m[0] += r.d("mae");
                m[1]++;
            }
        }
        List<List<String>> rows = new ArrayList<>();
        by.forEach((imp, s) -> {
            List<String> row = new ArrayList<>(List.of(Html.esc(imp)));
            for (int c = 0; c < cols.length; c++) {
                row.add(s[2 * c + 1] > 0 ? Html.f3(s[2 * c] / s[2 * c + 1]) : "\u2013");
            }
            List<Map.Entry<String, double[]>> worst = new ArrayList<>(perSubject.get(imp).entrySet());
            worst.removeIf(e -> e.getValue()[1] == 0);
            worst.sort(Comparator.comparingDouble((Map.Entry<String, double[]> e) -> e.getValue()[0]
                    / e.getValue()[1]).reversed());
            List<String> names = new ArrayList<>();
            for (Map.Entry<String, double[]> e : worst.subList(0, Math.min(3, worst.size()))) {
                names.add(d.redact.id(e.getKey()) + " (" + Html.f3(e.getValue()[0] / e.getValue()[1]) + ")");
            }
            row.add(Html.esc(String.join(", ", names)));
            rows.add(row);
        });
        return "<p>Error of the imputed target against the observed target, for test subjects whose target was "
                + "observed, averaged over subjects and repeats. Skill is 1 \u2212 MAE / MAE of the mean imputer "
                + "(the training subjects' mean target) on the same subject: above 0 the imputer beats the mean, 0 "
                + "is no better, below 0 worse.</p>\n" + Html.table("imputation", List.of("imputer", "MAE", "RMSE",
                "Pearson r", "strength MAE", "skill vs mean", "largest MAE (subject)"), rows);
    }

    static String heatmaps(ReportData d) {
        if (d.imputationEdges == null) {
            return Html.notComputed("imputation error per edge", "imputation_edges.csv");
        }
        Map<String, Map<String, Double>> by = new LinkedHashMap<>();
        for (CsvRows.Row r : d.imputationEdges.rows()) {
            by.computeIfAbsent(r.s("imputer"), k -> new LinkedHashMap<>()).put(r.s("feature"), r.d("mae"));
        }
        StringBuilder b = new StringBuilder("<div class=\"grid\">");
        by.forEach((imp, edges) -> {
            List<String> regions = new ArrayList<>();
            for (String f : edges.keySet()) {
                String[] kl = f.split("~", 2);
                if (kl.length < 2) {
                    regions.clear();
                    break;
                }
                for (String reg : kl) {
                    if (!regions.contains(reg)) {
                        regions.add(reg);
                    }
                }
            }
            if (regions.isEmpty()) {
                b.append("<p class=\"absent\">The features of imputer ").append(Html.esc(imp))
                        .append(" are not edges between regions, so there is no region-by-region map.</p>\n");
                return;
            }
            String caption = "Mean absolute imputation error per edge, " + imp + " (" + regions.size()
                    + " regions; darker is larger).";
            b.append(Charts.figure(() -> chart(edges, regions), 480, 460, caption, d.redact));
        });
        return b.append("</div>\n").toString();
    }

    private static JFreeChart chart(Map<String, Double> edges, List<String> regions) {
        int n = regions.size();
        Map<String, Integer> at = new LinkedHashMap<>();
        for (int i = 0; i < n; i++) {
            at.put(regions.get(i), i);
        }
        double[][] xyz = new double[3][2 * edges.size()];
        int k = 0;
        double max = 0;
        for (Map.Entry<String, Double> e : edges.entrySet()) {
            String[] kl = e.getKey().split("~", 2);
            int i = at.get(kl[0]);
            int j = at.get(kl[1]);
            double v = e.getValue();
            max = Double.isFinite(v) ? Math.max(max, v) : max;
            xyz[0][k] = i;
            xyz[1][k] = j;
            xyz[2][k++] = v;
            xyz[0][k] = j;
            xyz[1][k] = i;
            xyz[2][k++] = v;
        }
        DefaultXYZDataset data = new DefaultXYZDataset();
        data.addSeries("mae", xyz);
        XYBlockRenderer r = new XYBlockRenderer();
        Ramp scale = new Ramp(max > 0 ? max : 1);
        r.setPaintScale(scale);
        String[] names = regions.toArray(new String[0]);
        SymbolAxis x = new SymbolAxis(null, names);
        SymbolAxis y = new SymbolAxis(null, names);
        for (SymbolAxis a : new SymbolAxis[] {x, y}) {
            a.setGridBandsVisible(false);
            a.setRange(-0.5, n - 0.5);
            a.setTickLabelsVisible(n <= 30);
        }
        x.setVerticalTickLabels(true);
        y.setInverted(true);
        XYPlot plot = new XYPlot(data, x, y, r);
        plot.setDomainGridlinesVisible(false);
        plot.setRangeGridlinesVisible(false);
        JFreeChart chart = new JFreeChart(null, Charts.LABEL, plot, false);
        NumberAxis legendAxis = new NumberAxis("MAE");
        legendAxis.setRange(0, max > 0 ? max : 1);
        PaintScaleLegend legend = new PaintScaleLegend(scale, legendAxis);
        legend.setPosition(RectangleEdge.RIGHT);
        legend.setStripWidth(12);
        legend.setMargin(4, 8, 4, 4);
        chart.addSubtitle(legend);
        return chart;
    }

    /** A white-to-teal-to-ink colour ramp over [0, max]; missing values are light grey. */
    static final class Ramp implements PaintScale {
        private final double max;

        Ramp(double max) {
            this.max = max;
        }

        @Override
        public double getLowerBound() {
            return 0;
        }

        @Override
        public double getUpperBound() {
            return max;
        }

        @Override
        public Paint getPaint(double value) {
            if (!Double.isFinite(value)) {
                return new Color(0xEEEEEE);
            }
            double t = Math.max(0, Math.min(1, value / max));
            Color a = t < 0.5 ? new Color(0xF7FBFA) : new Color(0x1F7A72);
            Color b = t < 0.5 ? new Color(0x1F7A72) : new Color(0x0E2A33);
            double u = t < 0.5 ? 2 * t : 2 * t - 1;
            return new Color(mix(a.getRed(), b.getRed(), u), mix(a.getGreen(), b.getGreen(), u),
                    mix(a.getBlue(), b.getBlue(), u));
        }

        private static int mix(int a, int b, double u) {
            return (int) Math.round(a + (b - a) * u);
        }
    }
}
