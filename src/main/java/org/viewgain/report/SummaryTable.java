package org.viewgain.report;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.viewgain.engine.Evaluation;
import org.viewgain.engine.Pipeline;

/** The plain-text table printed at the end of a run: one line per pipeline. */
public final class SummaryTable {
    private SummaryTable() {
    }

    public static String text(List<Evaluation.MetricRow> rows) {
        return text(rows, 0.95);
    }

    /** The table, its footnote naming the interval level actually used ({@code significance.confidence}). */
    public static String text(List<Evaluation.MetricRow> rows, double confidence) {
        Map<Pipeline, Map<String, Evaluation.MetricRow>> by = new LinkedHashMap<>();
        for (Evaluation.MetricRow r : rows) {
            by.computeIfAbsent(r.pipeline(), k -> new LinkedHashMap<>()).put(r.metric(), r);
        }
        List<String[]> lines = new ArrayList<>();
        lines.add(new String[] {"imputer", "feature set", "classifier", "n", "balanced acc.", "AUC", "sensitivity",
            "specificity"});
        by.forEach((p, m) -> lines.add(new String[] {p.imputer(), p.featureSet().label(), p.classifier(),
            String.valueOf(m.get("balanced_accuracy").n()), cell(m.get("balanced_accuracy")), cell(m.get("auc")),
            cell(m.get("sensitivity")), cell(m.get("specificity"))}));
        int[] w = new int[lines.get(0).length];
        for (String[] l : lines) {
            for (int c = 0; c < l.length; c++) {
                w[c] = Math.max(w[c], l[c].length());
            }
        }
        StringBuilder b = new StringBuilder();
        for (String[] l : lines) {
            for (int c = 0; c < l.length; c++) {
                b.append(c == 0 ? "" : "  ").append(c < 3 ? pad(l[c], w[c]) : padLeft(l[c], w[c]));
            }
            b.append('\n');
        }
        b.append("(mean over repeats [" + CsvTable.formatNumber(100 * confidence) + "% interval, unadjusted: Wilson "
                + "for proportions, DeLong for AUC, bootstrap for balanced accuracy]; details in metrics.csv and "
                + "report.html)\n");
        return b.toString();
    }

    private static String cell(Evaluation.MetricRow r) {
        if (r == null || Double.isNaN(r.estimate())) {
            return "-";
        }
        return Double.isNaN(r.ciLow()) ? String.format(Locale.ROOT, "%.3f", r.estimate())
                : String.format(Locale.ROOT, "%.3f [%.2f, %.2f]", r.estimate(), r.ciLow(), r.ciHigh());
    }

    private static String pad(String s, int w) {
        return s + " ".repeat(w - s.length());
    }

    private static String padLeft(String s, int w) {
        return " ".repeat(w - s.length()) + s;
    }
}
