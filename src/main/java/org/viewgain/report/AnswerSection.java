package org.viewgain.report;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;

/**
 * Section 1, the answer: per classifier, did source+imputed beat source (and the observed target)? One plain
 * sentence per comparison and a small table whose numbers are those of comparisons.csv; without comparisons.csv
 * the mean estimates of metrics.csv are set side by side and the missing paired tests are named.
 */
final class AnswerSection {
    static final List<String> HEAD = List.of("test", "metric", "A", "B", "difference", "interval", "p",
            "adjusted p", "P(A better)", "P(practically equal)", "P(B better)");

    private AnswerSection() {
    }

    static String html(ReportData d) {
        StringBuilder b = new StringBuilder();
        b.append("<section id=\"answer\"><h2>1. The answer</h2>\n");
        b.append("<p class=\"lead\">Does adding the imputed target view to the source view tell the groups apart "
                + "better than the source view alone, and better than chance? A is the first pipeline of each "
                + "comparison, B the second; a positive difference favours A.</p>\n");
        b.append("<p class=\"verdict\" id=\"verdict\"><strong>In one sentence:</strong> ")
                .append(Html.esc(Verdict.of(d))).append(" Intervals are unadjusted; p-values of comparisons are "
                        + "adjusted across comparisons as the spec asks (significance.adjust).</p>\n");
        Chance chance = new Chance(d);
        if (d.comparisons != null) {
            fromComparisons(d, chance, b);
        } else {
            b.append(Html.notComputed("paired comparisons between pipelines (tests, adjusted p-values and Bayesian "
                    + "probabilities)", "comparisons.csv"));
            MetricPairs.html(d, chance, b);
        }
        b.append("<h3 id=\"chance\">Against chance</h3>\n");
        b.append(chance.table());
        return b.append("</section>\n").toString();
    }

    private static void fromComparisons(ReportData d, Chance chance, StringBuilder b) {
        Power power = Power.of(d);
        b.append("<p class=\"small\" id=\"verdict-basis\">Each verdict rests on the corrected repeated "
                + "cross-validation t-test of balanced accuracy. McNemar's and DeLong's tests treat the trained "
                + "models as fixed and are shown for reference only; on invented null cohorts DeLong's test rejected "
                + "7-10% of comparisons of two different pipelines at a nominal 5% (docs/benchmarks.md).</p>\n");
        if (power.low()) {
            b.append("<p class=\"warn\" id=\"power\">").append(Html.esc(power.note())).append("</p>\n");
        }
        Set<String> classifiers = new LinkedHashSet<>();
        d.comparisons.rows().forEach(r -> classifiers.add(r.s("classifier_a")));
        List<CsvRows.Row> mixed = d.comparisons.where(r -> !r.s("classifier_a").equals(r.s("classifier_b")));
        for (String c : classifiers) {
            List<CsvRows.Row> rows = d.comparisons.where(r -> r.s("classifier_a").equals(c)
                    && r.s("classifier_b").equals(c));
            if (rows.isEmpty()) {
                continue;
            }
            b.append("<div class=\"classifier\" id=\"answer-").append(Html.esc(slug(c))).append("\"><h3>Classifier ")
                    .append(Html.esc(c)).append("</h3>\n<ul class=\"verdicts\">\n");
            pairs(rows).forEach((pair, pr) -> b.append("<li>").append(sentence(pr, d.alpha(), chance, power,
                            level(d)))
                    .append("</li>\n"));
            b.append("</ul>\n").append(table(rows, chance, level(d)));
            b.append("</div>\n");
        }
        if (!mixed.isEmpty()) {
            b.append("<h3>Comparisons across classifiers</h3>\n").append(table(mixed, chance, level(d)));
        }
    }

    /** Rows grouped by the pair of pipelines they compare. */
    private static Map<String, List<CsvRows.Row>> pairs(List<CsvRows.Row> rows) {
        Map<String, List<CsvRows.Row>> out = new LinkedHashMap<>();
        for (CsvRows.Row r : rows) {
            String k = r.s("comparison") + "#" + a(r) + "#" + bKey(r);
            out.computeIfAbsent(k, x -> new ArrayList<>()).add(r);
        }
        return out;
    }

    static String a(CsvRows.Row r) {
        return Names.key(r.s("imputer_a"), r.s("feature_set_a"), r.s("classifier_a"));
    }

    static String bKey(CsvRows.Row r) {
        return Names.key(r.s("imputer_b"), r.s("feature_set_b"), r.s("classifier_b"));
    }

