package org.viewgain.imputation;

import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.frozen.Freezable;
import org.viewgain.frozen.FrozenIn;
import org.viewgain.frozen.FrozenOut;
import org.viewgain.stats.SmileMatrices;

/**
 * The fitted imputers that can be frozen into a bundle ({@code mean}, {@code nearest-neighbours}, {@code ridge},
 * {@code pls}, {@code multi-kernel-neighbours}), each holding what it needs to impute, and their readers. A thawed imputer runs the same arithmetic on the same
 * numbers as the fitted one, so it imputes bit for bit the same.
 */
public final class FrozenImputers {
    private FrozenImputers() {
    }

    /**
     * The fitted imputer a part holds.
     *
     * @throws IllegalArgumentException for a part of another kind or a damaged one
     */
    public static ViewImputer.Fitted thaw(FrozenIn in) {
        ViewImputer.Fitted out = switch (in.kind()) {
            case Mean.KIND -> new Mean(in.numbers(), in.integer());
            case Neighbours.KIND -> new Neighbours(in.matrix(), in.matrix(), in.integer(), in.integer() == 1);
            case RidgePrimal.KIND -> new RidgePrimal(in.numbers(), in.numbers(), in.matrix());
            case RidgeDual.KIND -> new RidgeDual(in.numbers(), in.numbers(), in.matrix(), in.matrix());
            case RidgeDualInverse.KIND -> new RidgeDualInverse(in.numbers(), in.numbers(), in.matrix(), in.matrix(),
                    in.matrix());
            case Pls.KIND -> new Pls(new SimplsModel(in.numbers(), in.numbers(), in.matrix(), in.matrix(), null),
                    in.integer());
            case MultiKernel.KIND -> new MultiKernel(in.numbers(), in.matrix(), LocalScaleKernels.thaw(in),
                    in.numbers(), in.integer(), in.matrix(), in.integer());
            default -> throw in.bad("not an imputer this version can read");
        };
        in.end();
        return out;
    }

    /** The training mean of every target feature. */
    record Mean(double[] means, int p) implements ViewImputer.Fitted, Freezable {
        static final String KIND = "imputer-mean";

        @Override
        public double[][] impute(FitContext ctx, Rows rows) {
            Shapes.checkWidth(MeanImputer.METHOD, rows, p);
            double[][] out = new double[rows.n()][];
            for (int i = 0; i < out.length; i++) {
                out[i] = means.clone();
            }
            return out;
        }

        @Override
        public String kind() {
            return KIND;
        }

        @Override
        public void freeze(FrozenOut out) {
            out.numbers(means).integer(p);
        }
    }

    /** The k nearest training subjects in the source view: their source rows and targets. */
    /**
     * A fitted nearest-neighbours imputer; {@code trainRows} and {@code shared} (the run's table of source distances,
     * label-free) only speed up imputation inside a run and are not frozen (both null when read from a bundle).
     */
    record Neighbours(double[][] train, double[][] y, int k, boolean byDistance, Rows trainRows,
                      SourceDistances shared) implements ViewImputer.Fitted, Freezable {
        static final String KIND = "imputer-nearest-neighbours";

        Neighbours(double[][] train, double[][] y, int k, boolean byDistance) {
            this(train, y, k, byDistance, null, null);
        }

        @Override
        public double[][] impute(FitContext ctx, Rows rows) {
            return NearestNeighboursImputer.impute(rows, train, y, k, byDistance, trainRows, shared);
        }

        @Override
        public String kind() {
            return KIND;
        }

        @Override
        public void freeze(FrozenOut out) {
            out.matrix(train).matrix(y).integer(k).integer(byDistance ? 1 : 0);
        }
    }

    /** Ridge in its primal form: {@code (x - mx) B + my}. */
    record RidgePrimal(double[] mx, double[] my, double[][] coef) implements ViewImputer.Fitted, Freezable {
        static final String KIND = "imputer-ridge-primal";

        @Override
        public double[][] impute(FitContext ctx, Rows rows) {
            Shapes.checkWidth(RidgeImputer.METHOD, rows, mx.length);
            return RidgeImputer.addMeans(SmileMatrices.times(Centring.centre(rows.x(), mx), coef), my);
        }

