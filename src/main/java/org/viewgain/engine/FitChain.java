package org.viewgain.engine;

import java.util.ArrayList;
import java.util.List;
import org.viewgain.classify.ClassifierMethod;
import org.viewgain.classify.Predictions;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.prep.Transform;
import org.viewgain.spec.Params;

/**
 * The steps of one fit in their fixed order: covariate adjustment, harmonization, scaling, selection, classifier;
 * each fitted on the rows given to the fit only, then applied to any rows. The label-free steps before selection
 * are fitted once per set of training rows and shared by every grid point.
 */
final class FitChain {
    private FitChain() {
    }

    /** Fitted steps applied one after another. */
    record Steps(List<Transform.Fitted> steps) {
        Steps {
            steps = List.copyOf(steps);
        }

        Rows apply(Rows x) {
            Rows out = x;
            for (Transform.Fitted s : steps) {
                out = s.apply(out);
            }
            return out;
        }

        Steps then(Transform.Fitted next) {
            List<Transform.Fitted> all = new ArrayList<>(steps);
            all.add(next);
            return new Steps(all);
        }
    }

    /** A fitted chain: its steps and the classifier, which sees the rows the steps produce. */
    record Fitted(Steps steps, ClassifierMethod.Model model, List<String> inputNames) {
        Predictions predict(Rows x) {
            return model.predict(steps.apply(x));
        }
    }

    /** Fitted upstream steps and the training rows they produced. */
    record Upstream(Steps steps, Rows transformed) {
    }

    /**
     * Fits adjustment, harmonization and scaling (those configured) in order on {@code x}, each on the output of the
     * one before, and returns them with the transformed training rows. With {@code owned} the caller gives up
     * {@code x} (its arrays may be overwritten: no second copy of the block); otherwise the first step copies.
     */
    static Upstream upstream(Experiment ex, FitContext ctx, Rows x, int[] y, boolean owned) {
        List<Transform.Fitted> steps = new ArrayList<>();
        Rows cur = x;
        boolean mine = owned;
        for (Transform t : new Transform[] {ex.prep().adjuster(), ex.prep().harmonizer(), ex.scaler()}) {
            if (t != null) {
                Transform.Fitted f = t.fit(ctx, cur, y);
                steps.add(f);
                cur = mine ? f.applyInPlace(cur) : f.apply(cur);
                mine = true; // from here on the rows are this chain's own copy
            }
        }
        return new Upstream(new Steps(steps), cur);
    }

    /**
     * The selection of setting {@code selection} (an index into the keep values) fitted on {@code rows} (training
     * rows after the upstream steps), or null for {@code selection} -1 (no selection).
     */
    static Transform.Fitted selection(Experiment ex, FitContext ctx, Rows rows, int[] y, int selection) {
        return selection < 0 ? null : ex.prep().selectors().get(selection).fit(ctx, rows, y);
    }
}
