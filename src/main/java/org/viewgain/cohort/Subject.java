package org.viewgain.cohort;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Objects;

/**
 * One row of the subjects table: the id exactly as written (e.g. "007" stays "007"), the group label, the site
 * ({@code null} when no site column is named), numeric covariates in the order the spec lists them, and the line
 * of the table the row came from (for messages).
 */
public record Subject(String id, String group, String site, Map<String, Double> covariates, int line) {

    public Subject {
        Objects.requireNonNull(id, "id");
        Objects.requireNonNull(group, "group");
        covariates = Collections.unmodifiableMap(new LinkedHashMap<>(covariates));
    }

    /** The value of a covariate; throws {@link IllegalArgumentException} for a covariate that was not loaded. */
    public double covariate(String name) {
        Double v = covariates.get(name);
        if (v == null) {
            throw new IllegalArgumentException("subject " + id + " has no covariate " + name);
        }
        return v;
    }
}
