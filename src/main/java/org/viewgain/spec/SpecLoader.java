package org.viewgain.spec;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Reads a YAML spec into an {@link ExperimentSpec}. Every problem found is collected and reported together in one
 * {@link BadInputException}, each naming the key path, its line and what is allowed. Method names and their
 * parameters are checked later against the method registries (they live above this package).
 */
public final class SpecLoader {
    static final List<String> EXTRACTORS = List.of("edges", "strength");

    private SpecLoader() {
    }

    /** Loads and checks a spec file. */
    public static ExperimentSpec load(Path file) {
        String text;
        try {
            text = Files.readString(file, StandardCharsets.UTF_8);
        } catch (IOException e) {
            String why = Files.isDirectory(file) ? "it is a folder" : IoMessages.ioProblem(e);
            throw new BadInputException(file + ": cannot read the spec file (" + why + ")", e);
        }
        return parse(text, file);
    }

    /** Parses spec text; {@code file} names it in messages and anchors relative paths. */
    public static ExperimentSpec parse(String text, Path file) {
        YamlTree.Parsed parsed = YamlTree.parse(text, file.toString());
        JsonNode root = parsed.root();
        Problems problems = new Problems(parsed.where());
        if (root == null || !root.isObject()) {
            throw new BadInputException(file + ": the spec must be a YAML mapping of keys (experiment, seed, cohort, "
                    + "views, ...), found " + Section.describe(root));
        }
        Path base = file.toAbsolutePath().getParent();
        Section top = new Section(root, "", problems);
        top.allowOnly(Set.of("experiment", "seed", "cohort", "views", "features", "imputers", "imputed-for-training",
                "feature-sets", "classifiers", "validation", "significance", AvailabilityKeys.KEY,
                IndependentKeys.KEY, "bundle"));

        String experiment = top.text("experiment", "experiment", true);
        if (experiment != null && !experiment.matches("[A-Za-z0-9][A-Za-z0-9._-]{0,79}")) {
            problems.add("experiment", "'" + experiment + "' cannot name a folder; use letters, digits, '.', '_' or '-'"
                    + " (at most 80)");
        }
        long seed = top.longValue("seed", 1L);

        Specs.Cohort cohort = cohort(top.section("cohort", true), base);
        Section views = top.section("views", true);
        views.allowOnly(Set.of("source", "target"));
        Specs.View source = ViewKeys.read(views, "source", base, true);
        Specs.View target = ViewKeys.read(views, "target", base, false);
        Specs.Features features = features(top.section("features", false), source, target);
        features = FeatureSteps.read(top.section("features", false), features, cohort);
        List<Specs.Method> imputers = methods(top, "imputers", base, false);
        Specs.TrainingImputation training = top.has("imputed-for-training")
                ? trainingImputation(top) : Specs.TrainingImputation.CROSS_FITTED;
        // a misspelled feature-sets key is already reported; do not pile consequences of the default on top
        List<FeatureSet> sets = problems.wasMisspelled("feature-sets") ? List.of() : featureSets(top, problems);
        List<Specs.Method> classifiers = methods(top, "classifiers", base, true);
        Specs.Validation validation = validation(top.section("validation", false), cohort);
        Specs.Significance significance = significance(top.section("significance", false), sets, validation);
        FeatureSteps.checkScheme(features, validation, problems);
        AvailabilityCurve curve = AvailabilityKeys.read(top, sets, imputers, validation);
        Specs.Independent independent = IndependentKeys.read(top, base);
        boolean bundle = IndependentKeys.bundle(top);

        boolean defaultSets = !top.has("feature-sets");
        for (int i = 0; i < sets.size(); i++) {
            FeatureSet fs = sets.get(i);
            // a spec without feature-sets gets the default, which it never wrote: say so rather than name a line
            String key = defaultSets ? "feature-sets (not given; the default is [source, source+imputed])"
                    : "feature-sets[" + i + "]";
            if ((fs.needsImputer() || fs.needsObservedTarget()) && target == null) {
                problems.add(key, "'" + fs.label() + "' needs a target view, but views.target is not given");
            }
            if (fs.needsImputer() && imputers.isEmpty()) {
                problems.add(key, "'" + fs.label() + "' needs at least one entry under imputers");
            }
        }
        if (!imputers.isEmpty() && target == null) {
            problems.add("imputers", "imputers need a target view to learn from, but views.target is not given");
        }
        problems.throwIfAny();
        return new ExperimentSpec(experiment, seed, file, text, cohort, source, target, features, imputers, training,
                sets, classifiers, validation, significance, parsed.where(), curve, independent, bundle);
    }

