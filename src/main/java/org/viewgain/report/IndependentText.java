package org.viewgain.report;

import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.viewgain.engine.Experiment;
import org.viewgain.engine.IndependentData;

/** What {@code check} and a run print about the final pipelines and the independent cohort. */
final class IndependentText {
    private IndependentText() {
    }

    static String text(Experiment ex) {
        if (!ex.spec().finalPipelines()) {
            return "";
        }
        StringBuilder b = new StringBuilder("\nfinal pipelines: each pipeline is refitted on all ")
                .append(ex.data().n()).append(" development subjects after cross-validation (tuned by the same inner")
                .append(" folds) and written to bundle/ (+").append(ex.pipelines().size()).append(" units)\n");
        IndependentData ind = ex.independent();
        if (ind == null) {
            return b.toString();
        }
        b.append("independent cohort '").append(ind.spec().name()).append("': ").append(ind.n()).append(" subjects");
        b.append(ind.spec().labelled() ? ", labelled" : ", no labels (predictions only)");
        b.append(ind.target() == null ? ", no target view" : ", target observed for " + ind.withTarget());
        b.append('\n');
        if (ind.y() != null) {
            List<String> groups = ex.spec().cohort().groups();
            int[] count = new int[groups.size()];
            for (int y : ind.y()) {
                count[y]++;
            }
            b.append("  per group:");
            for (int g = 0; g < groups.size(); g++) {
                b.append(' ').append(groups.get(g)).append('=').append(count[g]);
            }
            b.append('\n');
        }
        if (ind.spec().site() != null) {
            Map<String, Integer> bySite = new TreeMap<>();
            ind.subjects().forEach(s -> bySite.merge(s.site(), 1, Integer::sum));
            b.append("  per site:");
            bySite.forEach((k, v) -> b.append(' ').append(k).append('=').append(v));
            b.append('\n');
        }
        b.append("  source: ").append(CheckReport.describe(ind.source())).append(" (same regions as the development"
                + " cohort)\n");
        if (ind.target() != null) {
            b.append("  target: ").append(CheckReport.describe(ind.target())).append('\n');
        }
        b.append("  ").append(duplicates(ex, 5));
        return b.toString();
    }

    /**
     * Possible duplicate scans between the cohorts, at most {@code limit} listed; one line when there are none, empty
     * without an independent cohort.
     */
    static String duplicates(Experiment ex, int limit) {
        IndependentData ind = ex.independent();
        if (ind == null) {
            return "";
        }
        double threshold = ex.spec().cohort().duplicateThreshold();
        if (ind.duplicates().isEmpty()) {
            return "possible duplicates of development subjects: none (no source view correlates above " + threshold
                    + " with a development subject's)\n";
        }
        StringBuilder b = new StringBuilder("possible duplicates of development subjects: ")
                .append(ind.duplicates().size()).append(" pair(s) whose source views correlate above ")
                .append(threshold).append("; a development subject in the independent cohort makes its result"
                        + " optimistic\n");
        for (int k = 0; k < Math.min(limit, ind.duplicates().size()); k++) {
            var d = ind.duplicates().get(k);
            b.append(String.format(java.util.Locale.ROOT, "    %s (independent) ~ %s (development) (r = %.6f)%n",
                    ind.id(d.b()), ex.data().id(d.a()), d.correlation()));
        }
        if (ind.duplicates().size() > limit) {
            b.append("    ... and ").append(ind.duplicates().size() - limit)
                    .append(" more (all are listed in external_duplicates.csv)\n");
        }
        return b.toString();
    }
}
