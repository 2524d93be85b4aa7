package org.viewgain.imputation;

import java.util.List;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.spec.ParamDef;
import org.viewgain.spec.Params;

/**
 * Neighbour imputation on a similarity learned from many kernels, after SIMLR (Wang et al. 2017, Nature Methods
 * 14:414-416): kernel weights, a sparse training similarity and a low-rank embedding are learned from the training
 * sources ({@link MultiKernelSimilarity}). A new subject's similarity to each training subject is the learned kernel
 * weights applied to the kernels between its source and the training sources (its target is never used); its target
 * is the similarity-weighted mean of the targets of its {@code neighbours} most similar training subjects.
 * {@code neighbours} also sets how many non-zero entries each row of the training similarity keeps (SIMLR's k).
 * Needs at least 3 training subjects; nothing is random.
 */
public final class MultiKernelNeighboursImputer implements ViewImputer {

    /** The name used in specs. */
    public static final String METHOD = "multi-kernel-neighbours";

    @Override
    public String method() {
        return METHOD;
    }

    @Override
    public List<ParamDef> parameters() {
        return List.of(
                ParamDef.integer("neighbours", 1, Integer.MAX_VALUE, 10,
                        "most similar training subjects averaged; also non-zero entries kept per similarity row"),
                ParamDef.integer("rank", 1, Integer.MAX_VALUE, 3,
                        "columns of the low-rank embedding (the first is nearly constant, so 3 gives two shapes)"),
                ParamDef.integer("iterations", 1, 1000, 10,
                        "rounds of updating similarity, embedding and kernel weights in turn"));
    }

    @Override
    public Fitted fit(FitContext ctx, Rows source, Rows target, Params params) {
        Shapes.checkTraining(METHOD, source, target);
        if (!(source.n() >= 3)) {
            throw new IllegalArgumentException(METHOD + ": needs at least 3 training subjects, got " + source.n());
        }
        int p = source.p();
        double[] centre = Centring.columnMeans(source.x(), p);
        double[][] train = Centring.centre(source.x(), centre);
        double[][] sq = LocalScaleKernels.squaredDistances(train);
        LocalScaleKernels kernels = LocalScaleKernels.of(sq);
        MultiKernelSimilarity.Result learned = MultiKernelSimilarity.learn(kernels.trainingKernels(sq),
                params.getInt("neighbours"), params.getInt("rank"), params.getInt("iterations"));
        int k = Math.min(params.getInt("neighbours"), source.n());
        return new Learned(learned, new FrozenImputers.MultiKernel(centre, train, kernels, learned.weights(), k,
                target.x(), target.p()));
    }

    /** The imputations of new rows: similarity-weighted means of the targets of their most similar subjects. */
    static double[][] impute(Rows rows, double[] centre, double[][] train, LocalScaleKernels kernels,
                             double[] weights, int k, double[][] y, int q) {
        Shapes.checkWidth(METHOD, rows, centre.length);
        double[][] sqNew = LocalScaleKernels.squaredDistances(Centring.centre(rows.x(), centre), train);
        double[][] out = new double[rows.n()][];
        for (int i = 0; i < out.length; i++) {
            double[] sim = kernels.similarityToTraining(sqNew[i], weights);
            int[] top = Neighbours.largest(sim, k);
            double[] w = new double[top.length];
            for (int h = 0; h < top.length; h++) {
                w[h] = sim[top[h]];
            }
            out[i] = Neighbours.weightedMean(top, w, y, q);
        }
        return out;
    }

    @Override
    public boolean freezable() {
        return true;
    }

    /** A fit that also shows what it learned, for tests; it freezes as its predictor. */
    record Learned(MultiKernelSimilarity.Result learned, FrozenImputers.MultiKernel predictor)
            implements Fitted, org.viewgain.frozen.Freezable {
        @Override
        public double[][] impute(FitContext ctx, Rows source) {
            return predictor.impute(ctx, source);
        }

        @Override
        public String kind() {
            return predictor.kind();
        }

        @Override
        public void freeze(org.viewgain.frozen.FrozenOut out) {
            predictor.freeze(out);
        }

        /** The learned training similarity (rows sum to 1). */
        double[][] similarity() {
            return learned.similarity();
        }

        /** The learned kernel weights (on the simplex). */
        double[] kernelWeights() {
            return learned.weights();
        }
    }
}
