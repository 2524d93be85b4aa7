package org.viewgain.report;

import java.util.HashSet;
import java.util.Set;
import org.viewgain.stats.CorrectedTTest;

/**
 * Whether a run's outer plan left the corrected repeated cross-validation t-test with little power: a stratified
 * k-fold plan with fewer folds or repeats than the 10 x 10 that Bouckaert &amp; Frank (2004) recommend. Read from
 * {@code folds.csv} (folds and repeats as run) and the spec in {@code run.json} (the scheme).
 */
final class Power {
    final int folds;
    final int repeats;
    final boolean kFold;

    private Power(int folds, int repeats, boolean kFold) {
        this.folds = folds;
        this.repeats = repeats;
        this.kFold = kFold;
    }

    static Power of(int folds, int repeats, boolean kFold) {
        return new Power(folds, repeats, kFold);
    }

    static Power of(ReportData d) {
        String scheme = d.spec.path("validation").path("outer").path("scheme").asText("stratified-k-fold");
        Set<String> repeats = new HashSet<>();
        Set<String> folds = new HashSet<>();
        if (d.folds != null && !d.folds.rows().isEmpty()) {
            String first = d.folds.rows().get(0).s("repetition");
            for (CsvRows.Row r : d.folds.rows()) {
                repeats.add(r.s("repetition"));
                if (r.s("repetition").equals(first)) {
                    folds.add(r.s("fold"));
                }
            }
        }
        return of(folds.size(), repeats.size(), scheme.equals("stratified-k-fold") && !folds.isEmpty());
    }

    /** True when the plan is k-fold with fewer folds or repeats than recommended. */
    boolean low() {
        return kFold && CorrectedTTest.fewResamples(folds, repeats);
    }

    /** The plan in words, e.g. "5 folds x 2 repeats". */
    String plan() {
        return folds + " folds x " + repeats + (repeats == 1 ? " repeat" : " repeats");
    }

    /** A plain note for the answer section; empty when the plan is not low in power. */
    String note() {
        if (!low()) {
            return "";
        }
        return "With " + plan() + " the corrected repeated cross-validation t-test, on which each verdict rests, "
                + "has little power: its correction for overlapping training sets makes it conservative, and with "
                + "few resamples it misses real differences (on invented cohorts of 60 subjects it found a planted "
                + "gain of 0.12 in balanced accuracy in 29% of cohorts at 5 x 2 and 75% at 10 x 10; "
                + "docs/benchmarks.md). A p-value above the level is therefore not evidence that the pipelines "
                + "perform alike. Bouckaert & Frank (2004) recommend 10 repeats of 10-fold cross-validation for "
                + "this test: set validation.outer.folds: 10 (at most the size of the smallest group) and "
                + "validation.outer.repeats: 10, and rerun.";
    }
}
