package org.viewgain.cohort;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.viewgain.spec.BadInputException;

/**
 * Turns a view's base vector into features by a list of named extractors, concatenated in list order:
 * {@code edges} (the base vector itself: "Rk~Rl" edges of a graph, or a table's columns) and {@code strength}
 * (node strength per region, named "strength:Rk"; graph views only). Works on any base vector of the view's shape,
 * observed or imputed.
 */
public final class Extractors {
    /** The extractor that passes the base vector through. */
    public static final String EDGES = "edges";
    /** The extractor that gives each region's node strength. */
    public static final String STRENGTH = "strength";
    /** All extractor names. */
    public static final List<String> KNOWN = List.of(EDGES, STRENGTH);

    private Extractors() {
    }

    /**
     * The feature names the extractors give for this view, in output order. Throws {@link BadInputException} for an
     * empty or repeated list, an unknown name (listing the known ones) or {@code strength} on a tabular view.
     */
    public static List<String> names(List<String> extract, View view) {
        check(extract, view);
        List<String> names = new ArrayList<>();
        for (String e : extract) {
            if (e.equals(EDGES)) {
                names.addAll(view.baseNames());
            } else {
                for (String r : view.regionNames()) {
                    names.add("strength:" + r);
                }
            }
        }
        return List.copyOf(names);
    }

    /**
     * The features of one base vector (observed or imputed), in the order of {@link #names}: {@code base} itself
     * (not a copy) for {@code edges} alone, else a new array.
     */
    public static double[] apply(List<String> extract, View view, double[] base) {
        check(extract, view);
        if (base.length != view.width()) {
            throw new IllegalArgumentException("view " + view.name() + ": base vector of length " + base.length
                    + ", expected " + view.width());
        }
        if (extract.size() == 1 && extract.get(0).equals(EDGES)) {
            return base;
        }
        List<double[]> parts = new ArrayList<>();
        int total = 0;
        for (String e : extract) {
            double[] part = e.equals(EDGES) ? base : GraphFeatures.strength(base, view.regions());
            parts.add(part);
            total += part.length;
        }
        double[] out = new double[total];
        int at = 0;
        for (double[] p : parts) {
            System.arraycopy(p, 0, out, at, p.length);
            at += p.length;
        }
        return out;
    }

    /** Throws {@link BadInputException} when the extractor list does not fit the view; see {@link #names}. */
    public static void check(List<String> extract, View view) {
        if (extract == null || extract.isEmpty()) {
            throw new BadInputException("view " + view.name() + ": no extractors given; expected some of " + KNOWN);
        }
        Set<String> seen = new HashSet<>();
        for (String e : extract) {
            if (!KNOWN.contains(e)) {
                throw new BadInputException("view " + view.name() + ": unknown extractor " + CsvText.show(
                        String.valueOf(e)) + "; expected one of " + KNOWN);
            }
            if (!seen.add(e)) {
                throw new BadInputException("view " + view.name() + ": extractor " + e + " is listed twice");
            }
            if (e.equals(STRENGTH) && !view.isGraph()) {
                throw new BadInputException("view " + view.name() + ": extractor strength needs a graph view (from "
                        + "matrices), but this view is a table; use edges");
            }
        }
    }
}
