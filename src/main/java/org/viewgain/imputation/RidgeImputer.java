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
 * place of p x p; Saunders, Gammerman &amp; Vovk 1998). Both are solved by Cholesky.
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

    @Override
    public Fitted fit(FitContext ctx, Rows source, Rows target, Params params) {
        return fit(source, target, params.getDouble("alpha"), Form.AUTO);
    }

    /** The fit with a chosen form, for checking that both forms agree. */
    Fitted fit(Rows source, Rows target, double alpha, Form form) {
        Shapes.checkTraining(METHOD, source, target);
        int n = source.n();
        int p = source.p();
        double[] mx = Centring.columnMeans(source.x(), p);
        double[] my = Centring.columnMeans(target.x(), target.p());
        double[][] xc = Centring.centre(source.x(), mx);
        double[][] yc = Centring.centre(target.x(), my);
        boolean dual = form == Form.DUAL || (form == Form.AUTO && p > n);
        if (dual) {
            // predictions (x - mx) Xc' A + my: the p x q coefficient matrix is never formed
            double[][] k = SmileMatrices.gram(xc);
            addToDiagonal(k, alpha);
            double[][] a = SmileMatrices.solveSpd(k, yc);
            return new FrozenImputers.RidgeDual(mx, my, xc, a);
        }
        double[][] g = SmileMatrices.transposeTimes(xc, xc);
        addToDiagonal(g, alpha);
        double[][] coef = SmileMatrices.solveSpd(g, SmileMatrices.transposeTimes(xc, yc));
        return new FrozenImputers.RidgePrimal(mx, my, coef);
    }

    static double[][] addMeans(double[][] out, double[] my) {
        for (double[] row : out) {
            for (int j = 0; j < row.length; j++) {
                row[j] += my[j];
            }
        }
        return out;
    }

    private static void addToDiagonal(double[][] a, double v) {
        for (int i = 0; i < a.length; i++) {
            a[i][i] += v;
        }
    }
}
