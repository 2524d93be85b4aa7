package org.viewgain.stats;

/**
 * A closed interval [low, high]; both ends NaN when the interval is undefined for the data.
 *
 * @param low  lower end
 * @param high upper end
 */
public record Interval(double low, double high) {
    /** The interval whose ends are both NaN. */
    public static Interval undefined() {
        return new Interval(Double.NaN, Double.NaN);
    }

    /** True when both ends are numbers. */
    public boolean isDefined() {
        return !Double.isNaN(low) && !Double.isNaN(high);
    }
}
