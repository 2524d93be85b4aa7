package org.viewgain.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * The missing-target audit in the cohort section: the pattern of missing target views with counts per group, site
 * and covariate, the test of each (from {@code missingness.csv}), and a warning when any is associated with
 * missingness. Empty for runs without that table (no target view, nothing missing, or an older run).
 */
final class MissingSection {
    private MissingSection() {
    }

    static String html(ReportData d) {
        if (d.missingness == null || d.missingness.rows().isEmpty()) {
            return "";
        }
        List<List<String>> rows = new ArrayList<>();
        for (CsvRows.Row r : d.missingness.rows()) {
            int obs = r.i("target_observed", 0);
            int mis = r.i("target_missing", 0);
            String pattern = r.s("level").isEmpty()
                    ? "median " + CsvTable.formatNumber(r.d("median_observed")) + " with a target, "
                    + CsvTable.formatNumber(r.d("median_missing")) + " without"
                    : String.format(Locale.ROOT, "%d of %d missing (%.0f%%)", mis, obs + mis,
                    obs + mis == 0 ? 0 : 100.0 * mis / (obs + mis));
            rows.add(List.of(Html.esc(r.s("variable")), Html.esc(r.s("level")), String.valueOf(obs),
                    String.valueOf(mis), Html.esc(pattern), Html.esc(MissingTargets.testName(r.s("test"))),
                    Html.esc(MissingTargets.pText(r.d("p_value"))), Html.esc(r.s("caveat"))));
        }
        return "<h3 id=\"missing-targets\">Missing target views</h3>\n<p>Is a missing target view associated with "
                + "group, site or a covariate? Fisher's exact test for two levels, its Freeman-Halton extension for more "
                + "(a chi-square test when the tables are too many to enumerate), the "
                + "Wilcoxon rank-sum test for a covariate (two-sided, unadjusted). A p above the level does not show "
                + "that targets are missing at random.</p>\n"
                + Html.table("missing", List.of("variable", "level", "target observed", "target missing",
                "pattern", "test", "p", "caveat"), rows);
    }

    /** A warning when a test has p at most the run's alpha; none otherwise. */
    static List<String> warnings(ReportData d) {
        if (d.missingness == null) {
            return List.of();
        }
        List<String> assoc = new ArrayList<>();
        for (CsvRows.Row r : d.missingness.rows()) {
            if (r.d("p_value") <= d.alpha() && !assoc.contains(r.s("variable"))) {
                assoc.add(r.s("variable"));
            }
        }
        if (assoc.isEmpty()) {
            return List.of();
        }
        return List.of("Whether the target view is missing is associated with " + String.join(", ", assoc)
                + " (p \u2264 " + CsvTable.formatNumber(d.alpha()) + "; table above): the complete-case feature "
                + "sets (target, source+target) describe a selected subgroup, not the cohort, and imputation's "
                + "missing-at-random assumption is doubtful.");
    }
}
