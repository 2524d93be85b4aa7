package org.viewgain.spec;

import java.util.List;

/**
 * The spec's {@code availability-curve}: levels of target availability at which the imputer and the
 * {@code source+imputed} pipelines are re-run inside every outer training block, either as fractions of the block's
 * subjects with an observed target or as counts of them (exactly one of the two lists is non-empty), and the margin
 * of balanced-accuracy gain within which a level counts as close to the full data's gain.
 *
 * @param fractions strictly increasing, each in (0, 1]; empty when counts are given
 * @param counts    strictly increasing whole numbers, each at least twice the inner folds; empty when fractions are
 *                  given
 * @param margin    in balanced-accuracy units, in [0, 1)
 */
public record AvailabilityCurve(List<Double> fractions, List<Integer> counts, double margin) {
    /** The margin when the spec gives none (common practice, no source: two points of balanced accuracy). */
    public static final double DEFAULT_MARGIN = 0.02;

    public AvailabilityCurve {
        fractions = List.copyOf(fractions);
        counts = List.copyOf(counts);
        if (fractions.isEmpty() == counts.isEmpty()) {
            throw new IllegalArgumentException("give fractions or counts, not both and not neither");
        }
    }

    /** True when the levels are fractions of the available targets. */
    public boolean byFraction() {
        return !fractions.isEmpty();
    }

    /** Number of levels as written in the spec. */
    public int size() {
        return byFraction() ? fractions.size() : counts.size();
    }

    /**
     * How many of {@code available} training subjects with a target level {@code level} keeps: for a fraction f the
     * nearest whole number to f x available (halves up, at least 1), for a count the count itself (the caller checks
     * that it does not exceed {@code available}).
     */
    public int keep(int level, int available) {
        if (!byFraction()) {
            return counts.get(level);
        }
        return (int) Math.max(1, Math.min(available, Math.round(fractions.get(level) * available)));
    }

    /** The level as written: {@code 0.25} or {@code 40}. */
    public String label(int level) {
        if (!byFraction()) {
            return Integer.toString(counts.get(level));
        }
        double f = fractions.get(level);
        return f == Math.rint(f) ? Long.toString((long) f) : Double.toString(f);
    }
}
