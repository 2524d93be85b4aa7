package org.viewgain.report;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;

/**
 * Section 2, the cohort and its flow: subjects per group and site, observed targets, who entered which feature set
 * and why not, duplicate ids, and plain warnings about features of the cohort that weaken the answer.
 */
final class CohortSection {
    private CohortSection() {
    }

    static String html(ReportData d) {
        StringBuilder b = new StringBuilder("<section id=\"cohort\"><h2>2. The cohort and its flow</h2>\n");
        if (d.folds == null) {
            b.append(Html.notComputed("the cohort table", "folds.csv"));
            return b.append("</section>\n").toString();
        }
        String firstRepeat = d.folds.rows().isEmpty() ? "1" : d.folds.rows().get(0).s("repetition");
        List<CsvRows.Row> subjects = d.folds.where(r -> r.s("repetition").equals(firstRepeat));
        Map<String, int[]> groups = new LinkedHashMap<>();
        Map<String, Map<String, Integer>> sites = new TreeMap<>();
        Map<String, Integer> seen = new LinkedHashMap<>();
        for (CsvRows.Row r : subjects) {
            int[] c = groups.computeIfAbsent(r.s("group"), k -> new int[2]);
            c[0]++;
            c[1] += hasTarget(r) ? 1 : 0;
            if (!r.s("site").isEmpty()) {
                sites.computeIfAbsent(r.s("site"), k -> new LinkedHashMap<>()).merge(r.s("group"), 1, Integer::sum);
            }
            seen.merge(r.s("subject"), 1, Integer::sum);
        }
        boolean targets = subjects.stream().anyMatch(CohortSection::hasTarget);
        b.append(flow(subjects.size(), groups, targets));
        b.append(groupTable(groups, sites, targets));
        b.append(MissingSection.html(d));
        b.append("<h3 id=\"flow\">Who entered which feature set</h3>\n").append(FlowTable.html(d, groups));
        List<String> dups = new ArrayList<>();
        seen.forEach((id, k) -> {
            if (k > 1) {
                dups.add(d.redact.id(id) + " (" + k + " times)");
            }
        });
        b.append("<h3>Checks</h3>\n<ul class=\"checks\">\n");
        b.append(dups.isEmpty() ? "<li class=\"ok\">No duplicate subject ids in the fold plan.</li>\n"
                : "<li class=\"warn\">Duplicate subject ids: " + Html.esc(String.join(", ", dups)) + ".</li>\n");
        List<String> all = new ArrayList<>(warnings(groups, sites, targets));
        all.addAll(MissingSection.warnings(d));
        for (String w : all) {
            b.append("<li class=\"warn\">").append(Html.esc(w)).append("</li>\n");
        }
        return b.append("</ul>\n</section>\n").toString();
    }

    private static String flow(int n, Map<String, int[]> groups, boolean targets) {
        int seen = groups.values().stream().mapToInt(c -> c[1]).sum();
        StringBuilder b = new StringBuilder("<div class=\"flow\">");
        b.append("<div class=\"box\"><b>").append(n)
                .append("</b> subjects with a source view<br><span class=\"small\">")
                .append(Html.esc(perGroup(groups, 0))).append("</span></div>");
        if (targets) {
            b.append("<div class=\"arrow\">\u2192</div><div class=\"box\"><b>").append(seen)
                    .append("</b> with an observed target view<br><span class=\"small\">")
                    .append(Html.esc(perGroup(groups, 1))).append("</span></div>");
            b.append("<div class=\"arrow\">\u2192</div><div class=\"box\"><b>").append(n - seen)
                    .append("</b> without: their target is imputed for source+imputed, and they are left out of "
                            + "target and source+target</div>");
        }
        return b.append("</div>\n").toString();
    }

    private static String perGroup(Map<String, int[]> groups, int k) {
        List<String> parts = new ArrayList<>();
        groups.forEach((g, c) -> parts.add(g + " " + c[k]));
        return String.join(", ", parts);
    }

    private static String groupTable(Map<String, int[]> groups, Map<String, Map<String, Integer>> sites,
                                     boolean targets) {
        List<String> head = new ArrayList<>(List.of("group", "subjects"));
        if (targets) {
            head.addAll(List.of("target observed", "target missing"));
        }
        sites.keySet().forEach(s -> head.add("site " + Html.esc(s)));
        List<List<String>> rows = new ArrayList<>();
        int[] total = new int[2];
        groups.forEach((g, c) -> {
            List<String> row = new ArrayList<>(List.of(Html.esc(g), String.valueOf(c[0])));
            if (targets) {
                row.add(String.valueOf(c[1]));
                row.add(String.valueOf(c[0] - c[1]));
            }
            sites.values().forEach(m -> row.add(String.valueOf(m.getOrDefault(g, 0))));
            rows.add(row);
            total[0] += c[0];
            total[1] += c[1];
        });
        List<String> all = new ArrayList<>(List.of("<b>all</b>", "<b>" + total[0] + "</b>"));
        if (targets) {
            all.add(String.valueOf(total[1]));
            all.add(String.valueOf(total[0] - total[1]));
        }
        sites.values().forEach(m -> all.add(String.valueOf(m.values().stream().mapToInt(Integer::intValue).sum())));
        rows.add(all);
        return Html.table("cohort", head, rows);
    }

    /** Plain warnings: small groups, imbalance, site-group confounding, target missingness that differs by group. */
    static List<String> warnings(Map<String, int[]> groups, Map<String, Map<String, Integer>> sites, boolean targets) {
        List<String> out = new ArrayList<>();
        int min = groups.values().stream().mapToInt(c -> c[0]).min().orElse(0);
        int max = groups.values().stream().mapToInt(c -> c[0]).max().orElse(0);
        // Threshold is common practice, no source: below ~50 per group, CV intervals span +-10 points or more.
        if (min < 50) {
            out.add("Small cohort: the smallest group has " + min + " subjects, so every estimate has a wide "
                    + "interval (Varoquaux 2018).");
        }
        if (min > 0 && max > 1.5 * min) {
            out.add("Unbalanced groups (" + max + " against " + min + "): read balanced accuracy and AUC, not "
                    + "accuracy.");
        }
        Set<String> all = groups.keySet();
        sites.forEach((site, m) -> {
            if (all.size() > 1 && m.size() == 1) {
                out.add("Site " + site + " holds only group " + m.keySet().iterator().next()
                        + ": site and group are confounded there.");
            }
        });
        if (targets && groups.size() > 1) {
            Set<String> rates = new LinkedHashSet<>();
            double lo = 1;
            double hi = 0;
            for (Map.Entry<String, int[]> e : groups.entrySet()) {
                double f = e.getValue()[0] == 0 ? 0 : 1.0 - (double) e.getValue()[1] / e.getValue()[0];
                lo = Math.min(lo, f);
                hi = Math.max(hi, f);
                rates.add(e.getKey() + " " + String.format(Locale.ROOT, "%.0f%%", 100 * f));
            }
            if (hi - lo > 0.15) {
                out.add("The target view is missing more often in some groups (" + String.join(", ", rates)
                        + "): imputation assumes targets are missing at random given the source, which is doubtful "
                        + "here.");
            }
        }
        return out;
    }

    /** folds.csv's has_target: true/false, or yes/no in runs written before the tables used true/false. */
    static boolean hasTarget(CsvRows.Row r) {
        return r.s("has_target").equals("true") || r.s("has_target").equals("yes");
    }
}
