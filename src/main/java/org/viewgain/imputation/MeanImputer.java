package org.viewgain.imputation;

import java.util.List;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.spec.ParamDef;
import org.viewgain.spec.Params;

/**
 * The baseline imputer: every subject gets the training mean of each target column, whatever its source view.
 * Learned imputers are judged against it ({@link ImputationQuality#skill}).
 */
public final class MeanImputer implements ViewImputer {

    /** The name used in specs. */
    public static final String METHOD = "mean";

    @Override
    public String method() {
        return METHOD;
    }

    @Override
    public List<ParamDef> parameters() {
        return List.of();
    }

    @Override
    public boolean freezable() {
        return true;
    }

    @Override
    public Fitted fit(FitContext ctx, Rows source, Rows target, Params params) {
        Shapes.checkTraining(METHOD, source, target);
        double[] means = Centring.columnMeans(target.x(), target.p());
        return new FrozenImputers.Mean(means, source.p());
    }
}
