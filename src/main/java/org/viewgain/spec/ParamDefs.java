package org.viewgain.spec;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/** Checking raw spec values against a method's declared parameters. */
public final class ParamDefs {
    private ParamDefs() {
    }

    /**
     * Resolves one grid point: every key must be declared, every value must fit its declaration, and undeclared
     * parameters with defaults are filled in.
     *
     * @param raw key to raw value (Integer, Double, String ...), as read from the spec
     * @throws IllegalArgumentException naming the first bad key and what is allowed
     */
    public static Params resolve(List<ParamDef> defs, Map<String, Object> raw) {
        Map<String, ParamDef> byName = new LinkedHashMap<>();
        defs.forEach(d -> byName.put(d.name(), d));
        Map<String, Object> out = new TreeMap<>();
        for (Map.Entry<String, Object> e : raw.entrySet()) {
            ParamDef d = byName.get(e.getKey());
            if (d == null) {
                throw new IllegalArgumentException("unknown parameter '" + e.getKey() + "'; allowed: "
                        + (byName.isEmpty() ? "none" : String.join(", ", byName.keySet())));
            }
            try {
                out.put(d.name(), d.coerce(e.getValue()));
            } catch (IllegalArgumentException ex) {
                throw new IllegalArgumentException("parameter '" + d.name() + "' = " + e.getValue() + ": "
                        + ex.getMessage(), ex);
            }
        }
        List<String> missing = new ArrayList<>();
        for (ParamDef d : defs) {
            if (!out.containsKey(d.name())) {
                if (d.defaultValue() == null) {
                    missing.add(d.name());
                } else {
                    out.put(d.name(), d.defaultValue());
                }
            }
        }
        if (!missing.isEmpty()) {
            throw new IllegalArgumentException("missing parameter(s): " + String.join(", ", missing));
        }
        return new Params(out);
    }
}
