package org.viewgain.engine;

import java.util.List;
import org.viewgain.prep.Transform;

/**
 * The steps of {@code features} fitted inside every fit before scaling and the classifier: covariate adjustment, then
 * harmonization; after scaling, selection with one of the {@code keep} values (a grid searched together with the
 * classifier's grid).
 *
 * @param adjuster   covariate adjustment, or null
 * @param harmonizer site harmonization, or null
 * @param method     selection method, or null for no selection
 * @param keep       the keep values (empty without selection)
 * @param selectors  one selection step per keep value, same order
 */
public record Preprocessing(Transform adjuster, Transform harmonizer, String method, List<Integer> keep,
                            List<Transform> selectors) {
    public Preprocessing {
        keep = List.copyOf(keep);
        selectors = List.copyOf(selectors);
        if (keep.size() != selectors.size()) {
            throw new IllegalArgumentException("one selector per keep value");
        }
    }

    /** No steps besides scaling. */
    public static Preprocessing none() {
        return new Preprocessing(null, null, null, List.of(), List.of());
    }

    /** Whether features are selected. */
    public boolean selects() {
        return !selectors.isEmpty();
    }

    /** How many selection settings each classifier grid point is combined with (1 without selection). */
    public int selectionPoints() {
        return selects() ? selectors.size() : 1;
    }
}
