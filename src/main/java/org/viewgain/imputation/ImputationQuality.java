package org.viewgain.imputation;

/**
 * How close an imputed row is to the observed one: mean absolute error, root mean squared error, Pearson
 * correlation, the mean absolute error of node strengths of a network view, and skill against the mean imputer.
 */
public final class ImputationQuality {
    private ImputationQuality() {
    }

    /** Mean absolute difference over the features. */
    public static double mae(double[] observed, double[] imputed) {
        checkSameLength(observed, imputed);
        double s = 0;
        for (int j = 0; j < observed.length; j++) {
            s += Math.abs(observed[j] - imputed[j]);
        }
        return s / observed.length;
    }

    /** Square root of the mean squared difference over the features. */
    public static double rmse(double[] observed, double[] imputed) {
        checkSameLength(observed, imputed);
        double s = 0;
        for (int j = 0; j < observed.length; j++) {
            double d = observed[j] - imputed[j];
            s += d * d;
        }
        return Math.sqrt(s / observed.length);
    }

    /** Pearson correlation across the features; NaN when either row is constant (the correlation is undefined). */
    public static double pearsonR(double[] observed, double[] imputed) {
        checkSameLength(observed, imputed);
        int n = observed.length;
        double mo = 0;
        double mi = 0;
        for (int j = 0; j < n; j++) {
            mo += observed[j];
            mi += imputed[j];
        }
        mo /= n;
        mi /= n;
        double so = 0;
        double si = 0;
        double sc = 0;
        for (int j = 0; j < n; j++) {
            double a = observed[j] - mo;
            double b = imputed[j] - mi;
            so += a * a;
            si += b * b;
            sc += a * b;
        }
        if (so > 0 && si > 0) {
            return sc / Math.sqrt(so * si);
        }
        return Double.NaN;
    }

    /**
     * Mean absolute error of node strengths. The edges are the upper triangle (i &lt; j, row-major) of a symmetric
     * regions x regions matrix; a region's strength is the sum of the weights of its edges.
     */
    public static double nodeStrengthMae(double[] observedEdges, double[] imputedEdges, int regions) {
        checkSameLength(observedEdges, imputedEdges);
        if (!(regions >= 2 && (long) regions * (regions - 1) / 2 == observedEdges.length)) {
            throw new IllegalArgumentException(observedEdges.length + " edges is not the upper triangle of "
                    + regions + " regions (expected " + (long) regions * (regions - 1) / 2 + ")");
        }
        double[] so = strengths(observedEdges, regions);
        double[] si = strengths(imputedEdges, regions);
        return mae(so, si);
    }

    /** Skill against the mean imputer: {@code 1 - maeImputer / maeMean}; above 0 means better than the mean. */
    public static double skill(double maeImputer, double maeMean) {
        return 1 - maeImputer / maeMean;
    }

    static double[] strengths(double[] edges, int regions) {
        double[] s = new double[regions];
        int e = 0;
        for (int i = 0; i < regions; i++) {
            for (int j = i + 1; j < regions; j++) {
                s[i] += edges[e];
                s[j] += edges[e];
                e++;
            }
        }
        return s;
    }

    private static void checkSameLength(double[] a, double[] b) {
        if (a.length != b.length || a.length == 0) {
            throw new IllegalArgumentException("rows must be non-empty and of equal length: " + a.length + " vs "
                    + b.length);
        }
    }
}
