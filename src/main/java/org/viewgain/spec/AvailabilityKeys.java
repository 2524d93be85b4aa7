package org.viewgain.spec;

import com.fasterxml.jackson.databind.JsonNode;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;

/** Reads and checks the spec's {@code availability-curve} section; problems name key and line. */
final class AvailabilityKeys {
    static final String KEY = "availability-curve";

    private AvailabilityKeys() {
    }

    /** The curve, or null when the spec does not ask for one (or asks wrongly: the problems say why). */
    static AvailabilityCurve read(Section top, List<FeatureSet> sets, List<Specs.Method> imputers,
                                  Specs.Validation validation) {
        if (!top.has(KEY)) {
            return null;
        }
        Section s = top.section(KEY, false);
        if (s.node == null) {
            return null;
        }
        s.allowOnly(Set.of("fractions", "counts", "margin"));
        double margin = s.number("margin", AvailabilityCurve.DEFAULT_MARGIN, 0, 0.999);
        int before = s.problems.messages().size();
        if (s.problems.wasMisspelled(s.key("fractions")) || s.problems.wasMisspelled(s.key("counts"))) {
            return null; // the unknown key is reported with a "did you mean"
        }
        if (s.has("fractions") == s.has("counts")) {
            s.problems.add(KEY, "give either fractions (e.g. fractions: [0.1, 0.25, 0.5, 1.0]) or counts (e.g. "
                    + "counts: [20, 40, 80]) of the training subjects with an observed target, not both");
            return null;
        }
        if (!sets.contains(FeatureSet.SOURCE_IMPUTED) || !sets.contains(FeatureSet.SOURCE)) {
            s.problems.add(KEY, "the curve compares source+imputed with source at every level; list both in "
                    + "feature-sets");
        }
        if (imputers.stream().anyMatch(m -> "external".equals(m.method()))) {
            s.problems.add(KEY, "an external imputer's file holds imputations for the full training sets only; the "
                    + "curve needs imputers the engine fits (remove the external entry or the curve)");
        }
        List<Double> fractions = new ArrayList<>();
        List<Integer> counts = new ArrayList<>();
        String name = s.has("fractions") ? "fractions" : "counts";
        int min = 2 * validation.innerFolds();
        List<JsonNode> items = items(s, name);
        for (int i = 0; i < items.size(); i++) {
            JsonNode e = items.get(i);
            String at = s.key(name) + "[" + i + "]";
            if (name.equals("fractions")) {
                double f = e.isNumber() ? e.asDouble() : Double.NaN;
                if (!(f > 0 && f <= 1)) {
                    s.problems.add(at, "expected a fraction in (0, 1], found " + Section.describe(e));
                } else if (!fractions.isEmpty() && !(f > fractions.get(fractions.size() - 1))) {
                    s.problems.add(at, f + " does not exceed the level before it; list the levels strictly "
                            + "increasing");
                } else {
                    fractions.add(f);
                }
            } else {
                if (!(e.isIntegralNumber() && e.canConvertToInt() && e.asInt() >= min)) {
                    s.problems.add(at, "expected a whole number of at least " + min + " (twice validation.inner."
                            + "folds: the imputer is tuned and cross-fitted in the inner folds), found "
                            + Section.describe(e));
                } else if (!counts.isEmpty() && e.asInt() <= counts.get(counts.size() - 1)) {
                    s.problems.add(at, e.asInt() + " does not exceed the level before it; list the levels strictly "
                            + "increasing");
                } else {
                    counts.add(e.asInt());
                }
            }
        }
        if (s.problems.messages().size() != before) {
            return null;
        }
        return new AvailabilityCurve(fractions, counts, margin);
    }

    private static List<JsonNode> items(Section s, String name) {
        JsonNode n = s.node.get(name);
        List<JsonNode> out = new ArrayList<>();
        if (!n.isArray()) {
            s.problems.add(s.key(name), "expected a list of levels, e.g. [0.1, 0.25, 0.5, 1.0], found "
                    + Section.describe(n));
            return out;
        }
        n.forEach(out::add);
        if (out.isEmpty()) {
            s.problems.add(s.key(name), "an empty list; give at least one level");
        }
        return out;
    }
}