    /** One plain sentence: the verdict, then balanced accuracy, AUC and the Bayesian probabilities. */
    static String sentence(List<CsvRows.Row> rows, double alpha, Chance chance, Power power, String level) {
        CsvRows.Row first = rows.get(0);
        String nameA = Names.features(first.s("imputer_a"), first.s("feature_set_a"));
        String nameB = Names.features(first.s("imputer_b"), first.s("feature_set_b"));
        CsvRows.Row bal = pick(rows, "balanced_accuracy", "corrected-t");
        CsvRows.Row auc = pick(rows, "auc", "delong");
        CsvRows.Row bayes = null;
        for (CsvRows.Row r : rows) {
            if (r.s("test").equals("bayes-correlated-t") && (bayes == null
                    || r.s("metric").equals("balanced_accuracy"))) {
                bayes = r;
            }
        }
        CsvRows.Row primary = bal != null ? bal : auc;
        StringBuilder s = new StringBuilder();
        s.append("<strong>").append(Html.esc(verdict(primary, alpha, nameA, nameB, power))).append("</strong> ");
        s.append(Html.esc(nameA)).append(" against ").append(Html.esc(nameB)).append(": ");
        List<String> parts = new ArrayList<>();
        for (CsvRows.Row r : new CsvRows.Row[] {bal, auc}) {
            if (r != null) {
                boolean adjusted = Double.isFinite(r.d("p_adjusted"));
                String of = r.s("quantity").isEmpty() ? "" : " (" + Names.quantity(r.s("quantity")) + ")";
                parts.add(Html.esc(String.format(Locale.ROOT, "%s%s %s vs %s (%s%s; %s p = %s)",
                        Names.metric(r.s("metric")), of, Html.f3(r.d("estimate_a")), Html.f3(r.d("estimate_b")),
                        Html.signed3(r.d("difference")), interval(r, level), adjusted ? "adjusted" : "",
                        Html.p(adjusted ? r.d("p_adjusted") : r.d("p_value"))).replace(";  p", "; p")));
            }
        }
        if (bayes != null) {
            parts.add(Html.esc(String.format(Locale.ROOT, "probability that A is better %s, practically equal %s "
                    + "(Bayesian, \u00b1%s)", Html.f3(bayes.d("prob_a_better")), Html.f3(bayes.d("prob_equivalent")),
                    bayes.s("rope").isEmpty() ? "?" : bayes.s("rope"))));
        }
        s.append(parts.isEmpty() ? "no balanced-accuracy or AUC test in comparisons.csv" : String.join("; ", parts));
        s.append('.');
        String markA = chance.mark(a(first));
        if (!markA.isEmpty()) {
            s.append(' ').append(markA);
        }
        return s.toString();
    }

    /** The interval level of the run, e.g. {@code 95%} (significance.confidence). */
    static String level(ReportData d) {
        double c = d.spec.path("significance").path("confidence").asDouble(0.95);
        return CsvTable.formatNumber(100 * (c > 0 && c < 1 ? c : 0.95)) + "%";
    }

    private static String interval(CsvRows.Row r, String level) {
        double lo = r.d("ci_low");
        double hi = r.d("ci_high");
        return Double.isFinite(lo) && Double.isFinite(hi) ? " (unadjusted " + level + " interval "
                + Html.signed3(lo) + " to "
                + Html.signed3(hi) + ")" : "";
    }

    /**
     * The verdict rests on the primary test (the corrected t-test when present). When it is not significant and the
     * plan left it little power ({@link Power}), the verdict says "not shown", never "no difference".
     */
    static String verdict(CsvRows.Row r, double alpha, String nameA, String nameB, Power power) {
        if (r == null) {
            return "No frequentist test for this pair.";
        }
        double p = Double.isFinite(r.d("p_adjusted")) ? r.d("p_adjusted") : r.d("p_value");
        double diff = r.d("difference");
        String level = CsvTable.formatNumber(alpha);
        if (p <= alpha && diff > 0) {
            return nameA + " is better than " + nameB + " (p \u2264 " + level + ").";
        }
        if (p <= alpha && diff < 0) {
            return nameA + " is worse than " + nameB + " (p \u2264 " + level + ").";
        }
        if (power.low() && r.s("test").equals("corrected-t")) {
            return "Not shown at level " + level + ": " + power.plan() + " leave the corrected t-test little power;"
                    + " this is not evidence of no difference.";
        }
        return "No clear difference at level " + level + ".";
    }

