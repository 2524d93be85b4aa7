package org.viewgain.imputation;

import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.frozen.Freezable;
import org.viewgain.frozen.FrozenIn;
import org.viewgain.frozen.FrozenOut;

/**
 * The fitted imputers that can be frozen into a bundle ({@code mean}, {@code nearest-neighbours}, {@code ridge}),
 * each holding what it needs to impute, and their readers. A thawed imputer runs the same arithmetic on the same
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

    /** Ridge in its dual form: {@code (x - mx) Xc' A + my}, with the centred training rows {@code Xc}. */
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
}
