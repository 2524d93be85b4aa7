package org.viewgain.engine;

import org.viewgain.spec.FeatureSet;

/**
 * One imputer x feature set x classifier combination. {@code imputer} is {@value #NO_IMPUTER} for feature sets that
 * contain no imputed features.
 */
public record Pipeline(String imputer, FeatureSet featureSet, String classifier) {
    public static final String NO_IMPUTER = "none";

    /** {@code imputer/feature-set/classifier}, used in seeds and messages. */
    public String label() {
        return imputer + "/" + featureSet.label() + "/" + classifier;
    }
}
