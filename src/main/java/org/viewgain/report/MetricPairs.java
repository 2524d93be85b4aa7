package org.viewgain.report;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * The answer without paired tests: for each classifier, the metrics.csv estimates of source+imputed set beside those
 * of source, target and source+target, with their intervals (or spread over repeats), and no claim of a difference.
 */
final class MetricPairs {
    static final List<String> METRICS = List.of("balanced_accuracy", "auc");
    static final List<String> BASELINES = List.of("source", "target", "source+target");

    private MetricPairs() {
    }

    static void html(ReportData d, Chance chance, StringBuilder b) {
        if (d.metrics == null) {
            b.append(Html.notComputed("metrics per pipeline", "metrics.csv"));
            return;
        }
        Map<String, CsvRows.Row> byKey = new LinkedHashMap<>();
        Set<String> classifiers = new LinkedHashSet<>();
        for (CsvRows.Row r : d.metrics.rows()) {
            byKey.put(Names.key(r) + "|" + r.s("metric"), r);
            classifiers.add(r.s("classifier"));
        }
        Set<String> imputed = new LinkedHashSet<>();
        d.metrics.rows().stream().filter(r -> r.s("feature_set").equals("source+imputed"))
                .forEach(r -> imputed.add(r.s("imputer")));
        if (imputed.isEmpty()) {
            b.append("<p class=\"absent\">No source+imputed pipeline in this run; the estimates of every pipeline "
                    + "are in the charts below.</p>\n");
            return;
        }
        b.append("<p><strong>Paired tests were not computed in this run, so the differences below are differences "
                + "of mean estimates, with no claim that they are real.</strong></p>\n");
        for (String c : classifiers) {
            List<String[]> pairs = new ArrayList<>();
            for (String imp : imputed) {
                for (String base : BASELINES) {
                    String ka = Names.key(imp, "source+imputed", c);
                    String kb = Names.key("none", base, c);
                    if (byKey.containsKey(ka + "|balanced_accuracy") && byKey.containsKey(kb + "|balanced_accuracy")) {
                        pairs.add(new String[] {ka, kb});
                    }
                }
            }
            if (pairs.isEmpty()) {
                continue;
            }
            b.append("<div class=\"classifier\" id=\"answer-").append(Html.esc(AnswerSection.slug(c)))
                    .append("\"><h3>Classifier ").append(Html.esc(c)).append("</h3>\n<ul class=\"verdicts\">\n");
            for (String[] p : pairs) {
                if (p[1].equals(Names.key("none", "source", c))) {
                    b.append("<li>").append(sentence(byKey, p)).append(' ').append(chance.mark(p[0])).append("</li>\n");
                }
            }
            b.append("</ul>\n").append(table(byKey, pairs, chance)).append("</div>\n");
        }
        b.append("<p class=\"small\">Intervals are those of metrics.csv (method named beside them); where a run gave "
                + "none, the standard deviation over repeats is shown instead, which is not a confidence interval. "
                + "Pipelines with the observed target use only subjects whose target was observed, so they are not "
                + "paired with pipelines on all subjects.</p>\n");
    }

    private static String name(CsvRows.Row r) {
        return Names.features(r.s("imputer"), r.s("feature_set"));
    }

    private static String sentence(Map<String, CsvRows.Row> byKey, String[] p) {
        CsvRows.Row a0 = byKey.get(p[0] + "|balanced_accuracy");
        CsvRows.Row b0 = byKey.get(p[1] + "|balanced_accuracy");
        List<String> parts = new ArrayList<>();
        for (String m : METRICS) {
            CsvRows.Row a = byKey.get(p[0] + "|" + m);
            CsvRows.Row b = byKey.get(p[1] + "|" + m);
            if (a != null && b != null) {
                parts.add(Names.metric(m) + " " + Html.f3(a.d("estimate")) + " vs " + Html.f3(b.d("estimate")) + " ("
                        + Html.signed3(a.d("estimate") - b.d("estimate")) + ")");
            }
        }
        return "<strong>" + Html.esc(name(a0)) + "</strong> against " + Html.esc(name(b0)) + ": "
                + Html.esc(String.join("; ", parts)) + ".";
    }

    private static String table(Map<String, CsvRows.Row> byKey, List<String[]> pairs, Chance chance) {
        StringBuilder b = new StringBuilder("<table class=\"answer pairs\"><thead><tr>");
        for (String h : List.of("A", "B", "balanced accuracy A", "balanced accuracy B", "difference", "AUC A",
                "AUC B", "difference")) {
            b.append("<th>").append(Html.esc(h)).append("</th>");
        }
        b.append("</tr></thead><tbody>\n");
        for (String[] p : pairs) {
            CsvRows.Row a0 = byKey.get(p[0] + "|balanced_accuracy");
            CsvRows.Row b0 = byKey.get(p[1] + "|balanced_accuracy");
            b.append("<tr data-a=\"").append(Html.esc(p[0])).append("\" data-b=\"").append(Html.esc(p[1]))
                    .append("\">");
            b.append("<td>").append(Html.esc(name(a0))).append(chance.badge(p[0]))
                    .append("<br><span class=\"small\">n = ")
                    .append(Html.esc(a0.s("n"))).append("</span></td>");
            b.append("<td>").append(Html.esc(name(b0))).append(chance.badge(p[1]))
                    .append("<br><span class=\"small\">n = ")
                    .append(Html.esc(b0.s("n"))).append("</span></td>");
            for (String m : METRICS) {
                CsvRows.Row a = byKey.get(p[0] + "|" + m);
                CsvRows.Row o = byKey.get(p[1] + "|" + m);
                if (a == null || o == null) {
                    b.append("<td>\u2013</td><td>\u2013</td><td>\u2013</td>");
                    continue;
                }
                b.append("<td>").append(Html.num(m + ".estimate_a", a.s("estimate"), Html.f3(a.d("estimate"))))
                        .append("<br>").append(interval(a, m + ".", "_a")).append("</td>");
                b.append("<td>").append(Html.num(m + ".estimate_b", o.s("estimate"), Html.f3(o.d("estimate"))))
                        .append("<br>").append(interval(o, m + ".", "_b")).append("</td>");
                b.append("<td>").append(Html.esc(Html.signed3(a.d("estimate") - o.d("estimate")))).append("</td>");
            }
            b.append("</tr>\n");
        }
        return b.append("</tbody></table>\n").toString();
    }

    /** The metric's interval from metrics.csv, or its spread over repeats. */
    static String interval(CsvRows.Row r, String prefix, String suffix) {
        if (Double.isFinite(r.d("ci_low")) && Double.isFinite(r.d("ci_high"))) {
            return "<span class=\"small\">"
                    + Html.num(prefix + "ci_low" + suffix, r.s("ci_low"), Html.f3(r.d("ci_low")))
                    + " to " + Html.num(prefix + "ci_high" + suffix, r.s("ci_high"), Html.f3(r.d("ci_high")))
                    + (r.s("ci_method").isEmpty() ? "" : " " + Html.esc(r.s("ci_method"))) + "</span>";
        }
        if (Double.isFinite(r.d("sd_over_repeats"))) {
            return "<span class=\"small\">\u00b1 " + Html.num(prefix + "sd_over_repeats" + suffix,
                    r.s("sd_over_repeats"), Html.f3(r.d("sd_over_repeats"))) + " SD</span>";
        }
        return "";
    }
}
