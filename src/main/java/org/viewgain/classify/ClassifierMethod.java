package org.viewgain.classify;

import java.util.List;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import java.util.Map;
import org.viewgain.spec.ParamDef;
import org.viewgain.spec.ParamDefs;
import org.viewgain.spec.Params;

/**
 * A classifier family (random forest, SVM, a Weka class, ...). Implementations are stateless factories;
 * {@link #fit} returns a trained model. All randomness comes from {@link FitContext#seed()}.
 */
public interface ClassifierMethod {

    /** The method name used in specs, e.g. {@code random-forest}. */
    String method();

    /** The hyperparameters this method accepts. */
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

    /** Whether trained models give a continuous score per class (needed for AUC); false means labels only. */
    boolean producesScores();

    /**
     * What the scores are, as predictions.csv's {@code score_kind} says: {@code probability} (class probabilities,
     * which calibration measures apply to), {@code decision_value} (a signed margin that orders subjects but is not
     * a probability), or {@code none} when the method gives labels only.
     */
    default String scoreKind() {
        return producesScores() ? "probability" : "none";
    }

    /**
     * Whether its trained models can be frozen into a bundle (they implement {@code frozen.Freezable} and
     * {@link FrozenModels} reads them back). Smile and Weka models cannot: a bundle holds no Java serialization.
     */
    default boolean freezable() {
        return false;
    }

    /**
     * Trains a model.
     *
     * @param x       training rows (already scaled/selected by the pipeline)
     * @param y       class index of each row, 0..classes-1
     * @param classes number of classes
     */
    Model fit(FitContext ctx, Rows x, int[] y, int classes, Params params);

    /**
     * Fits one model per grid point on the same training rows and labels, in grid order, each point with its own
     * context (and so its own seed); the same models as calling {@link #fit} once per point. A method whose
     * label-free preparation (binned features, a kernel matrix) depends only on the rows and a few parameters
     * overrides it to do that work once for all points that share it. The rows are only read.
     */
    default List<Model> fitGrid(List<FitContext> contexts, Rows x, int[] y, int classes, List<Params> grid) {
        if (contexts.size() != grid.size()) {
            throw new IllegalArgumentException("contexts " + contexts.size() + " != grid points " + grid.size());
        }
        List<Model> out = new java.util.ArrayList<>(grid.size());
        for (int g = 0; g < grid.size(); g++) {
            out.add(fit(contexts.get(g), x, y, classes, grid.get(g)));
        }
        return out;
    }

    /**
     * {@link #fitGrid} with the hints of one pipeline's training ({@link FitHints}): a method may read them to
     * choose how to compute and add to them; the models are those {@link #fitGrid} gives, up to rounding. The default
     * ignores them.
     */
    default List<Model> fitGrid(List<FitContext> contexts, Rows x, int[] y, int classes, List<Params> grid,
                                FitHints hints) {
        return fitGrid(contexts, x, y, classes, grid);
    }

    /**
     * The predictions of the models one {@link #fitGrid} call returned, for the same rows, in grid order; the same
     * predictions as calling each model's {@link Model#predict}. A method whose prediction work depends only on the
     * rows and the training block (the distances from each row to the support vectors) overrides it to do that work
     * once for all the models.
     */
    default List<Predictions> predictGrid(List<Model> models, Rows x) {
        List<Predictions> out = new java.util.ArrayList<>(models.size());
        for (Model m : models) {
            out.add(m.predict(x));
        }
        return out;
    }

    /**
     * Like {@link #fit}, for rows the caller will never read again (the final fit of a unit, on rows built for it).
     * A method that copies the rows into its own format may release each row as it copies it, by setting
     * {@code x.x()[i]} to null, so that the two copies do not live side by side for the whole fit. The default
     * simply calls {@link #fit}.
     */
    default Model fitOwned(FitContext ctx, Rows x, int[] y, int classes, Params params) {
        return fit(ctx, x, y, classes, params);
    }

    /**
     * {@link #fitOwned} with the hints of one pipeline's training, as in {@link #fitGrid(List, Rows, int[], int, List,
     * FitHints)}; the default ignores them.
     */
    default Model fitOwned(FitContext ctx, Rows x, int[] y, int classes, Params params, FitHints hints) {
        return fitOwned(ctx, x, y, classes, params);
    }

    /** A trained model. */
    interface Model {
        Predictions predict(Rows x);

        /**
         * How much each input feature mattered to this model (e.g. impurity importance of a forest, absolute
         * weights of a linear model on its standardized inputs), in the order of the training columns; null when
         * the method offers none.
         */
        default double[] importance() {
            return null;
        }

        /** What {@link #importance()} measures, e.g. {@code impurity} or {@code abs_weight}; null when none. */
        default String importanceKind() {
            return null;
        }

        /**
         * False when an iterative solver stopped at its limit (e.g. {@code svm-linear}'s {@code iterations}) before
         * its own stopping rule held: the model is usable but not the optimum the method defines. Runs count such
         * fits and say so (hyperparameters.csv {@code unconverged_fits}, a warning, the report).
         */
        default boolean converged() {
            return true;
        }
    }
}
