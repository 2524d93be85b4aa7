package org.viewgain.engine;

import java.util.List;
import org.viewgain.spec.Params;

/**
 * The imputed target of every subject of one outer fold, from one imputer: training subjects per the spec's
 * {@code imputed-for-training} mode, test subjects always from the imputer fitted on the outer training set.
 *
 * @param imputed     imputed target base vector per subject position (null outside the outer fold's subjects)
 * @param chosen      the grid point chosen by inner cross-validation
 * @param innerMae    the inner cross-validated MAE of the chosen point (NaN when no tuning was needed)
 * @param quality     one row per outer-test subject with an observed target
 */
record ImputedFold(double[][] imputed, Params chosen, double innerMae, List<Quality> quality) {

    /**
     * How close one test subject's imputation came to its observed target.
     *
     * @param skill    {@code 1 - mae / mae_mean}, with mae_mean from a {@code mean} imputer fitted on the same
     *                 training subjects; NaN when mae_mean is 0
     * @param absError absolute error of each target feature (base-vector order)
     */
    record Quality(int subject, double mae, double rmse, double pearsonR, double strengthMae, double skill,
                   double[] absError) {
    }
}