    private static Specs.Cohort cohort(Section s, Path base) {
        s.allowOnly(Set.of("subjects", "id", "group", "groups", "positive", "site", "covariates",
                "duplicate-threshold"));
        String subjects = s.text("subjects", null, s.node != null);
        String id = s.text("id", "subject", false);
        String group = s.text("group", "group", false);
        List<String> groups = s.textList("groups", List.of());
        if (s.node != null && groups.size() < 2) {
            s.problems.add(s.key("groups"), "list the group labels, at least two (e.g. [control, patient])");
        }
        if (new HashSet<>(groups).size() != groups.size()) {
            s.problems.add(s.key("groups"), "a group label is listed twice");
        }
        String positive = s.text("positive", null, false);
        if (positive != null && !groups.contains(positive)) {
            s.problems.add(s.key("positive"), "'" + positive + "' is not one of groups " + groups);
        }
        if (positive == null && groups.size() == 2) {
            s.problems.add(s.key("positive"), "missing; with two groups, say which is positive (one of " + groups + ")");
        }
        String site = s.text("site", null, false);
        List<String> covariates = s.textList("covariates", List.of());
        double duplicates = s.number("duplicate-threshold", Specs.Cohort.DEFAULT_DUPLICATE_THRESHOLD, 0, 1);
        // a column read as site, covariate or id must not be the group: ComBat, adjustment and the fold plan would
        // then read the test subjects' labels
        if (group != null && group.equals(id)) {
            s.problems.add(s.key("id"), "'" + id + "' is also cohort.group; the id column must differ from the group");
        }
        if (group != null && group.equals(site)) {
            s.problems.add(s.key("site"), "'" + site + "' is also cohort.group; a site column equal to the group would"
                    + " let harmonization and the folds read the test subjects' labels");
        }
        if (group != null && covariates.contains(group)) {
            s.problems.add(s.key("covariates"), "'" + group + "' is cohort.group; the group cannot be a covariate"
                    + " (adjustment would read the test subjects' labels)");
        }
        return new Specs.Cohort(subjects == null ? null : base.resolve(subjects).normalize(), id, group, groups,
                positive, site, covariates, duplicates);
    }

    private static Specs.Features features(Section s, Specs.View source, Specs.View target) {
        s.allowOnly(Set.of("extract", "scale", "select", "adjust", "harmonize"));
        List<String> extract = s.textList("extract", List.of("edges"));
        if (extract.isEmpty()) {
            s.problems.add(s.key("extract"), "give at least one extractor: " + String.join(", ", EXTRACTORS));
        }
        for (int i = 0; i < extract.size(); i++) {
            String e = extract.get(i);
            if (!EXTRACTORS.contains(e)) {
                s.problems.add(s.key("extract") + "[" + i + "]", "'" + e + "' is not an extractor; expected one of "
                        + String.join(", ", EXTRACTORS));
            } else if (e.equals("strength")) {
                for (Specs.View v : new Specs.View[] {source, target}) {
                    if (v != null && v.layout() == Specs.Layout.TABLE) {
                        s.problems.add(s.key("extract") + "[" + i + "]", "'strength' needs graph views, but views."
                                + v.name() + " is a table; use 'edges' (the table's columns as they are)");
                    }
                }
            }
        }
        if (new HashSet<>(extract).size() != extract.size()) {
            s.problems.add(s.key("extract"), "an extractor is listed twice");
        }
        Specs.Scaling scale = Specs.byLabel(Specs.Scaling.class, s.choice("scale",
                Specs.labels(Specs.Scaling.class, Specs.Scaling::label), Specs.Scaling.STANDARDIZE.label()),
                Specs.Scaling::label);
        return new Specs.Features(extract, scale);
    }

    private static Specs.TrainingImputation trainingImputation(Section top) {
        String v = top.choice("imputed-for-training", List.of("cross-fitted", "observed"), "cross-fitted");
        return "observed".equals(v) ? Specs.TrainingImputation.OBSERVED : Specs.TrainingImputation.CROSS_FITTED;
    }

