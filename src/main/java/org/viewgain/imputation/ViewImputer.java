package org.viewgain.imputation;

import java.util.List;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import java.util.Map;
import org.viewgain.spec.ParamDef;
import org.viewgain.spec.ParamDefs;
import org.viewgain.spec.Params;

/**
 * A way of predicting the target view of a subject from its source view. Imputers never see group labels.
 * Implementations are stateless factories; {@link #fit} returns the fitted state.
 */
public interface ViewImputer {

    /** The method name used in specs, e.g. {@code ridge}. */
    String method();

    /** The hyperparameters this method accepts (for spec checking, grids and the README). */
    List<ParamDef> parameters();

    /**
     * Checks one grid point given in a spec and fills in defaults. The default checks against {@link #parameters()};
     * a method with open-ended options (a Weka class) overrides it.
     *
     * @throws IllegalArgumentException naming the bad key and what is allowed
     */
    default Params resolve(Map<String, Object> raw) {
        return ParamDefs.resolve(parameters(), raw);
    }

    /**
     * Whether its fitted imputers can be frozen into a bundle (they implement {@code frozen.Freezable} and
     * {@link FrozenImputers} reads them back).
     */
    default boolean freezable() {
        return false;
    }

    /**
     * Fits on training subjects that have both views.
     *
     * @param ctx    where the fit happens and the seed to use
     * @param source source-view features of the training subjects
     * @param target target-view features of the same subjects, in the same order
     * @param params one point of the grid, already checked against {@link #parameters()}
     */
    Fitted fit(FitContext ctx, Rows source, Rows target, Params params);

    /**
     * {@link #fit}, where the rows given (to this fit and to its {@link Fitted#impute}) are the subjects' source views
     * as loaded and {@code shared} holds label-free distances between them, computed once per run. A method that
     * needs such distances reads them from it (the same numbers it would compute); the default ignores it.
     *
     * @param shared the run's table of source distances, or null when there is none
     */
    default Fitted fit(FitContext ctx, Rows source, Rows target, Params params, SourceDistances shared) {
        return fit(ctx, source, target, params);
    }

    /**
     * Fits every point of a grid on the same rows, one context per point: the same models as {@link #fit} point by
     * point (the default does exactly that). A method whose label-free work on the rows does not depend on the point
     * does it once for all of them ({@code ridge}: the centred rows and their Gram matrix).
     */
    default List<Fitted> fitGrid(List<FitContext> contexts, Rows source, Rows target, List<Params> grid,
                                 SourceDistances shared) {
        List<Fitted> out = new java.util.ArrayList<>(grid.size());
        for (int g = 0; g < grid.size(); g++) {
            out.add(fit(contexts.get(g), source, target, grid.get(g), shared));
        }
        return out;
    }

    /**
     * Imputes the same rows with each model of one {@link #fitGrid}: the same numbers as each model's {@link
     * Fitted#impute} (the default calls it); {@code ridge} computes the rows' products with its training rows once.
     */
    default List<double[][]> imputeGrid(List<FitContext> contexts, List<Fitted> fitted, Rows source) {
        List<double[][]> out = new java.util.ArrayList<>(fitted.size());
        for (int g = 0; g < fitted.size(); g++) {
            out.add(fitted.get(g).impute(contexts.get(g), source));
        }
        return out;
    }

    /** A fitted imputer. */
    interface Fitted {
        /**
         * Predicts target-view features (one row per subject of {@code source}, as many columns as the target
         * view had at fit time).
         *
         * @param ctx where the prediction happens (outside imputations are looked up by it)
         */
        double[][] impute(FitContext ctx, Rows source);
    }
}
