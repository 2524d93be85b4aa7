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
        int[] labels = new int[rows.n()];
        double[][] scores = new double[rows.n()][classes];
        for (int i = 0; i < rows.n(); i++) {
            double[] row = rows.x()[i];
            if (classes == 2) {
                double f = machines.decision(0, row);
                scores[i][0] = -f;
                scores[i][1] = f;
            } else {
                for (int c = 0; c < classes; c++) {
                    scores[i][c] = machines.decision(c, row);
                }
            }
            labels[i] = TrainingLabels.argmax(scores[i]);
        }
        return new Predictions(labels, scores);
    }
}
