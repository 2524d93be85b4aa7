package org.viewgain.stats;

import org.apache.commons.math3.distribution.NormalDistribution;

/** Standard normal quantiles and two-sided p-values (commons-math3), with confidence levels checked. */
final class Normal {
    // no random generator: these distributions are only used for cdf and quantiles
    private static final NormalDistribution STANDARD = new NormalDistribution(null, 0, 1);

    private Normal() {
    }

    /** The z with P(|Z| &lt;= z) = confidence. */
    static double twoSidedZ(double confidence) {
        checkConfidence(confidence);
        return STANDARD.inverseCumulativeProbability(0.5 + confidence / 2);
    }

    /** Two-sided p-value of a standard normal statistic; NaN for NaN. */
    static double twoSidedP(double z) {
        if (Double.isNaN(z)) {
            return Double.NaN;
        }
        return 2 * STANDARD.cumulativeProbability(-Math.abs(z));
    }

    static void checkConfidence(double confidence) {
        if (confidence > 0 && confidence < 1) {
            return;
        }
        throw new IllegalArgumentException("confidence must be in (0, 1), got " + confidence);
    }
}
