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
}
