package org.viewgain.engine;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.viewgain.classify.ClassifierMethod;
import org.viewgain.classify.FitHints;
import org.viewgain.classify.Predictions;
import org.viewgain.cohort.Extractors;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.folds.FoldPlan;
import org.viewgain.folds.Seeds;
import org.viewgain.imputation.ExternalImputer;
import org.viewgain.prep.Transform;
import org.viewgain.spec.FeatureSet;
import org.viewgain.spec.Params;

/**
 * Trains and tests one pipeline in one outer fold: grid search by inner cross-validation on the outer training
 * subjects over the classifier's grid combined with the selection settings (every step re-fitted inside every inner
 * fold, see {@link FitChain}), then a final fit on the outer training subjects and predictions for the outer test
 * subjects.
 */
final class ClassifierStage {
    private final Experiment ex;

    ClassifierStage(Experiment ex) {
        this.ex = ex;
    }

    /**
     * The result of one unit.
     *
     * @param choice     the tuning choice (null when the fold had no test subjects and nothing was fitted)
     * @param importance what the final model used (null for permuted labels, or when nothing was fitted)
     */
    record Output(List<RunResults.Prediction> predictions, RunResults.Choice choice, Importance.Fold importance) {
    }

    /** One grid point: classifier hyperparameters and a selection setting (index into the keep values, or -1). */
    private record Point(Params params, int selection) {
        /** Parts added to a seed derivation, unchanged from a run without selection when there is none. */
        Object[] seedParts(Experiment ex, Object... head) {
            List<Object> parts = new ArrayList<>(Arrays.asList(head));
            parts.add(params);
            if (selection >= 0) {
                parts.add("keep");
                parts.add(ex.prep().keep().get(selection));
            }
            return parts.toArray();
        }

        String describe(Experiment ex) {
            return selection < 0 ? params.toString()
                    : params.with("select.keep", ex.prep().keep().get(selection)).toString();
        }
    }

    private List<Point> points(Resolved.Classifier cl) {
        List<Point> out = new ArrayList<>();
        for (int s = ex.prep().selects() ? 0 : -1; s < ex.prep().keep().size(); s++) {
            for (Params params : cl.grid()) {
                out.add(new Point(params, s));
            }
        }
        return out;
    }

    /**
     * Runs one pipeline in one outer fold of a plan (the run's, or a permutation's re-drawn one) with the given
     * labels and classifier inner folds. An outer fold without test subjects in the pipeline's population (leave-one-
     * out, a complete-case feature set, a left-out subject without a target) is skipped: no fit, no predictions, no
     * choice.
     */
    Output run(Pipeline p, int permutation, FoldPlan plan, int repeat, int fold, int[] innerOf, ImputedFold imputed,
               int[] labels) {
        int[] test = Arrays.stream(plan.test(repeat, fold)).filter(i -> ex.inPopulation(p.featureSet(), i))
                .toArray();
        if (test.length == 0) {
            return new Output(List.of(), null, null);
        }
        int[] train = Arrays.stream(plan.train(repeat, fold)).filter(i -> ex.inPopulation(p.featureSet(), i))
                .toArray();
        Trained trained = train(p, permutation, repeat, fold, train, innerOf, imputed, labels);
        FitChain.Fitted model = trained.model();
        Predictions pr = model.predict(rows(p.featureSet(), test, imputed));
        List<RunResults.Prediction> out = new ArrayList<>(test.length);
        int positive = ex.spec().cohort().groups().size() == 2 ? ex.spec().cohort().positiveIndex() : -1;
        for (int t = 0; t < test.length; t++) {
            double score = Double.NaN;
            double[] scores = pr.hasScores() ? pr.scores()[t] : null;
            if (scores != null) {
                score = positive >= 0 ? scores[positive] : scores[pr.labels()[t]];
            }
            out.add(new RunResults.Prediction(p, repeat, fold, test[t], labels[test[t]], pr.labels()[t], score,
                    scores));
        }
        Importance.Fold used = permutation == 0 ? new Importance.Fold(p, repeat, fold, trained.selected(),
                model.inputNames(), model.model().importance(), model.model().importanceKind()) : null;
        return new Output(out, trained.choice(ex, p, repeat, fold), used);
    }

    /** A pipeline trained on a training set: the fitted chain, the chosen grid point and how tuning went. */
    record Trained(FitChain.Fitted model, Point chosen, double innerScore, int points, int unconverged,
                   boolean selected) {
        RunResults.Choice choice(Experiment ex, Pipeline p, int repeat, int fold) {
            return new RunResults.Choice(repeat, fold, "classifier", p.imputer(), p.featureSet().label(),
                    p.classifier(), chosen.describe(ex), innerScore, points, unconverged);
        }
    }

    /**
     * A final pipeline: tuned by inner cross-validation over every development subject of its population and fitted
     * on them all ({@code innerOf} from {@link InnerFolds#whole}, {@code imputed} from the imputer's whole-cohort
     * fit).
     */
    Trained wholeCohort(Pipeline p, int[] innerOf, ImputedFold imputed) {
        int[] train = java.util.stream.IntStream.range(0, ex.data().n())
                .filter(i -> ex.inPopulation(p.featureSet(), i)).toArray();
        return train(p, 0, ImputationStage.FINAL, ImputationStage.FINAL, train, innerOf, imputed, ex.data().y());
    }

