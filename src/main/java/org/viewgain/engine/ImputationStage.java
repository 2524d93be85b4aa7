package org.viewgain.engine;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.folds.Seeds;
import org.viewgain.imputation.ImputationQuality;
import org.viewgain.imputation.ViewImputer;
import org.viewgain.spec.Params;
import org.viewgain.spec.Specs;

/**
 * Fits one imputer inside one outer fold. Only outer-training subjects with an observed target are ever given to a
 * fit; group labels are never given. The grid is scored by inner cross-validated MAE; the same inner fits provide
 * the cross-fitted imputations of the training subjects.
 */
final class ImputationStage {
    private final Experiment ex;

    ImputationStage(Experiment ex) {
        this.ex = ex;
    }

    ImputedFold run(Resolved.Imputer imp, int permutation, int repeat, int fold, int[] innerOf) {
        StudyData d = ex.data();
        int[] train = ex.plan().train(repeat, fold);
        int[] test = ex.plan().test(repeat, fold);
        int[] withTarget = Arrays.stream(train).filter(d::hasTarget).toArray();
        boolean crossFit = ex.spec().imputedForTraining() == Specs.TrainingImputation.CROSS_FITTED;
        int k = ex.spec().validation().innerFolds();
        FitContext base = new FitContext(permutation, repeat, fold, FitContext.WHOLE, FitContext.Role.FINAL, 0L);

        double[][] out = new double[d.n()][];
        Params chosen = imp.grid().get(0);
        double innerMae = Double.NaN;
        if (crossFit || imp.grid().size() > 1) {
            double best = Double.POSITIVE_INFINITY;
            double[][] bestPreds = null;
            for (Params p : imp.grid()) {
                double[][] preds = new double[d.n()][];
                double absSum = 0;
                long cells = 0;
                for (int j = 0; j < k; j++) {
                    final int jj = j;
                    int[] fitSet = Arrays.stream(withTarget).filter(i -> innerOf[i] != jj).toArray();
                    int[] predSet = Arrays.stream(train).filter(i -> innerOf[i] == jj).toArray();
                    if (predSet.length == 0) {
                        continue;
                    }
                    FitContext ctx = base.at(j, FitContext.Role.CROSS_FIT,
                            Seeds.derive(ex.spec().seed(), "impute", repeat, fold, j, imp.name(), p.toString()));
                    ViewImputer.Fitted fitted = imp.method().fit(ctx, sourceRows(fitSet), targetRows(fitSet), p);
                    double[][] got = fitted.impute(ctx, sourceRows(predSet));
                    for (int t = 0; t < predSet.length; t++) {
                        int i = predSet[t];
                        preds[i] = got[t];
                        if (d.hasTarget(i)) {
                            double[] obs = d.target().base(d.id(i));
                            for (int c = 0; c < obs.length; c++) {
                                absSum += Math.abs(obs[c] - got[t][c]);
                            }
                            cells += obs.length;
                        }
                    }
                }
                double mae = absSum / cells;
                if (mae < best) {
                    best = mae;
                    bestPreds = preds;
                    chosen = p;
                }
            }
            innerMae = best;
            if (crossFit) {
                for (int i : train) {
                    out[i] = bestPreds[i];
                }
            }
        }
        FitContext ctx = base.at(FitContext.WHOLE, FitContext.Role.FINAL,
                Seeds.derive(ex.spec().seed(), "impute", repeat, fold, "final", imp.name(), chosen.toString()));
        ViewImputer.Fitted fitted = imp.method().fit(ctx, sourceRows(withTarget), targetRows(withTarget), chosen);
        int[] toImpute = crossFit ? test : concat(test, Arrays.stream(train).filter(i -> !d.hasTarget(i)).toArray());
        double[][] got = fitted.impute(ctx, sourceRows(toImpute));
        for (int t = 0; t < toImpute.length; t++) {
            out[toImpute[t]] = got[t];
        }
        if (!crossFit) {
            for (int i : withTarget) {
                out[i] = d.target().base(d.id(i));
            }
        }
        List<ImputedFold.Quality> quality = new ArrayList<>();
        for (int i : test) {
            if (d.hasTarget(i)) {
                double[] obs = d.target().base(d.id(i));
                double[] im = out[i];
                double strength = d.target().isGraph()
                        ? ImputationQuality.nodeStrengthMae(obs, im, d.target().regions()) : Double.NaN;
                quality.add(new ImputedFold.Quality(i, ImputationQuality.mae(obs, im), ImputationQuality.rmse(obs, im),
                        ImputationQuality.pearsonR(obs, im), strength));
            }
        }
        return new ImputedFold(out, chosen, innerMae, quality);
    }

    private Rows sourceRows(int[] positions) {
        StudyData d = ex.data();
        double[][] x = new double[positions.length][];
        List<String> ids = new ArrayList<>(positions.length);
        for (int t = 0; t < positions.length; t++) {
            x[t] = d.source().base(d.id(positions[t]));
            ids.add(d.id(positions[t]));
        }
        return new Rows(ids, x, d.source().baseNames());
    }

    private Rows targetRows(int[] positions) {
        StudyData d = ex.data();
        double[][] x = new double[positions.length][];
        List<String> ids = new ArrayList<>(positions.length);
        for (int t = 0; t < positions.length; t++) {
            x[t] = d.target().base(d.id(positions[t]));
            ids.add(d.id(positions[t]));
        }
        return new Rows(ids, x, d.target().baseNames());
    }

    private static int[] concat(int[] a, int[] b) {
        int[] r = Arrays.copyOf(a, a.length + b.length);
        System.arraycopy(b, 0, r, a.length, b.length);
        return r;
    }
}
