package org.viewgain.engine;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import org.viewgain.spec.FeatureSet;
import org.viewgain.spec.Problems;

/**
 * Checks, before anything runs, that ComBat can be fitted and applied in every fit of the plan: every site of the
 * rows a fit is applied to has training rows in that fit, and every site in a fit's training rows has at least 2
 * (ComBat estimates a site's scale from its rows). Leave-site-out is refused earlier, in the spec.
 */
final class SiteChecks {
    private SiteChecks() {
    }

    static void check(Experiment ex, Problems problems) {
        // unseen sites first, in every fit, so that their message names the subject; then small sites
        if (pass(ex, problems, true)) {
            pass(ex, problems, false);
        }
    }

    /** Checks every fit for one kind of problem; false after recording the first one found. */
    private static boolean pass(Experiment ex, Problems problems, boolean unseen) {
        boolean tuned = ex.classifiers().stream()
                .anyMatch(c -> c.grid().size() * ex.prep().selectionPoints() > 1);
        Set<Boolean> populations = new LinkedHashSet<>();
        for (FeatureSet fs : ex.spec().featureSets()) {
            populations.add(fs.needsObservedTarget());
        }
        for (int r = 0; r < ex.plan().repeats(); r++) {
            for (int f = 0; f < ex.plan().folds(r); f++) {
                int[] innerOf = tuned ? InnerFolds.of(ex, r, f) : null;
                for (boolean targetOnly : populations) {
                    List<Integer> train = population(ex, ex.plan().train(r, f), targetOnly);
                    List<Integer> test = population(ex, ex.plan().test(r, f), targetOnly);
                    String where = "repeat " + (r + 1) + ", outer fold " + (f + 1);
                    if (!fits(ex, train, test, where, problems, unseen)) {
                        return false;
                    }
                    for (int j = 0; tuned && j < ex.spec().validation().innerFolds(); j++) {
                        List<Integer> fit = new ArrayList<>();
                        List<Integer> val = new ArrayList<>();
                        for (int i : train) {
                            (innerOf[i] == j ? val : fit).add(i);
                        }
                        if (!fits(ex, fit, val, where + ", inner fold " + (j + 1), problems, unseen)) {
                            return false;
                        }
                    }
                }
            }
        }
        return true;
    }

    private static List<Integer> population(Experiment ex, int[] positions, boolean targetOnly) {
        List<Integer> out = new ArrayList<>();
        for (int i : positions) {
            if (!targetOnly || ex.data().hasTarget(i)) {
                out.add(i);
            }
        }
        return out;
    }

    /** Records the first problem of one fit (unseen sites, or else small sites) and returns false, or returns true. */
    private static boolean fits(Experiment ex, List<Integer> train, List<Integer> applied, String where,
                                Problems problems, boolean unseen) {
        Map<String, Integer> count = new TreeMap<>();
        for (int i : train) {
            count.merge(ex.data().subjects().get(i).site(), 1, Integer::sum);
        }
        return unseen ? seen(ex, count, applied, where, problems) : large(count, where, problems);
    }

    private static boolean seen(Experiment ex, Map<String, Integer> count, List<Integer> applied, String where,
                                Problems problems) {
        for (int i : applied) {
            String site = ex.data().subjects().get(i).site();
            if (!count.containsKey(site)) {
                problems.add("features.harmonize", "subject '" + ex.data().id(i) + "' of site '" + site
                        + "' is held out in " + where + ", but no training subject there comes from site '" + site
                        + "'; ComBat cannot harmonize a site it has not seen. Use fewer folds or merge small sites");
                return false;
            }
        }
        return true;
    }

    private static boolean large(Map<String, Integer> count, String where, Problems problems) {
        for (Map.Entry<String, Integer> e : count.entrySet()) {
            if (e.getValue() < 2) {
                problems.add("features.harmonize", "site '" + e.getKey() + "' has only " + e.getValue()
                        + " training subject in " + where + "; ComBat needs at least 2 per site. Use fewer folds or"
                        + " merge small sites");
                return false;
            }
        }
        return true;
    }
}