    /** Tunes in the inner folds of {@code train} and fits the chosen point on all of {@code train}. */
    private Trained train(Pipeline p, int permutation, int repeat, int fold, int[] train, int[] innerOf,
                          ImputedFold imputed, int[] labels) {
        Resolved.Classifier cl = ex.classifier(p.classifier());
        Rows trainRows = rows(p.featureSet(), train, imputed);
        int[] yTrain = pick(labels, train);
        FitContext base = new FitContext(permutation, repeat, fold, FitContext.WHOLE, FitContext.Role.FINAL, 0L);
        List<Point> points = points(cl);
        Point chosen = points.get(0);
        double innerScore = Double.NaN;
        int[] unconverged = {0};
        // how the inner fits went (e.g. a solver's passes), for the later ones to choose how to compute
        FitHints hints = new FitHints();
        if (points.size() > 1) {
            double[] score = innerScores(p, cl, points, base, train, trainRows, yTrain, innerOf, unconverged, hints);
            double best = Double.NEGATIVE_INFINITY;
            for (int g = 0; g < points.size(); g++) {
                if (score[g] > best) {
                    best = score[g];
                    chosen = points.get(g);
                }
            }
            innerScore = best;
        }
        long seed = ex.spec().seed();
        FitContext prepCtx = base.at(FitContext.WHOLE, FitContext.Role.FINAL,
                Seeds.derive(seed, "prep", permutation, repeat, fold, "final", p.label()));
        // the training block is not read again: the upstream steps may write over it instead of copying it
        FitChain.Upstream upstream = FitChain.upstream(ex, prepCtx, trainRows, yTrain, true);
        trainRows = null;
        FitChain.Steps steps = upstream.steps();
        Rows in = upstream.transformed();
        Transform.Fitted sel = FitChain.selection(ex, prepCtx, in, yTrain, chosen.selection());
        if (sel != null) {
            steps = steps.then(sel);
            in = sel.apply(in);
        }
        FitContext ctx = base.at(FitContext.WHOLE, FitContext.Role.FINAL,
                Seeds.derive(seed, chosen.seedParts(ex, "classify", permutation, repeat, fold, "final", p.label())));
        // the unit built these rows for this fit alone: the method may release them as it copies them
        List<String> inputNames = in.featureNames();
        FitChain.Fitted model = new FitChain.Fitted(steps,
                cl.method().fitOwned(ctx, in, yTrain, ex.spec().cohort().groups().size(), chosen.params(), hints),
                inputNames);
        if (!model.model().converged()) {
            unconverged[0]++;
        }
        return new Trained(model, chosen, innerScore, points.size(), unconverged[0], sel != null);
    }

