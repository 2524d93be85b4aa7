package org.viewgain.report;

import com.fasterxml.jackson.databind.JsonNode;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * Section 5, the protocol: the spec as run, the fold scheme, grids and chosen hyperparameters per fold, what was
 * fitted where, versions, input hashes, seed and run time, all from run.json and the tables.
 */
final class ProtocolSection {
    private ProtocolSection() {
    }

    static String html(ReportData d) {
        StringBuilder b = new StringBuilder("<section id=\"protocol\"><h2>5. The protocol</h2>\n");
        b.append("<h3 id=\"leak-free\">What was fitted where</h3>\n<p>Everything fitted from data was fitted on the "
                + "outer training fold only and fitted again inside the inner folds for tuning: scaling, feature "
                + "selection, covariate adjustment and site harmonization, the imputer, the classifier and its "
                + "hyperparameters. A test subject's target view and group were never seen by anything that produced "
                + "its prediction. Training subjects received imputed targets ")
                .append(Html.esc(d.spec.path("imputed-for-training").asText("cross-fitted").equals("observed")
                        ? "only where theirs was missing; observed targets were used where they existed "
                        + "(imputed-for-training: observed)."
                        : "from imputers fitted on the other training subjects (imputed-for-training: cross-fitted), "
                        + "so classifiers trained on imputations of the same quality as at test time."))
                .append(" All pipelines share one fold plan (folds.csv), so every comparison is paired on the same "
                        + "subjects and folds.</p>\n");
        b.append(folds(d));
        b.append("<h3 id=\"tuning\">Tuning grids and chosen hyperparameters</h3>\n").append(Tuning.html(d));
        b.append("<h3 id=\"software\">Run, software and seeds</h3>\n").append(runTable(d));
        b.append("<h3 id=\"spec\">The spec as run</h3>\n<pre class=\"spec\">")
                .append(Html.esc(d.redact.text(d.run.path("spec_text").asText("(not recorded)")))).append("</pre>\n");
        b.append("<h3 id=\"inputs\">Input files (SHA-256)</h3>\n").append(hashes(d));
        return b.append("</section>\n").toString();
    }

    private static String folds(ReportData d) {
        JsonNode v = d.spec.path("validation");
        StringBuilder b = new StringBuilder("<h3 id=\"folds\">Fold scheme</h3>\n<p>");
        b.append(Html.esc("Outer: " + v.path("outer").path("scheme").asText("stratified-k-fold") + ", "
                + v.path("outer").path("folds").asText("?") + " folds, " + v.path("outer").path("repeats").asText("1")
                + " repeat(s). Inner: " + v.path("inner").path("folds").asText("?") + " folds. Tuned by: "
                + v.path("tune-by").asText("balanced-accuracy") + "."));
        b.append("</p>\n");
        if (d.folds != null) {
            Map<String, Map<String, Integer>> sizes = new TreeMap<>();
            d.folds.rows().forEach(r -> sizes.computeIfAbsent(r.s("repetition"), k -> new TreeMap<>())
                    .merge(r.s("fold"), 1, Integer::sum));
            List<List<String>> rows = new ArrayList<>();
            sizes.forEach((rep, m) -> rows.add(List.of(Html.esc(rep), Html.esc(String.valueOf(m.size())),
                    Html.esc(m.values().toString().replaceAll("[\\[\\]]", "")))));
            b.append(Html.table("folds", List.of("repeat", "outer folds", "test subjects per fold"), rows));
        }
        return b.toString();
    }

    private static String runTable(ReportData d) {
        JsonNode r = d.run;
        Map<String, String> m = new LinkedHashMap<>();
        m.put("experiment", r.path("experiment").asText());
        m.put("run", d.runId());
        m.put("status", r.path("status").asText());
        m.put("viewgain", r.path("tool_version").asText());
        m.put("run.json schema", r.path("schema_version").asText());
        m.put("Java", r.path("java_version").asText() + " (" + r.path("java_vendor").asText() + ")");
        m.put("system", r.path("os").asText() + ", " + r.path("arch").asText());
        List<String> libs = new ArrayList<>();
        r.path("libraries").fields().forEachRemaining(e -> libs.add(e.getKey() + " " + e.getValue().asText()));
        m.put("libraries", String.join(", ", libs));
        m.put("seed", r.path("seed").asText());
        m.put("threads", r.path("threads").asText());
        m.put("started", Html.time(r.path("started_at").asText()));
        m.put("finished", Html.time(r.path("finished_at").asText("(not finished)")));
        m.put("elapsed", r.has("elapsed_seconds") ? r.path("elapsed_seconds").asText() + " s" : "");
        m.put("subjects", r.path("subjects").asText(""));
        m.put("pipelines", r.path("pipelines").asText(""));
        m.put("model fits", r.path("model_fits").asText(""));
        List<String> cmd = new ArrayList<>();
        r.path("command_line").forEach(a -> cmd.add(a.asText()));
        m.put("command line", "viewgain " + String.join(" ", cmd));
        m.put("spec file", r.path("spec_file").asText());
        StringBuilder b = new StringBuilder("<table class=\"keyvalue\"><tbody>\n");
        m.forEach((k, v) -> {
            if (!v.isEmpty()) {
                b.append("<tr><th>").append(Html.esc(k)).append("</th><td>").append(Html.esc(d.redact.text(v)))
                        .append("</td></tr>\n");
            }
        });
        b.append("</tbody></table>\n<p class=\"small\">Every random choice derives from the run seed and the "
                + "(repeat, fold, permutation, pipeline) it serves, so the thread count does not change any "
                + "result.</p>\n");
        return b.toString();
    }

    private static String hashes(ReportData d) {
        List<List<String>> rows = new ArrayList<>();
        d.run.path("input_sha256").fields().forEachRemaining(e -> rows.add(List.of(
                Html.esc(d.redact.text(e.getKey())), "<code>" + Html.esc(e.getValue().asText()) + "</code>")));
        if (rows.isEmpty()) {
            return "<p class=\"absent\">No input hashes recorded in run.json.</p>\n";
        }
        String table = Html.table("hashes", List.of("file (relative to the spec)", "SHA-256"), rows);
        if (rows.size() <= 12) {
            return table;
        }
        return "<details><summary>" + rows.size() + " input files (spec, subjects table and views): show the "
                + "hashes</summary>\n" + table + "</details>\n";
    }
}
