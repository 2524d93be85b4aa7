package org.viewgain.report;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** Each pipeline against chance, from permutations.csv: marks for the answer and the full table. */
final class Chance {
    private final ReportData d;
    private final Map<String, CsvRows.Row> main = new LinkedHashMap<>();

    Chance(ReportData d) {
        this.d = d;
        if (d.permutations != null) {
            for (CsvRows.Row r : d.permutations.rows()) {
                String k = Names.key(r);
                CsvRows.Row had = main.get(k);
                if (had == null || r.s("metric").equals("balanced_accuracy")
                        && !had.s("metric").equals("balanced_accuracy")) {
                    main.put(k, r);
                }
            }
        }
    }

    /** One row per pipeline (its balanced-accuracy test when there are several), in permutations.csv order. */
    java.util.Collection<CsvRows.Row> pipelines() {
        return java.util.Collections.unmodifiableCollection(main.values());
    }

    boolean beats(CsvRows.Row r) {
        return r != null && r.d("p_value") <= d.alpha();
    }

    /** A small badge after a pipeline's name when it beats chance; empty otherwise. */
    String badge(String pipelineKey) {
        CsvRows.Row r = main.get(pipelineKey);
        if (!beats(r)) {
            return "";
        }
        return " <span class=\"badge\">beats chance, permutation p = "
                + Html.num("permutation_p", r.s("p_value"), Html.p(r.d("p_value"))) + "</span>";
    }

    /** A sentence on pipeline A against chance, or empty when no permutation test was run for it. */
    String mark(String pipelineKey) {
        CsvRows.Row r = main.get(pipelineKey);
        if (r == null) {
            return "";
        }
        return Html.esc("A against chance (" + Names.metric(r.s("metric")) + "): permutation p = "
                + Html.p(r.d("p_value")) + (beats(r) ? ", better than chance." : ", not shown to beat chance."));
    }

    /** The table of every permutation test, or the note that none was run. */
    String table() {
        if (d.permutations == null) {
            return Html.notComputed("permutation tests against chance", "permutations.csv");
        }
        List<List<String>> rows = new ArrayList<>();
        for (CsvRows.Row r : d.permutations.rows()) {
            rows.add(List.of(Html.esc(Names.pipeline(r.s("imputer"), r.s("feature_set"), r.s("classifier"))),
                    Html.esc(Names.metric(r.s("metric"))),
                    Html.num("observed", r.s("observed"), Html.f3(r.d("observed"))),
                    Html.esc(r.s("permutations_run")), Html.esc(r.s("exceedances")),
                    Html.num("p_value", r.s("p_value"), Html.p(r.d("p_value"))),
                    Html.esc(r.s("stopped_early")), Html.esc(r.s("exchangeability")),
                    beats(r) ? "<strong>better than chance</strong>" : "not shown"));
        }
        return "<p>Labels permuted among the subjects each pipeline uses (within sites when a site is given) and the "
                + "whole nested procedure re-run as the run ran it: stratified folds drawn from the permuted labels, "
                + "imputers and everything else re-fitted; p = (C + 1) / (N + 1) "
                + "(Ojala &amp; Garriga 2010), where C of N permutations reached the observed value. Level "
                + Html.esc(CsvTable.formatNumber(d.alpha())) + ".</p>\n"
                + Html.table("chance", List.of("pipeline", "metric", "observed", "permutations", "exceedances", "p",
                        "stopped early", "permuted within", "verdict"), rows);
    }
}
