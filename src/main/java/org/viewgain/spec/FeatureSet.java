package org.viewgain.spec;

import java.util.Arrays;
import java.util.List;

/** Which views a classifier sees. */
public enum FeatureSet {
    SOURCE("source", false, false),
    TARGET("target", false, true),
    IMPUTED("imputed", true, false),
    SOURCE_IMPUTED("source+imputed", true, false),
    SOURCE_TARGET("source+target", false, true);

    private final String label;
    private final boolean needsImputer;
    private final boolean needsObservedTarget;

    FeatureSet(String label, boolean needsImputer, boolean needsObservedTarget) {
        this.label = label;
        this.needsImputer = needsImputer;
        this.needsObservedTarget = needsObservedTarget;
    }

    /** The spelling used in specs and outputs. */
    public String label() {
        return label;
    }

    /** True when the set contains imputed target features (one pipeline per imputer). */
    public boolean needsImputer() {
        return needsImputer;
    }

    /** True when only subjects with an observed target view can be used. */
    public boolean needsObservedTarget() {
        return needsObservedTarget;
    }

    public boolean usesSource() {
        return this == SOURCE || this == SOURCE_IMPUTED || this == SOURCE_TARGET;
    }

    public static List<String> labels() {
        return Arrays.stream(values()).map(FeatureSet::label).toList();
    }

    public static FeatureSet byLabel(String s) {
        for (FeatureSet f : values()) {
            if (f.label.equals(s)) {
                return f;
            }
        }
        return null;
    }
}
