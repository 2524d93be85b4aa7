package org.viewgain.engine;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.BitSet;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import java.util.TreeMap;
import org.viewgain.folds.Seeds;
import org.viewgain.spec.AvailabilityCurve;
import org.viewgain.spec.Problems;

/**
 * The subsets of an availability curve: inside each outer training block, the subjects with an observed target are
 * put in one seeded order, and level {@code l} keeps the first {@code n_l} of them, so every level's subset contains
 * the smaller levels' (nested). With a site column the order interleaves the sites in proportion to their share of
 * the block (member k of a site's shuffled list, of m, gets the key (k + u) / m with a seeded offset u in [0, 1), and
 * the block is ordered by key), so every prefix holds each site within one subject of its proportional share. The
 * order reads only the block's positions, which of them have a target, their sites, the run seed, the repeat and the
 * outer fold: never a label, never a test subject.
 */
public final class Availability {
    private Availability() {
    }

    /**
     * Model fits the spec's availability curve adds to the run (0 without a curve): imputers and source+imputed
     * pipelines re-fitted at every level and outer fold where the level does not keep every target.
     */
    public static long modelFits(Experiment ex) {
        return new AvailabilityRun(ex).modelFits();
    }

    /** The order in which the training block's subjects with an observed target enter the levels (positions). */
    static int[] order(Experiment ex, int repeat, int fold) {
        StudyData d = ex.data();
        boolean sites = ex.spec().cohort().site() != null;
        Map<String, List<Integer>> bySite = new TreeMap<>();
        for (int i : ex.plan().train(repeat, fold)) {
            if (d.hasTarget(i)) {
                bySite.computeIfAbsent(sites ? d.subjects().get(i).site() : "", s -> new ArrayList<>()).add(i);
            }
        }
        List<double[]> keyed = new ArrayList<>(); // {key, site index, position}
        int siteIndex = 0;
        for (Map.Entry<String, List<Integer>> e : bySite.entrySet()) {
            List<Integer> members = new ArrayList<>(e.getValue());
            members.sort(Integer::compare);
            SplittableRandom rng = new SplittableRandom(Seeds.derive(ex.spec().seed(), "availability", repeat, fold,
                    e.getKey()));
            for (int k = members.size() - 1; k > 0; k--) { // Fisher-Yates
                int j = rng.nextInt(k + 1);
                Integer t = members.get(k);
                members.set(k, members.get(j));
                members.set(j, t);
            }
            double u = rng.nextDouble();
            int m = members.size();
            for (int k = 0; k < m; k++) {
                keyed.add(new double[] {(k + u) / m, siteIndex, members.get(k)});
            }
            siteIndex++;
        }
        keyed.sort((a, b) -> a[0] != b[0] ? Double.compare(a[0], b[0]) : Double.compare(a[1], b[1]));
        return keyed.stream().mapToInt(a -> (int) a[2]).toArray();
    }

    /** The positions level {@code level} keeps in an outer training block, ascending. */
    static int[] subset(Experiment ex, int level, int repeat, int fold) {
        return subset(ex.spec().availability(), level, order(ex, repeat, fold));
    }

    static int[] subset(AvailabilityCurve curve, int level, int[] order) {
        int[] keep = Arrays.copyOf(order, Math.min(order.length, curve.keep(level, order.length)));
        Arrays.sort(keep);
        return keep;
    }

    /**
     * The experiment as a level sees it in one outer fold: the training block's targets outside {@code keep} are
     * treated as missing (test subjects keep theirs, which only score the imputations, as in the run).
     */
    static Experiment masked(Experiment ex, int repeat, int fold, int[] keep) {
        BitSet hidden = new BitSet(ex.data().n());
        for (int i : ex.plan().train(repeat, fold)) {
            if (ex.data().hasTarget(i) && Arrays.binarySearch(keep, i) < 0) {
                hidden.set(i);
            }
        }
        return new Experiment(ex.spec(), ex.data().withoutTargets(hidden), ex.plan(), ex.imputers(),
                ex.classifiers(), ex.pipelines(), ex.scaler(), ex.prep(), ex.duplicates());
    }

    /** Fewest training subjects with a target an imputer fit can learn from. */
    static final int MIN_PER_FIT = 1;

