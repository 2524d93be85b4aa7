package org.viewgain.spec;

import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.stream.Stream;

/**
 * Reads one view of a spec ({@code views.source}, {@code views.target}): its layout ({@code matrices},
 * {@code stacked} or {@code table}) and the keys each layout allows, every problem recorded with its key and line.
 */
final class ViewKeys {
    private ViewKeys() {
    }

    /** The view {@code views.<name>}, or null when it is absent or too broken to describe (problems recorded). */
    static Specs.View read(Section views, String name, Path base, boolean required) {
        if (!views.has(name)) {
            if (required && views.node != null) {
                views.problems.add(views.key(name), "missing; the source view is required");
            }
            return null;
        }
        Section s = views.section(name, true);
        if (s.node == null) {
            return null;
        }
        s.allowOnly(Set.of("matrices", "stacked", "table", "id", "missing", "tolerance", "variable", "subject-order",
                "subject-axis", "labels"));
        List<String> layouts = Stream.of("matrices", "stacked", "table").filter(s::has).toList();
        if (layouts.size() != 1) {
            s.problems.add(s.path, "give exactly one of 'matrices' (a path pattern with {subject}), 'stacked' (one"
                    + " .npy or .mat array of every subject) or 'table' (a CSV)"
                    + (layouts.isEmpty() ? "" : "; found " + String.join(" and ", layouts)));
            return null;
        }
        String layoutKey = layouts.get(0);
        Specs.Layout layout = switch (layoutKey) {
            case "matrices" -> Specs.Layout.MATRICES;
            case "stacked" -> Specs.Layout.STACKED;
            default -> Specs.Layout.TABLE;
        };
        String where = s.text(layoutKey, null, true);
        if (where == null) {
            return null;
        }
        if (layout == Specs.Layout.MATRICES && !where.contains("{subject}")) {
            s.problems.add(s.key("matrices"), "the path pattern must contain {subject}, e.g. views/area/{subject}.csv");
        }
        if (layout == Specs.Layout.STACKED && !where.toLowerCase(Locale.ROOT).matches(".*\\.(npy|mat)")) {
            s.problems.add(s.key("stacked"), "'" + where + "': a stacked view is a .npy or .mat file");
        }
        if (layout != Specs.Layout.TABLE && s.has("id")) {
            s.problems.add(s.key("id"), "only a 'table' view has an id column");
        }
        onlyWith(s, "subject-order", layout == Specs.Layout.STACKED, "a 'stacked' view");
        onlyWith(s, "subject-axis", layout == Specs.Layout.STACKED, "a 'stacked' view");
        onlyWith(s, "labels", layout != Specs.Layout.TABLE, "'matrices' or 'stacked' views");
        onlyWith(s, "variable", layout != Specs.Layout.TABLE && where.toLowerCase(Locale.ROOT).endsWith(".mat"),
                "MATLAB files (.mat)");
        String order = s.text("subject-order", null, layout == Specs.Layout.STACKED);
        String axis = s.choice("subject-axis", List.of("first", "last"), "first");
        String labels = s.text("labels", null, false);
        String missing = s.choice("missing", List.of("allowed", "not-allowed"), "not-allowed");
        double tolerance = s.number("tolerance", 1e-6, 0, Double.MAX_VALUE);
        return new Specs.View(name, layout, base.resolve(where).normalize(), s.text("id", null, false),
                "allowed".equals(missing), tolerance, s.text("variable", null, false),
                order == null ? null : base.resolve(order).normalize(),
                labels == null ? null : base.resolve(labels).normalize(), "last".equals(axis));
    }

    private static void onlyWith(Section s, String key, boolean allowed, String what) {
        if (s.has(key) && !allowed) {
            s.problems.add(s.key(key), "only for " + what);
        }
    }
}
