package org.viewgain.engine;

import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.viewgain.cohort.Rows;
import org.viewgain.cohort.Subject;
import org.viewgain.folds.FitContext;
import org.viewgain.folds.FoldPlan;
import org.viewgain.prep.Standardize;
import org.viewgain.prep.Transform;
import org.viewgain.spec.BadInputException;
import org.viewgain.spec.ExperimentSpec;
import org.viewgain.spec.FeatureSet;
import org.viewgain.spec.Problems;
import org.viewgain.spec.Specs;

/**
 * Turns a spec into a ready {@link Experiment}: resolves methods, loads data, builds the fold plan and checks that
 * the plan is possible on this cohort (enough subjects of every group in every training set, and so on).
 */
public final class Setup {
    private Setup() {
    }

    /** Checks and prepares; every user mistake becomes a {@link BadInputException}. */
    public static Experiment prepare(ExperimentSpec spec) {
        return prepare(spec, Methods.standard());
    }

    /** Checks and prepares with the given methods (tests pass recording stand-ins). */
    public static Experiment prepare(ExperimentSpec spec, Methods methods) {
        Problems problems = new Problems(spec.where());
        List<Resolved.Imputer> imputers = MethodResolver.imputers(spec, methods, problems);
        List<Resolved.Classifier> classifiers = MethodResolver.classifiers(spec, methods, problems);
        problems.throwIfAny();
        StudyData data = DataLoader.load(spec);
        checkCohort(spec, data, problems);
        problems.throwIfAny();
        FoldPlan plan = plan(spec, data, data.y());
        List<Pipeline> pipelines = Experiment.pipelines(spec.featureSets(), imputers, classifiers);
        checkExternalPermutations(spec, imputers, pipelines, problems);
        Preprocessing prep = preprocessing(spec, data, methods, problems);
        problems.throwIfAny();
        double[][] base = data.subjects().stream().map(s -> data.source().base(s.id())).toArray(double[][]::new);
        Transform.Fitted qcScale = null;
        if (!data.source().isGraph() && base.length > 0) {
            // A table's columns may be different measures in different units; on raw values the largest decides
            // every correlation (breast-cancer-wisconsin's ten mean_* columns: 95,853 of 161,596 pairs above 0.999).
            // Compare subjects on the pipeline's standardized scale, over everyone: a QC scan, nothing is trained.
            Rows rows = new Rows(data.subjects().stream().map(Subject::id).toList(), base, data.source().baseNames());
            qcScale = new Standardize().fit(new FitContext(0, 0, 0, FitContext.WHOLE, FitContext.Role.FINAL, 0L),
                    rows, data.y());
            qcScale.applyInPlace(rows);
        }
        List<Duplicates.Pair> duplicates = Duplicates.find(base, spec.cohort().duplicateThreshold());
        FinalChecks.freezable(spec, imputers, classifiers, pipelines, problems);
        problems.throwIfAny();
        IndependentData independent = null;
        if (spec.independent() != null) {
            Experiment dev = new Experiment(spec, data, plan, imputers, classifiers, pipelines,
                    methods.scaler(spec.features().scale()), prep, duplicates);
            independent = IndependentData.load(spec.independent(), CohortShape.of(dev));
            independent = independent.withDuplicates(acrossCohorts(base, independent, qcScale,
                    spec.cohort().duplicateThreshold()));
        }
        Experiment ex = new Experiment(spec, data, plan, imputers, classifiers, pipelines,
                methods.scaler(spec.features().scale()), prep, duplicates, independent);
        checkPlan(ex, problems);
        Availability.check(ex, problems);
        problems.throwIfAny();
        ComparisonPairs.of(ex); // the names in significance.compare must be pipelines of the spec (one line if not)
        if (prep.harmonizer() != null) {
            SiteChecks.check(ex, problems);
            problems.throwIfAny();
        }
        return ex;
    }