    /**
     * The fewest training subjects with a target among the imputer fits a level runs in one outer fold: the final fit,
     * the cross-fits over the imputation folds, and for pipelines tuned with nested imputations, the same one level
     * down in every classifier inner fold.
     */
    static int fewestInAFit(Experiment ex, int repeat, int fold, int[] keep) {
        Experiment m = masked(ex, repeat, fold, keep);
        int[] train = ex.plan().train(repeat, fold);
        boolean crossFits = ex.imputers().stream().anyMatch(i -> ImputationTasks.runsCrossFits(ex, i));
        int k = ex.spec().validation().innerFolds();
        int fewest = fewest(m, train, crossFits ? ImputationFolds.of(m, train, Seeds.derive(ex.spec().seed(),
                "imputation-folds", repeat, fold)) : null, k);
        boolean nested = false;
        for (Pipeline p : ex.pipelines()) {
            int points = ex.classifier(p.classifier()).grid().size() * ex.prep().selectionPoints();
            nested |= p.featureSet() == org.viewgain.spec.FeatureSet.SOURCE_IMPUTED && points > 1
                    && ClassifierStage.nestedImputation(ex, p);
        }
        if (nested) {
            int[] innerOf = InnerFolds.of(ex, repeat, fold);
            for (int j = 0; j < k; j++) {
                final int jj = j;
                int[] fit = Arrays.stream(train).filter(i -> innerOf[i] != jj).toArray();
                fewest = Math.min(fewest, fewest(m, fit, crossFits ? ImputationFolds.of(m, fit, Seeds.derive(
                        ex.spec().seed(), "imputation-folds", repeat, fold, "nested", j)) : null, k));
            }
        }
        return fewest;
    }

    private static int fewest(Experiment m, int[] train, int[] foldOf, int k) {
        int all = (int) Arrays.stream(train).filter(m.data()::hasTarget).count();
        int fewest = all;
        for (int j = 0; j < k && foldOf != null; j++) {
            final int jj = j;
            fewest = Math.min(fewest, (int) Arrays.stream(train).filter(i -> m.data().hasTarget(i) && foldOf[i] != jj)
                    .count());
        }
        return fewest;
    }

    /**
     * Checks that every level is possible in every outer fold: a count no larger than the block's subjects with a
     * target, and at least twice the inner folds kept (as the imputers need in the run).
     */
    static void check(Experiment ex, Problems problems) {
        AvailabilityCurve curve = ex.spec().availability();
        if (curve == null) {
            return;
        }
        int min = 2 * ex.spec().validation().innerFolds();
        String list = curve.byFraction() ? "fractions" : "counts";
        for (int r = 0; r < ex.plan().repeats(); r++) {
            for (int f = 0; f < ex.plan().folds(r); f++) {
                int available = (int) Arrays.stream(ex.plan().train(r, f)).filter(ex.data()::hasTarget).count();
                for (int l = 0; l < curve.size(); l++) {
                    String key = "availability-curve." + list + "[" + l + "]";
                    if (!curve.byFraction() && curve.counts().get(l) > available) {
                        problems.add(key, curve.counts().get(l) + " exceeds the " + available + " training subjects "
                                + "with an observed target in repeat " + (r + 1) + ", outer fold " + (f + 1)
                                + "; use counts up to " + available + " or fractions");
                        return;
                    }
                    int keep = curve.keep(l, available);
                    if (keep < min) {
                        problems.add(key, curve.label(l) + " keeps " + keep + " of the " + available + " training "
                                + "subjects with an observed target in repeat " + (r + 1) + ", outer fold " + (f + 1)
                                + "; imputers need at least " + min + " (twice the inner folds)");
                        return;
                    }
                    int fewest = fewestInAFit(ex, r, f, subset(curve, l, order(ex, r, f)));
                    if (fewest < MIN_PER_FIT) {
                        problems.add(key, curve.label(l) + " keeps " + keep + " training subjects with an observed "
                                + "target in repeat " + (r + 1) + ", outer fold " + (f + 1) + ", and the imputers' "
                                + "tuning and cross-fitting split them further: one fit would get " + fewest
                                + ", and an imputer needs at least " + MIN_PER_FIT + "; use a larger level");
                        return;
                    }
                }
            }
        }
    }
}
