package org.viewgain.engine;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.viewgain.spec.Specs;
import org.viewgain.stats.Adjust;
import org.viewgain.stats.BayesCorrelatedTTest;
import org.viewgain.stats.CorrectedTTest;
import org.viewgain.stats.DeLong;
import org.viewgain.stats.Interval;
import org.viewgain.stats.McNemar;

/**
 * Paired comparisons of two pipelines on identical folds and the subjects both use:
 * <ul>
 * <li>balanced accuracy: corrected repeated cross-validation t-test on per-fold differences (Nadeau &amp; Bengio
 * 2003; Bouckaert &amp; Frank 2004) with its interval, and the Bayesian correlated t-test with a region of practical
 * equivalence (Corani &amp; Benavoli 2015; Benavoli et al. 2017);</li>
 * <li>accuracy: exact McNemar test and its mid-p (Fagerland, Lydersen &amp; Laake 2013) on the pooled out-of-fold
 * predictions of the first repeat;</li>
 * <li>AUC: DeLong test (DeLong et al. 1988) on each subject's score averaged over repeats.</li>
 * </ul>
 * p-values are adjusted across all comparisons of a run, separately for each test, by the spec's method. Every row
 * names the {@code quantity} its estimates, difference and interval are of (see {@link #MEAN_OVER_FOLDS} and the
 * others), so that estimate A minus estimate B is the difference the test is about and the interval is centred on it.
 */
public final class Comparisons {
    private Comparisons() {
    }

    /** The metric in each outer fold, averaged over folds and repeats: what the two t-tests are about. */
    public static final String MEAN_OVER_FOLDS = "mean-over-folds";
    /** The metric on the pooled out-of-fold predictions of repeat 1: what McNemar's test is about. */
    public static final String FIRST_REPEAT_POOLED = "first-repeat-pooled";
    /** The AUC of each subject's score averaged over repeats: what the DeLong test is about. */
    public static final String REPEAT_AVERAGED_SCORES = "repeat-averaged-scores";

    /**
     * One test of one comparison (cells that do not apply are NaN); estimateA, estimateB, difference = estimateA -
     * estimateB and the interval are all of {@code quantity}.
     */
    public record Row(String comparison, Pipeline a, Pipeline b, int n, String test, String metric, String quantity,
                      double estimateA, double estimateB, double difference, double ciLow, double ciHigh,
                      double statistic, double pValue, double pAdjusted, String adjustMethod, double probABetter,
                      double probEquivalent, double probBBetter, double rope) {
        Row withAdjusted(double adj) {
            return new Row(comparison, a, b, n, test, metric, quantity, estimateA, estimateB, difference, ciLow,
                    ciHigh, statistic, pValue, adj, adjustMethod, probABetter, probEquivalent, probBBetter, rope);
        }
    }

    public static List<Row> of(RunResults res) {
        Experiment ex = res.experiment();
        Specs.Significance sig = ex.spec().significance();
        List<Row> rows = new ArrayList<>();
        for (ComparisonPairs.Pair pair : ComparisonPairs.of(ex)) {
            rows.addAll(compare(res, pair, sig));
        }
        return adjust(rows, sig.adjust());
    }

    /** The tests of one pair, unadjusted (the availability curve's gains: the same tests as the run's rows). */
    static List<Row> unadjusted(RunResults res, Pipeline a, Pipeline b) {
        return compare(res, new ComparisonPairs.Pair(a.featureSet().label() + " vs " + b.featureSet().label(), a, b),
                res.experiment().spec().significance());
    }

