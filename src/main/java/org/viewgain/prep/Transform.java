package org.viewgain.prep;

import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;

/**
 * A step fitted on training rows only and then applied to any rows (training or test): scaling, selection,
 * covariate adjustment, harmonization. Labels are given to steps that need them (selection); others ignore them.
 */
public interface Transform {

    /** A short name for provenance, e.g. {@code standardize}. */
    String name();

    /** Fits on training rows; {@code y} holds their class indices. */
    Fitted fit(FitContext ctx, Rows train, int[] y);

    /** A fitted step. */
    interface Fitted {
        /** The transformed rows, in new arrays; {@code rows} is left as it was. */
        Rows apply(Rows rows);

        /**
         * The transformed rows, possibly written over {@code rows}' own arrays (saving a copy of a block that can be
         * hundreds of megabytes). Only for rows the caller owns, shares with no one and will not read again.
         */
        default Rows applyInPlace(Rows rows) {
            return apply(rows);
        }
    }

    /**
     * A fitted step that reads each subject's site or covariates (ComBat, covariate adjustment). Applied to another
     * cohort, it is first given that cohort's; the fitted parameters stay those of the training rows.
     */
    interface PerSubject {
        /**
         * The same fitted step, reading subjects' sites and covariates from these maps.
         *
         * @param siteById       subject id to site
         * @param covariatesById subject id to covariate values, in the order the step was fitted with
         */
        Fitted forCohort(java.util.Map<String, String> siteById, java.util.Map<String, double[]> covariatesById);
    }
}
