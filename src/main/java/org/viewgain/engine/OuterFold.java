package org.viewgain.engine;

/**
 * One outer fold of the run's plan: its repeat, its fold within the repeat, and its slot (its position among all
 * outer folds, repeat-major), which indexes the per-fold results and names it in unit keys.
 */
record OuterFold(int repeat, int fold, int slot) {
    OuterFold {
        if (!(repeat >= 0 && fold >= 0 && slot >= 0)) {
            throw new IllegalArgumentException("outer fold " + repeat + "/" + fold + " at slot " + slot);
        }
    }

    /** Every outer fold of a plan, in slot order. */
    static java.util.List<OuterFold> of(org.viewgain.folds.FoldPlan plan) {
        java.util.List<OuterFold> out = new java.util.ArrayList<>();
        for (int r = 0; r < plan.repeats(); r++) {
            for (int f = 0; f < plan.folds(r); f++) {
                out.add(new OuterFold(r, f, out.size()));
            }
        }
        return java.util.List.copyOf(out);
    }
}
