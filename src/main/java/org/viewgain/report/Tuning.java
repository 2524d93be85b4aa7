package org.viewgain.report;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** Chosen hyperparameters: how often each grid point won per pipeline, and every fold's choice one click below. */
final class Tuning {
    private Tuning() {
    }

    static String html(ReportData d) {
        if (d.hyperparameters == null) {
            return Html.notComputed("tuning choices", "hyperparameters.csv");
        }
        if (d.hyperparameters.rows().isEmpty()) {
            return "<p>No hyperparameter was tuned in this run (every grid had one point).</p>\n";
        }
        Map<String, Map<String, Integer>> counts = new LinkedHashMap<>();
        Map<String, String[]> about = new LinkedHashMap<>();
        for (CsvRows.Row r : d.hyperparameters.rows()) {
            String k = r.s("stage") + "|" + Names.key(r);
            counts.computeIfAbsent(k, x -> new LinkedHashMap<>()).merge(r.s("chosen"), 1, Integer::sum);
            about.putIfAbsent(k, new String[] {r.s("stage"), r.s("stage").equals("imputer") ? r.s("imputer")
                    : Names.pipeline(r.s("imputer"), r.s("feature_set"), r.s("classifier")), r.s("grid_size"),
                r.s("tuned_by")});
        }
        List<List<String>> rows = new ArrayList<>();
        counts.forEach((k, m) -> {
            int total = m.values().stream().mapToInt(Integer::intValue).sum();
            List<String> chosen = new ArrayList<>();
            m.forEach((c, n) -> chosen.add(Html.esc(c) + " <span class=\"small\">(" + n + " of " + total
                    + ")</span>"));
            String[] a = about.get(k);
            rows.add(List.of(Html.esc(a[0]), Html.esc(a[1]), Html.esc(a[2]), Html.esc(a[3]),
                    String.join("<br>", chosen)));
        });
        StringBuilder b = new StringBuilder("<p>Each grid was searched by inner cross-validation inside every outer "
                + "training fold; the grids themselves are in the spec below.</p>\n");
        b.append(unconverged(d));
        b.append(Html.table("tuning", List.of("stage", "for", "grid points", "chosen by", "chosen (outer folds)"),
                rows));
        List<List<String>> all = new ArrayList<>();
        for (CsvRows.Row r : d.hyperparameters.rows()) {
            all.add(List.of(Html.esc(r.s("repetition")), Html.esc(r.s("fold")), Html.esc(r.s("stage")),
                    Html.esc(r.s("stage").equals("imputer") ? r.s("imputer")
                            : Names.pipeline(r.s("imputer"), r.s("feature_set"), r.s("classifier"))),
                    Html.esc(r.s("chosen")), Html.esc(Html.f3(r.d("inner_score")))));
        }
        b.append("<details><summary>Every outer fold's choice (").append(all.size()).append(" rows)</summary>\n")
                .append(Html.table("tuning-all", List.of("repeat", "fold", "stage", "for", "chosen", "inner score"),
                        all))
                .append("</details>\n");
        return b.toString();
    }

    /** A caution naming the pipelines some of whose fits stopped at their iteration limit; empty when none. */
    static String unconverged(ReportData d) {
        Map<String, Integer> counts = new LinkedHashMap<>();
        for (CsvRows.Row r : d.hyperparameters.rows()) {
            int n = r.i("unconverged_fits", 0);
            if (n > 0) {
                counts.merge(Names.pipeline(r.s("imputer"), r.s("feature_set"), r.s("classifier")), n,
                        Integer::sum);
            }
        }
        if (counts.isEmpty()) {
            return "";
        }
        List<String> parts = new ArrayList<>();
        counts.forEach((k, n) -> parts.add(Html.esc(k) + " (" + n + ")"));
        return "<p class=\"warn\">Some model fits stopped at their solver's iteration limit before converging: "
                + String.join(", ", parts) + ". Their predictions count in every table, but they are not the "
                + "optimum the method defines; a rerun with more iterations (or a smaller C) may change them. "
                + "hyperparameters.csv, column unconverged_fits, says in which folds.</p>\n";
    }
}
