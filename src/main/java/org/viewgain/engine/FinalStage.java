package org.viewgain.engine;

import java.util.ArrayList;
import java.util.List;
import org.viewgain.classify.FrozenModels;
import org.viewgain.frozen.Freezable;
import org.viewgain.frozen.FrozenIn;
import org.viewgain.frozen.FrozenOut;
import org.viewgain.imputation.FrozenImputers;
import org.viewgain.imputation.ViewImputer;
import org.viewgain.prep.FrozenSteps;
import org.viewgain.prep.Transform;

/**
 * The final pipelines of a run: after cross-validation every pipeline is refitted on the whole development cohort,
 * its hyperparameters chosen by the same inner cross-validation over all development subjects, its imputer tuned and
 * fitted on every development subject with an observed target. A final classifier fit is a journaled unit (its
 * frozen parts are the record); final imputer fits are label-free and deterministic, so, like the outer folds'
 * imputations, they are recomputed rather than journaled.
 */
final class FinalStage {
    private final Experiment ex;

    FinalStage(Experiment ex) {
        this.ex = ex;
    }

    /**
     * One finished final classifier unit: the tuning choice and the frozen parts of its steps and model.
     */
    record Unit(RunResults.Choice choice, List<byte[]> steps, byte[] model) {
        Unit {
            steps = List.copyOf(steps);
        }
    }

    /** Whether any pipeline uses this imputer. */
    boolean used(Resolved.Imputer imp) {
        return ex.pipelines().stream().anyMatch(p -> p.featureSet().needsImputer() && p.imputer().equals(imp.name()));
    }

    /** The imputer's whole-cohort fit. */
    ImputationStage.Final imputer(Resolved.Imputer imp) {
        return new ImputationStage(ex).wholeCohort(imp);
    }

    /** Trains one final pipeline ({@code imputed} null for sets without imputed features). */
    ClassifierStage.Trained train(Pipeline p, ImputationStage.Final imputed) {
        return new ClassifierStage(ex).wholeCohort(p, InnerFolds.whole(ex), imputed == null ? null : imputed.imputed());
    }

    /** The unit of a trained final pipeline: its frozen parts. */
    Unit unit(Pipeline p, ClassifierStage.Trained t) {
        List<byte[]> steps = new ArrayList<>();
        for (Transform.Fitted s : t.model().steps().steps()) {
            steps.add(FrozenOut.of(freezable(s, p)));
        }
        Freezable m = FrozenModels.of(t.model().model());
        if (m == null) {
            throw new IllegalStateException("the model of " + p.label() + " cannot be frozen");
        }
        return new Unit(t.choice(ex, p, ImputationStage.FINAL, ImputationStage.FINAL), steps, FrozenOut.of(m));
    }

    /** The in-memory pipeline of a trained final fit (no freezing). */
    FrozenPipeline live(Pipeline p, ClassifierStage.Trained t, ImputationStage.Final imputed) {
        return new FrozenPipeline(p, CohortShape.of(ex), imputed == null ? null : imputed.fitted(),
                t.model().steps().steps(), t.model().model());
    }

    /** A pipeline rebuilt from its parts (a unit of this run, or a bundle's). */
    static FrozenPipeline thaw(Pipeline p, CohortShape shape, byte[] imputer, List<byte[]> steps, byte[] model,
                               String where) {
        ViewImputer.Fitted imp = imputer == null ? null
                : FrozenImputers.thaw(new FrozenIn(where + " imputer", imputer));
        List<Transform.Fitted> fitted = new ArrayList<>();
        for (int k = 0; k < steps.size(); k++) {
            fitted.add(FrozenSteps.thaw(new FrozenIn(where + " step " + (k + 1), steps.get(k))));
        }
        return new FrozenPipeline(p, shape, imp, fitted,
                FrozenModels.thaw(new FrozenIn(where + " model", model)));
    }

    /** The frozen bytes of an imputer's final fit. */
    static byte[] imputerPart(ImputationStage.Final f, String name) {
        if (!(f.fitted() instanceof Freezable fr)) {
            throw new IllegalStateException("imputer " + name + " cannot be frozen");
        }
        return FrozenOut.of(fr);
    }

    private static Freezable freezable(Transform.Fitted s, Pipeline p) {
        if (s instanceof Freezable f) {
            return f;
        }
        throw new IllegalStateException("a step of " + p.label() + " cannot be frozen");
    }
}
