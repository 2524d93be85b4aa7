package org.viewgain.classify;

import org.viewgain.cohort.Rows;

/**
 * How the SVMs turn binary machines into a classifier: two classes are one machine with class 1 on the positive
 * side; more classes are one machine per class against the rest. Scores are the machines' decision values: for two
 * classes {@code scores[i][1]} is the value and {@code scores[i][0]} its negative; the label is the largest score.
 */
final class OneAgainstRest {
    /** A fitted machine's decision value for a row. */
    interface Machines {
        double decision(int machine, double[] row);
    }

    /** A fitted machine's decision value for the {@code i}-th row of a block being predicted. */
    interface IndexedMachines {
        double decision(int machine, int i);
    }

    private OneAgainstRest() {
    }

    /** How many machines {@code classes} need. */
    static int machines(int classes) {
        return classes == 2 ? 1 : classes;
    }

    /** +1 for the rows machine {@code m} puts on the positive side, -1 for the others. */
    static int[] signs(int[] y, int classes, int m) {
        int positive = classes == 2 ? 1 : m;
        int[] signs = new int[y.length];
        for (int i = 0; i < y.length; i++) {
            signs[i] = y[i] == positive ? 1 : -1;
        }
        return signs;
    }

    /** Labels and decision-value scores of the rows. */
    static Predictions predict(Rows rows, int classes, Machines machines) {
        return predict(rows.n(), classes, (m, i) -> machines.decision(m, rows.x()[i]));
    }

    /** Labels and decision-value scores of {@code n} rows known by their position. */
    static Predictions predict(int n, int classes, IndexedMachines machines) {
        int[] labels = new int[n];
        double[][] scores = new double[n][classes];
        for (int i = 0; i < n; i++) {
            if (classes == 2) {
                double f = machines.decision(0, i);
                scores[i][0] = -f;
                scores[i][1] = f;
            } else {
                for (int c = 0; c < classes; c++) {
                    scores[i][c] = machines.decision(c, i);
                }
            }
            labels[i] = TrainingLabels.argmax(scores[i]);
        }
        return new Predictions(labels, scores);
    }
}
