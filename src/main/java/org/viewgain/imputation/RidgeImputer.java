package org.viewgain.imputation;

import java.util.List;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.spec.ParamDef;
import org.viewgain.spec.Params;
import org.viewgain.stats.SmileMatrices;

/**
 * Multi-output ridge regression (Hoerl &amp; Kennard 1970) with an unpenalised intercept: source and target are
 * centred on their training means and {@code B = (X'X + alpha I)^-1 X'Y}. When source features outnumber training
 * subjects the equal dual (kernel) form {@code B = X'(XX' + alpha I)^-1 Y} is solved instead (an n x n system in
 * place of p x p; Saunders, Gammerman &amp; Vovk 1998). Both are solved by Cholesky; the dual keeps the inverse of
 * the n x n system, so that imputing costs two products with it instead of a solve with one right side per target
 * feature at fit time. The points of a grid fitted together ({@link #fitGrid}) share the centring and the Gram matrix.
 * In a run, the dual form reads the products of its centred training rows, and of the rows it imputes with them, from
 * the run's table of source products ({@link SourceGram}, computed once for every ridge fit of the run) whenever the
 * rows are the cohort's source views as loaded; otherwise it computes them.
 */
public final class RidgeImputer implements ViewImputer {

    /** The name used in specs. */
    public static final String METHOD = "ridge";

    /** Which system to solve; AUTO picks the smaller one. */
    enum Form { AUTO, PRIMAL, DUAL }

    @Override
    public String method() {
        return METHOD;
    }

    @Override
    public List<ParamDef> parameters() {
        return List.of(ParamDef.number("alpha", 1e-12, Double.MAX_VALUE, 1.0,
                "penalty on the squared coefficients (> 0); the intercept is not penalised"));
    }

    @Override
    public boolean freezable() {
        return true;
    }

    /** Computes the Gram matrix of the centred training rows (a seam for tests that count how often it happens). */
    private final java.util.function.UnaryOperator<double[][]> gramOf;

    public RidgeImputer() {
        this(SmileMatrices::gram);
    }

    RidgeImputer(java.util.function.UnaryOperator<double[][]> gramOf) {
        this.gramOf = gramOf;
    }

    @Override
    public Fitted fit(FitContext ctx, Rows source, Rows target, Params params) {
        return fit(source, target, params.getDouble("alpha"), Form.AUTO);
    }

    @Override
    public Fitted fit(FitContext ctx, Rows source, Rows target, Params params, SourceDistances shared) {
        return fitGrid(List.of(ctx), source, target, List.of(params), shared).get(0);
    }

    /** The fit with a chosen form, for checking that both forms agree. */
    Fitted fit(Rows source, Rows target, double alpha, Form form) {
        return fitAll(source, target, new double[] {alpha}, form).get(0);
    }

    /**
     * Every alpha of the grid on one centring of the rows and, in the dual form, one Gram matrix: each point's model
     * is the one {@link #fit} gives for it alone, bit for bit.
     */
    @Override
    public List<Fitted> fitGrid(List<FitContext> contexts, Rows source, Rows target, List<Params> grid,
                                SourceDistances shared) {
        double[] alphas = new double[grid.size()];
        for (int g = 0; g < alphas.length; g++) {
            alphas[g] = grid.get(g).getDouble("alpha");
        }
        SourceGram products = source.p() > source.n() && shared != null ? shared.products() : null;
        int[] at = products == null ? null : products.positions(source);
        if (at != null) {
            return fitShared(source, target, alphas, products, at);
        }
        return fitAll(source, target, alphas, Form.AUTO);
    }

    /**
     * The dual form with the products of the centred training rows read from the run's table ({@link SourceGram})
     * instead of computed: the same model up to rounding, without the n^2 p multiply-adds of the Gram matrix or the
     * m n p of the imputed rows' products.
     */
    private List<Fitted> fitShared(Rows source, Rows target, double[] alphas, SourceGram products, int[] at) {
        Shapes.checkTraining(METHOD, source, target);
        int n = source.n();
        double[] my = Centring.columnMeans(target.x(), target.p());
        double[][] yc = Centring.centre(target.x(), my);
        double[][] k = products.centred(at);
        List<Fitted> out = new java.util.ArrayList<>(alphas.length);
        for (double alpha : alphas) {
            double[][] ka = new double[n][];
            for (int i = 0; i < n; i++) {
                ka[i] = k[i].clone();
                ka[i][i] += alpha;
            }
            out.add(new SharedDual(products, at, source.x(), my, SmileMatrices.inverseSpd(ka), yc));
        }
        return out;
    }

    /**
     * A dual-form model fitted through the run's table: {@code ((x - mx) Xc') Z Yc + my}, the rows' products with the
     * training rows read from the table when the rows are the cohort's own source views, computed from the kept
     * training rows otherwise (the rows it was given, not copied: callers hand it rows of their own). It freezes as
     * the {@link FrozenImputers.RidgeDualInverse} it equals.
     */
    static final class SharedDual implements Fitted, org.viewgain.frozen.Freezable {
        private final SourceGram products;
        private final int[] at;
        private final double[][] x;
        private final double[] my;
        private final double[][] z;
        private final double[][] yc;
        private FrozenImputers.RidgeDualInverse whole;