    private static List<Row> compare(RunResults res, ComparisonPairs.Pair pair, Specs.Significance sig) {
        Experiment ex = res.experiment();
        Set<Integer> common = new HashSet<>();
        for (int i = 0; i < ex.data().n(); i++) {
            if (ex.inPopulation(pair.a().featureSet(), i) && ex.inPopulation(pair.b().featureSet(), i)) {
                common.add(i);
            }
        }
        int repeats = res.plan().repeats();
        String adjust = sig.adjust().label();
        List<Row> out = new ArrayList<>();
        // balanced accuracy, fold by fold; the estimates are the means of the fold values the test uses
        List<Double> diffs = new ArrayList<>();
        double ratio = 0;
        int ratioCount = 0;
        double baA = 0;
        double baB = 0;
        for (int r = 0; r < repeats; r++) {
            List<RunResults.Prediction> pa = restrict(Evaluation.select(res, pair.a(), r, -1), common);
            List<RunResults.Prediction> pb = restrict(Evaluation.select(res, pair.b(), r, -1), common);
            for (int f = 0; f < res.plan().folds(r); f++) {
                final int ff = f;
                List<RunResults.Prediction> fa = pa.stream().filter(p -> p.fold() == ff).toList();
                List<RunResults.Prediction> fb = pb.stream().filter(p -> p.fold() == ff).toList();
                double va = Evaluation.compute(ex, fa).get("balanced_accuracy");
                double vb = Evaluation.compute(ex, fb).get("balanced_accuracy");
                double d = va - vb;
                if (!Double.isNaN(d) && !fa.isEmpty()) {
                    diffs.add(d);
                    baA += va;
                    baB += vb;
                    // n_test / n_train of this fold within the subjects both pipelines use
                    ratio += fa.size() / (double) (common.size() - fa.size());
                    ratioCount++;
                }
            }
        }
        baA /= diffs.size();
        baB /= diffs.size();
        int n = common.size();
        double[] d = diffs.stream().mapToDouble(Double::doubleValue).toArray();
        if (d.length >= 2 && ratioCount > 0) {
            double rt = ratio / ratioCount;
            CorrectedTTest.Result t = CorrectedTTest.test(d, rt);
            Interval ci = t.interval(sig.confidence());
            out.add(new Row(pair.comparison(), pair.a(), pair.b(), n, "corrected-t", "balanced_accuracy",
                    MEAN_OVER_FOLDS, baA, baB, t.meanDifference(), ci.low(), ci.high(), t.t(), t.p(), Double.NaN,
                    adjust, Double.NaN, Double.NaN, Double.NaN, Double.NaN));
            BayesCorrelatedTTest.Posterior post = BayesCorrelatedTTest.of(d, rt / (1 + rt), sig.rope());
            out.add(new Row(pair.comparison(), pair.a(), pair.b(), n, "bayes-correlated-t", "balanced_accuracy",
                    MEAN_OVER_FOLDS, baA, baB, post.mean(), Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN, "", post.right(),
                    post.rope(), post.left(), sig.rope()));
        }
        // accuracy, McNemar on the first repeat's pooled predictions
        Map<Integer, RunResults.Prediction> a0 = bySubject(restrict(Evaluation.select(res, pair.a(), 0, -1), common));
        Map<Integer, RunResults.Prediction> b0 = bySubject(restrict(Evaluation.select(res, pair.b(), 0, -1), common));
        List<Integer> subjects = new ArrayList<>(a0.keySet());
        subjects.retainAll(b0.keySet());
        subjects.sort(Integer::compare);
        int[] truth = new int[subjects.size()];
        int[] predA = new int[subjects.size()];
        int[] predB = new int[subjects.size()];
        for (int k = 0; k < subjects.size(); k++) {
            truth[k] = a0.get(subjects.get(k)).truth();
            predA[k] = a0.get(subjects.get(k)).predicted();
            predB[k] = b0.get(subjects.get(k)).predicted();
        }
        if (!subjects.isEmpty()) {
            McNemar.Discordant disc = McNemar.discordant(truth, predA, predB);
            double accA = accuracy(truth, predA);
            double accB = accuracy(truth, predB);
            double stat = disc.onlyACorrect() - disc.onlyBCorrect();
            out.add(new Row(pair.comparison(), pair.a(), pair.b(), subjects.size(), "mcnemar-exact", "accuracy",
                    FIRST_REPEAT_POOLED, accA, accB, accA - accB, Double.NaN, Double.NaN, stat, McNemar.exactP(disc),
                    Double.NaN, adjust, Double.NaN, Double.NaN, Double.NaN, Double.NaN));
            out.add(new Row(pair.comparison(), pair.a(), pair.b(), subjects.size(), "mcnemar-mid-p", "accuracy",
                    FIRST_REPEAT_POOLED, accA, accB, accA - accB, Double.NaN, Double.NaN, stat, McNemar.midP(disc),
                    Double.NaN, adjust, Double.NaN, Double.NaN, Double.NaN, Double.NaN));
        }
        // AUC, DeLong on repeat-averaged scores (two groups only)
        if (ex.spec().cohort().groups().size() == 2 && !subjects.isEmpty()) {
            double[] sa = meanScores(res, pair.a(), subjects);
            double[] sb = meanScores(res, pair.b(), subjects);
            if (sa != null && sb != null) {
                boolean[] pos = new boolean[subjects.size()];
                for (int k = 0; k < pos.length; k++) {
                    pos[k] = truth[k] == ex.spec().cohort().positiveIndex();
                }
                DeLong.Comparison c = DeLong.compare(sa, sb, pos);
                Interval ci = c.interval(sig.confidence());
                out.add(new Row(pair.comparison(), pair.a(), pair.b(), subjects.size(), "delong", "auc",
                        REPEAT_AVERAGED_SCORES, c.aucA(), c.aucB(), c.difference(), ci.low(), ci.high(), c.z(),
                        c.p(), Double.NaN, adjust, Double.NaN, Double.NaN, Double.NaN, Double.NaN));
            }
        }
        return out;
    }

