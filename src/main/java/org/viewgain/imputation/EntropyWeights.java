package org.viewgain.imputation;

/**
 * Weights on the simplex that trade a cost against entropy: {@code w_l ~ exp(-beta cost_l)}, with beta found by
 * bisection so that {@code exp(entropy(w))} equals a target perplexity (the rule the SIMLR authors' code uses to set
 * its entropy penalty; the same search as t-SNE's, van der Maaten &amp; Hinton 2008).
 */
final class EntropyWeights {
    private EntropyWeights() {
    }

    static double[] withPerplexity(double[] cost, double perplexity) {
        double min = Double.POSITIVE_INFINITY;
        for (double c : cost) {
            min = Math.min(min, c);
        }
        double target = Math.log(perplexity);
        double lo = 0;
        double hi = 1;
        while (entropy(cost, min, hi) > target && hi < 1e300) {
            lo = hi;
            hi *= 2;
        }
        if (entropy(cost, min, 0) <= target) {
            hi = 0;
        } else {
            for (int it = 0; it < 200; it++) {
                double mid = (lo + hi) / 2;
                if (entropy(cost, min, mid) > target) {
                    lo = mid;
                } else {
                    hi = mid;
                }
            }
        }
        return weights(cost, min, hi);
    }

    private static double[] weights(double[] cost, double min, double beta) {
        double[] w = new double[cost.length];
        double sum = 0;
        for (int l = 0; l < cost.length; l++) {
            w[l] = Math.exp(-beta * (cost[l] - min));
            sum += w[l];
        }
        for (int l = 0; l < cost.length; l++) {
            w[l] /= sum;
        }
        return w;
    }

    private static double entropy(double[] cost, double min, double beta) {
        double h = 0;
        for (double p : weights(cost, min, beta)) {
            if (p > 0) {
                h -= p * Math.log(p);
            }
        }
        return h;
    }
}
