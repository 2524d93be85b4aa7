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
        FitContext base = new FitContext(permutation, repeat, fold, FitContext.WHOLE, FitContext.Role.FINAL, 0L);
        int[] train = plan.train(repeat, fold);
        int[] test = plan.test(repeat, fold);
        Level outer = new Level(base, FitContext.Role.CROSS_FIT, FitContext.Role.FINAL,
                ImputationFolds.of(ex, train, Seeds.derive(ex.spec().seed(), "imputation-folds", repeat, fold)),
                new Object[] {"impute", repeat, fold});
        return fit(imp, outer, train, test, true);
    }

    /**
     * The imputations for tuning a classifier in inner fold {@code j} of an outer fold: the outer procedure applied
     * one level down, with the outer training subjects outside fold {@code j} as the training set (imputation folds,
     * grid choice, cross-fitting) and the subjects of fold {@code j} imputed by the imputer fitted on them. No imputer
     * behind these imputations saw a target of fold {@code j}, so the inner validation is as clean as the outer test.
     *
     * @param fit        outer training subjects outside inner fold {@code j}
     * @param validation outer training subjects in inner fold {@code j}
     */
    ImputedFold nested(Resolved.Imputer imp, int permutation, int repeat, int fold, int j, int[] fit,
                       int[] validation) {
        FitContext base = new FitContext(permutation, repeat, fold, j, FitContext.Role.NESTED, 0L);
        Level inner = new Level(base, FitContext.Role.NESTED, FitContext.Role.NESTED,
                ImputationFolds.of(ex, fit, Seeds.derive(ex.spec().seed(), "imputation-folds", repeat, fold,
                        "nested", j)),
                new Object[] {"impute", repeat, fold, "nested", j});
        return fit(imp, inner, fit, validation, false);
    }

    /** The final imputer of a run: tuned and fitted on every development subject with an observed target. */
    record Final(ImputedFold imputed, ViewImputer.Fitted fitted) {
    }

    /**
     * Fits the imputer on the whole development cohort as an outer fold fits it on its training set: grid chosen by
     * cross-validated MAE in imputation folds over all subjects, cross-fitted imputations of every subject (or the
     * observed targets, per {@code imputed-for-training}), and the final fit on every subject with a target.
     */
    Final wholeCohort(Resolved.Imputer imp) {
        FitContext base = new FitContext(0, FINAL, FINAL, FitContext.WHOLE, FitContext.Role.FINAL, 0L);
        int[] all = java.util.stream.IntStream.range(0, ex.data().n()).toArray();
        Level level = new Level(base, FitContext.Role.CROSS_FIT, FitContext.Role.FINAL,
                ImputationFolds.of(ex, all, Seeds.derive(ex.spec().seed(), "imputation-folds", "final")),
                new Object[] {"impute", "final"});
        ViewImputer.Fitted[] kept = new ViewImputer.Fitted[1];
        ImputedFold fold = fit(imp, level, all, new int[0], false, kept);
        return new Final(fold, kept[0]);
    }

    /** The repeat and fold coordinates of fits on the whole development cohort (no outer fold has them). */
    static final int FINAL = -1;

    /**
     * Where a level of imputation happens: the context its fits derive from, the roles of its cross-fits and of its
     * final fit, its imputation folds and the head of its seed derivations.
     */
    private record Level(FitContext base, FitContext.Role crossFitRole, FitContext.Role finalRole, int[] foldOf,
                         Object[] seedHead) {
        long seed(long runSeed, Object... tail) {
            Object[] parts = java.util.Arrays.copyOf(seedHead, seedHead.length + tail.length);
            System.arraycopy(tail, 0, parts, seedHead.length, tail.length);
            return Seeds.derive(runSeed, parts);
        }

        /** The context of a fit: the inner fold of a cross-fit at the outer level, the level's own otherwise. */
        FitContext at(FitContext.Role role, int crossFitFold, long seed) {
            int inner = role == FitContext.Role.CROSS_FIT ? crossFitFold : base.innerFold();
            return base.at(inner, role, seed);
        }
    }

    private ImputedFold fit(Resolved.Imputer imp, Level level, int[] train, int[] test, boolean scoreTest) {
        return fit(imp, level, train, test, scoreTest, null);
    }

    private ImputedFold fit(Resolved.Imputer imp, Level level, int[] train, int[] test, boolean scoreTest,
                            ViewImputer.Fitted[] keep) {
        StudyData d = ex.data();
        boolean crossFit = ex.spec().imputedForTraining() == Specs.TrainingImputation.CROSS_FITTED;
        int k = ex.spec().validation().innerFolds();
        long runSeed = ex.spec().seed();

        // kept in single precision (they stay in memory for the whole run); quality is measured before rounding
        float[][] out = new float[d.n()][];
        Params chosen = imp.grid().get(0);
        double innerMae = Double.NaN;
        if (ImputationTasks.runsCrossFits(ex, imp)) {
            List<ImputationTasks.Task> tasks = new ArrayList<>(k);
            for (int j = 0; j < k; j++) {
                tasks.add(ImputationTasks.crossFit(ex, level.base().repeat(), level.base().outerFold(), train,
                        level.foldOf(), j));
            }
            // task by task, every grid point fitted on the task's rows together (label-free work on the rows is
            // then done once, e.g. ridge's Gram matrix), each point's errors summed in task order as before
            List<Params> grid = imp.grid();
            double[] absSum = new double[grid.size()];
            long cells = 0;
            float[][][] preds = new float[grid.size()][d.n()][];
            for (ImputationTasks.Task task : tasks) {
                int[] predSet = task.imputePositions();
                if (predSet.length == 0) {
                    continue;
                }
                int[] fitSet = task.trainPositions();
                List<FitContext> contexts = new ArrayList<>(grid.size());
                for (Params p : grid) {
                    contexts.add(level.at(level.crossFitRole(), task.inner(),
                            level.seed(runSeed, task.inner(), imp.name(), p.toString())));
                }
                List<ViewImputer.Fitted> fitted = imp.method().fitGrid(contexts, sourceRows(fitSet),
                        targetRows(fitSet), grid, d.sourceDistances());
                List<double[][]> got = imp.method().imputeGrid(contexts, fitted, sourceRows(predSet));
                fitted = null;
                cells += keepAndScore(predSet, got, preds, absSum);
            }
            double best = Double.POSITIVE_INFINITY;
            float[][] bestPreds = null;
            for (int g = 0; g < grid.size(); g++) {
                double mae = absSum[g] / cells;
                if (mae < best) {
                    best = mae;
                    bestPreds = preds[g];
                    chosen = grid.get(g);
                }
            }
            innerMae = best;
            if (crossFit) {
                for (int i : train) {
                    out[i] = bestPreds[i];
                }
            }
        }
        ImputationTasks.Task last = ImputationTasks.finalTask(ex, level.base().repeat(), level.base().outerFold(),
                train, test);
        int[] withTarget = last.trainPositions();
        FitContext ctx = level.at(level.finalRole(), FitContext.WHOLE,
                level.seed(runSeed, "final", imp.name(), chosen.toString()));
        ViewImputer.Fitted fitted = imp.method().fit(ctx, sourceRows(withTarget), targetRows(withTarget), chosen,
                d.sourceDistances());
        if (keep != null) {
            keep[0] = fitted;
        }
        int[] toImpute = last.imputePositions();
        double[][] got = toImpute.length == 0 ? new double[0][] : fitted.impute(ctx, sourceRows(toImpute));
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
        if (!scoreTest) {
            return new ImputedFold(out, chosen, innerMae, List.of(), null);
        }
        List<ImputedFold.Quality> quality = new ArrayList<>();
        double[] edgeErrors = quality(ctx, withTarget, test, exact, quality);
        return new ImputedFold(out, chosen, innerMae, quality, edgeErrors);
    }

    /**
     * Keeps each grid point's imputations of the rows {@code predSet} (in single precision, in {@code preds}) and adds
     * their absolute errors against the observed targets to {@code absSum}, per grid point; returns how many observed
     * cells were scored. (Its own method, with the loop below, so that the just-in-time compiler optimizes these loops
     * without compiling the whole of {@link #fit}, which runs a few times per fold: that compilation alone took
     * 0.7 s of a compiler thread in the demo.)
     */
    private long keepAndScore(int[] predSet, List<double[][]> got, float[][][] preds, double[] absSum) {
        StudyData d = ex.data();
        long cells = 0;
        for (int t = 0; t < predSet.length; t++) {
            int i = predSet[t];
            for (int g = 0; g < preds.length; g++) {
                preds[g][i] = ImputedFold.compact(got.get(g)[t]);
            }
            if (d.hasTarget(i)) {
                double[] obs = d.target().base(d.id(i));
                for (int g = 0; g < preds.length; g++) {
                    absSum[g] = absErrors(obs, got.get(g)[t], absSum[g]);
                }
                cells += obs.length;
            }
        }
        return cells;
    }

    /** {@code sum} plus the absolute differences of two rows, added in column order. */
    private static double absErrors(double[] obs, double[] row, double sum) {
        for (int c = 0; c < obs.length; c++) {
            sum += Math.abs(obs[c] - row[c]);
        }
        return sum;
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
