package org.viewgain.stats;

import org.apache.commons.math3.distribution.TDistribution;

/** Student t distribution helpers (commons-math3) without a random generator. */
final class StudentT {
    private StudentT() {
    }

    static TDistribution of(double df) {
        return new TDistribution(null, df);
    }

    /** Sample mean and variance (n - 1 divisor) of the values; variance NaN for fewer than 2 values. */
    static double[] meanAndVariance(double[] values) {
        int n = values.length;
        double mean = 0;
        for (double v : values) {
            mean += v / n;
        }
        double ss = 0;
        for (double v : values) {
            ss += (v - mean) * (v - mean);
        }
        return new double[] {n > 0 ? mean : Double.NaN, n > 1 ? ss / (n - 1) : Double.NaN};
    }
}
