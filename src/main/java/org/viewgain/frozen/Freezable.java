package org.viewgain.frozen;

/**
 * A fitted thing (a transform, an imputer, a model) that can write everything it needs to predict into a part of a
 * bundle; its package reads it back by {@link #kind()} into an object that predicts bit for bit the same.
 */
public interface Freezable {
    /** The part's kind, e.g. {@code standardize}, {@code random-forest}; it selects the reader. */
    String kind();

    /** Writes the state, in the order its reader reads it. */
    void freeze(FrozenOut out);
}
