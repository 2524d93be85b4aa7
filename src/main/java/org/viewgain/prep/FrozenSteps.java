package org.viewgain.prep;

import org.viewgain.frozen.FrozenIn;

/** Reads fitted steps back from their bundle parts. */
public final class FrozenSteps {
    private FrozenSteps() {
    }

    /**
     * The fitted step a part holds.
     *
     * @throws IllegalArgumentException for a part of another kind or a damaged one
     */
    public static Transform.Fitted thaw(FrozenIn in) {
        Transform.Fitted out = switch (in.kind()) {
            case Standardize.Scaling.KIND -> Standardize.Scaling.thaw(in);
            case SelectTopK.Selection.KIND -> SelectTopK.Selection.thaw(in);
            case ComBatFit.KIND -> ComBatFit.thaw(in);
            case CovariateAdjust.Adjustment.KIND -> CovariateAdjust.Adjustment.thaw(in);
            default -> throw in.bad("not a step this version can read");
        };
        in.end();
        return out;
    }

    /**
     * The sites a fitted step harmonizes, sorted: those of a ComBat fit, empty for any other step. A cohort it is
     * applied to must have only these sites.
     */
    public static java.util.SortedSet<String> sites(Transform.Fitted f) {
        return f instanceof ComBatFit c ? c.sites() : new java.util.TreeSet<>();
    }

    /**
     * Whether a fitted step reads covariates in the given order: a covariate adjustment with these names, a ComBat
     * with as many protected covariates; any other step reads none and fits any list.
     */
    public static boolean readsCovariates(Transform.Fitted f, java.util.List<String> names) {
        if (f instanceof CovariateAdjust.Adjustment a) {
            return a.names().equals(names);
        }
        return !(f instanceof ComBatFit c) || c.covariates() == 0 || c.covariates() == names.size();
    }
}
