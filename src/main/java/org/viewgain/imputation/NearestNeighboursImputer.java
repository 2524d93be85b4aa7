package org.viewgain.imputation;

import java.util.List;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.spec.ParamDef;
import org.viewgain.spec.Params;

/**
 * k-nearest-neighbour regression (Fix &amp; Hodges 1951; Cover &amp; Hart 1967): a subject's target is the mean, or
 * the inverse-distance weighted mean, of the targets of the k training subjects whose source views are nearest in
 * Euclidean distance. When k exceeds the number of training subjects all of them are used. Ties in distance are
 * broken by training order, so results do not depend on anything but the rows given.
 */
public final class NearestNeighboursImputer implements ViewImputer {

    /** The name used in specs. */
    public static final String METHOD = "nearest-neighbours";

    @Override
    public String method() {
        return METHOD;
    }

    @Override
    public List<ParamDef> parameters() {
        return List.of(
                ParamDef.integer("k", 1, Integer.MAX_VALUE, 5,
                        "number of nearest training subjects (all of them if fewer)"),
                ParamDef.choice("weights", List.of("uniform", "distance"), "uniform",
                        "uniform mean, or weights 1/distance (an exact match takes all the weight)"));
    }

    @Override
    public boolean freezable() {
        return true;
    }

    @Override
    public Fitted fit(FitContext ctx, Rows source, Rows target, Params params) {
        return fit(ctx, source, target, params, null);
    }

    /** As {@link #fit}, reading the distances from {@code shared} when it holds them (label-free, computed once). */
    @Override
    public Fitted fit(FitContext ctx, Rows source, Rows target, Params params, SourceDistances shared) {
        Shapes.checkTraining(METHOD, source, target);
        int k = Math.min(params.getInt("k"), source.n());
        boolean byDistance = "distance".equals(params.getString("weights"));
        return new FrozenImputers.Neighbours(source.x(), target.x(), k, byDistance, source, shared);
    }

    /**
     * Imputes rows from the training subjects' source rows and targets; the distances come from {@code shared} when
     * it holds those of the rows to {@code trainRows} (null for none), otherwise they are computed here.
     */
    static double[][] impute(Rows rows, double[][] train, double[][] y, int k, boolean byDistance,
                             Rows trainRows, SourceDistances shared) {
        int p = train.length == 0 ? 0 : train[0].length;
        int q = y.length == 0 ? 0 : y[0].length;
        Shapes.checkWidth(METHOD, rows, p);
        double[][] out = new double[rows.n()][];
        double[][] table = shared == null || trainRows == null ? null : shared.squared(rows, trainRows);
        double[] d2 = new double[train.length];
        for (int r = 0; r < out.length; r++) {
            if (table != null) {
                d2 = table[r];
            } else {
                double[] x = rows.x()[r];
                for (int i = 0; i < train.length; i++) {
                    d2[i] = squaredDistance(x, train[i]);
                }
            }
            int[] nearest = Neighbours.smallest(d2, k);
            out[r] = average(nearest, d2, y, q, byDistance);
        }
        return out;
    }

    private static double[] average(int[] nearest, double[] d2, double[][] y, int q, boolean byDistance) {
        double[] w = new double[nearest.length];
        boolean exact = false;
        for (int h = 0; h < nearest.length; h++) {
            exact |= d2[nearest[h]] == 0;
        }
        for (int h = 0; h < nearest.length; h++) {
            double d = d2[nearest[h]];
            if (!byDistance) {
                w[h] = 1;
            } else if (exact) {
                w[h] = d == 0 ? 1 : 0;
            } else {
                w[h] = 1 / Math.sqrt(d);
            }
        }
        return Neighbours.weightedMean(nearest, w, y, q);
    }

    static double squaredDistance(double[] a, double[] b) {
        double s = 0;
        for (int j = 0; j < a.length; j++) {
            double d = a[j] - b[j];
            s += d * d;
        }
        return s;
    }
}
