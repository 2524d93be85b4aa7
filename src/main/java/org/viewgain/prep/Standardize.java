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
        return new Scaling(mean, sd);
    }

    /** Fitted standardization: the training means and standard deviations. */
    static final class Scaling implements Fitted, org.viewgain.frozen.Freezable {
        static final String KIND = "standardize";
        private final double[] mean;
        private final double[] sd;

        Scaling(double[] mean, double[] sd) {
            this.mean = mean;
            this.sd = sd;
        }

        @Override
        public String kind() {
            return KIND;
        }

        @Override
        public void freeze(org.viewgain.frozen.FrozenOut out) {
            out.numbers(mean).numbers(sd);
        }

        static Scaling thaw(org.viewgain.frozen.FrozenIn in) {
            double[] mean = in.numbers();
            double[] sd = in.numbers();
            if (mean == null || sd == null || mean.length != sd.length) {
                throw in.bad("means and standard deviations differ in length");
            }
            return new Scaling(mean, sd);
        }

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
            int p = mean.length;
            if (rows.p() != p) {
                throw new IllegalArgumentException("standardize was fitted on " + p + " columns, got " + rows.p());
            }
            for (double[] r : rows.x()) {
                for (int j = 0; j < p; j++) {
                    r[j] = sd[j] > 0 ? (r[j] - mean[j]) / sd[j] : 0;
                }
            }
            return rows;
        }
    }
}
