package org.viewgain.cohort;

import java.util.Arrays;
import java.util.List;

/**
 * A block of feature rows with the subject id of each row. Fitting code receives ids so that test stand-ins can
 * record who they saw (leakage canaries) and so that outside imputations can be matched to subjects; methods must
 * never use an id as a feature.
 *
 * <p>The arrays are shared, not copied: callers must treat them as read-only.
 */
public record Rows(List<String> ids, double[][] x, List<String> featureNames) {

    public Rows {
        ids = List.copyOf(ids);
        featureNames = List.copyOf(featureNames);
        if (x.length != ids.size()) {
            throw new IllegalArgumentException("rows " + x.length + " != ids " + ids.size());
        }
        for (double[] r : x) {
            if (r.length != featureNames.size()) {
                throw new IllegalArgumentException("row width " + r.length + " != features " + featureNames.size());
            }
        }
    }

    public int n() {
        return x.length;
    }

    public int p() {
        return featureNames.size();
    }

    /** The rows at the given positions, sharing the row arrays. */
    public Rows select(int[] positions) {
        double[][] sub = new double[positions.length][];
        String[] sid = new String[positions.length];
        for (int i = 0; i < positions.length; i++) {
            sub[i] = x[positions[i]];
            sid[i] = ids.get(positions[i]);
        }
        return new Rows(Arrays.asList(sid), sub, featureNames);
    }

    /** Same subjects, new values and names (e.g. after a transform). */
    public Rows withValues(double[][] values, List<String> names) {
        return new Rows(ids, values, names);
    }

    /** Columns of this block followed by the columns of another block on the same subjects. */
    public Rows concat(Rows other) {
        if (!ids.equals(other.ids)) {
            throw new IllegalArgumentException("cannot join blocks of different subjects");
        }
        double[][] joined = new double[x.length][];
        for (int i = 0; i < x.length; i++) {
            double[] a = x[i];
            double[] b = other.x[i];
            double[] r = Arrays.copyOf(a, a.length + b.length);
            System.arraycopy(b, 0, r, a.length, b.length);
            joined[i] = r;
        }
        List<String> names = new java.util.ArrayList<>(featureNames);
        names.addAll(other.featureNames);
        return new Rows(ids, joined, names);
    }
}
