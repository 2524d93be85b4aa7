package org.viewgain.cohort;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;

/**
 * One measurement of the cohort for the subjects who have it: either a graph (a symmetric matrix over named
 * regions, kept as its upper triangle) or a table of named columns. Each subject's <em>base vector</em> is the upper
 * triangle {@code i<j} in row-major order for a graph, or the row's values for a table. Immutable.
 *
 * <p>Values are held in single precision (a 24-bit significand, about 7 significant digits, far finer than any
 * morphometric or connectivity measurement): at 268 regions a view of 1,000 subjects is 143 MB instead of 286 MB.
 * Every computation on them is done in double precision.
 */
public final class View {
    private final String name;
    private final boolean graph;
    private final List<String> regionNames;
    private final List<String> baseNames;
    private final Map<String, float[]> bases;

    private View(String name, boolean graph, List<String> regionNames, List<String> baseNames,
                 Map<String, double[]> bases) {
        this.name = Objects.requireNonNull(name, "name");
        this.graph = graph;
        this.regionNames = List.copyOf(regionNames);
        this.baseNames = List.copyOf(baseNames);
        Map<String, float[]> copy = new LinkedHashMap<>();
        for (Map.Entry<String, double[]> e : bases.entrySet()) {
            double[] v = e.getValue();
            if (v.length != this.baseNames.size()) {
                throw new IllegalArgumentException("view " + name + ": subject " + e.getKey() + " has "
                        + v.length + " values, expected " + this.baseNames.size());
            }
            float[] f = new float[v.length];
            for (int c = 0; c < f.length; c++) {
                f[c] = (float) v[c];
            }
            copy.put(e.getKey(), f);
        }
        this.bases = Collections.unmodifiableMap(copy);
    }

    /**
     * A graph view over the given regions; each base vector holds the upper triangle ({@code i<j}, row-major) of
     * that subject's matrix. Subjects keep the map's iteration order.
     */
    public static View graph(String name, List<String> regionNames, Map<String, double[]> upperTriangles) {
        return new View(name, true, regionNames, edgeNames(regionNames), upperTriangles);
    }

    /** A tabular view with the given column names; each base vector holds that subject's row. */
    public static View tabular(String name, List<String> columnNames, Map<String, double[]> rows) {
        return new View(name, false, List.of(), columnNames, rows);
    }

    /** Default region names R1..Rn, used when a matrix file carries no names. */
    public static List<String> defaultRegionNames(int regions) {
        List<String> names = new ArrayList<>(regions);
        for (int i = 1; i <= regions; i++) {
            names.add("R" + i);
        }
        return names;
    }

    /** Edge names "Rk~Rl" for {@code k<l} in row-major upper-triangle order. */
    static List<String> edgeNames(List<String> regionNames) {
        int n = regionNames.size();
        List<String> names = new ArrayList<>(n * (n - 1) / 2);
        for (int i = 0; i < n; i++) {
            for (int j = i + 1; j < n; j++) {
                names.add(regionNames.get(i) + "~" + regionNames.get(j));
            }
        }
        return names;
    }

    public String name() {
        return name;
    }

    /** True for a graph view (from matrices), false for a tabular one (from an edge table). */
    public boolean isGraph() {
        return graph;
    }

    /** The number of regions of a graph view; 0 for a tabular view. */
    public int regions() {
        return regionNames.size();
    }

    /** The region names of a graph view (empty for a tabular view). */
    public List<String> regionNames() {
        return regionNames;
    }

    /** The names of the base vector's entries: "Rk~Rl" edges for a graph, the column names for a table. */
    public List<String> baseNames() {
        return baseNames;
    }

    /** The length of every base vector. */
    public int width() {
        return baseNames.size();
    }

    /** True when the view holds data for this subject. */
    public boolean has(String id) {
        return bases.containsKey(id);
    }

    /**
     * A copy of the subject's base vector in double precision; throws {@link IllegalArgumentException} when the
     * subject has none.
     */
    public double[] base(String id) {
        float[] v = stored(id);
        double[] out = new double[v.length];
        for (int c = 0; c < v.length; c++) {
            out[c] = v[c];
        }
        return out;
    }

    /**
     * The subject's base vector as stored, shared rather than copied so that feature matrices need not hold a second
     * copy of a view: callers must never write to it. Throws {@link IllegalArgumentException} when the subject has
     * none.
     */
    public float[] stored(String id) {
        float[] v = bases.get(id);
        if (v == null) {
            throw new IllegalArgumentException("view " + name + " has no data for subject " + id);
        }
        return v;
    }

    /** The subjects with data in this view, in loading order (the subjects table's order). */
    public Set<String> subjects() {
        return bases.keySet();
    }

    @Override
    public String toString() {
        return "View[" + name + ", " + (graph ? regions() + " regions" : width() + " columns") + ", "
                + bases.size() + " subjects]";
    }
}
