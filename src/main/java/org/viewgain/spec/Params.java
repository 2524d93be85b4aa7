package org.viewgain.spec;

import java.util.Collections;
import java.util.Map;
import java.util.StringJoiner;
import java.util.TreeMap;

/**
 * One point of a hyperparameter grid: an immutable, sorted map from parameter name to a value already checked
 * against the method's {@link ParamDef}s (Integer, Double or String).
 */
public record Params(Map<String, Object> values) {

    public static final Params NONE = new Params(Map.of());

    public Params {
        values = Collections.unmodifiableSortedMap(new TreeMap<>(values));
    }

    public static Params of(Object... keyValues) {
        Map<String, Object> m = new TreeMap<>();
        for (int i = 0; i < keyValues.length; i += 2) {
            m.put((String) keyValues[i], keyValues[i + 1]);
        }
        return new Params(m);
    }

    public boolean has(String name) {
        return values.containsKey(name);
    }

    public Object get(String name) {
        Object v = values.get(name);
        if (v == null) {
            throw new IllegalStateException("parameter '" + name + "' was not resolved; known: " + values.keySet());
        }
        return v;
    }

    public int getInt(String name) {
        return ((Number) get(name)).intValue();
    }

    public double getDouble(String name) {
        return ((Number) get(name)).doubleValue();
    }

    public String getString(String name) {
        return String.valueOf(get(name));
    }

    /** A copy with one value replaced or added. */
    public Params with(String name, Object value) {
        Map<String, Object> m = new TreeMap<>(values);
        m.put(name, value);
        return new Params(m);
    }

    /** Stable text form {@code a=1;b=x}, used in hyperparameters.csv and for seeds. */
    @Override
    public String toString() {
        StringJoiner j = new StringJoiner(";");
        values.forEach((k, v) -> j.add(k + "=" + (v instanceof Double d && d == Math.rint(d) && Math.abs(d) < 1e15
                ? String.valueOf(d) : String.valueOf(v))));
        return j.toString();
    }
}