    /**
     * An {@code external} imputer's file holds the imputations of the run's own fold plan, but the permutation test
     * re-draws a stratified plan from every permutation's labels, whose training sets the file cannot cover.
     */
    private static void checkExternalPermutations(ExperimentSpec spec, List<Resolved.Imputer> imputers,
                                                  List<Pipeline> pipelines, Problems problems) {
        if (spec.significance().permutations() == 0 || !planDependsOnLabels(spec)) {
            return;
        }
        for (Resolved.Imputer imp : imputers) {
            boolean used = pipelines.stream().anyMatch(p -> p.imputer().equals(imp.name()));
            if (used && org.viewgain.imputation.ExternalImputer.METHOD.equals(imp.method().method())) {
                problems.add("significance.permutations", "imputer '" + imp.name() + "' is external, but the"
                        + " permutation test re-draws the stratified folds from each permutation's labels and would"
                        + " need imputations for folds its file does not have; use validation.outer.scheme"
                        + " leave-one-out or leave-site-out, or permutations: 0");
                return;
            }
        }
    }

    /** The steps of {@code features.adjust}, {@code features.harmonize} and {@code features.select}. */
    static Preprocessing preprocessing(ExperimentSpec spec, StudyData data, Methods methods, Problems problems) {
        Specs.Features f = spec.features();
        Map<String, double[]> covariates = new HashMap<>();
        Map<String, String> sites = new HashMap<>();
        for (Subject s : data.subjects()) {
            covariates.put(s.id(), f.adjust().stream().mapToDouble(s::covariate).toArray());
            sites.put(s.id(), s.site());
        }
        org.viewgain.prep.Transform adjuster = null;
        org.viewgain.prep.Transform harmonizer = null;
        List<org.viewgain.prep.Transform> selectors = new java.util.ArrayList<>();
        try {
            if (!f.adjust().isEmpty()) {
                adjuster = methods.covariateAdjuster(covariates, f.adjust());
            }
            if (f.harmonized()) {
                harmonizer = methods.harmonizer(f.harmonize(), sites, f.adjust().isEmpty() ? Map.of() : covariates);
            }
        } catch (IllegalArgumentException e) {
            problems.add(f.adjust().isEmpty() ? "features.harmonize" : "features.adjust", e.getMessage());
        }
        if (f.select() == null) {
            return new Preprocessing(adjuster, harmonizer, null, List.of(), List.of());
        }
        for (int keep : f.select().keep()) {
            try {
                selectors.add(methods.selector(f.select().method(), keep));
            } catch (IllegalArgumentException e) {
                problems.add("features.select", e.getMessage());
                return Preprocessing.none();
            }
        }
        return new Preprocessing(adjuster, harmonizer, f.select().method(), f.select().keep(), selectors);
    }

    /**
     * The outer fold plan drawn for the given labels: the real ones for the run, a permutation's for the permutation
     * test, which re-draws the plan exactly as the run drew it so that the observed and permuted statistics come
     * from one procedure. Leave-one-out and leave-site-out plans do not depend on labels.
     */
    static FoldPlan plan(ExperimentSpec spec, StudyData data, int[] labels) {
        Specs.Validation v = spec.validation();
        return switch (v.scheme()) {
            case LEAVE_ONE_OUT -> FoldPlan.leaveOneOut(data.n());
            case LEAVE_SITE_OUT -> FoldPlan.leaveSiteOut(data.subjects().stream().map(Subject::site)
                    .toArray(String[]::new));
            default -> FoldPlan.stratifiedKFold(outerStrata(spec, data, labels), v.folds(), v.repeats(),
                    spec.seed());
        };
    }

    /** True when the outer plan is drawn from the labels (stratified k-fold). */
    static boolean planDependsOnLabels(ExperimentSpec spec) {
        return spec.validation().scheme() == Specs.Scheme.STRATIFIED_K_FOLD;
    }

    /**
     * Group x target observed, x site when a site column is given: the complete-case feature sets then get folds as
     * balanced as the whole cohort's.
     */
    static int[] outerStrata(ExperimentSpec spec, StudyData data, int[] labels) {
        Map<String, Integer> codes = new HashMap<>();
        int[] s = new int[data.n()];
        for (int i = 0; i < data.n(); i++) {
            Subject sub = data.subjects().get(i);
            String key = labels[i] + "|" + data.hasTarget(i) + "|"
                    + (spec.cohort().site() == null ? "" : sub.site());
            s[i] = codes.computeIfAbsent(key, k -> codes.size());
        }
        return s;
    }