        @Override
        public String kind() {
            return KIND;
        }

        @Override
        public void freeze(FrozenOut out) {
            out.numbers(mx).numbers(my).matrix(coef);
        }
    }

    /**
     * Ridge in its dual form as fitted: {@code ((x - mx) Xc') Z Yc + my}, with the centred training rows {@code Xc}
     * and targets {@code Yc} and {@code Z = (Xc Xc' + alpha I)^-1}.
     */
    record RidgeDualInverse(double[] mx, double[] my, double[][] xc, double[][] z, double[][] yc)
            implements ViewImputer.Fitted, Freezable {
        static final String KIND = "imputer-ridge-dual-inverse";

        @Override
        public double[][] impute(FitContext ctx, Rows rows) {
            return impute(cross(rows));
        }

        /** The rows' products with the training rows, {@code (x - mx) Xc'}. */
        double[][] cross(Rows rows) {
            Shapes.checkWidth(RidgeImputer.METHOD, rows, mx.length);
            return SmileMatrices.cross(Centring.centre(rows.x(), mx), xc);
        }

        /** The imputations from the rows' {@link #cross} products. */
        double[][] impute(double[][] cross) {
            return RidgeImputer.addMeans(SmileMatrices.times(SmileMatrices.times(cross, z), yc), my);
        }

        @Override
        public String kind() {
            return KIND;
        }

        @Override
        public void freeze(FrozenOut out) {
            out.numbers(mx).numbers(my).matrix(xc).matrix(z).matrix(yc);
        }
    }

    /**
     * Ridge in its dual form as bundles of earlier versions hold it: {@code (x - mx) Xc' A + my}, with the centred
     * training rows {@code Xc} and {@code A = (Xc Xc' + alpha I)^-1 Yc}; read, no longer fitted.
     */
    record RidgeDual(double[] mx, double[] my, double[][] xc, double[][] a) implements ViewImputer.Fitted, Freezable {
        static final String KIND = "imputer-ridge-dual";

        @Override
        public double[][] impute(FitContext ctx, Rows rows) {
            Shapes.checkWidth(RidgeImputer.METHOD, rows, mx.length);
            double[][] kNew = SmileMatrices.cross(Centring.centre(rows.x(), mx), xc);
            return RidgeImputer.addMeans(SmileMatrices.times(kNew, a), my);
        }

        @Override
        public String kind() {
            return KIND;
        }

        @Override
        public void freeze(FrozenOut out) {
            out.numbers(mx).numbers(my).matrix(xc).matrix(a);
        }
    }

    /** PLS (SIMPLS): means, weights and loadings; the training scores are not needed to predict and not kept. */
    record Pls(SimplsModel model, int p) implements ViewImputer.Fitted, Freezable {
        static final String KIND = "imputer-pls";

        @Override
        public double[][] impute(FitContext ctx, Rows rows) {
            Shapes.checkWidth(PlsImputer.METHOD, rows, p);
            return model.predict(rows.x());
        }

        @Override
        public String kind() {
            return KIND;
        }

        @Override
        public void freeze(FrozenOut out) {
            out.numbers(model.xMeans()).numbers(model.yMeans()).matrix(model.weights()).matrix(model.loadings())
                    .integer(p);
        }
    }

    /**
     * Multi-kernel neighbours: the centring, the centred training sources, their local kernel scales, the learned
     * kernel weights, the neighbour count and the training targets.
     */
    record MultiKernel(double[] centre, double[][] train, LocalScaleKernels kernels, double[] weights, int k,
                       double[][] y, int q) implements ViewImputer.Fitted, Freezable {
        static final String KIND = "imputer-multi-kernel-neighbours";

        @Override
        public double[][] impute(FitContext ctx, Rows rows) {
            return MultiKernelNeighboursImputer.impute(rows, centre, train, kernels, weights, k, y, q);
        }

        @Override
        public String kind() {
            return KIND;
        }

        @Override
        public void freeze(FrozenOut out) {
            out.numbers(centre).matrix(train);
            kernels.freeze(out);
            out.numbers(weights).integer(k).matrix(y).integer(q);
        }
    }
}