    private static List<FeatureSet> featureSets(Section top, Problems problems) {
        List<String> raw = top.textList("feature-sets", List.of("source", "source+imputed"));
        List<FeatureSet> out = new ArrayList<>();
        for (int i = 0; i < raw.size(); i++) {
            FeatureSet fs = FeatureSet.byLabel(raw.get(i));
            if (fs == null) {
                problems.add("feature-sets[" + i + "]", "'" + raw.get(i) + "' is not a feature set; expected one of "
                        + String.join(", ", FeatureSet.labels()));
            } else if (out.contains(fs)) {
                problems.add("feature-sets[" + i + "]", "'" + raw.get(i) + "' is listed twice");
            } else {
                out.add(fs);
            }
        }
        if (raw.isEmpty()) {
            problems.add("feature-sets", "give at least one feature set: " + String.join(", ", FeatureSet.labels()));
        }
        return out;
    }

    private static List<Specs.Method> methods(Section top, String key, Path base, boolean required) {
        List<Specs.Method> out = new ArrayList<>();
        if (!top.has(key)) {
            if (required) {
                top.missing(key, "missing; list at least one entry with a method");
            }
            return out;
        }
        JsonNode list = top.node.get(key);
        if (!list.isArray()) {
            top.problems.add(key, "expected a list of entries (- { name: ..., method: ... }), found " + Section.describe(list));
            return out;
        }
        if (list.isEmpty() && required) {
            top.problems.add(key, "an empty list; give at least one entry");
        }
        Set<String> names = new HashSet<>();
        boolean classifier = key.equals("classifiers");
        for (int i = 0; i < list.size(); i++) {
            String path = key + "[" + i + "]";
            JsonNode n = list.get(i);
            if (!n.isObject()) {
                top.problems.add(path, "expected a mapping with at least 'method', found " + Section.describe(n));
                continue;
            }
            Section s = new Section(n, path, top.problems);
            s.allowOnly(classifier ? Set.of("name", "method", "fixed", "grid", "class", "options")
                    : Set.of("name", "method", "fixed", "grid"));
            String method = s.text("method", null, true);
            String name = s.text("name", method, false);
            if (name != null && !name.matches("[A-Za-z0-9][A-Za-z0-9._-]*")) {
                top.problems.add(s.key("name"), "'" + name + "': use letters, digits, '.', '_' or '-'");
            }
            if (name != null && !names.add(name)) {
                top.problems.add(s.key("name"), "'" + name + "' is used by two entries; names must be unique");
            }
            if (name != null && name.equals("none")) {
                top.problems.add(s.key("name"), "'none' is reserved (it marks pipelines without an imputer)");
            }
            Map<String, Object> fixed = s.scalarMap("fixed");
            Map<String, List<Object>> grid = s.gridMap("grid");
            for (String k : fixed.keySet()) {
                if (grid.containsKey(k)) {
                    top.problems.add(s.key("grid") + "." + k, "given both as fixed and in the grid; choose one");
                }
            }
            // settings of the method itself, beside `method` (the weka method's class and option string)
            Map<String, String> settings = new java.util.LinkedHashMap<>();
            for (String setting : classifier ? List.of("class", "options") : List.<String>of()) {
                String v = s.text(setting, null, false);
                if (v != null) {
                    settings.put(setting, v);
                }
            }
            if (method != null && name != null) {
                out.add(new Specs.Method(name, method, fixed, grid, settings, path));
            }
        }
        return out;
    }

