package org.viewgain.prep;

import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;

/**
 * Centres each column on its training mean and divides by its training standard deviation (divisor n - 1). A column
 * constant on the training rows becomes 0 for every row, so no NaN appears.
 */
public final class Standardize implements Transform {

    @Override
    public String name() {
        return "standardize";
    }

    @Override
    public Fitted fit(FitContext ctx, Rows train, int[] y) {
        int n = train.n();
        int p = train.p();
        if (!(n >= 1)) {
            throw new IllegalArgumentException("standardize: no training rows");
        }
        double[] mean = ColumnStats.means(train.x(), p);
        // row by row (each column still sums its rows in order): a column-wise pass strides through every row
        // for every column, which is slow on blocks of tens of thousands of columns
        double[] sd = new double[p];
        for (double[] r : train.x()) {
            for (int j = 0; j < p; j++) {
                double d = r[j] - mean[j];
                sd[j] += d * d;
            }
        }
        for (int j = 0; j < p; j++) {
            sd[j] = n > 1 ? Math.sqrt(sd[j] / (n - 1)) : 0;
        }
        return new Fitted() {
            @Override
            public Rows apply(Rows rows) {
                double[][] out = new double[rows.n()][];
                for (int i = 0; i < rows.n(); i++) {
                    out[i] = rows.x()[i].clone();
                }
                return applyInPlace(rows.withValues(out, rows.featureNames()));
            }

            @Override
            public Rows applyInPlace(Rows rows) {
                for (double[] r : rows.x()) {
                    for (int j = 0; j < p; j++) {
                        r[j] = sd[j] > 0 ? (r[j] - mean[j]) / sd[j] : 0;
                    }
                }
                return rows;
            }
        };
    }
}
