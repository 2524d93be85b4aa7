package org.viewgain.report;

import java.util.ArrayList;
import java.util.List;

/** Section 4: group separation without a classifier (PERMANOVA, from separation.csv), stated as descriptive. */
final class SeparationSection {
    private SeparationSection() {
    }

    static String html(ReportData d) {
        StringBuilder b = new StringBuilder("<section id=\"separation\"><h2>4. Group separation without a "
                + "classifier</h2>\n");
        b.append("<p>PERMANOVA (Anderson 2001): the pseudo-F of the groups on Euclidean distances between the "
                + "standardized features of all subjects that have the feature set, with a permutation p-value. "
                + "<strong>This is descriptive and not cross-validated</strong>: it says whether the groups differ "
                + "in these features on this cohort, not whether a new subject's group can be predicted.</p>\n");
        if (d.separation == null) {
            b.append(Html.notComputed("group separation (PERMANOVA)", "separation.csv"));
            return b.append("</section>\n").toString();
        }
        List<List<String>> rows = new ArrayList<>();
        for (CsvRows.Row r : d.separation.rows()) {
            rows.add(List.of(Html.esc(Names.features(r.s("imputer"), r.s("feature_set"))), Html.esc(r.s("n")),
                    Html.num("pseudo_f", r.s("pseudo_f"), Html.f3(r.d("pseudo_f"))),
                    Html.num("p_value", r.s("p_value"), Html.p(r.d("p_value"))), Html.esc(r.s("permutations"))));
        }
        b.append(Html.table("separation", List.of("feature set", "subjects", "pseudo-F", "p", "permutations"), rows));
        return b.append("</section>\n").toString();
    }
}
