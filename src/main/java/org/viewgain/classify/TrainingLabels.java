package org.viewgain.classify;

import org.viewgain.cohort.Rows;

/** Checks shared by the adapters: labels in range, every class present, rows and labels of equal length. */
final class TrainingLabels {
    private TrainingLabels() {
    }

    /**
     * Every adapter requires every class 0..classes-1 among the training rows, so that the back end's internal class
     * coding is the identity and score columns line up with our class indices.
     */
    static void check(String method, Rows x, int[] y, int classes) {
        if (y.length != x.n()) {
            throw new IllegalArgumentException(method + ": " + x.n() + " rows but " + y.length + " labels");
        }
        if (!(classes >= 2)) {
            throw new IllegalArgumentException(method + ": need at least 2 classes, got " + classes);
        }
        int[] count = new int[classes];
        for (int label : y) {
            if (!(label >= 0 && label < classes)) {
                throw new IllegalArgumentException(method + ": class index " + label + " outside 0.." + (classes - 1));
            }
            count[label]++;
        }
        for (int c = 0; c < classes; c++) {
            if (count[c] == 0) {
                throw new IllegalArgumentException(method + ": class " + c + " has no training rows");
            }
        }
    }

    /** Index of the largest value, the lowest index on ties. */
    static int argmax(double[] v) {
        int best = 0;
        for (int i = 1; i < v.length; i++) {
            if (v[i] > v[best]) {
                best = i;
            }
        }
        return best;
    }
}