        SharedDual(SourceGram products, int[] at, double[][] x, double[] my, double[][] z, double[][] yc) {
            this.products = products;
            this.at = at;
            this.x = x;
            this.my = my;
            this.z = z;
            this.yc = yc;
        }

        @Override
        public double[][] impute(FitContext ctx, Rows rows) {
            return impute(cross(rows));
        }

        /** The rows' products with the centred training rows, {@code (x - mx) Xc'}. */
        double[][] cross(Rows rows) {
            int[] q = products.positions(rows);
            return q != null ? products.centredCross(q, at) : inverse().cross(rows);
        }

        double[][] impute(double[][] cross) {
            return addMeans(SmileMatrices.times(SmileMatrices.times(cross, z), yc), my);
        }

        boolean sameTraining(SharedDual other) {
            return other.products == products && other.at == at;
        }

        /** The same model with the centred training rows kept (made on first need: a bundle, other rows). */
        synchronized FrozenImputers.RidgeDualInverse inverse() {
            if (whole == null) {
                double[] mx = Centring.columnMeans(x, x[0].length);
                whole = new FrozenImputers.RidgeDualInverse(mx, my, Centring.centre(x, mx), z, yc);
            }
            return whole;
        }

        @Override
        public String kind() {
            return FrozenImputers.RidgeDualInverse.KIND;
        }

        @Override
        public void freeze(org.viewgain.frozen.FrozenOut out) {
            inverse().freeze(out);
        }
    }

    private List<Fitted> fitAll(Rows source, Rows target, double[] alphas, Form form) {
        Shapes.checkTraining(METHOD, source, target);
        int n = source.n();
        int p = source.p();
        double[] mx = Centring.columnMeans(source.x(), p);
        double[] my = Centring.columnMeans(target.x(), target.p());
        double[][] xc = Centring.centre(source.x(), mx);
        double[][] yc = Centring.centre(target.x(), my);
        boolean dual = form == Form.DUAL || (form == Form.AUTO && p > n);
        List<Fitted> out = new java.util.ArrayList<>(alphas.length);
        if (dual) {
            // predictions (x - mx) Xc' (K + alpha I)^-1 Yc + my, K = Xc Xc': with the n x n inverse kept, neither the
            // p x q coefficients nor the n x q solution (K + alpha I)^-1 Yc is formed (a Cholesky solve with one right
            // side per target feature cost more than everything else in the fit)
            double[][] k = gramOf.apply(xc);
            for (double alpha : alphas) {
                double[][] ka = new double[n][];
                for (int i = 0; i < n; i++) {
                    ka[i] = k[i].clone();
                    ka[i][i] += alpha;
                }
                out.add(new FrozenImputers.RidgeDualInverse(mx, my, xc, SmileMatrices.inverseSpd(ka), yc));
            }
            return out;
        }
        double[][] g = SmileMatrices.transposeTimes(xc, xc);
        double[][] xy = SmileMatrices.transposeTimes(xc, yc);
        for (double alpha : alphas) {
            double[][] ga = new double[p][];
            for (int i = 0; i < p; i++) {
                ga[i] = g[i].clone();
                ga[i][i] += alpha;
            }
            out.add(new FrozenImputers.RidgePrimal(mx, my, SmileMatrices.solveSpd(ga, xy)));
        }
        return out;
    }

    /**
     * Each model's imputations, as its own {@link Fitted#impute} gives them bit for bit; dual models fitted together
     * on one centring share the products of the rows with the training rows.
     */
    @Override
    public List<double[][]> imputeGrid(List<FitContext> contexts, List<Fitted> fitted, Rows source) {
        double[][] cross = null;
        FrozenImputers.RidgeDualInverse first = null;
        SharedDual firstShared = null;
        List<double[][]> out = new java.util.ArrayList<>(fitted.size());
        for (int g = 0; g < fitted.size(); g++) {
            if (fitted.get(g) instanceof SharedDual d) {
                if (firstShared == null || !d.sameTraining(firstShared)) {
                    firstShared = d;
                    first = null;
                    cross = d.cross(source);
                }
                out.add(d.impute(cross));
            } else if (fitted.get(g) instanceof FrozenImputers.RidgeDualInverse d) {
                if (first == null || d.xc() != first.xc() || d.mx() != first.mx()) {
                    first = d;
                    firstShared = null;
                    cross = d.cross(source);
                }
                out.add(d.impute(cross));
            } else {
                out.add(fitted.get(g).impute(contexts.get(g), source));
            }
        }
        return out;
    }

    static double[][] addMeans(double[][] out, double[] my) {
        for (double[] row : out) {
            for (int j = 0; j < row.length; j++) {
                row[j] += my[j];
            }
        }
        return out;
    }
}
