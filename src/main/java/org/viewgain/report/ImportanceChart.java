package org.viewgain.report;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.CategoryAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.CategoryPlot;
import org.jfree.chart.plot.PlotOrientation;
import org.jfree.chart.renderer.category.StackedBarRenderer;
import org.jfree.chart.renderer.category.StandardBarPainter;
import org.jfree.data.category.DefaultCategoryDataset;

/** The most important features of the source+imputed pipelines (importance.csv), coloured by their view. */
final class ImportanceChart {
    static final int TOP = 15;
    static final int MAX_CHARTS = 6;
    static final List<String> VIEWS = List.of("source", "target", "imputed");

    private ImportanceChart() {
    }

    static String html(ReportData d) {
        if (d.importance == null) {
            return Html.notComputed("feature importance", "importance.csv");
        }
        Map<String, List<CsvRows.Row>> by = new LinkedHashMap<>();
        for (CsvRows.Row r : d.importance.rows()) {
            if (Double.isFinite(r.d("estimate"))) {
                by.computeIfAbsent(Names.key(r) + "|" + r.s("kind"), k -> new ArrayList<>()).add(r);
            }
        }
        List<String> keys = new ArrayList<>(by.keySet());
        keys.sort(Comparator.comparingInt((String k) -> k.contains("|source+imputed|") ? 0 : 1));
        StringBuilder b = new StringBuilder("<div class=\"grid\">");
        for (String k : keys.subList(0, Math.min(MAX_CHARTS, keys.size()))) {
            List<CsvRows.Row> top = top(by.get(k));
            CsvRows.Row first = top.get(0);
            String caption = "Top " + top.size() + " features of " + Names.pipeline(first.s("imputer"),
                    first.s("feature_set"), first.s("classifier")) + " by " + first.s("kind")
                    + " (colour: the view each feature comes from).";
            String axis = axis(first.s("kind"));
            b.append(Charts.figure(() -> chart(top, axis), 480, 120 + 22 * top.size(), caption, d.redact));
        }
        b.append("</div>\n");
        if (keys.size() > MAX_CHARTS) {
            b.append("<p class=\"small\">").append(keys.size() - MAX_CHARTS)
                    .append(" more pipelines have importances in importance.csv.</p>\n");
        }
        return b.toString();
    }

    /** A row with the size of its estimate, read once (a sort that parses in its comparator reads it log n times). */
    private record Sized(CsvRows.Row row, double size) {
    }

    /** The {@link #TOP} rows of largest |estimate|, largest first; equal sizes keep the file's order. */
    static List<CsvRows.Row> top(List<CsvRows.Row> rows) {
        List<Sized> sized = new ArrayList<>(rows.size());
        for (CsvRows.Row r : rows) {
            sized.add(new Sized(r, Math.abs(r.d("estimate"))));
        }
        sized.sort(Comparator.comparingDouble(Sized::size).reversed());
        List<CsvRows.Row> out = new ArrayList<>(TOP);
        for (Sized s : sized.subList(0, Math.min(TOP, sized.size()))) {
            out.add(s.row());
        }
        return out;
    }

    /** The feature's name, with its view added when the same name comes from two views. */
    private static String label(CsvRows.Row r, Map<String, Integer> seen) {
        return seen.get(r.s("feature")) > 1 ? r.s("feature") + " (" + r.s("view") + ")" : r.s("feature");
    }

    /** The value axis with its unit, by the kind of importance (importance.csv {@code kind}). */
    static String axis(String kind) {
        return switch (kind) {
            case "impurity" -> "Gini impurity decrease (weighted by rows, summed over trees; mean over outer folds)";
            case "abs_weight" -> "|weight| x training SD of the input (standardized units; mean over outer folds)";
            case "selection_frequency" -> "fraction of outer folds in which the feature was selected (0-1)";
            default -> "importance (" + kind + ")";
        };
    }

    private static JFreeChart chart(List<CsvRows.Row> top, String axis) {
        DefaultCategoryDataset data = new DefaultCategoryDataset();
        Map<String, Integer> seen = new LinkedHashMap<>();
        top.forEach(r -> seen.merge(r.s("feature"), 1, Integer::sum));
        for (String v : VIEWS) {
            for (CsvRows.Row r : top) {
                data.addValue(r.s("view").equals(v) ? r.d("estimate") : 0, v, label(r, seen));
            }
        }
        for (CsvRows.Row r : top) {
            if (!VIEWS.contains(r.s("view"))) {
                data.addValue(r.d("estimate"), r.s("view"), label(r, seen));
            }
        }
        StackedBarRenderer renderer = new StackedBarRenderer();
        renderer.setBarPainter(new StandardBarPainter());
        renderer.setShadowVisible(false);
        for (int i = 0; i < data.getRowCount(); i++) {
            renderer.setSeriesPaint(i, Charts.color(i));
        }
        CategoryAxis features = new CategoryAxis(null);
        features.setMaximumCategoryLabelWidthRatio(0.45f);
        CategoryPlot plot = new CategoryPlot(data, features, new NumberAxis(axis), renderer);
        plot.setOrientation(PlotOrientation.HORIZONTAL);
        return new JFreeChart(null, Charts.LABEL, plot, true);
    }
}
