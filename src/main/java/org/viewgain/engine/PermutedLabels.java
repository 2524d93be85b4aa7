package org.viewgain.engine;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.TreeMap;
import org.viewgain.cohort.Subject;
import org.viewgain.folds.Seeds;

/**
 * Label permutations for the permutation test (Ojala &amp; Garriga 2010, test 1). With a site column, labels are
 * shuffled within sites (exchangeability blocks), so a site-group imbalance cannot make the null look better than
 * it is. Permutation k is the same for every pipeline (seeded by run seed and k).
 */
final class PermutedLabels {
    private PermutedLabels() {
    }

    /** True when labels are shuffled within sites. */
    static boolean withinSites(Experiment ex) {
        return ex.spec().cohort().site() != null;
    }

    static int[] of(Experiment ex, int k) {
        int[] y = ex.data().y().clone();
        TreeMap<String, List<Integer>> blocks = new TreeMap<>();
        for (int i = 0; i < y.length; i++) {
            Subject s = ex.data().subjects().get(i);
            blocks.computeIfAbsent(withinSites(ex) ? s.site() : "", b -> new ArrayList<>()).add(i);
        }
        SplittableRandom rng = new SplittableRandom(Seeds.derive(ex.spec().seed(), "permutation", k));
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
