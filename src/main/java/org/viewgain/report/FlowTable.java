package org.viewgain.report;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/** Who entered which feature set: cohort_flow.csv when written, else counts derived from predictions.csv. */
final class FlowTable {
    private static final List<String> HEAD = List.of("feature set", "imputer", "group", "included", "excluded",
            "reason");

    private FlowTable() {
    }

    static String html(ReportData d, Map<String, int[]> groups) {
        List<List<String>> rows = new ArrayList<>();
        if (d.cohortFlow != null) {
            for (CsvRows.Row r : d.cohortFlow.rows()) {
                rows.add(List.of(Html.esc(r.s("feature_set")), Html.esc(r.s("imputer")), Html.esc(r.s("group")),
                        Html.esc(r.s("included")), Html.esc(r.s("excluded")), Html.esc(d.redact.text(r.s("reason")))));
            }
            return Html.table("flowtable", HEAD, rows);
        }
        // no command writes cohort_flow.csv today: the table is derived from predictions.csv, which says so below
        if (d.predictions == null) {
            return Html.notComputed("the cohort flow table", "predictions.csv");
        }
        StringBuilder b = new StringBuilder();
        String firstRepeat = d.predictions.rows().isEmpty() ? "1" : d.predictions.rows().get(0).s("repetition");
        Map<String, Map<String, Set<String>>> in = new LinkedHashMap<>();
        for (CsvRows.Row r : d.predictions.rows()) {
            if (r.s("repetition").equals(firstRepeat)) {
                in.computeIfAbsent(r.s("feature_set") + "|" + r.s("imputer"), k -> new LinkedHashMap<>())
                        .computeIfAbsent(r.s("truth"), k -> new HashSet<>()).add(r.s("subject"));
            }
        }
        in.forEach((k, byGroup) -> {
            String[] fi = k.split("\\|", 2);
            groups.forEach((g, c) -> {
                int included = byGroup.getOrDefault(g, Set.of()).size();
                int excluded = c[0] - included;
                String reason = excluded == 0 ? "" : fi[0].contains("target") ? "no observed target view"
                        : "not in predictions.csv";
                rows.add(List.of(Html.esc(fi[0]), Html.esc(fi[1]), Html.esc(g), String.valueOf(included),
                        String.valueOf(excluded), Html.esc(reason)));
            });
        });
        b.append("<p class=\"small\">Counts below are derived from the subjects with a prediction in repeat ")
                .append(Html.esc(firstRepeat)).append(" of predictions.csv.</p>\n");
        return b.append(Html.table("flowtable", HEAD, rows)).toString();
    }
}
