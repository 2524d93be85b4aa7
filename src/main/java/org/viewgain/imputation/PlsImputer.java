package org.viewgain.imputation;

import java.util.List;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.spec.ParamDef;
import org.viewgain.spec.Params;

/**
 * Multi-output partial least squares regression by SIMPLS (de Jong 1993, Chemometrics and Intelligent Laboratory
 * Systems 18:251-263). Source and target are centred on their training means and not scaled, so features keep
 * their own units (scale them beforehand if they should count equally). Asking for more components than the
 * centred source has rank gives as many as it has: the fit stops when no covariance is left to explain.
 */
public final class PlsImputer implements ViewImputer {

    /** The name used in specs. */
    public static final String METHOD = "pls";

    @Override
    public String method() {
        return METHOD;
    }

    @Override
    public List<ParamDef> parameters() {
        return List.of(ParamDef.integer("components", 1, Integer.MAX_VALUE, 2,
                "number of latent components (clamped to the rank of the centred source)"));
    }

    @Override
    public Fitted fit(FitContext ctx, Rows source, Rows target, Params params) {
        Shapes.checkTraining(METHOD, source, target);
        SimplsModel model = Simpls.fit(source.x(), target.x(), source.p(), target.p(),
                params.getInt("components"));
        return new FrozenImputers.Pls(model, source.p());
    }

    @Override
    public boolean freezable() {
        return true;
    }

    /** The SIMPLS model behind a fit, for tests of its scores and weights. */
    static SimplsModel model(Rows source, Rows target, int components) {
        Shapes.checkTraining(METHOD, source, target);
        return Simpls.fit(source.x(), target.x(), source.p(), target.p(), components);
    }
}
