package org.viewgain.engine;

import java.util.ArrayList;
import java.util.List;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.folds.FoldPlan;
import org.viewgain.folds.Seeds;
import org.viewgain.imputation.ImputationQuality;
import org.viewgain.imputation.MeanImputer;
import org.viewgain.imputation.ViewImputer;
import org.viewgain.spec.Params;
import org.viewgain.spec.Specs;

/**
 * Fits one imputer inside one outer fold. Only outer-training subjects with an observed target are ever given to a
 * fit; group labels are never given. The grid is scored by inner cross-validated MAE; the same inner fits provide
 * the cross-fitted imputations of the training subjects. Who trains and who is imputed in each fit is defined by
 * {@link ImputationTasks}. Test-subject quality is scored against a {@code mean} imputer fitted on the same
 * training subjects (skill).
 */
final class ImputationStage {
    private final Experiment ex;

    ImputationStage(Experiment ex) {
        this.ex = ex;
    }

    /** Fits the imputer in one outer fold of a plan (the run's, or a permutation's re-drawn one). */
    ImputedFold run(Resolved.Imputer imp, int permutation, FoldPlan plan, int repeat, int fold) {
        StudyData d = ex.data();
        boolean crossFit = ex.spec().imputedForTraining() == Specs.TrainingImputation.CROSS_FITTED;
        int k = ex.spec().validation().innerFolds();
        FitContext base = new FitContext(permutation, repeat, fold, FitContext.WHOLE, FitContext.Role.FINAL, 0L);

        // kept in single precision (they stay in memory for the whole run); quality is measured before rounding
        float[][] out = new float[d.n()][];
        Params chosen = imp.grid().get(0);
        double innerMae = Double.NaN;
        if (ImputationTasks.runsCrossFits(ex, imp)) {
            List<ImputationTasks.Task> tasks = new ArrayList<>(k);
            int[] foldOf = ImputationFolds.of(ex, plan, repeat, fold);
            for (int j = 0; j < k; j++) {
                tasks.add(ImputationTasks.crossFit(ex, plan, repeat, fold, foldOf, j));
            }
            double best = Double.POSITIVE_INFINITY;
            float[][] bestPreds = null;
            for (Params p : imp.grid()) {
                float[][] preds = new float[d.n()][];
                double absSum = 0;
                long cells = 0;
                for (ImputationTasks.Task task : tasks) {
                    int[] predSet = task.imputePositions();
                    if (predSet.length == 0) {
                        continue;
                    }
                    int[] fitSet = task.trainPositions();
                    FitContext ctx = base.at(task.inner(), FitContext.Role.CROSS_FIT, Seeds.derive(ex.spec().seed(),
                            "impute", repeat, fold, task.inner(), imp.name(), p.toString()));
                    ViewImputer.Fitted fitted = imp.method().fit(ctx, sourceRows(fitSet), targetRows(fitSet), p);
                    double[][] got = fitted.impute(ctx, sourceRows(predSet));
                    for (int t = 0; t < predSet.length; t++) {
                        int i = predSet[t];
                        preds[i] = ImputedFold.compact(got[t]);
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
                for (int i : plan.train(repeat, fold)) {
                    out[i] = bestPreds[i];
                }
            }
        }
        ImputationTasks.Task last = ImputationTasks.finalTask(ex, plan, repeat, fold);
        int[] withTarget = last.trainPositions();
        FitContext ctx = base.at(FitContext.WHOLE, FitContext.Role.FINAL,
                Seeds.derive(ex.spec().seed(), "impute", repeat, fold, "final", imp.name(), chosen.toString()));
        ViewImputer.Fitted fitted = imp.method().fit(ctx, sourceRows(withTarget), targetRows(withTarget), chosen);
        int[] toImpute = last.imputePositions();
        double[][] got = fitted.impute(ctx, sourceRows(toImpute));
        double[][] exact = new double[d.n()][];
        for (int t = 0; t < toImpute.length; t++) {
            out[toImpute[t]] = ImputedFold.compact(got[t]);
            exact[toImpute[t]] = got[t];
        }
        if (!crossFit) {
            for (int i : withTarget) {
                out[i] = d.target().stored(d.id(i)); // shared with the view, not copied
            }
        }
        List<ImputedFold.Quality> quality = new ArrayList<>();
        double[] edgeErrors = quality(ctx, withTarget, plan.test(repeat, fold), exact, quality);
        return new ImputedFold(out, chosen, innerMae, quality, edgeErrors);
    }

    /**
     * Adds the quality rows of the test subjects with an observed target (skill against a mean fitted alongside) to
     * {@code quality} and returns the per-feature sums of their absolute errors (null when there are none).
     */
    private double[] quality(FitContext ctx, int[] withTarget, int[] test, double[][] out,
                             List<ImputedFold.Quality> quality) {
        StudyData d = ex.data();
        int[] scored = java.util.Arrays.stream(test).filter(d::hasTarget).toArray();
        if (scored.length == 0) {
            return null;
        }
        double[] sums = new double[d.target().width()];
        MeanImputer mean = new MeanImputer();
        double[][] baseline = mean.fit(ctx, sourceRows(withTarget), targetRows(withTarget), Params.NONE)
                .impute(ctx, sourceRows(scored));
        for (int t = 0; t < scored.length; t++) {
            int i = scored[t];
            double[] obs = d.target().base(d.id(i));
            double[] im = out[i];
            double strength = d.target().isGraph()
                    ? ImputationQuality.nodeStrengthMae(obs, im, d.target().regions()) : Double.NaN;
            double mae = ImputationQuality.mae(obs, im);
            double maeMean = ImputationQuality.mae(obs, baseline[t]);
            double skill = maeMean > 0 ? ImputationQuality.skill(mae, maeMean) : Double.NaN;
            for (int c = 0; c < obs.length; c++) {
                sums[c] += Math.abs(obs[c] - im[c]);
            }
            quality.add(new ImputedFold.Quality(i, mae, ImputationQuality.rmse(obs, im),
                    ImputationQuality.pearsonR(obs, im), strength, skill));
        }
        return sums;
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
}
