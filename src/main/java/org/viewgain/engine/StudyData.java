package org.viewgain.engine;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import org.viewgain.cohort.Subject;
import org.viewgain.cohort.View;
import org.viewgain.spec.FeatureSet;

/**
 * A loaded cohort: subjects in file order, their class indices, the views, and the extracted features of observed
 * views (extraction has nothing fitted, so it is done once for everyone). Features are held in single precision
 * like the views (see {@link View}); with the {@code edges} extractor alone a subject's features are the view's
 * stored base vector itself, not a copy. Work units read rows through {@link #sourceInto} and {@link #targetInto},
 * which widen them to double precision into arrays the unit owns. Immutable.
 */
public final class StudyData {
    private final List<Subject> subjects;
    private final int[] y;
    private final View source;
    private final View target;
    private final float[][] sourceFeatures;
    private final float[][] targetFeatures;
    private final List<String> sourceNames;
    private final List<String> targetNames;
    private final Map<FeatureSet, List<String>> prefixed = new EnumMap<>(FeatureSet.class);

    /**
     * @param y              class index of each subject (order of {@code spec.cohort.groups})
     * @param target         the target view, or null when the spec has none
     * @param sourceFeatures extracted source features per subject (not copied: never written afterwards)
     * @param targetFeatures extracted observed target features per subject, null where the target is missing (null
     *                       altogether without a target view)
     * @param sourceNames    feature names of the source view (unprefixed)
     * @param targetNames    feature names of the target view (without prefix), or empty
     */
    public StudyData(List<Subject> subjects, int[] y, View source, View target, float[][] sourceFeatures,
                     float[][] targetFeatures, List<String> sourceNames, List<String> targetNames) {
        this.subjects = List.copyOf(subjects);
        this.y = y;
        this.source = source;
        this.target = target;
        this.sourceFeatures = sourceFeatures;
        this.targetFeatures = targetFeatures;
        this.sourceNames = List.copyOf(sourceNames);
        this.targetNames = List.copyOf(targetNames);
        List<String> src = sourceNames.stream().map(n -> "source:" + n).toList();
        List<String> tgt = targetNames.stream().map(n -> "target:" + n).toList();
        List<String> imp = targetNames.stream().map(n -> "imputed:" + n).toList();
        for (FeatureSet fs : FeatureSet.values()) {
            List<String> names = new ArrayList<>();
            if (fs.usesSource()) {
                names.addAll(src);
            }
            if (fs != FeatureSet.SOURCE) {
                names.addAll(fs.needsImputer() ? imp : tgt);
            }
            prefixed.put(fs, List.copyOf(names));
        }
    }

    public List<Subject> subjects() {
        return subjects;
    }

    /** Class index of every subject; read only. */
    public int[] y() {
        return y;
    }

    public View source() {
        return source;
    }

    /** The target view, or null. */
    public View target() {
        return target;
    }

    public List<String> sourceNames() {
        return sourceNames;
    }

    public List<String> targetNames() {
        return targetNames;
    }

    /**
     * Prefixed feature names of a feature set: {@code source:}, then {@code target:} or {@code imputed:}; one shared
     * list per feature set.
     */
    public List<String> featureNames(FeatureSet fs) {
        return prefixed.get(fs);
    }

    public int n() {
        return subjects.size();
    }

    private org.viewgain.imputation.SourceDistances distances;
    private boolean distancesMade;
    /** The data whose distance table this one shares (itself, or the data it hid targets of). */
    private StudyData distanceOwner = this;

    /**
     * The run's table of label-free distances between source views (every subject against those with an observed
     * target), made on first use and shared by every imputer fit; null without a target view or above its budget.
     * Data with hidden targets (an availability level) shares its origin's table: the source views are the same,
     * and its subjects with a target are among the origin's.
     */
    public org.viewgain.imputation.SourceDistances sourceDistances() {
        return distanceOwner.ownDistances();
    }

    private synchronized org.viewgain.imputation.SourceDistances ownDistances() {
        if (!distancesMade) {
            distancesMade = true;
            if (target != null) {
                List<String> all = new ArrayList<>(n());
                List<String> trainable = new ArrayList<>();
                for (int i = 0; i < n(); i++) {
                    all.add(id(i));
                    if (hasTarget(i)) {
                        trainable.add(id(i));
                    }
                }
                distances = org.viewgain.imputation.SourceDistances.of(all, trainable, source::stored);
            }
        }
        return distances;
    }

    public boolean hasTarget(int i) {
        return targetFeatures != null && targetFeatures[i] != null;
    }

    public String id(int i) {
        return subjects.get(i).id();
    }

    /** Writes subject {@code i}'s source features into {@code dst} from position {@code at}. */
    public void sourceInto(int i, double[] dst, int at) {
        widen(sourceFeatures[i], dst, at);
    }

    /** Writes subject {@code i}'s observed target features into {@code dst} from position {@code at}. */
    public void targetInto(int i, double[] dst, int at) {
        if (!hasTarget(i)) {
            throw new IllegalArgumentException("subject " + id(i) + " has no observed target");
        }
        widen(targetFeatures[i], dst, at);
    }

    /** Subject {@code i}'s source features in a new double array. */
    public double[] sourceFeatures(int i) {
        double[] out = new double[sourceNames.size()];
        sourceInto(i, out, 0);
        return out;
    }

    /** Subject {@code i}'s observed target features in a new double array. */
    public double[] targetFeatures(int i) {
        double[] out = new double[targetNames.size()];
        targetInto(i, out, 0);
        return out;
    }

    /** The source features of every subject, in new double arrays. */
    public double[][] sourceMatrix() {
        double[][] out = new double[n()][];
        for (int i = 0; i < out.length; i++) {
            out[i] = sourceFeatures(i);
        }
        return out;
    }

    /**
     * The same cohort with the observed targets of the {@code hidden} positions treated as missing (views, features
     * and names shared, not copied): what an availability-curve level's imputers and pipelines see.
     */
    StudyData withoutTargets(java.util.BitSet hidden) {
        float[][] kept = targetFeatures == null ? null : targetFeatures.clone();
        if (kept != null) {
            hidden.stream().forEach(i -> kept[i] = null);
        }
        StudyData out = new StudyData(subjects, y, source, target, sourceFeatures, kept, sourceNames, targetNames);
        out.distanceOwner = distanceOwner;
        return out;
    }

    /** Subject {@code i}'s source features as stored (shared; for checks of the storage, never written). */
    float[] storedSource(int i) {
        return sourceFeatures[i];
    }

    static void widen(float[] src, double[] dst, int at) {
        for (int c = 0; c < src.length; c++) {
            dst[at + c] = src[c];
        }
    }
}