    private static void checkCohort(ExperimentSpec spec, StudyData data, Problems problems) {
        List<String> groups = spec.cohort().groups();
        int[] count = new int[groups.size()];
        int[] withTarget = new int[groups.size()];
        for (int i = 0; i < data.n(); i++) {
            count[data.y()[i]]++;
            if (data.hasTarget(i)) {
                withTarget[data.y()[i]]++;
            }
        }
        for (int g = 0; g < groups.size(); g++) {
            if (count[g] == 0) {
                problems.add("cohort.groups", "group '" + groups.get(g) + "' has no subjects in "
                        + spec.cohort().subjects().getFileName());
            }
        }
        Specs.Validation v = spec.validation();
        if (v.scheme() == Specs.Scheme.STRATIFIED_K_FOLD) {
            for (int g = 0; g < groups.size(); g++) {
                if (count[g] > 0 && count[g] < v.folds()) {
                    problems.add("validation.outer.folds", v.folds() + " folds but group '" + groups.get(g)
                            + "' has only " + count[g] + " subjects; use at most " + count[g] + " folds");
                }
            }
            for (int k = 0; k < spec.featureSets().size(); k++) {
                FeatureSet fs = spec.featureSets().get(k);
                for (int g = 0; g < groups.size() && fs.needsObservedTarget(); g++) {
                    if (withTarget[g] < v.folds()) {
                        problems.add("feature-sets[" + k + "]", "'" + fs.label() + "' uses subjects with an observed"
                                + " target, but group '" + groups.get(g) + "' has only " + withTarget[g]
                                + " of them, fewer than the " + v.folds() + " outer folds");
                    }
                }
            }
        }
        if (spec.cohort().site() != null) {
            for (Subject s : data.subjects()) {
                if (s.site() == null || s.site().isBlank()) {
                    throw new BadInputException(spec.cohort().subjects() + ":" + s.line() + ": subject '" + s.id()
                            + "' has no value in the site column '" + spec.cohort().site() + "'");
                }
            }
        }
    }

    private static void checkPlan(Experiment ex, Problems problems) {
        int classes = ex.spec().cohort().groups().size();
        int inner = ex.spec().validation().innerFolds();
        boolean anyImputer = ex.pipelines().stream().anyMatch(p -> p.featureSet().needsImputer());
        for (int r = 0; r < ex.plan().repeats(); r++) {
            for (int f = 0; f < ex.plan().folds(r); f++) {
                int[] train = ex.plan().train(r, f);
                for (FeatureSet fs : ex.spec().featureSets()) {
                    int[] perClass = new int[classes];
                    for (int i : train) {
                        if (ex.inPopulation(fs, i)) {
                            perClass[ex.data().y()[i]]++;
                        }
                    }
                    for (int g = 0; g < classes; g++) {
                        if (perClass[g] < inner) {
                            problems.add("validation.inner.folds", "in repeat " + (r + 1) + ", outer fold " + (f + 1)
                                    + ", the training subjects of feature set '" + fs.label() + "' include only "
                                    + perClass[g] + " of group '" + ex.spec().cohort().groups().get(g) + "', fewer than "
                                    + inner + " inner folds; use fewer inner or outer folds");
                            return;
                        }
                    }
                }
                if (anyImputer) {
                    long withTarget = java.util.Arrays.stream(train).filter(ex.data()::hasTarget).count();
                    if (withTarget < 2L * inner) {
                        problems.add("imputers", "in repeat " + (r + 1) + ", outer fold " + (f + 1) + " only "
                                + withTarget + " training subjects have an observed target; imputers need at least "
                                + (2 * inner) + " (twice the inner folds)");
                        return;
                    }
                }
            }
        }
    }

    /**
     * Possible duplicate scans between the development cohort ({@code devBase}, already on the QC scale) and the
     * independent cohort: the same person in both makes the independent result optimistic. A table's columns are put
     * on the development cohort's QC scale ({@code qcScale}, fitted on development subjects) first; a QC scan, nothing
     * is trained.
     */
    static List<Duplicates.Pair> acrossCohorts(double[][] devBase, IndependentData ind, Transform.Fitted qcScale,
                                               double threshold) {
        double[][] other = ind.subjects().stream().map(s -> ind.source().base(s.id())).toArray(double[][]::new);
        if (qcScale != null && other.length > 0) {
            qcScale.applyInPlace(new Rows(ind.subjects().stream().map(Subject::id).toList(), other,
                    ind.source().baseNames()));
        }
        return Duplicates.across(devBase, other, threshold);
    }
}
