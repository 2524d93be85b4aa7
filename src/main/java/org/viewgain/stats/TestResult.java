package org.viewgain.stats;

/**
 * A test statistic with its p-value; both NaN when the test is undefined for the data.
 *
 * @param statistic the test statistic
 * @param p         the p-value
 */
public record TestResult(double statistic, double p) {
}
