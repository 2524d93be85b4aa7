package org.viewgain.engine;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.TreeMap;
import org.viewgain.cohort.Subject;
import org.viewgain.folds.Seeds;
import org.viewgain.spec.FeatureSet;

/**
 * Label permutations for the permutation test (Ojala &amp; Garriga 2010, test 1). Labels are shuffled among the
 * subjects a pipeline uses: everyone, or, for feature sets that need an observed target, only those who have one, so
 * that a group-dependent missing target cannot change the class counts of the population from one permutation to
 * the next. With a site column they are shuffled within sites (exchangeability blocks), so a site-group imbalance
 * cannot make the null look better than it is. Subjects outside the population keep their real label. Permutation k
 * is the same for every pipeline of one population (seeded by run seed, k and the population).
 */
final class PermutedLabels {
    private PermutedLabels() {
    }

    /** True when labels are shuffled within sites. */
    static boolean withinSites(Experiment ex) {
        return ex.spec().cohort().site() != null;
    }

    /** The labels of permutation {@code k} (from 1) for the population of feature set {@code fs}. */
    static int[] of(Experiment ex, int k, FeatureSet fs) {
        int[] y = ex.data().y().clone();
        TreeMap<String, List<Integer>> blocks = new TreeMap<>();
        for (int i = 0; i < y.length; i++) {
            if (ex.inPopulation(fs, i)) {
                Subject s = ex.data().subjects().get(i);
                blocks.computeIfAbsent(withinSites(ex) ? s.site() : "", b -> new ArrayList<>()).add(i);
            }
        }
        long seed = fs.needsObservedTarget()
                ? Seeds.derive(ex.spec().seed(), "permutation", k, "observed-target")
                : Seeds.derive(ex.spec().seed(), "permutation", k);
        SplittableRandom rng = new SplittableRandom(seed);
        for (List<Integer> members : blocks.values()) {
            int[] labels = members.stream().mapToInt(i -> ex.data().y()[i]).toArray();
            for (int i = labels.length - 1; i > 0; i--) {
                int j = rng.nextInt(i + 1);
                int t = labels[i];
                labels[i] = labels[j];
                labels[j] = t;
            }
            for (int t = 0; t < labels.length; t++) {
                y[members.get(t)] = labels[t];
            }
        }
        return y;
    }
}
