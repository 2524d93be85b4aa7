package org.viewgain.report;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.CombinedDomainXYPlot;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYErrorRenderer;
import org.jfree.data.xy.YIntervalSeries;
import org.jfree.data.xy.YIntervalSeriesCollection;

/**
 * The availability curve (from {@code availability.csv}): imputation error and the gain of source+imputed over
 * source against the number of target scans kept per outer training block, with intervals, and per imputer and
 * classifier the smallest level whose gain came within the spec's margin of the full data's gain, worded as an
 * estimate from this cohort.
 */
final class AvailabilityChart {
    private AvailabilityChart() {
    }

    /** The chart block, or nothing when the run wrote no curve. */
    static String html(ReportData d) {
        if (d.availability == null || d.availability.rows().isEmpty()) {
            return "";
        }
        List<CsvRows.Row> rows = d.availability.rows();
        String caption = "Imputation MAE per imputer (top) and the gain in balanced accuracy of source+imputed over "
                + "source per imputer and classifier (bottom), against the training subjects with a target scan "
                + "kept per outer training block (mean over outer folds); bars are the intervals of availability.csv"
                + " (bootstrap for MAE, corrected repeated-CV t-test for the gain); the grey line is no gain.";
        StringBuilder b = new StringBuilder();
        b.append(Charts.figure(() -> chart(rows), 860, 560, caption, d.redact));
        b.append(findings(rows, margin(d)));
        return b.toString();
    }

    /** The spec's {@code availability-curve.margin}, or the default when the spec text does not give one. */
    static double margin(ReportData d) {
        double m = d.spec.path("availability-curve").path("margin").asDouble(
                org.viewgain.spec.AvailabilityCurve.DEFAULT_MARGIN);
        return m >= 0 && m < 1 ? m : org.viewgain.spec.AvailabilityCurve.DEFAULT_MARGIN;
    }

    /** One finding per imputer and classifier: the smallest level within the margin of the full data's gain. */
    record Finding(String imputer, String classifier, CsvRows.Row full, CsvRows.Row smallest) {
    }

    static List<Finding> find(List<CsvRows.Row> rows, double margin) {
        Map<String, List<CsvRows.Row>> gains = new LinkedHashMap<>();
        for (CsvRows.Row r : rows) {
            if (r.s("measure").equals("balanced_accuracy_gain")) {
                gains.computeIfAbsent(r.s("imputer") + "\u0000" + r.s("classifier"), k -> new ArrayList<>()).add(r);
            }
        }
        List<Finding> out = new ArrayList<>();
        for (List<CsvRows.Row> g : gains.values()) {
            CsvRows.Row full = null;
            for (CsvRows.Row r : g) {
                if (r.s("full_data").equals("true")) {
                    full = r; // the last full-data level: the run itself
                }
            }
            CsvRows.Row smallest = null;
            if (full != null && Double.isFinite(full.d("estimate"))) {
                for (CsvRows.Row r : g) {
                    if (r.d("estimate") >= full.d("estimate") - margin) {
                        smallest = r;
                        break;
                    }
                }
            }
            out.add(new Finding(g.get(0).s("imputer"), g.get(0).s("classifier"), full, smallest));
        }
        return out;
    }

    static String findings(List<CsvRows.Row> rows, double margin) {
        List<List<String>> table = new ArrayList<>();
        for (Finding f : find(rows, margin)) {
            List<String> cells = new ArrayList<>();
            cells.add(Html.esc(Names.pipeline(f.imputer(), "source+imputed", f.classifier())));
            cells.add(f.full() == null ? "\u2013" : gain(f.full()));
            if (f.smallest() == null || f.full().d("estimate") <= 0) {
                cells.add(f.full() == null ? "\u2013" : "no gain at full data");
                cells.add("\u2013");
            } else {
                cells.add(Html.esc(level(f.smallest())) + " (" + Html.num("targets_mean",
                        f.smallest().s("targets_mean"), String.format(java.util.Locale.ROOT, "%.1f",
                                f.smallest().d("targets_mean"))) + " scans)");
                cells.add(gain(f.smallest()));
            }
            table.add(cells);
        }
        String marginText = String.format(java.util.Locale.ROOT, "%.3f", margin);
        return Html.table("grid", List.of("pipeline", "gain with all target scans", "smallest level within "
                + marginText, "its gain"), table)
                + Html.para("small", "A level counts as enough when its estimated gain in balanced accuracy (mean "
                + "over outer folds, against source) is no more than " + marginText + " below the gain with all "
                + "target scans (availability-curve.margin). This is an estimate from this cohort, not a guarantee: "
                + "the intervals of neighbouring levels overlap, the subsets are one seeded draw per outer fold, and "
                + "another cohort, scanner or imputer may need more scans. Where the full data shows no gain, the "
                + "curve cannot say how many scans are enough. The permutation test was not run per level.");
    }

