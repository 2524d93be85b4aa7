package org.viewgain.classify;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import java.util.stream.LongStream;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.folds.Seeds;
import org.viewgain.spec.ParamDef;
import org.viewgain.spec.Params;
import smile.base.cart.SplitRule;
import smile.classification.RandomForest;
import smile.data.DataFrame;
import smile.data.Tuple;
import smile.data.formula.Formula;
import smile.data.vector.IntVector;

/**
 * {@code smile-random-forest}: Breiman (2001), Machine Learning 45:5-32, through Smile's {@code RandomForest} with Gini
 * splits and bootstrap samples. Every tree gets its own seed derived from {@link FitContext#seed()}, so the forest
 * does not depend on Smile's thread-local generator or on which pool thread grows which tree. Scores are the
 * fractions of tree votes per class. Importance: the impurity (Gini) decrease of the splits on each feature, summed
 * over the trees (Breiman 2001), kind {@code impurity}.
 */
public final class SmileForest implements ClassifierMethod {

    private static final String CLASS_COLUMN = "viewgain_class";

    @Override
    public String method() {
        return "smile-random-forest";
    }

    @Override
    public List<ParamDef> parameters() {
        return BinnedForest.PARAMETERS;
    }

    @Override
    public boolean producesScores() {
        return true;
    }

    /** See {@link BinnedForest#featuresPerSplit}. */
    static int featuresPerSplit(Object setting, int p) {
        return BinnedForest.featuresPerSplit(setting, p);
    }

    /** Distinct seeds above 1 (Smile ignores a tree seed of 1 or less), derived from the fit seed. */
    static long[] treeSeeds(long seed, int trees) {
        Set<Long> seeds = new LinkedHashSet<>();
        for (long i = 0; seeds.size() < trees; i++) {
            seeds.add((Seeds.derive(seed, "forest-tree", i) & Long.MAX_VALUE) | 2L);
        }
        return seeds.stream().mapToLong(Long::longValue).toArray();
    }

    @Override
    public Model fit(FitContext ctx, Rows x, int[] y, int classes, Params params) {
        TrainingLabels.check(method(), x, y, classes);
        String[] names = columnNames(x.p());
        DataFrame data = DataFrame.of(x.x(), names).merge(IntVector.of(CLASS_COLUMN, y));
        int trees = params.getInt("trees");
        int mtry = featuresPerSplit(params.get("features-per-split"), x.p());
        // maxNodes = n leaves is no limit at all: depth and node size are the only stopping rules.
        RandomForest forest = RandomForest.fit(Formula.lhs(CLASS_COLUMN), data, trees, mtry, SplitRule.GINI,
                params.getInt("max-depth"), Math.max(2, x.n()), params.getInt("min-node-size"), 1.0, null,
                LongStream.of(treeSeeds(ctx.seed(), trees)));
        ClassifierMethod.Model model = rows -> {
            DataFrame test = DataFrame.of(rows.x(), columnNames(rows.p()));
            int[] labels = new int[rows.n()];
            double[][] scores = new double[rows.n()][classes];
            for (int i = 0; i < rows.n(); i++) {
                Tuple t = test.get(i);
                forest.vote(t, scores[i]);
                labels[i] = TrainingLabels.argmax(scores[i]);
            }
            return new Predictions(labels, scores);
        };
        // Smile's importance: the Gini impurity decrease of every split on a feature, summed over all trees
        return new Explained(model, forest.importance(), Explained.IMPURITY);
    }

    private static String[] columnNames(int p) {
        List<String> names = new ArrayList<>(p);
        for (int j = 0; j < p; j++) {
            names.add("x" + j);
        }
        return names.toArray(String[]::new);
    }
}