    /**
     * The tune-by score of every grid point by inner cross-validation ({@code -infinity} where undefined); adds the
     * number of fits that did not converge to {@code unconverged[0]}.
     */
    private double[] innerScores(Pipeline p, Resolved.Classifier cl, List<Point> points, FitContext base,
                                 int[] train, Rows trainRows, int[] yTrain, int[] innerOf, int[] unconverged,
                                 FitHints hints) {
        int k = ex.spec().validation().innerFolds();
        int classes = ex.spec().cohort().groups().size();
        int n = train.length;
        int[][] pred = new int[points.size()][n];
        double[][][] scores = new double[points.size()][n][];
        boolean[] haveScores = new boolean[points.size()];
        Arrays.fill(haveScores, true);
        long seed = ex.spec().seed();
        for (int j = 0; j < k; j++) {
            List<Integer> fitPos = new ArrayList<>();
            List<Integer> valPos = new ArrayList<>();
            for (int t = 0; t < n; t++) {
                (innerOf[train[t]] == j ? valPos : fitPos).add(t);
            }
            if (valPos.isEmpty()) {
                continue;
            }
            int[] fp = fitPos.stream().mapToInt(Integer::intValue).toArray();
            int[] vp = valPos.stream().mapToInt(Integer::intValue).toArray();
            int[] yFit = pick(yTrain, fp);
            FitContext prepCtx = base.at(j, FitContext.Role.TUNE, Seeds.derive(seed, "prep", base.permutation(),
                    base.repeat(), base.outerFold(), j, p.label()));
            boolean nested = nestedImputation(p);
            Rows fitRows;
            Rows valRows;
            if (nested) {
                // imputations from imputers that never saw a target of this inner fold (see ImputationStage.nested)
                int[] fitSubjects = pick(train, fp);
                int[] valSubjects = pick(train, vp);
                ImputedFold inner = new ImputationStage(ex).nested(ex.imputer(p.imputer()), base.permutation(),
                        base.repeat(), base.outerFold(), j, fitSubjects, valSubjects);
                fitRows = rows(p.featureSet(), fitSubjects, inner);
                valRows = rows(p.featureSet(), valSubjects, inner);
            } else {
                fitRows = trainRows.select(fp);
                valRows = trainRows.select(vp);
            }
            // selected rows share their arrays with trainRows, which later inner folds read: owned only when nested
            FitChain.Upstream fitted = FitChain.upstream(ex, prepCtx, fitRows, yFit, nested);
            FitChain.Steps up = fitted.steps();
            Rows fitUp = fitted.transformed();
            Rows valUp = up.apply(valRows);
            // the grid points of one selection setting see the same rows: fitted together, so that a method's
            // label-free work on those rows (bins, a kernel matrix) is done once for all of them
            for (int from = 0; from < points.size(); ) {
                int selection = points.get(from).selection();
                int to = from;
                while (to < points.size() && points.get(to).selection() == selection) {
                    to++;
                }
                Transform.Fitted sel = FitChain.selection(ex, prepCtx, fitUp, yFit, selection);
                Rows fitIn = sel == null ? fitUp : sel.apply(fitUp);
                Rows valIn = sel == null ? valUp : sel.apply(valUp);
                List<FitContext> contexts = new ArrayList<>(to - from);
                List<Params> grid = new ArrayList<>(to - from);
                for (int g = from; g < to; g++) {
                    contexts.add(base.at(j, FitContext.Role.TUNE, Seeds.derive(seed, points.get(g).seedParts(ex,
                            "classify", base.permutation(), base.repeat(), base.outerFold(), j, p.label()))));
                    grid.add(points.get(g).params());
                }
                List<ClassifierMethod.Model> trained = cl.method().fitGrid(contexts, fitIn, yFit, classes, grid,
                        hints);
                for (ClassifierMethod.Model model : trained) {
                    if (!model.converged()) {
                        unconverged[0]++;
                    }
                }
                // predicted together, so that a method's label-free prediction work is also done once
                List<Predictions> predicted = cl.method().predictGrid(trained, valIn);
                for (int g = from; g < to; g++) {
                    Predictions pr = predicted.get(g - from);
                    for (int t = 0; t < vp.length; t++) {
                        pred[g][vp[t]] = pr.labels()[t];
                        scores[g][vp[t]] = pr.hasScores() ? pr.scores()[t] : null;
                    }
                    haveScores[g] &= pr.hasScores();
                }
                from = to;
            }
        }
        String tuneBy = ex.spec().validation().tuneByColumn();
        double[] out = new double[points.size()];
        for (int g = 0; g < points.size(); g++) {
            double v = Evaluation.of(ex, yTrain, pred[g], haveScores[g] ? scores[g] : null).get(tuneBy);
            out[g] = Double.isNaN(v) ? Double.NEGATIVE_INFINITY : v;
        }
        return out;
    }

    /**
     * True when tuning this pipeline uses nested imputations: its features include imputed ones, built by an imputer
     * the engine fits (an {@code external} imputer's file holds the outer level's imputations only; tuning then uses
     * the outer training set's cross-fitted imputations, whose imputers saw the inner fold's targets, never labels).
     */
    boolean nestedImputation(Pipeline p) {
        return nestedImputation(ex, p);
    }

    static boolean nestedImputation(Experiment ex, Pipeline p) {
        return p.featureSet().needsImputer()
                && !ExternalImputer.METHOD.equals(ex.imputer(p.imputer()).method().method());
    }

    /**
     * Feature rows of a feature set for the given subject positions, in double precision arrays owned by the caller
     * (the data are stored once, in single precision, and widened here; see {@link StudyData}).
     */
    Rows rows(FeatureSet fs, int[] positions, ImputedFold imputed) {
        return rows(ex, fs, positions, imputed);
    }

    /** See {@link #rows(FeatureSet, int[], ImputedFold)}; {@code imputed} may be null for sets without imputations. */
    static Rows rows(Experiment ex, FeatureSet fs, int[] positions, ImputedFold imputed) {
        StudyData d = ex.data();
        double[][] x = new double[positions.length][];
        List<String> ids = new ArrayList<>(positions.length);
        List<String> names = d.featureNames(fs);
        int sourceWidth = fs.usesSource() ? d.sourceNames().size() : 0;
        for (int t = 0; t < positions.length; t++) {
            int i = positions[t];
            ids.add(d.id(i));
            double[] row = new double[names.size()];
            if (fs.usesSource()) {
                d.sourceInto(i, row, 0);
            }
            if (fs.needsImputer()) {
                double[] imp = Extractors.apply(ex.spec().features().extract(), d.target(), imputed.row(i));
                System.arraycopy(imp, 0, row, sourceWidth, imp.length);
            } else if (fs != FeatureSet.SOURCE) {
                d.targetInto(i, row, sourceWidth);
            }
            x[t] = row;
        }
        return new Rows(ids, x, names);
    }

    private static int[] pick(int[] all, int[] positions) {
        int[] r = new int[positions.length];
        for (int t = 0; t < positions.length; t++) {
            r[t] = all[positions[t]];
        }
        return r;
    }
}
