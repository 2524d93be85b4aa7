package org.viewgain.engine;

import java.util.ArrayList;
import java.util.List;
import org.viewgain.folds.FoldPlan;
import org.viewgain.prep.Transform;
import org.viewgain.spec.ExperimentSpec;
import org.viewgain.spec.FeatureSet;

/**
 * Everything a run needs, checked and ready: the spec, the loaded data, the fold plan, the resolved methods and the
 * list of pipelines in output order, the scaling step (null for none), the other steps fitted inside every fit, and
 * the possible duplicate scans found in the source view, and the independent cohort (null when the spec has none).
 */
public record Experiment(ExperimentSpec spec, StudyData data, FoldPlan plan, List<Resolved.Imputer> imputers,
                         List<Resolved.Classifier> classifiers, List<Pipeline> pipelines, Transform scaler,
                         Preprocessing prep, List<Duplicates.Pair> duplicates, IndependentData independent) {
    public Experiment {
        imputers = List.copyOf(imputers);
        classifiers = List.copyOf(classifiers);
        pipelines = List.copyOf(pipelines);
        duplicates = List.copyOf(duplicates);
    }

    /** An experiment without an independent cohort. */
    public Experiment(ExperimentSpec spec, StudyData data, FoldPlan plan, List<Resolved.Imputer> imputers,
                      List<Resolved.Classifier> classifiers, List<Pipeline> pipelines, Transform scaler,
                      Preprocessing prep, List<Duplicates.Pair> duplicates) {
        this(spec, data, plan, imputers, classifiers, pipelines, scaler, prep, duplicates, null);
    }

    /** An experiment with scaling as the only step and no duplicate check. */
    public Experiment(ExperimentSpec spec, StudyData data, FoldPlan plan, List<Resolved.Imputer> imputers,
                      List<Resolved.Classifier> classifiers, List<Pipeline> pipelines, Transform scaler) {
        this(spec, data, plan, imputers, classifiers, pipelines, scaler, Preprocessing.none(), List.of());
    }

    /** Pipelines in a fixed order: feature sets as listed, then imputers, then classifiers as listed. */
    static List<Pipeline> pipelines(List<FeatureSet> sets, List<Resolved.Imputer> imputers,
                                    List<Resolved.Classifier> classifiers) {
        List<Pipeline> out = new ArrayList<>();
        for (FeatureSet fs : sets) {
            List<String> imps = fs.needsImputer() ? imputers.stream().map(Resolved.Imputer::name).toList()
                    : List.of(Pipeline.NO_IMPUTER);
            for (String imp : imps) {
                for (Resolved.Classifier c : classifiers) {
                    out.add(new Pipeline(imp, fs, c.name()));
                }
            }
        }
        return out;
    }

    public Resolved.Imputer imputer(String name) {
        return imputers.stream().filter(i -> i.name().equals(name)).findFirst().orElseThrow();
    }

    public Resolved.Classifier classifier(String name) {
        return classifiers.stream().filter(c -> c.name().equals(name)).findFirst().orElseThrow();
    }

    /**
     * The outer fold plan for the given labels: this run's plan for the real labels or when the scheme does not
     * depend on labels (leave-one-out, leave-site-out), otherwise the plan drawn from these labels as the run's plan
     * was drawn from the real ones (the permutation test, so that observed and permuted statistics are exchangeable).
     */
    public FoldPlan planFor(int[] labels) {
        if (!Setup.planDependsOnLabels(spec) || java.util.Arrays.equals(labels, data.y())) {
            return plan;
        }
        return Setup.plan(spec, data, labels);
    }

    /** Positions of the subjects a feature set can use (all, or those with an observed target). */
    public boolean inPopulation(FeatureSet fs, int i) {
        return !fs.needsObservedTarget() || data.hasTarget(i);
    }

    /** Fits of one imputation: cross-fits over the grid when tuned or cross-fitted, and the final fit. */
    private static long imputerFits(Resolved.Imputer i, boolean crossFit, int k) {
        return (crossFit || i.grid().size() > 1 ? (long) i.grid().size() * k : 0) + 1;
    }

    /**
     * How many model fits (imputers and classifiers, tuning included) the run will do, the final pipelines' (one
     * more outer fold's work, on every development subject) included.
     */
    public long modelFits() {
        int k = spec.validation().innerFolds();
        boolean crossFit = spec.imputedForTraining() == org.viewgain.spec.Specs.TrainingImputation.CROSS_FITTED;
        boolean anyImputed = pipelines.stream().anyMatch(p -> p.featureSet().needsImputer());
        long perFold = 0;
        if (anyImputed) {
            for (Resolved.Imputer i : imputers) {
                perFold += imputerFits(i, crossFit, k);
            }
        }
        for (Pipeline p : pipelines) {
            int g = classifier(p.classifier()).grid().size() * prep.selectionPoints();
            perFold += (g > 1 ? (long) g * k : 0) + 1;
            if (g > 1 && ClassifierStage.nestedImputation(this, p)) {
                perFold += k * imputerFits(imputer(p.imputer()), crossFit, k); // nested imputations for tuning
            }
        }
        long folds = plan.outerFolds();
        // the final pipelines repeat one outer fold's work on the whole development cohort
        return perFold * (folds + (spec.finalPipelines() ? 1 : 0));
    }
}
