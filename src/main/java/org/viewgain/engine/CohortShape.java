package org.viewgain.engine;

import java.util.List;
import org.viewgain.cohort.View;

/**
 * What a cohort must look like for the development cohort's pipelines to apply to it: whether each view is a graph
 * and its region names (a table's column names), the extractors, and the groups in class order. Kept in a bundle's
 * manifest so that {@code viewgain apply} checks a later cohort without the development data.
 *
 * @param targetNames the target view's region or column names; empty when the development cohort had no target
 * @param positive    the positive group, or null for three or more groups
 * @param sites       the sites the pipelines harmonize (ComBat, {@code features.harmonize}), sorted; empty without
 *                    harmonization. A cohort applied must then name a site column and only these sites
 * @param covariates  the covariates the pipelines adjust for ({@code features.adjust}), in order; a cohort applied
 *                    must have these columns in its subjects table
 */
public record CohortShape(boolean sourceGraph, List<String> sourceNames, boolean targetGraph, List<String> targetNames,
                          List<String> extract, List<String> groups, String positive, List<String> sites,
                          List<String> covariates) {
    public CohortShape {
        sourceNames = List.copyOf(sourceNames);
        targetNames = List.copyOf(targetNames);
        extract = List.copyOf(extract);
        groups = List.copyOf(groups);
        sites = List.copyOf(sites);
        covariates = List.copyOf(covariates);
    }

    /** The shape of an experiment's development cohort. */
    public static CohortShape of(Experiment ex) {
        StudyData d = ex.data();
        View t = d.target();
        return new CohortShape(d.source().isGraph(), names(d.source()), t != null && t.isGraph(),
                t == null ? List.of() : names(t), ex.spec().features().extract(), ex.spec().cohort().groups(),
                ex.spec().cohort().positive(), ex.prep().harmonizer() == null ? List.of()
                        : d.subjects().stream().map(org.viewgain.cohort.Subject::site).distinct().sorted().toList(),
                ex.spec().features().adjust());
    }

    /** Whether the pipelines harmonize sites, so that a cohort applied needs a site for every subject. */
    boolean harmonized() {
        return !sites.isEmpty();
    }

    /** Region names of a graph view, column names of a table. */
    static List<String> names(View v) {
        return v.isGraph() ? v.regionNames() : v.baseNames();
    }

    /** An empty view of the target's shape, for extracting features from imputed base vectors. */
    View targetShape() {
        return targetGraph ? View.graph("target", targetNames, java.util.Map.of())
                : View.tabular("target", targetNames, java.util.Map.of());
    }

    /**
     * The first difference between a view of another cohort and the development cohort's view of that role, as a
     * phrase (null when they agree): the kind, the count, or the first name that differs, with its position.
     */
    static String difference(View v, boolean devGraph, List<String> devNames) {
        String unit = devGraph ? "region" : "column";
        if (v.isGraph() != devGraph) {
            return "it is " + (v.isGraph() ? "a graph (matrices)" : "a table") + " but the development cohort's is "
                    + (devGraph ? "a graph (matrices)" : "a table");
        }
        List<String> names = names(v);
        for (int i = 0; i < Math.min(names.size(), devNames.size()); i++) {
            if (!names.get(i).equals(devNames.get(i))) {
                return unit + " " + (i + 1) + " is '" + names.get(i) + "' but the development cohort's is '"
                        + devNames.get(i) + "'";
            }
        }
        if (names.size() != devNames.size()) {
            return "it has " + names.size() + " " + unit + "s but the development cohort's has " + devNames.size();
        }
        return null;
    }
}
