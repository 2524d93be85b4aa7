package org.viewgain.cohort;

/**
 * Graph measures computed from an upper-triangle edge vector ({@code i<j}, row-major), so that observed and imputed
 * target vectors are treated the same way.
 */
public final class GraphFeatures {
    private GraphFeatures() {
    }

    /** The number of edges of a graph with {@code regions} regions: n(n-1)/2. */
    public static int edgeCount(int regions) {
        return regions * (regions - 1) / 2;
    }

    /**
     * Node strength (weighted degree): for each region the sum of the weights of its edges (Barrat et al. 2004,
     * PNAS 101:3747, the weighted generalisation of degree).
     */
    public static double[] strength(double[] upperEdges, int regions) {
        checkLength(upperEdges, regions);
        double[] s = new double[regions];
        int k = 0;
        for (int i = 0; i < regions; i++) {
            for (int j = i + 1; j < regions; j++) {
                s[i] += upperEdges[k];
                s[j] += upperEdges[k];
                k++;
            }
        }
        return s;
    }

    /** The symmetric matrix with a zero diagonal whose upper triangle is {@code upperEdges}. */
    public static double[][] toMatrix(double[] upperEdges, int regions) {
        checkLength(upperEdges, regions);
        double[][] m = new double[regions][regions];
        int k = 0;
        for (int i = 0; i < regions; i++) {
            for (int j = i + 1; j < regions; j++) {
                m[i][j] = upperEdges[k];
                m[j][i] = upperEdges[k];
                k++;
            }
        }
        return m;
    }

    private static void checkLength(double[] upperEdges, int regions) {
        if (regions < 0 || upperEdges.length != edgeCount(regions)) {
            throw new IllegalArgumentException("an upper triangle of " + regions + " regions has "
                    + edgeCount(Math.max(regions, 0)) + " edges, got " + upperEdges.length);
        }
    }
}
