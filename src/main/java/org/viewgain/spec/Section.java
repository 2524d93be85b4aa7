package org.viewgain.spec;

import com.fasterxml.jackson.databind.JsonNode;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * A YAML mapping being read: typed getters that record a problem (with key path and line) instead of throwing, so
 * that every problem of a spec is reported at once.
 */
final class Section {
    final JsonNode node;
    final String path;
    final Problems problems;

    Section(JsonNode node, String path, Problems problems) {
        this.node = node;
        this.path = path;
        this.problems = problems;
    }

    String key(String name) {
        return path.isEmpty() ? name : path + "." + name;
    }

    boolean has(String name) {
        return node != null && node.has(name) && !node.get(name).isNull();
    }

    /** Records an error for every key that is not allowed here. */
    void allowOnly(Set<String> allowed) {
        if (node == null || !node.isObject()) {
            return;
        }
        Iterator<String> it = node.fieldNames();
        while (it.hasNext()) {
            String k = it.next();
            if (!allowed.contains(k)) {
                String near = allowed.stream().filter(a -> editDistance(a, k) <= 2).sorted().findFirst().orElse(null);
                if (near != null && !node.has(near)) {
                    problems.misspelled(key(near));
                    problems.add(key(k), "unknown key; did you mean '" + near + "'? (allowed here: "
                            + String.join(", ", allowed.stream().sorted().toList()) + ")");
                } else {
                    problems.add(key(k), "unknown key; allowed here: "
                            + String.join(", ", allowed.stream().sorted().toList()));
                }
            }
        }
    }

    /** Levenshtein distance, for "did you mean" hints. */
    static int editDistance(String a, String b) {
        int[] prev = new int[b.length() + 1];
        int[] cur = new int[b.length() + 1];
        for (int j = 0; j <= b.length(); j++) {
            prev[j] = j;
        }
        for (int i = 1; i <= a.length(); i++) {
            cur[0] = i;
            for (int j = 1; j <= b.length(); j++) {
                int sub = prev[j - 1] + (a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1);
                cur[j] = Math.min(sub, Math.min(prev[j] + 1, cur[j - 1] + 1));
            }
            int[] t = prev;
            prev = cur;
            cur = t;
        }
        return prev[b.length()];
    }

    /** Records that a required key is missing, unless it was given under a misspelled name. */
    void missing(String name, String message) {
        if (!problems.wasMisspelled(key(name))) {
            problems.add(key(name), message);
        }
    }

    Section section(String name, boolean required) {
        if (!has(name)) {
            if (required && !problems.wasMisspelled(key(name))) {
                problems.add(key(name), "missing; this section is required");
            }
            return new Section(null, key(name), problems);
        }
        JsonNode n = node.get(name);
        if (!n.isObject()) {
            problems.add(key(name), "expected a mapping of keys, found " + describe(n));
            return new Section(null, key(name), problems);
        }
        return new Section(n, key(name), problems);
    }

    String text(String name, String def, boolean required) {
        if (!has(name)) {
            if (required) {
                missing(name, "missing; required");
            }
            return def;
        }
        JsonNode n = node.get(name);
        if (n.isTextual() || n.isNumber() || n.isBoolean()) {
            String s = n.asText().trim();
            if (s.isEmpty()) {
                problems.add(key(name), "must not be empty");
                return def;
            }
            return s;
        }
        problems.add(key(name), "expected text, found " + describe(n));
        return def;
    }

    String choice(String name, List<String> allowed, String def) {
        String v = text(name, def, def == null);
        if (v != null && !allowed.contains(v)) {
            problems.add(key(name), "'" + v + "' is not allowed; expected one of " + String.join(", ", allowed));
            return def;
        }
        return v;
    }

    int integer(String name, int def, int min, int max) {
        if (!has(name)) {
            return def;
        }
        JsonNode n = node.get(name);
        if (n.isIntegralNumber() && n.asLong() >= min && n.asLong() <= max) {
            return n.asInt();
        }
        problems.add(key(name), "expected a whole number " + ParamDef.range(min, max) + ", found " + describe(n));
        return def;
    }