    private static String level(CsvRows.Row r) {
        if (!r.s("count").isEmpty()) {
            return r.s("count") + " scans";
        }
        return r.s("full_data").equals("true") ? "all"
                : String.format(java.util.Locale.ROOT, "%.0f%%", 100 * r.d("fraction"));
    }

    private static String gain(CsvRows.Row r) {
        return Html.num("estimate", r.s("estimate"), Html.signed3(r.d("estimate"))) + " ["
                + Html.num("ci_low", r.s("ci_low"), Html.signed3(r.d("ci_low"))) + ", "
                + Html.num("ci_high", r.s("ci_high"), Html.signed3(r.d("ci_high"))) + "]";
    }

    private static JFreeChart chart(List<CsvRows.Row> rows) {
        NumberAxis scans = new NumberAxis("training subjects with a target scan (mean per outer fold)");
        scans.setAutoRangeIncludesZero(true);
        CombinedDomainXYPlot plot = new CombinedDomainXYPlot(scans);
        plot.setGap(12);
        XYPlot quality = panel(rows, "imputation_mae", "imputation MAE", false, 0);
        plot.add(quality, 1);
        // the gain panel's series take the palette on from the quality panel's, so the shared legend stays apart
        plot.add(panel(rows, "balanced_accuracy_gain", "gain in balanced accuracy", true,
                quality.getDataset().getSeriesCount()), 1);
        return new JFreeChart(null, Charts.LABEL, plot, true);
    }

    private static XYPlot panel(List<CsvRows.Row> rows, String measure, String axis, boolean zeroLine, int first) {
        Map<String, YIntervalSeries> series = new LinkedHashMap<>();
        double widest = 1;
        for (CsvRows.Row r : rows) {
            widest = Math.max(widest, Double.isFinite(r.d("targets_mean")) ? r.d("targets_mean") : 0);
        }
        List<String> names = new ArrayList<>();
        for (CsvRows.Row r : rows) {
            String name = r.s("imputer") + "\u0000" + r.s("classifier");
            if (r.s("measure").equals(measure) && !names.contains(name)) {
                names.add(name);
            }
        }
        for (CsvRows.Row r : rows) {
            if (!r.s("measure").equals(measure) || !Double.isFinite(r.d("estimate"))) {
                continue;
            }
            String name = r.s("classifier").isEmpty() ? r.s("imputer") + " (" + axis.replace("imputation ", "") + ")"
                    : r.s("imputer") + " \u00b7 " + r.s("classifier");
            double est = r.d("estimate");
            double lo = Double.isFinite(r.d("ci_low")) ? r.d("ci_low") : est;
            double hi = Double.isFinite(r.d("ci_high")) ? r.d("ci_high") : est;
            // series side by side around each level (1% of the axis apart), so their bars do not hide each other
            int k = names.indexOf(r.s("imputer") + "\u0000" + r.s("classifier"));
            double x = r.d("targets_mean") + (k - (names.size() - 1) / 2.0) * 0.01 * widest;
            series.computeIfAbsent(name, YIntervalSeries::new).add(x, est, lo, hi);
        }
        YIntervalSeriesCollection data = new YIntervalSeriesCollection();
        series.values().forEach(data::addSeries);
        XYErrorRenderer renderer = new XYErrorRenderer();
        renderer.setDrawXError(false);
        renderer.setDrawYError(true);
        renderer.setDefaultLinesVisible(true);
        renderer.setCapLength(5);
        int i = 0;
        for (String ignored : series.keySet()) {
            renderer.setSeriesPaint(i, Charts.color(first + i));
            renderer.setSeriesStroke(i, Charts.line(first + i, 1.6f));
            i++;
        }
        renderer.setErrorStroke(Charts.stroke(1.2f));
        NumberAxis value = new NumberAxis(axis);
        value.setAutoRangeIncludesZero(zeroLine);
        XYPlot p = new XYPlot(data, null, value, renderer);
        if (zeroLine) {
            p.addRangeMarker(new ValueMarker(0, Charts.CHANCE, Charts.dashed(1.2f)));
        }
        return p;
    }
}
