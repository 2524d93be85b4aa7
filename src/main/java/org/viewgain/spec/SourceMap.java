package org.viewgain.spec;

import java.util.Map;
import java.util.TreeMap;

/** The line of every key path in a spec file ({@code classifiers[1].grid.C}), for error messages. */
public record SourceMap(String file, Map<String, Integer> lines) {

    public SourceMap {
        lines = java.util.Collections.unmodifiableMap(new TreeMap<>(lines));
    }

    /** The line of a key path, or of its nearest enclosing key, or 0 when unknown. */
    public int line(String path) {
        String p = path;
        while (!p.isEmpty()) {
            Integer l = lines.get(p);
            if (l != null) {
                return l;
            }
            int cut = Math.max(p.lastIndexOf('.'), p.lastIndexOf('['));
            p = cut < 0 ? "" : p.substring(0, cut);
        }
        return 0;
    }

    /** {@code file:line: key: message}. */
    public String at(String path, String message) {
        int l = line(path);
        return file + (l > 0 ? ":" + l : "") + ": " + path + ": " + message;
    }
}
