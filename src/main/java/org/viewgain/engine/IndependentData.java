package org.viewgain.engine;

import java.util.List;
import org.viewgain.cohort.Subject;
import org.viewgain.cohort.SubjectsTable;
import org.viewgain.cohort.View;
import org.viewgain.cohort.ViewLoader;
import org.viewgain.spec.BadInputException;
import org.viewgain.spec.Specs;

/**
 * A loaded independent cohort: subjects in file order, their class indices (null without labels), and the views,
 * checked against the development cohort's shape (the same regions or columns, in the same order), and the possible
 * duplicate scans between the two cohorts ({@code Pair.a} a development subject's position, {@code Pair.b} this
 * cohort's). Nothing of it is ever given to a fit: it only receives the frozen pipelines' predictions.
 */
public record IndependentData(Specs.Independent spec, List<Subject> subjects, int[] y, View source, View target,
                              List<Duplicates.Pair> duplicates) {
    public IndependentData {
        subjects = List.copyOf(subjects);
        duplicates = List.copyOf(duplicates);
    }

    /** The same cohort with the possible duplicates of development subjects found by {@code Setup}. */
    IndependentData withDuplicates(List<Duplicates.Pair> found) {
        return new IndependentData(spec, subjects, y, source, target, found);
    }

    /**
     * Loads the cohort and checks it against the development cohort's shape; a mismatch is one line naming the key,
     * the view and the first region (or column) that differs.
     */
    public static IndependentData load(Specs.Independent spec, CohortShape dev) {
        // the covariates the pipelines adjust for must be columns of this cohort's table too (same names)
        List<Subject> subjects = SubjectsTable.load(spec.subjects(), spec.id(), spec.group(), spec.site(),
                dev.covariates(), dev.groups());
        checkSites(spec, subjects, dev);
        List<String> ids = subjects.stream().map(Subject::id).toList();
        View source = ViewLoader.load(spec.source(), ids);
        String diff = CohortShape.difference(source, dev.sourceGraph(), dev.sourceNames());
        if (diff != null) {
            throw new BadInputException(key(spec, "views.source") + ": " + diff);
        }
        View target = null;
        if (spec.target() != null) {
            if (dev.targetNames().isEmpty()) {
                throw new BadInputException(spec.where() + ".views.target: the development cohort has no target view"
                        + " to compare it with; remove it");
            }
            target = ViewLoader.load(spec.target(), ids);
            diff = CohortShape.difference(target, dev.targetGraph(), dev.targetNames());
            if (diff != null) {
                throw new BadInputException(key(spec, "views.target") + ": " + diff);
            }
        }
        int[] y = null;
        if (spec.labelled()) {
            y = new int[subjects.size()];
            for (int i = 0; i < y.length; i++) {
                y[i] = dev.groups().indexOf(subjects.get(i).group());
            }
        }
        return new IndependentData(spec, subjects, y, source, target, List.of());
    }

    /**
     * With harmonized pipelines, every subject needs a site the development cohort had: ComBat holds a location and
     * scale for those sites only, and applying another site's to a new scanner would be wrong.
     */
    private static void checkSites(Specs.Independent spec, List<Subject> subjects, CohortShape dev) {
        if (!dev.harmonized()) {
            return;
        }
        if (spec.site() == null) {
            throw new BadInputException(key(spec, "site") + ": required: the development pipelines harmonize sites"
                    + " by ComBat (features.harmonize), so every subject needs a site; the development sites are "
                    + String.join(", ", dev.sites()));
        }
        for (Subject s : subjects) {
            if (!dev.sites().contains(s.site())) {
                throw new BadInputException(spec.subjects() + " line " + s.line() + ": subject '" + s.id()
                        + "' is from site '" + s.site() + "', which the development cohort does not have ("
                        + String.join(", ", dev.sites()) + "); ComBat has no location and scale for it and will not"
                        + " use another site's. Leave out that site's subjects, or drop features.harmonize from the"
                        + " development spec");
            }
        }
    }

    /** Each subject's site (subject id to site); empty when the cohort names no site column. */
    public java.util.Map<String, String> siteById() {
        java.util.Map<String, String> out = new java.util.HashMap<>();
        for (Subject s : subjects) {
            if (s.site() != null) {
                out.put(s.id(), s.site());
            }
        }
        return out;
    }

    /** Each subject's values of these covariates, in this order (subject id to values). */
    public java.util.Map<String, double[]> covariatesById(List<String> names) {
        java.util.Map<String, double[]> out = new java.util.HashMap<>();
        for (Subject s : subjects) {
            out.put(s.id(), names.stream().mapToDouble(s::covariate).toArray());
        }
        return out;
    }

    /** A key of the cohort for messages: {@code independent-cohort.views.source}, or {@code FILE: views.source}. */
    private static String key(Specs.Independent spec, String key) {
        boolean file = spec.where().contains("/") || spec.where().contains("\\") || spec.where().contains(".");
        return spec.where() + (file ? ": " : ".") + key;
    }

    public int n() {
        return subjects.size();
    }

    public String id(int i) {
        return subjects.get(i).id();
    }

    /** Whether subject {@code i} has an observed target. */
    public boolean hasTarget(int i) {
        return target != null && target.has(id(i));
    }

    /** How many subjects have an observed target. */
    public int withTarget() {
        int k = 0;
        for (int i = 0; i < n(); i++) {
            k += hasTarget(i) ? 1 : 0;
        }
        return k;
    }
}
