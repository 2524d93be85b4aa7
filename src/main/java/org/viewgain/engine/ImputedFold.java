package org.viewgain.engine;

import java.util.List;
import org.viewgain.spec.Params;

/**
 * The imputed target of every subject of one outer fold, from one imputer: training subjects per the spec's
 * {@code imputed-for-training} mode, test subjects always from the imputer fitted on the outer training set.
 *
 * @param imputed     imputed target base vector per subject position (null outside the outer fold's subjects), kept
 *                    in single precision: these stay in memory for the whole run (the permutation phase reuses
 *                    them), and at 1,000 subjects x 35,778 edges a fold's doubles alone take 286 MB; read only (in
 *                    {@code observed} mode a training subject's row is the target view's stored array itself)
 * @param chosen      the grid point chosen by inner cross-validation
 * @param innerMae    the inner cross-validated MAE of the chosen point (NaN when no tuning was needed)
 * @param quality     one row per outer-test subject with an observed target
 * @param edgeErrors  per target feature (base-vector order), the sum over the quality rows of the absolute error;
 *                    null when no test subject has an observed target
 */
record ImputedFold(float[][] imputed, Params chosen, double innerMae, List<Quality> quality, double[] edgeErrors) {

    /** Single precision copy of a row. */
    static float[] compact(double[] row) {
        float[] out = new float[row.length];
        for (int c = 0; c < out.length; c++) {
            out[c] = (float) row[c];
        }
        return out;
    }

    /** The imputed base vector of subject position {@code i} as doubles (a new array), or null. */
    double[] row(int i) {
        float[] r = imputed[i];
        if (r == null) {
            return null;
        }
        double[] out = new double[r.length];
        for (int c = 0; c < r.length; c++) {
            out[c] = r[c];
        }
        return out;
    }

    /**
     * How close one test subject's imputation came to its observed target.
     *
     * @param skill    {@code 1 - mae / mae_mean}, with mae_mean from a {@code mean} imputer fitted on the same
     *                 training subjects; NaN when mae_mean is 0
     */
    record Quality(int subject, double mae, double rmse, double pearsonR, double strengthMae, double skill) {
    }
}
