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
            default -> throw in.bad("not a step this version can read");
        };
        in.end();
        return out;
    }

    /** Whether a configured step can be frozen: standardization and selection; adjustment and ComBat cannot yet. */
    public static boolean freezable(Transform t) {
        return t instanceof Standardize || t instanceof SelectTopK;
    }
}
