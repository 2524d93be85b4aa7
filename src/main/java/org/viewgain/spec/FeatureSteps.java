package org.viewgain.spec;

import com.fasterxml.jackson.databind.JsonNode;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;

/**
 * Reads the keys of {@code features} that add steps fitted inside every fit ({@code select}, {@code adjust},
 * {@code harmonize}) and checks them against the cohort and the validation scheme; problems name key and line.
 */
final class FeatureSteps {
    static final List<String> SELECT_METHODS = List.of("t-test", "anova", "variance");

    private FeatureSteps() {
    }

    /** The features record with selection, adjustment and harmonization read from {@code s}. */
    static Specs.Features read(Section s, Specs.Features base, Specs.Cohort cohort) {
        Specs.Selection select = selection(s, cohort);
        List<String> adjust = s.textList("adjust", List.of());
        for (int i = 0; i < adjust.size(); i++) {
            String name = adjust.get(i);
            if (name.equals(cohort.group())) {
                s.problems.add(s.key("adjust") + "[" + i + "]", "'" + name + "' is the group column; the diagnosis is "
                        + "never a covariate (adjusting for it would need the test subjects' labels)");
            } else if (!cohort.covariates().contains(name)) {
                s.problems.add(s.key("adjust") + "[" + i + "]", "'" + name + "' is not listed in cohort.covariates "
                        + (cohort.covariates().isEmpty() ? "(none are listed)" : cohort.covariates().toString()));
            }
        }
        if (new HashSet<>(adjust).size() != adjust.size()) {
            s.problems.add(s.key("adjust"), "a covariate is listed twice");
        }
        Specs.Harmonization harmonize = Specs.byLabel(Specs.Harmonization.class, s.choice("harmonize",
                Specs.labels(Specs.Harmonization.class, Specs.Harmonization::label),
                Specs.Harmonization.NONE.label()), Specs.Harmonization::label);
        if (harmonize == Specs.Harmonization.COMBAT && cohort.site() == null) {
            s.problems.add(s.key("harmonize"), "combat needs cohort.site (the site column)");
        }
        return new Specs.Features(base.extract(), base.scale(), select, adjust, harmonize);
    }

    private static Specs.Selection selection(Section features, Specs.Cohort cohort) {
        if (!features.has("select")) {
            return null;
        }
        Section s = features.section("select", false);
        if (s.node == null) {
            return null;
        }
        s.allowOnly(java.util.Set.of("method", "keep"));
        String method = s.choice("method", SELECT_METHODS, null);
        if ("t-test".equals(method) && cohort.groups().size() > 2) {
            s.problems.add(s.key("method"), "t-test compares two groups, but cohort.groups lists "
                    + cohort.groups().size() + "; use anova");
        }
        List<Integer> keep = keep(s);
        return method == null || keep.isEmpty() ? null : new Specs.Selection(method, keep);
    }

    /** {@code keep}: a whole number of at least 1, or a non-empty list of distinct such numbers (a grid). */
    private static List<Integer> keep(Section s) {
        String key = s.key("keep");
        if (!s.has("keep")) {
            s.missing("keep", "missing; how many features to keep, e.g. keep: 200 or keep: [100, 500]");
            return List.of();
        }
        JsonNode n = s.node.get("keep");
        List<JsonNode> items = new ArrayList<>();
        if (n.isArray()) {
            n.forEach(items::add);
            if (items.isEmpty()) {
                s.problems.add(key, "an empty list; give at least one number of features to keep");
            }
        } else {
            items.add(n);
        }
        List<Integer> out = new ArrayList<>();
        for (int i = 0; i < items.size(); i++) {
            JsonNode e = items.get(i);
            String at = n.isArray() ? key + "[" + i + "]" : key;
            if (e.isIntegralNumber() && e.canConvertToInt() && e.asInt() >= 1) {
                if (out.contains(e.asInt())) {
                    s.problems.add(at, e.asInt() + " is listed twice");
                } else {
                    out.add(e.asInt());
                }
            } else {
                s.problems.add(at, "expected a whole number of at least 1, found " + Section.describe(e));
            }
        }
        return out.size() == items.size() ? out : List.of();
    }

    /** Leave-site-out tests a site no training subject comes from, which ComBat cannot harmonize. */
    static void checkScheme(Specs.Features features, Specs.Validation validation, Problems problems) {
        if (features.harmonize() == Specs.Harmonization.COMBAT && validation.scheme() == Specs.Scheme.LEAVE_SITE_OUT) {
            problems.add("features.harmonize", "combat cannot be combined with leave-site-out: every test site is "
                    + "unseen in training, so its site effect cannot be estimated; use stratified-k-fold, or drop "
                    + "harmonize");
        }
    }
}
