package org.viewgain.engine;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * The final pipelines of a run, as frozen parts: per pipeline its tuning choice, steps and model; per imputer its
 * final fit and chosen grid point. What the bundle is written from and what the independent cohort is predicted
 * with (both through {@link #pipelines()}, which reads the parts back).
 */
public record FinalPipelines(Experiment experiment, List<Entry> entries, Map<String, byte[]> imputerParts,
                             Map<String, String> imputerChoices) {
    public FinalPipelines {
        entries = List.copyOf(entries);
        imputerParts = Map.copyOf(imputerParts);
        imputerChoices = Map.copyOf(imputerChoices);
    }

    /** One pipeline's final unit. */
    public record Entry(Pipeline pipeline, FinalStage.Unit unit) {
        /** The grid point chosen by inner cross-validation over the development cohort. */
        public String chosen() {
            return unit.choice().params();
        }

        /** Its inner cross-validated score (NaN when there was nothing to choose). */
        public double innerScore() {
            return unit.choice().innerScore();
        }
    }

    /** The pipelines rebuilt from their parts, in the experiment's pipeline order. */
    public List<FrozenPipeline> pipelines() {
        CohortShape shape = CohortShape.of(experiment);
        List<FrozenPipeline> out = new ArrayList<>();
        for (Entry e : entries) {
            Pipeline p = e.pipeline();
            byte[] imp = p.featureSet().needsImputer() ? imputerParts.get(p.imputer()) : null;
            out.add(FinalStage.thaw(p, shape, imp, e.unit().steps(), e.unit().model(), p.label()));
        }
        return out;
    }
}
