package org.viewgain.engine;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import org.viewgain.classify.ClassifierMethod;
import org.viewgain.classify.Predictions;
import org.viewgain.cohort.Extractors;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.folds.Seeds;
import org.viewgain.prep.Transform;
import org.viewgain.spec.FeatureSet;
import org.viewgain.spec.Params;
import org.viewgain.stats.ClassificationMetrics;

/**
 * Trains and tests one pipeline in one outer fold: grid search over the classifier's grid by inner cross-validation
 * on the outer training subjects (scaling re-fitted inside every inner fold), then a final fit on the outer training
 * subjects and predictions for the outer test subjects.
 */
final class ClassifierStage {
    private final Experiment ex;

    ClassifierStage(Experiment ex) {
        this.ex = ex;
    }

    /** The result of one unit. */
    record Output(List<RunResults.Prediction> predictions, RunResults.Choice choice) {
    }

    Output run(Pipeline p, int permutation, int repeat, int fold, int[] innerOf, ImputedFold imputed, int[] labels) {
        Resolved.Classifier cl = ex.classifier(p.classifier());
        int[] train = Arrays.stream(ex.plan().train(repeat, fold)).filter(i -> ex.inPopulation(p.featureSet(), i))
                .toArray();
        int[] test = Arrays.stream(ex.plan().test(repeat, fold)).filter(i -> ex.inPopulation(p.featureSet(), i))
                .toArray();
        Rows trainRows = rows(p.featureSet(), train, imputed);
        int[] yTrain = pick(labels, train);
        FitContext base = new FitContext(permutation, repeat, fold, FitContext.WHOLE, FitContext.Role.FINAL, 0L);
        Params chosen = cl.grid().get(0);
        double innerScore = Double.NaN;
        if (cl.grid().size() > 1) {
            double best = Double.NEGATIVE_INFINITY;
            for (Params params : cl.grid()) {
                double score = innerScore(p, cl, params, base, train, trainRows, yTrain, innerOf);
                if (score > best) {
                    best = score;
                    chosen = params;
                }
            }
            innerScore = best;
        }
        FitContext ctx = base.at(FitContext.WHOLE, FitContext.Role.FINAL,
                Seeds.derive(ex.spec().seed(), "classify", permutation, repeat, fold, "final", p.label(), chosen));
        Fitted model = fit(ctx, cl.method(), trainRows, yTrain, chosen);
        Predictions pr = model.predict(rows(p.featureSet(), test, imputed));
        List<RunResults.Prediction> out = new ArrayList<>(test.length);
        int positive = ex.spec().cohort().positiveIndex();
        for (int t = 0; t < test.length; t++) {
            double score = Double.NaN;
            double[] scores = pr.hasScores() ? pr.scores()[t] : null;
            if (scores != null) {
                score = positive >= 0 ? scores[positive] : scores[pr.labels()[t]];
            }
            out.add(new RunResults.Prediction(p, repeat, fold, test[t], labels[test[t]], pr.labels()[t], score,
                    scores));
        }
        return new Output(out, new RunResults.Choice(repeat, fold, "classifier", p.imputer(),
                p.featureSet().label(), p.classifier(), chosen.toString(), innerScore, cl.grid().size()));
    }

    private double innerScore(Pipeline p, Resolved.Classifier cl, Params params, FitContext base, int[] train,
                              Rows trainRows, int[] yTrain, int[] innerOf) {
        int k = ex.spec().validation().innerFolds();
        int classes = ex.spec().cohort().groups().size();
        int n = train.length;
        int[] pred = new int[n];
        double[][] scores = new double[n][];
        boolean haveScores = true;
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
            FitContext ctx = base.at(j, FitContext.Role.TUNE, Seeds.derive(ex.spec().seed(), "classify",
                    base.permutation(), base.repeat(), base.outerFold(), j, p.label(), params));
            Fitted m = fit(ctx, cl.method(), trainRows.select(fp), pick(yTrain, fp), params);
            Predictions pr = m.predict(trainRows.select(vp));
            for (int t = 0; t < vp.length; t++) {
                pred[vp[t]] = pr.labels()[t];
                scores[vp[t]] = pr.hasScores() ? pr.scores()[t] : null;
            }
            haveScores &= pr.hasScores();
        }
        Map<String, Double> m = metrics(yTrain, pred, haveScores ? scores : null, classes);
        double v = m.get(ex.spec().validation().tuneBy().replace('-', '_'));
        return Double.isNaN(v) ? Double.NEGATIVE_INFINITY : v;
    }

    Map<String, Double> metrics(int[] truth, int[] pred, double[][] scores, int classes) {
        int positive = ex.spec().cohort().positiveIndex();
        if (classes == 2) {
            double[] s = null;
            if (scores != null) {
                s = new double[truth.length];
                for (int i = 0; i < s.length; i++) {
                    s[i] = scores[i][positive];
                }
            }
            return ClassificationMetrics.binary(truth, pred, s, positive);
        }
        return ClassificationMetrics.multiclass(truth, pred, scores, classes);
    }

    /** A fitted scaling + classifier pair. */
    private record Fitted(Transform.Fitted scaler, ClassifierMethod.Model model) {
        Predictions predict(Rows x) {
            return model.predict(scaler == null ? x : scaler.apply(x));
        }
    }

    private Fitted fit(FitContext ctx, ClassifierMethod method, Rows x, int[] y, Params params) {
        Transform.Fitted scaler = null;
        Rows xs = x;
        if (ex.scaler() != null) {
            scaler = ex.scaler().fit(ctx, x, y);
            xs = scaler.apply(x);
        }
        return new Fitted(scaler, method.fit(ctx, xs, y, ex.spec().cohort().groups().size(), params));
    }

    /** Feature rows of a feature set for the given subject positions. */
    Rows rows(FeatureSet fs, int[] positions, ImputedFold imputed) {
        StudyData d = ex.data();
        double[][] x = new double[positions.length][];
        List<String> ids = new ArrayList<>(positions.length);
        for (int t = 0; t < positions.length; t++) {
            int i = positions[t];
            ids.add(d.id(i));
            double[] imp = fs.needsImputer()
                    ? Extractors.apply(ex.spec().features().extract(), d.target(), imputed.imputed()[i]) : null;
            x[t] = switch (fs) {
                case SOURCE -> d.sourceFeatures()[i];
                case TARGET -> d.targetFeatures()[i];
                case IMPUTED -> imp;
                case SOURCE_IMPUTED -> join(d.sourceFeatures()[i], imp);
                case SOURCE_TARGET -> join(d.sourceFeatures()[i], d.targetFeatures()[i]);
            };
        }
        return new Rows(ids, x, names(fs));
    }

    List<String> names(FeatureSet fs) {
        StudyData d = ex.data();
        List<String> out = new ArrayList<>();
        if (fs.usesSource()) {
            d.sourceNames().forEach(n -> out.add("source:" + n));
        }
        String prefix = fs.needsImputer() ? "imputed:" : "target:";
        if (fs != FeatureSet.SOURCE) {
            d.targetNames().forEach(n -> out.add(prefix + n));
        }
        return out;
    }

    private static double[] join(double[] a, double[] b) {
        double[] r = Arrays.copyOf(a, a.length + b.length);
        System.arraycopy(b, 0, r, a.length, b.length);
        return r;
    }

    private static int[] pick(int[] all, int[] positions) {
        int[] r = new int[positions.length];
        for (int t = 0; t < positions.length; t++) {
            r[t] = all[positions[t]];
        }
        return r;
    }
}
