package org.viewgain.engine;

import java.util.ArrayList;
import java.util.List;
import org.viewgain.cohort.Extractors;
import org.viewgain.folds.Seeds;
import org.viewgain.spec.FeatureSet;
import org.viewgain.stats.Distances;
import org.viewgain.stats.Permanova;

/**
 * Group separation without a classifier, per feature set: PERMANOVA pseudo-F and permutation p (Anderson 2001) on
 * Euclidean distances between the features of all subjects of the set, each feature standardized over those subjects.
 * This is descriptive: nothing here is cross-validated, and it must not be read as a predictive result. Imputed
 * features are each subject's out-of-fold imputation from the first repeat (every subject is imputed exactly once
 * there, by an imputer that never saw its target).
 */
public final class Separation {
    /** Subjects beyond which the O(n^2) permutations are skipped (the row then says so with no p-value). */
    public static final int MAX_SUBJECTS = 1500;
    static final int PERMUTATIONS = 999;

    private Separation() {
    }

    /** One feature set (and imputer). */
    public record Row(String featureSet, String imputer, int n, double pseudoF, double pValue, long permutations) {
    }

    public static List<Row> of(RunResults res) {
        Experiment ex = res.experiment();
        List<Row> out = new ArrayList<>();
        double[][] imputedAll = null;
        for (Pipeline p : ex.pipelines()) {
            if (!p.classifier().equals(ex.classifiers().get(0).name())) {
                continue; // one row per feature set and imputer, not per classifier
            }
            List<Integer> members = new ArrayList<>();
            for (int i = 0; i < ex.data().n(); i++) {
                if (ex.inPopulation(p.featureSet(), i)) {
                    members.add(i);
                }
            }
            double[][] imputed = p.featureSet().needsImputer() ? firstRepeatImputations(ex, p.imputer()) : null;
            double[][] x = new double[members.size()][];
            int[] groups = new int[members.size()];
            for (int k = 0; k < members.size(); k++) {
                int i = members.get(k);
                groups[k] = ex.data().y()[i];
                x[k] = features(ex, p.featureSet(), i, imputed);
            }
            int n = members.size();
            if (n > MAX_SUBJECTS || n < 3) {
                out.add(new Row(p.featureSet().label(), p.imputer(), n, Double.NaN, Double.NaN, 0));
                continue;
            }
            standardize(x);
            double[][] d = Distances.euclidean(x);
            Permanova.Result r = Permanova.monteCarlo(d, groups, PERMUTATIONS,
                    Seeds.derive(ex.spec().seed(), "separation", p.featureSet().label(), p.imputer()));
            out.add(new Row(p.featureSet().label(), p.imputer(), n, r.pseudoF(), r.p(), r.permutations()));
        }
        return out;
    }

    private static double[] features(Experiment ex, FeatureSet fs, int i, double[][] imputed) {
        StudyData d = ex.data();
        double[] imp = imputed == null ? null
                : Extractors.apply(ex.spec().features().extract(), d.target(), imputed[i]);
        return switch (fs) {
            case SOURCE -> d.sourceFeatures()[i].clone();
            case TARGET -> d.targetFeatures()[i].clone();
            case IMPUTED -> imp;
            case SOURCE_IMPUTED -> join(d.sourceFeatures()[i], imp);
            case SOURCE_TARGET -> join(d.sourceFeatures()[i], d.targetFeatures()[i]);
        };
    }

    /** Out-of-fold imputed base vectors of the first repeat (recomputed: imputation is deterministic). */
    private static double[][] firstRepeatImputations(Experiment ex, String imputer) {
        double[][] out = new double[ex.data().n()][];
        Resolved.Imputer imp = ex.imputer(imputer);
        ImputationStage stage = new ImputationStage(ex);
        for (int f = 0; f < ex.plan().folds(0); f++) {
            ImputedFold fold = stage.run(imp, 0, 0, f, InnerFolds.of(ex, 0, f));
            for (int i : ex.plan().test(0, f)) {
                out[i] = fold.row(i);
            }
        }
        return out;
    }

    private static void standardize(double[][] x) {
        int n = x.length;
        int p = x[0].length;
        for (int j = 0; j < p; j++) {
            double m = 0;
            for (double[] r : x) {
                m += r[j];
            }
            m /= n;
            double s = 0;
            for (double[] r : x) {
                s += (r[j] - m) * (r[j] - m);
            }
            double sd = Math.sqrt(s / (n - 1));
            for (double[] r : x) {
                r[j] = sd > 0 ? (r[j] - m) / sd : 0;
            }
        }
    }

    private static double[] join(double[] a, double[] b) {
        double[] r = java.util.Arrays.copyOf(a, a.length + b.length);
        System.arraycopy(b, 0, r, a.length, b.length);
        return r;
    }
}
