package org.viewgain.engine;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Function;
import org.viewgain.classify.ClassifierMethod;
import org.viewgain.imputation.ViewImputer;
import org.viewgain.spec.ExperimentSpec;
import org.viewgain.spec.Params;
import org.viewgain.spec.Problems;
import org.viewgain.spec.Specs;

/**
 * Finds every imputer and classifier of a spec in the registries and expands its grid (the product of all grid
 * values, in the order written, combined with the fixed values); problems name the spec key and line.
 */
final class MethodResolver {
    private MethodResolver() {
    }

    static List<Resolved.Imputer> imputers(ExperimentSpec spec, Methods methods, Problems problems) {
        List<Resolved.Imputer> out = new ArrayList<>();
        for (Specs.Method m : spec.imputers()) {
            ViewImputer method;
            try {
                method = methods.imputer(m.method());
            } catch (IllegalArgumentException e) {
                problems.add(m.path() + ".method", e.getMessage());
                continue;
            }
            List<Params> grid = resolvePaths(expand(m, method::resolve, problems), method.parameters(), spec);
            if (!grid.isEmpty()) {
                out.add(new Resolved.Imputer(m.name(), method, grid));
            }
        }
        return out;
    }

    static List<Resolved.Classifier> classifiers(ExperimentSpec spec, Methods methods, Problems problems) {
        List<Resolved.Classifier> out = new ArrayList<>();
        for (Specs.Method m : spec.classifiers()) {
            ClassifierMethod method;
            try {
                method = methods.classifier(m.method(), m.settings());
            } catch (IllegalArgumentException e) {
                problems.add(m.path() + (m.settings().containsKey("class") && "weka".equals(m.method()) ? ".class"
                        : ".method"), e.getMessage());
                continue;
            }
            List<Params> grid = expand(m, method::resolve, problems);
            if (!grid.isEmpty()) {
                out.add(new Resolved.Classifier(m.name(), method, grid));
            }
        }
        return out;
    }

    /** Makes PATH parameters absolute, relative to the spec file's folder. */
    private static List<Params> resolvePaths(List<Params> grid, List<org.viewgain.spec.ParamDef> defs,
                                             ExperimentSpec spec) {
        java.nio.file.Path base = spec.specFile().toAbsolutePath().getParent();
        List<Params> out = new ArrayList<>();
        for (Params p : grid) {
            Params q = p;
            for (org.viewgain.spec.ParamDef d : defs) {
                if (d.kind() == org.viewgain.spec.ParamDef.Kind.PATH && p.has(d.name())) {
                    q = q.with(d.name(), base.resolve(p.getString(d.name())).normalize().toString());
                }
            }
            out.add(q);
        }
        return out;
    }

    private static List<Params> expand(Specs.Method m, Function<Map<String, Object>, Params> resolve,
                                       Problems problems) {
        List<Map<String, Object>> points = new ArrayList<>();
        points.add(new LinkedHashMap<>(m.fixed()));
        for (Map.Entry<String, List<Object>> e : m.grid().entrySet()) {
            List<Map<String, Object>> next = new ArrayList<>();
            for (Map<String, Object> p : points) {
                for (Object v : e.getValue()) {
                    Map<String, Object> q = new LinkedHashMap<>(p);
                    q.put(e.getKey(), v);
                    next.add(q);
                }
            }
            points = next;
        }
        List<Params> out = new ArrayList<>();
        for (Map<String, Object> p : points) {
            try {
                out.add(resolve.apply(p));
            } catch (IllegalArgumentException e) {
                problems.add(m.path() + keyOf(e.getMessage(), m), e.getMessage());
                return List.of();
            }
        }
        return out;
    }

    /** Points the message at the grid or fixed key it names, when it names one. */
    private static String keyOf(String message, Specs.Method m) {
        for (String k : m.grid().keySet()) {
            if (message != null && message.contains("'" + k + "'")) {
                return ".grid." + k;
            }
        }
        for (String k : m.fixed().keySet()) {
            if (message != null && message.contains("'" + k + "'")) {
                return ".fixed." + k;
            }
        }
        return "";
    }
}