    private static List<Row> adjust(List<Row> rows, Specs.Adjustment method) {
        Map<String, List<Integer>> byTest = new HashMap<>();
        for (int i = 0; i < rows.size(); i++) {
            if (!Double.isNaN(rows.get(i).pValue())) {
                byTest.computeIfAbsent(rows.get(i).test(), t -> new ArrayList<>()).add(i);
            }
        }
        List<Row> out = new ArrayList<>(rows);
        for (List<Integer> idx : byTest.values()) {
            double[] p = idx.stream().mapToDouble(i -> rows.get(i).pValue()).toArray();
            double[] adj = switch (method) {
                case HOLM -> Adjust.holm(p);
                case BENJAMINI_HOCHBERG -> Adjust.benjaminiHochberg(p);
                case BONFERRONI -> Adjust.bonferroni(p);
                case NONE -> p.clone();
            };
            for (int k = 0; k < idx.size(); k++) {
                out.set(idx.get(k), rows.get(idx.get(k)).withAdjusted(adj[k]));
            }
        }
        return out;
    }

    private static List<RunResults.Prediction> restrict(List<RunResults.Prediction> ps, Set<Integer> subjects) {
        return ps.stream().filter(p -> subjects.contains(p.subject())).toList();
    }

    private static Map<Integer, RunResults.Prediction> bySubject(List<RunResults.Prediction> ps) {
        Map<Integer, RunResults.Prediction> m = new HashMap<>();
        ps.forEach(p -> m.put(p.subject(), p));
        return m;
    }

    private static double accuracy(int[] truth, int[] pred) {
        int ok = 0;
        for (int i = 0; i < truth.length; i++) {
            ok += truth[i] == pred[i] ? 1 : 0;
        }
        return ok / (double) truth.length;
    }

    /** Each subject's score averaged over repeats, or null when a score is missing. */
    private static double[] meanScores(RunResults res, Pipeline p, List<Integer> subjects) {
        Map<Integer, Integer> at = new HashMap<>();
        for (int k = 0; k < subjects.size(); k++) {
            at.put(subjects.get(k), k);
        }
        double[] s = new double[subjects.size()];
        int[] count = new int[subjects.size()];
        for (RunResults.Prediction pr : res.predictions()) {
            Integer k = at.get(pr.subject());
            if (k != null && pr.pipeline().equals(p)) {
                if (Double.isNaN(pr.score())) {
                    return null;
                }
                s[k] += pr.score();
                count[k]++;
            }
        }
        for (int k = 0; k < s.length; k++) {
            s[k] /= count[k];
        }
        return s;
    }
}
