package org.viewgain.engine;

import java.util.List;
import org.viewgain.cohort.Subject;
import org.viewgain.cohort.View;

/**
 * A loaded cohort: subjects in file order, their class indices, the views, and the extracted features of observed
 * views (extraction has nothing fitted, so it is done once for everyone).
 *
 * @param y                class index of each subject (order of {@code spec.cohort.groups})
 * @param target           the target view, or null when the spec has none
 * @param sourceFeatures   extracted source features per subject
 * @param targetFeatures   extracted observed target features per subject, null where the target is missing
 * @param sourceNames      feature names of the source view (unprefixed)
 * @param targetNames      feature names of the target view (without prefix), or empty
 */
public record StudyData(List<Subject> subjects, int[] y, View source, View target, double[][] sourceFeatures,
                        double[][] targetFeatures, List<String> sourceNames, List<String> targetNames) {
    public StudyData {
        subjects = List.copyOf(subjects);
        sourceNames = List.copyOf(sourceNames);
        targetNames = List.copyOf(targetNames);
    }

    public int n() {
        return subjects.size();
    }

    public boolean hasTarget(int i) {
        return targetFeatures != null && targetFeatures[i] != null;
    }

    public String id(int i) {
        return subjects.get(i).id();
    }
}
