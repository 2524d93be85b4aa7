package org.viewgain.report;

import java.io.IOException;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * The independent-cohort section (from external_metrics.csv and external_comparisons.csv beside metrics.csv): each
 * pipeline's AUC and balanced accuracy on the independent cohort beside its cross-validated value, and the paired
 * tests there. Empty when the run had no independent cohort with labels.
 */
final class IndependentSection {
    private IndependentSection() {
    }

    static String html(ReportData d) throws IOException {
        CsvRows ext = CsvRows.readIfPresent(d.dir, "external_metrics.csv");
        CsvRows preds = CsvRows.readIfPresent(d.dir, "external_predictions.csv");
        if (preds == null) {
            return "";
        }
        StringBuilder b = new StringBuilder("<section id=\"independent\"><h2>Independent cohort</h2>\n");
        String cohort = preds.rows().isEmpty() ? "" : preds.rows().get(0).s("cohort");
        b.append("<p>The final pipelines (refitted on the whole development cohort, bundle/) applied to the "
                + "independent cohort <strong>").append(Html.esc(cohort)).append("</strong>, which no fit saw. Its "
                + "paired comparisons use DeLong's test for AUC and the exact McNemar test on the same subjects; the "
                + "corrected repeated-CV t-test does not apply to a single test set.</p>\n");
        CsvRows dup = CsvRows.readIfPresent(d.dir, "external_duplicates.csv");
        if (dup != null && !dup.rows().isEmpty()) {
            b.append("<p class=\"warn\"><strong>Possible duplicates:</strong> ").append(dup.rows().size())
                    .append(" pair(s) of an independent and a development subject whose source views correlate above"
                            + " the duplicate threshold (external_duplicates.csv). If they are the same people,"
                            + " the independent cohort is not independent and its results are optimistic.</p>\n");
        }
        if (ext == null) {
            b.append("<p>The cohort has no labels: predictions only (external_predictions.csv).</p>\n");
            return b.append("</section>\n").toString();
        }
        Map<String, String> cv = new HashMap<>();
        if (d.metrics != null) {
            for (CsvRows.Row r : d.metrics.rows()) {
                cv.put(key(r), r.s("estimate"));
            }
        }
        List<List<String>> rows = new ArrayList<>();
        for (CsvRows.Row r : ext.rows()) {
            if (!r.s("metric").equals("auc") && !r.s("metric").equals("balanced_accuracy")) {
                continue;
            }
            String inCv = cv.get(key(r));
            rows.add(List.of(Html.esc(r.s("imputer") + "/" + r.s("feature_set") + "/" + r.s("classifier")),
                    Html.esc(r.s("metric")), Html.esc(inCv == null ? "" : Html.f3(Double.parseDouble(inCv))),
                    Html.esc(Html.f3(r.d("estimate"))), Html.esc(Html.f3(r.d("ci_low")) + " \u2013 "
                            + Html.f3(r.d("ci_high"))), Html.esc(r.s("n"))));
        }
        b.append(Html.table("independent", List.of("pipeline", "metric", "cross-validated", "independent cohort",
                "interval", "n"), rows));
        CsvRows cmp = CsvRows.readIfPresent(d.dir, "external_comparisons.csv");
        if (cmp != null) {
            List<List<String>> c = new ArrayList<>();
            for (CsvRows.Row r : cmp.rows()) {
                c.add(List.of(Html.esc(r.s("a") + " vs " + r.s("b")), Html.esc(r.s("test")),
                        Html.esc(Html.f3(r.d("estimate_a")) + " vs " + Html.f3(r.d("estimate_b"))),
                        Html.esc(Html.p(r.d("p")))));
            }
            b.append(Html.table("independent-comparisons", List.of("comparison", "test", "estimates", "p"), c));
        }
        b.append(ReliabilityCharts.external(d, preds, ext, cohort));
        return b.append("</section>\n").toString();
    }

    private static String key(CsvRows.Row r) {
        return r.s("imputer") + "|" + r.s("feature_set") + "|" + r.s("classifier") + "|" + r.s("metric");
    }
}
