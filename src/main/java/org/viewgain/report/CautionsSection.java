package org.viewgain.report;

/** Section 6: what the results are not, in plain words. */
final class CautionsSection {
    private CautionsSection() {
    }

    static String html(ReportData d) {
        return "<section id=\"cautions\"><h2>6. Cautions</h2>\n<ul class=\"cautions\">\n"
                + "<li><strong>Research use only.</strong> These results describe a cohort; they are not a diagnosis "
                + "and must not be used to make decisions about any person.</li>\n"
                + "<li><strong>Small cohorts give wide intervals.</strong> Cross-validated accuracy on a few dozen "
                + "or a few hundred subjects is uncertain by several percentage points or more (Varoquaux 2018, "
                + "NeuroImage 180:68\u201377); read the intervals, not only the point estimates.</li>\n"
                + "<li><strong>Independent validation is needed.</strong> Any clinical use needs validation on "
                + "independent data, under local regulations and with ethics approval.</li>\n"
                + "<li><strong>Missing-view assumption.</strong> Imputation assumes that a subject's target view is "
                + "missing at random given the source view; if the reason a target is missing is related to the "
                + "group or to the unseen target itself, the imputed view and every comparison that uses it can be "
                + "biased; the complete-case feature sets (target, source+target) then describe a selected subgroup. The "
                + "cohort section tests whether missing targets are associated with group, site or a covariate; a "
                + "test that finds nothing does not show that targets are missing at random.</li>\n"
                + "<li><strong>Permutation and PERMANOVA p-values</strong> test against chance on this cohort only; "
                + "group separation without a classifier is descriptive.</li>\n"
                + "</ul>\n</section>\n";
    }
}