    private static Specs.Validation validation(Section s, Specs.Cohort cohort) {
        s.allowOnly(Set.of("outer", "inner", "tune-by"));
        Section outer = s.section("outer", false);
        outer.allowOnly(Set.of("scheme", "folds", "repeats"));
        String schemeText = outer.choice("scheme", List.of("stratified-k-fold", "leave-one-out", "leave-site-out"),
                "stratified-k-fold");
        Specs.Scheme scheme = switch (schemeText) {
            case "leave-one-out" -> Specs.Scheme.LEAVE_ONE_OUT;
            case "leave-site-out" -> Specs.Scheme.LEAVE_SITE_OUT;
            default -> Specs.Scheme.STRATIFIED_K_FOLD;
        };
        int folds = outer.integer("folds", 5, 2, 1000);
        int repeats = outer.integer("repeats", 1, 1, 1000);
        if (scheme != Specs.Scheme.STRATIFIED_K_FOLD) {
            if (outer.has("folds")) {
                outer.problems.add(outer.key("folds"), "only stratified-k-fold takes a number of folds ("
                        + scheme.label() + " makes its own)");
            }
            if (repeats != 1) {
                outer.problems.add(outer.key("repeats"), scheme.label() + " has one fixed partition; repeats must be 1");
            }
        }
        if (scheme == Specs.Scheme.LEAVE_SITE_OUT && cohort.site() == null) {
            outer.problems.add(outer.key("scheme"), "leave-site-out needs cohort.site (the site column)");
        }
        Section inner = s.section("inner", false);
        inner.allowOnly(Set.of("folds"));
        int innerFolds = inner.integer("folds", 3, 2, 100);
        Specs.Metric tuneBy = Specs.byLabel(Specs.Metric.class, s.choice("tune-by",
                Specs.labels(Specs.Metric.class, Specs.Metric::spec), Specs.Metric.BALANCED_ACCURACY.spec()),
                Specs.Metric::spec);
        return new Specs.Validation(scheme, folds, repeats, innerFolds, tuneBy);
    }


    private static Specs.Significance significance(Section s, List<FeatureSet> sets, Specs.Validation validation) {
        s.allowOnly(Set.of("permutations", "early-stop", "metric", "alpha", "compare", "adjust", "rope", "bootstrap",
                "confidence"));
        int permutations = s.integer("permutations", 0, 0, 1_000_000);
        int earlyStop = s.integer("early-stop", 0, 0, 1_000_000);
        if (earlyStop > 0 && permutations > 0 && earlyStop > permutations) {
            s.problems.add(s.key("early-stop"), "h = " + earlyStop + " exceeds permutations = " + permutations);
        }
        Specs.Metric metric = Specs.byLabel(Specs.Metric.class, s.choice("metric",
                Specs.labels(Specs.Metric.class, Specs.Metric::spec), validation.tuneBy().spec()), Specs.Metric::spec);
        double alpha = s.number("alpha", 0.05, 1e-9, 0.5);
        List<String> defaults = new ArrayList<>();
        if (sets.contains(FeatureSet.SOURCE_IMPUTED) && sets.contains(FeatureSet.SOURCE)) {
            defaults.add("source+imputed vs source");
        }
        if (sets.contains(FeatureSet.SOURCE_IMPUTED) && sets.contains(FeatureSet.TARGET)) {
            defaults.add("source+imputed vs target");
        }
        List<String> compare = s.textList("compare", defaults);
        for (int i = 0; i < compare.size(); i++) {
            String c = compare.get(i);
            String[] sides = c.split("\\s+vs\\s+");
            if (c.equals("all-pairs")) {
                continue;
            }
            if (sides.length != 2) {
                s.problems.add(s.key("compare") + "[" + i + "]", "'" + c + "': write 'A vs B' with feature sets (e.g."
                        + " 'source+imputed vs source') or pipelines (imputer/feature-set/classifier), or 'all-pairs'");
                continue;
            }
            for (String side : sides) {
                if (!side.contains("/") && (FeatureSet.byLabel(side) == null || !sets.contains(FeatureSet.byLabel(side)))) {
                    s.problems.add(s.key("compare") + "[" + i + "]", "'" + side + "' is not one of the feature-sets of "
                            + "this spec (" + String.join(", ", sets.stream().map(FeatureSet::label).toList()) + ")");
                }
            }
        }
        Specs.Adjustment adjust = Specs.byLabel(Specs.Adjustment.class, s.choice("adjust",
                Specs.labels(Specs.Adjustment.class, Specs.Adjustment::label), Specs.Adjustment.HOLM.label()),
                Specs.Adjustment::label);
        double rope = s.number("rope", 0.01, 0, 1);
        int bootstrap = s.integer("bootstrap", 1000, 0, 1_000_000);
        double confidence = s.number("confidence", 0.95, 0.5, 0.999);
        return new Specs.Significance(permutations, earlyStop, metric, alpha, compare, adjust, rope, bootstrap,
                confidence);
    }
}
