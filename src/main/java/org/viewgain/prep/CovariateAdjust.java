package org.viewgain.prep;

import java.util.List;
import java.util.Map;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.QRDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.SingularMatrixException;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;

/**
 * Regresses covariates (e.g. age, sex coded 0/1) out of every feature: ordinary least squares of each feature on an
 * intercept and the covariates, fitted on the training rows; applying subtracts the covariate part
 * {@code covariates * beta} (the intercept stays, so columns keep their training mean) from any rows, with the
 * training coefficients. Group labels are never covariates.
 */
public final class CovariateAdjust implements Transform {

    private final Map<String, double[]> covariatesById;
    private final List<String> names;

    /**
     * @param covariatesById covariate values per subject id, in the order of {@code names}
     * @param names          covariate names, for messages
     */
    public CovariateAdjust(Map<String, double[]> covariatesById, List<String> names) {
        this.covariatesById = Map.copyOf(covariatesById);
        this.names = List.copyOf(names);
        if (this.names.isEmpty()) {
            throw new IllegalArgumentException("covariate adjustment needs at least one covariate");
        }
    }

    @Override
    public String name() {
        return "covariate-adjust";
    }

    /** Covariate rows of these subjects, each prefixed by 1 when {@code intercept}. */
    double[][] design(Rows rows, boolean intercept) {
        int q = names.size();
        int offset = intercept ? 1 : 0;
        double[][] z = new double[rows.n()][q + offset];
        for (int i = 0; i < rows.n(); i++) {
            String id = rows.ids().get(i);
            double[] c = covariatesById.get(id);
            if (c == null || c.length != q) {
                throw new IllegalArgumentException("subject '" + id + "' has no value for covariates "
                        + String.join(", ", names));
            }
            if (intercept) {
                z[i][0] = 1;
            }
            for (int k = 0; k < q; k++) {
                if (!Double.isFinite(c[k])) {
                    throw new IllegalArgumentException("subject '" + id + "': covariate '" + names.get(k)
                            + "' is not a finite number");
                }
                z[i][k + offset] = c[k];
            }
        }
        return z;
    }

    @Override
    public Fitted fit(FitContext ctx, Rows train, int[] y) {
        double[][] z = design(train, true);
        if (!(train.n() > z[0].length)) {
            throw new IllegalArgumentException("covariate adjustment needs more training rows (" + train.n()
                    + ") than covariates plus intercept (" + z[0].length + ")");
        }
        RealMatrix beta;
        try {
            beta = new QRDecomposition(new Array2DRowRealMatrix(z, false), 1e-10).getSolver()
                    .solve(new Array2DRowRealMatrix(train.x(), false));
        } catch (SingularMatrixException e) {
            throw new IllegalArgumentException("covariates " + String.join(", ", names)
                    + " are collinear (or constant) on the training rows");
        }
        int p = train.p();
        int q = names.size();
        return new Adjustment(this, beta.getSubMatrix(1, q, 0, p - 1).getData());
    }

    /**
     * The fitted adjustment: the training slopes of every feature on the covariates. It can be frozen into a bundle
     * (covariate names and slopes) and applied to another cohort's subjects with their own covariate values.
     */
    static final class Adjustment implements Fitted, Transform.PerSubject, org.viewgain.frozen.Freezable {
        static final String KIND = "covariate-adjust";
        private final CovariateAdjust owner;
        private final double[][] slopes;

        Adjustment(CovariateAdjust owner, double[][] slopes) {
            this.owner = owner;
            this.slopes = slopes;
        }

        /** The covariates, in the order of their slopes. */
        List<String> names() {
            return owner.names;
        }

        @Override
        public Rows apply(Rows rows) {
            int p = slopes.length == 0 ? rows.p() : slopes[0].length;
            int q = slopes.length;
            if (rows.p() != p) {
                throw new IllegalArgumentException("covariate adjustment was fitted on " + p + " columns, got "
                        + rows.p());
            }
            double[][] c = owner.design(rows, false);
            double[][] out = new double[rows.n()][p];
            for (int i = 0; i < rows.n(); i++) {
                for (int j = 0; j < p; j++) {
                    double fitted = 0;
                    for (int k = 0; k < q; k++) {
                        fitted += c[i][k] * slopes[k][j];
                    }
                    out[i][j] = rows.x()[i][j] - fitted;
                }
            }
            return rows.withValues(out, rows.featureNames());
        }

        @Override
        public Fitted forCohort(Map<String, String> siteById, Map<String, double[]> covariatesById) {
            return new Adjustment(new CovariateAdjust(covariatesById, owner.names), slopes);
        }

        @Override
        public String kind() {
            return KIND;
        }

        @Override
        public void freeze(org.viewgain.frozen.FrozenOut out) {
            out.texts(owner.names).matrix(slopes);
        }

        /** A frozen adjustment read back; it needs the covariates of the cohort it is applied to. */
        static Adjustment thaw(org.viewgain.frozen.FrozenIn in) {
            List<String> names = in.texts();
            double[][] slopes = in.matrix();
            if (names == null || names.isEmpty() || slopes == null || slopes.length != names.size()
                    || java.util.Arrays.stream(slopes).anyMatch(r -> r == null || r.length != slopes[0].length)) {
                throw in.bad("covariate names and slopes differ in count");
            }
            return new Adjustment(new CovariateAdjust(Map.of(), names), slopes);
        }
    }
}
