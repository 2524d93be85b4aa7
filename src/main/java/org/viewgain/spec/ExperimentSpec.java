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
 */
public record ExperimentSpec(String experiment, long seed, Path specFile, String text, Specs.Cohort cohort,
                             Specs.View source, Specs.View target, Specs.Features features,
                             List<Specs.Method> imputers, Specs.TrainingImputation imputedForTraining,
                             List<FeatureSet> featureSets, List<Specs.Method> classifiers,
                             Specs.Validation validation, Specs.Significance significance, SourceMap where,
                             AvailabilityCurve availability) {
    public ExperimentSpec {
        imputers = List.copyOf(imputers);
        featureSets = List.copyOf(featureSets);
        classifiers = List.copyOf(classifiers);
    }

    /** A spec without an availability curve. */
    public ExperimentSpec(String experiment, long seed, Path specFile, String text, Specs.Cohort cohort,
                          Specs.View source, Specs.View target, Specs.Features features,
                          List<Specs.Method> imputers, Specs.TrainingImputation imputedForTraining,
                          List<FeatureSet> featureSets, List<Specs.Method> classifiers,
                          Specs.Validation validation, Specs.Significance significance, SourceMap where) {
        this(experiment, seed, specFile, text, cohort, source, target, features, imputers, imputedForTraining,
                featureSets, classifiers, validation, significance, where, null);
    }
}
