package org.viewgain.report;

import java.util.List;
import org.viewgain.engine.Comparisons;
import org.viewgain.engine.PermutationResult;

/** Tables of the permutation tests and the paired comparisons. */
public final class SignificanceTables {
    private SignificanceTables() {
    }

    public static CsvTable permutations(List<PermutationResult> perms) {
        CsvTable t = new CsvTable("imputer", "feature_set", "classifier", "metric", "observed", "permutations_run",
                "exceedances", "p_value", "stopped_early", "exchangeability");
        for (PermutationResult p : perms) {
            t.row().text(p.pipeline().imputer()).text(p.pipeline().featureSet().label()).text(p.pipeline().classifier())
                    .text(p.metric()).number(p.observed()).integer(p.null_().length)
                    .integer(p.exceedances()).number(p.pValue()).text(p.stoppedEarly() ? "true" : "false")
                    .text(p.withinSites() ? "within site" : "whole cohort");
        }
        return t;
    }

    public static CsvTable permutationNull(List<PermutationResult> perms) {
        CsvTable t = new CsvTable("imputer", "feature_set", "classifier", "metric", "permutation",
                "estimate");
        for (PermutationResult p : perms) {
            for (int k = 0; k < p.null_().length; k++) {
                t.row().text(p.pipeline().imputer()).text(p.pipeline().featureSet().label())
                        .text(p.pipeline().classifier()).text(p.metric()).integer(k + 1)
                        .number(p.null_()[k]);
            }
        }
        return t;
    }

    public static CsvTable comparisons(List<Comparisons.Row> rows) {
        CsvTable t = new CsvTable("comparison", "imputer_a", "feature_set_a", "classifier_a", "imputer_b",
                "feature_set_b", "classifier_b", "n", "test", "metric", "quantity", "estimate_a", "estimate_b",
                "difference", "ci_low", "ci_high", "statistic", "p_value", "p_adjusted", "adjust_method", "prob_a_better",
                "prob_equivalent", "prob_b_better", "rope");
        for (Comparisons.Row r : rows) {
            t.row().text(r.comparison()).text(r.a().imputer()).text(r.a().featureSet().label()).text(r.a().classifier())
                    .text(r.b().imputer()).text(r.b().featureSet().label()).text(r.b().classifier()).integer(r.n())
                    .text(r.test()).text(r.metric()).text(r.quantity()).number(r.estimateA()).number(r.estimateB())
                    .number(r.difference()).number(r.ciLow()).number(r.ciHigh()).number(r.statistic())
                    .number(r.pValue()).number(r.pAdjusted()).text(r.adjustMethod()).number(r.probABetter())
                    .number(r.probEquivalent()).number(r.probBBetter()).number(r.rope());
        }
        return t;
    }

    public static CsvTable separation(List<org.viewgain.engine.Separation.Row> rows) {
        CsvTable t = new CsvTable("imputer", "feature_set", "n", "pseudo_f", "p_value", "permutations");
        for (org.viewgain.engine.Separation.Row r : rows) {
            t.row().text(r.imputer()).text(r.featureSet()).integer(r.n()).number(r.pseudoF()).number(r.pValue())
                    .integer(r.permutations());
        }
        return t;
    }
}
