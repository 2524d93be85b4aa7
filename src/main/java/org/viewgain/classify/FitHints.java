package org.viewgain.classify;

import java.util.HashMap;
import java.util.Map;
import org.viewgain.spec.Params;

/**
 * What the earlier fits of one pipeline's training (its inner folds, in order, then its final fit) tell the later
 * ones about how to compute, never about what: a method may read these hints to choose between ways of computing
 * that give the same model up to rounding. All the fits behind the hints are on the training rows of the same outer
 * fold, so nothing about its test subjects reaches them; the engine makes one per training and passes it to the
 * fits in their fixed order, so a run takes the same paths on any number of threads.
 *
 * <p>Today: how many passes {@code svm-linear} needed at each grid point ({@link LinearSvm}, which then computes
 * the rows' Gram matrix before the first pass instead of after {@link LinearSvm#switchAfter} passes).
 */
public final class FitHints {
    private final Map<Params, Integer> passes = new HashMap<>();

    /** The passes the last fit at this grid point needed, or -1 when none has been fitted. */
    int passes(Params point) {
        return passes.getOrDefault(point, -1);
    }

    void passes(Params point, int count) {
        passes.put(point, count);
    }
}