    private static CsvRows.Row pick(List<CsvRows.Row> rows, String metric, String preferredTest) {
        CsvRows.Row any = null;
        for (CsvRows.Row r : rows) {
            if (r.s("metric").equals(metric) && !r.s("test").equals("bayes-correlated-t")) {
                if (r.s("test").equals(preferredTest)) {
                    return r;
                }
                any = any == null ? r : any;
            }
        }
        return any;
    }

    /** The small answer table: one row per comparison and test, every number kept exact in data-value. */
    static String table(List<CsvRows.Row> rows, Chance chance, String level) {
        StringBuilder b = new StringBuilder("<table class=\"answer\"><thead><tr>");
        HEAD.forEach(h -> b.append("<th>").append(Html.esc(h.equals("interval") ? level + " interval (unadjusted)"
                : h)).append("</th>"));
        b.append("</tr></thead><tbody>\n");
        String pair = null;
        for (CsvRows.Row r : rows) {
            String thisPair = r.s("comparison") + "#" + a(r) + "#" + bKey(r);
            if (!thisPair.equals(pair)) {
                pair = thisPair;
                b.append("<tr class=\"pair\"><th colspan=\"").append(HEAD.size()).append("\">A = ")
                        .append(Html.esc(Names.pipeline(r.s("imputer_a"), r.s("feature_set_a"), r.s("classifier_a"))))
                        .append(chance.badge(a(r))).append(" &nbsp; B = ")
                        .append(Html.esc(Names.pipeline(r.s("imputer_b"), r.s("feature_set_b"), r.s("classifier_b"))))
                        .append(chance.badge(bKey(r))).append("</th></tr>\n");
            }
            b.append("<tr data-comparison=\"").append(Html.esc(r.s("comparison"))).append("\" data-a=\"")
                    .append(Html.esc(a(r))).append("\" data-b=\"").append(Html.esc(bKey(r))).append("\" data-test=\"")
                    .append(Html.esc(r.s("test"))).append("\" data-metric=\"").append(Html.esc(r.s("metric")))
                    .append("\">");
            b.append("<td>").append(Html.esc(Names.test(r.s("test")))).append(r.s("n").isEmpty() ? ""
                    : "<br><span class=\"small\">n = " + Html.esc(r.s("n")) + "</span>").append("</td>");
            b.append("<td>").append(Html.esc(Names.metric(r.s("metric")))).append(r.s("quantity").isEmpty() ? ""
                    : "<br><span class=\"small\">" + Html.esc(Names.quantity(r.s("quantity"))) + "</span>")
                    .append("</td>");
            b.append(cell(r, "estimate_a", false)).append(cell(r, "estimate_b", false))
                    .append(cell(r, "difference", true));
            b.append("<td>").append(r.s("ci_low").isEmpty() ? "\u2013" : Html.num("ci_low", r.s("ci_low"),
                    Html.signed3(r.d("ci_low"))) + " to " + Html.num("ci_high", r.s("ci_high"),
                    Html.signed3(r.d("ci_high")))).append("</td>");
            b.append(pCell(r, "p_value")).append(pCell(r, "p_adjusted").replace("</td>",
                    r.s("adjust_method").isEmpty() || r.s("p_adjusted").isEmpty() ? "</td>"
                            : "<br><span class=\"small\">" + Html.esc(r.s("adjust_method")) + "</span></td>"));
            b.append(cell(r, "prob_a_better", false)).append(cell(r, "prob_equivalent", false))
                    .append(cell(r, "prob_b_better", false));
            b.append("</tr>\n");
        }
        return b.append("</tbody></table>\n").toString();
    }

    private static String cell(CsvRows.Row r, String col, boolean signed) {
        String raw = r.s(col);
        if (raw.isEmpty()) {
            return "<td>\u2013</td>";
        }
        return "<td>" + Html.num(col, raw, signed ? Html.signed3(r.d(col)) : Html.f3(r.d(col))) + "</td>";
    }

    private static String pCell(CsvRows.Row r, String col) {
        String raw = r.s(col);
        return raw.isEmpty() ? "<td>\u2013</td>" : "<td>" + Html.num(col, raw, Html.p(r.d(col))) + "</td>";
    }

    static String slug(String s) {
        return s.toLowerCase(Locale.ROOT).replaceAll("[^a-z0-9]+", "-");
    }
}
