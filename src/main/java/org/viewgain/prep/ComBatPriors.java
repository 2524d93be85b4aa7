package org.viewgain.prep;

/**
 * The parametric empirical Bayes step of ComBat for one site (Johnson, Li &amp; Rabinovic 2007, Biostatistics
 * 8:118-127, equations 2.3 and the method-of-moments priors): a normal prior on the site's location effects and an
 * inverse-gamma prior on its scale effects, with posterior means found by iterating the two conditional formulas.
 */
final class ComBatPriors {

    /** Relative change at which the posterior iteration stops (tighter than the published 1e-4, so results are exact to ~1e-10). */
    static final double CONVERGENCE = 1e-12;
    static final int MAX_ITERATIONS = 10_000;

    final double gammaBar;
    final double tau2;
    final double a;
    final double b;
    final double deltaMean;
    final double deltaVar;

    /**
     * @param gammaHat  location estimates of this site, one per feature
     * @param delta2Hat scale estimates (variances) of this site, one per feature
     */
    ComBatPriors(double[] gammaHat, double[] delta2Hat) {
        gammaBar = mean(gammaHat);
        tau2 = variance(gammaHat, gammaBar);
        deltaMean = mean(delta2Hat);
        deltaVar = variance(delta2Hat, deltaMean);
        a = (2 * deltaVar + deltaMean * deltaMean) / deltaVar;
        b = (deltaMean * deltaVar + deltaMean * deltaMean * deltaMean) / deltaVar;
    }

    /**
     * Posterior location and scale of one feature at this site.
     *
     * @param s        standardized values of the site's training rows for the feature
     * @param gammaHat the feature's location estimate
     * @param delta2   the feature's scale estimate
     * @return {gamma*, delta*^2}
     */
    double[] posterior(double[] s, double gammaHat, double delta2) {
        int n = s.length;
        double gOld = gammaHat;
        double dOld = delta2;
        for (int it = 0; it < MAX_ITERATIONS; it++) {
            double weight = n * tau2 + dOld;
            double gNew = weight > 0 ? (n * tau2 * gammaHat + dOld * gammaBar) / weight : gammaBar;
            double sum2 = 0;
            for (double v : s) {
                sum2 += (v - gNew) * (v - gNew);
            }
            // An inverse-gamma prior with no spread (all scale estimates equal) is a point mass at their mean.
            double dNew = deltaVar > 0 ? (0.5 * sum2 + b) / (n / 2.0 + a - 1) : deltaMean;
            double change = Math.max(relative(gNew, gOld), relative(dNew, dOld));
            gOld = gNew;
            dOld = dNew;
            if (!(change > CONVERGENCE)) {
                break;
            }
        }
        return new double[] {gOld, dOld};
    }

    private static double relative(double now, double before) {
        double d = Math.abs(now - before);
        return before != 0 ? d / Math.abs(before) : d;
    }

    static double mean(double[] v) {
        double s = 0;
        for (double x : v) {
            s += x;
        }
        return s / v.length;
    }

    /** Sample variance, divisor n - 1. */
    static double variance(double[] v, double mean) {
        double s = 0;
        for (double x : v) {
            s += (x - mean) * (x - mean);
        }
        return s / (v.length - 1);
    }
}
