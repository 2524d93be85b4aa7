package org.viewgain.engine;

import java.util.List;
import org.viewgain.imputation.ExternalImputer;
import org.viewgain.spec.ExperimentSpec;
import org.viewgain.spec.IndependentKeys;
import org.viewgain.spec.Problems;

/**
 * Before anything runs: a spec that asks for final pipelines (an independent cohort, or {@code bundle: true}) may
 * use only steps and methods that can be frozen into a bundle, so that the independent cohort's predictions and a
 * later {@code viewgain apply} come from the same parts. Every step of {@code features} can be frozen: ComBat with
 * the development sites' parameters (a cohort with another site is refused when it is loaded, {@link
 * IndependentData#load}), covariate adjustment with its slopes (a cohort applied must have the covariate columns).
 */
final class FinalChecks {
    private FinalChecks() {
    }

    static void freezable(ExperimentSpec spec, List<Resolved.Imputer> imputers, List<Resolved.Classifier> classifiers,
                          List<Pipeline> pipelines, Problems problems) {
        if (!spec.finalPipelines()) {
            return;
        }
        String why = spec.independent() != null ? IndependentKeys.KEY + " is given" : "bundle is true";
        for (Resolved.Imputer imp : imputers) {
            boolean used = pipelines.stream().anyMatch(p -> p.imputer().equals(imp.name()));
            if (used && !imp.method().freezable()) {
                String extra = ExternalImputer.METHOD.equals(imp.method().method())
                        ? " (its imputations come from a file, which has no rows for new subjects)" : "";
                problems.add(path(spec.imputers(), imp.name(), "imputers"), "imputer '" + imp.name() + "' (method "
                        + imp.method().method() + ") cannot be frozen into a bundle" + extra + " (" + why
                        + "); bundles hold mean, nearest-neighbours, ridge, pls and multi-kernel-neighbours");
            }
        }
        for (Resolved.Classifier c : classifiers) {
            if (!c.method().freezable()) {
                problems.add(path(spec.classifiers(), c.name(), "classifiers"), "classifier '" + c.name()
                        + "' (method " + c.method().method() + ") cannot be frozen into a bundle (" + why
                        + "); bundles hold random-forest, svm-linear and svm-rbf (Smile and Weka models exist only as"
                        + " Java serialization, which a bundle never holds)");
            }
        }
    }

    private static String path(List<org.viewgain.spec.Specs.Method> methods, String name, String key) {
        return methods.stream().filter(m -> m.name().equals(name)).map(org.viewgain.spec.Specs.Method::path)
                .findFirst().orElse(key);
    }
}
