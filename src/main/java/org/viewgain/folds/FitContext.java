package org.viewgain.folds;

/**
 * Where a fit happens: which repeat, outer fold and inner fold, for which purpose, and the seed it must use.
 * Every fitted thing (scaler, selector, imputer, classifier) receives one, so that randomness is derived from the
 * run seed and never from a global generator, and so that test stand-ins can check what each fit saw.
 *
 * @param permutation 0 for the observed labels, 1..N for label permutations
 * @param repeat      outer repeat, from 0
 * @param outerFold   outer fold, from 0
 * @param innerFold   inner fold from 0, or {@link #WHOLE} when fitting on the whole outer training set
 * @param role        what the fit is for
 * @param seed        the seed to use for any random choice in this fit
 */
public record FitContext(int permutation, int repeat, int outerFold, int innerFold, Role role, long seed) {

    /** innerFold value of a fit on the whole outer training set. */
    public static final int WHOLE = -1;

    /** Why something is fitted. */
    public enum Role {
        /** Choosing hyperparameters inside the inner folds. */
        TUNE,
        /** Imputing training subjects from imputers fitted on the other training subjects. */
        CROSS_FIT,
        /** The final fit on the outer training set, used to predict the outer test subjects. */
        FINAL,
        /**
         * An imputer fit for tuning a classifier in inner fold {@code innerFold}: fitted on outer-training subjects
         * outside that fold only (its own cross-fits exclude more), so the fold's validation stays clean.
         */
        NESTED
    }

    /** A context for a fit of the same place with another role, inner fold and seed. */
    public FitContext at(int inner, Role newRole, long newSeed) {
        return new FitContext(permutation, repeat, outerFold, inner, newRole, newSeed);
    }
}