    long longValue(String name, long def) {
        if (!has(name)) {
            return def;
        }
        JsonNode n = node.get(name);
        if (n.isIntegralNumber() && n.canConvertToLong()) {
            return n.asLong();
        }
        problems.add(key(name), "expected a whole number, found " + describe(n));
        return def;
    }

    double number(String name, double def, double min, double max) {
        if (!has(name)) {
            return def;
        }
        JsonNode n = node.get(name);
        if (n.isNumber() && n.asDouble() >= min && n.asDouble() <= max) {
            return n.asDouble();
        }
        problems.add(key(name), "expected a number from " + min + " to " + max + ", found " + describe(n));
        return def;
    }

    List<String> textList(String name, List<String> def) {
        if (!has(name)) {
            return def;
        }
        JsonNode n = node.get(name);
        List<String> out = new ArrayList<>();
        if (n.isTextual()) {
            out.add(n.asText().trim());
            return out;
        }
        if (!n.isArray()) {
            problems.add(key(name), "expected a list, found " + describe(n));
            return def;
        }
        for (int i = 0; i < n.size(); i++) {
            JsonNode e = n.get(i);
            if (e.isTextual() || e.isNumber()) {
                out.add(e.asText().trim());
            } else {
                problems.add(key(name) + "[" + i + "]", "expected text, found " + describe(e));
            }
        }
        return out;
    }

    /** A mapping of scalar values (fixed hyperparameters). */
    Map<String, Object> scalarMap(String name) {
        Map<String, Object> out = new LinkedHashMap<>();
        if (!has(name)) {
            return out;
        }
        JsonNode n = node.get(name);
        if (!n.isObject()) {
            problems.add(key(name), "expected a mapping of parameter: value, found " + describe(n));
            return out;
        }
        n.fields().forEachRemaining(e -> {
            Object v = scalar(e.getValue());
            if (v == null) {
                problems.add(key(name) + "." + e.getKey(), "expected a single number or word, found " + describe(e.getValue()));
            } else {
                out.put(e.getKey(), v);
            }
        });
        return out;
    }

    /** A mapping of value lists (a grid); a single value counts as a one-element list. */
    Map<String, List<Object>> gridMap(String name) {
        Map<String, List<Object>> out = new LinkedHashMap<>();
        if (!has(name)) {
            return out;
        }
        JsonNode n = node.get(name);
        if (!n.isObject()) {
            problems.add(key(name), "expected a mapping of parameter: [values], found " + describe(n));
            return out;
        }
        n.fields().forEachRemaining(e -> {
            List<Object> values = new ArrayList<>();
            JsonNode v = e.getValue();
            if (v.isArray()) {
                for (int i = 0; i < v.size(); i++) {
                    Object s = scalar(v.get(i));
                    if (s == null) {
                        problems.add(key(name) + "." + e.getKey() + "[" + i + "]", "expected a number or word, found " + describe(v.get(i)));
                    } else {
                        values.add(s);
                    }
                }
                if (v.isEmpty()) {
                    problems.add(key(name) + "." + e.getKey(), "an empty list of values; give at least one");
                }
            } else {
                Object s = scalar(v);
                if (s == null) {
                    problems.add(key(name) + "." + e.getKey(), "expected a list of values, found " + describe(v));
                } else {
                    values.add(s);
                }
            }
            out.put(e.getKey(), List.copyOf(values));
        });
        return out;
    }

    static Object scalar(JsonNode n) {
        if (n.isIntegralNumber()) {
            return n.canConvertToInt() ? (Object) n.asInt() : (Object) n.asDouble();
        }
        if (n.isNumber()) {
            return n.asDouble();
        }
        if (n.isTextual()) {
            return n.asText();
        }
        if (n.isBoolean()) {
            return n.asText();
        }
        return null;
    }

    static String describe(JsonNode n) {
        if (n == null || n.isNull()) {
            return "nothing";
        }
        if (n.isObject()) {
            return "a mapping";
        }
        if (n.isArray()) {
            return "a list";
        }
        String t = n.asText();
        // escaped so that a message stays on one line whatever the value holds
        return "'" + (t.length() > 40 ? t.substring(0, 40) + "..." : t).replace("\r", "\\r").replace("\n", "\\n")
                .replace("\t", "\\t") + "'";
    }
}
