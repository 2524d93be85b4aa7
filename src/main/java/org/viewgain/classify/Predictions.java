package org.viewgain.classify;

/**
 * Predicted class indices and, when the method produces them, a score per class (higher means more likely; for
 * two classes only the ordering of {@code scores[i][1]} matters for AUC).
 *
 * @param labels predicted class index per row
 * @param scores per-row scores per class, or null for label-only methods
 */
public record Predictions(int[] labels, double[][] scores) {
    public boolean hasScores() {
        return scores != null;
    }
}
