package org.viewgain.spec;

import java.nio.file.Path;
import java.util.List;

/**
 * A whole experiment as read from a spec file. Paths are already resolved against the spec file's folder.
 *
 * @param specFile the spec file itself
 * @param text     the spec file's text (for provenance)
 * @param where    lines of keys, for messages about values checked later (methods, data)
 * @param availability the {@code availability-curve} to run, or null when the spec asks for none
 * @param independent the {@code independent-cohort} the final pipelines are applied to, or null
 * @param bundle   whether the final pipelines are fitted and written as a bundle ({@code bundle: true}, implied by
 *                 an independent cohort)
 */
public record ExperimentSpec(String experiment, long seed, Path specFile, String text, Specs.Cohort cohort,
                             Specs.View source, Specs.View target, Specs.Features features,
                             List<Specs.Method> imputers, Specs.TrainingImputation imputedForTraining,
                             List<FeatureSet> featureSets, List<Specs.Method> classifiers,
                             Specs.Validation validation, Specs.Significance significance, SourceMap where,
                             AvailabilityCurve availability, Specs.Independent independent, boolean bundle) {
    public ExperimentSpec {
        imputers = List.copyOf(imputers);
        featureSets = List.copyOf(featureSets);
        classifiers = List.copyOf(classifiers);
    }

    /** A spec without an availability curve, independent cohort or bundle. */
    public ExperimentSpec(String experiment, long seed, Path specFile, String text, Specs.Cohort cohort,
                          Specs.View source, Specs.View target, Specs.Features features,
                          List<Specs.Method> imputers, Specs.TrainingImputation imputedForTraining,
                          List<FeatureSet> featureSets, List<Specs.Method> classifiers,
                          Specs.Validation validation, Specs.Significance significance, SourceMap where) {
        this(experiment, seed, specFile, text, cohort, source, target, features, imputers, imputedForTraining,
                featureSets, classifiers, validation, significance, where, null, null, false);
    }

    /** Whether the run refits every pipeline on the whole development cohort after cross-validation. */
    public boolean finalPipelines() {
        return bundle || independent != null;
    }
}
