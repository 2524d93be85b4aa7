package org.viewgain.engine;

import java.util.ArrayList;
import java.util.List;
import org.viewgain.spec.BadInputException;
import org.viewgain.spec.FeatureSet;

/**
 * Expands the spec's {@code significance.compare} entries into pairs of pipelines. {@code X vs Y} with feature sets
 * pairs the pipelines of X and Y that share a classifier (and an imputer when both sets contain imputed features);
 * {@code imputer/set/classifier vs ...} names two pipelines; {@code all-pairs} pairs every two pipelines sharing a
 * classifier.
 */
public final class ComparisonPairs {
    private ComparisonPairs() {
    }

    /** A pair of pipelines compared on the same folds and the subjects they share. */
    public record Pair(String comparison, Pipeline a, Pipeline b) {
    }

    /** @throws BadInputException when an entry names a pipeline that the spec does not run */
    public static List<Pair> of(Experiment ex) {
        List<Pair> out = new ArrayList<>();
        List<String> compare = ex.spec().significance().compare();
        for (int i = 0; i < compare.size(); i++) {
            String c = compare.get(i);
            if (c.equals("all-pairs")) {
                List<Pipeline> ps = ex.pipelines();
                for (int a = 0; a < ps.size(); a++) {
                    for (int b = a + 1; b < ps.size(); b++) {
                        if (ps.get(a).classifier().equals(ps.get(b).classifier())) {
                            out.add(new Pair(ps.get(a).label() + " vs " + ps.get(b).label(), ps.get(a), ps.get(b)));
                        }
                    }
                }
                continue;
            }
            String[] sides = c.split("\\s+vs\\s+");
            if (sides[0].contains("/") || sides[1].contains("/")) {
                out.add(new Pair(c, find(ex, sides[0], i), find(ex, sides[1], i)));
                continue;
            }
            FeatureSet x = FeatureSet.byLabel(sides[0]);
            FeatureSet y = FeatureSet.byLabel(sides[1]);
            for (Resolved.Classifier cl : ex.classifiers()) {
                for (String ix : imputers(ex, x)) {
                    for (String iy : imputers(ex, y)) {
                        if (x.needsImputer() && y.needsImputer() && !ix.equals(iy)) {
                            continue;
                        }
                        out.add(new Pair(c, new Pipeline(ix, x, cl.name()), new Pipeline(iy, y, cl.name())));
                    }
                }
            }
        }
        return out;
    }

    private static List<String> imputers(Experiment ex, FeatureSet fs) {
        return fs.needsImputer() ? ex.imputers().stream().map(Resolved.Imputer::name).toList()
                : List.of(Pipeline.NO_IMPUTER);
    }

    private static Pipeline find(Experiment ex, String label, int index) {
        for (Pipeline p : ex.pipelines()) {
            if (p.label().equals(label.trim())) {
                return p;
            }
        }
        throw new BadInputException(ex.spec().where().at("significance.compare[" + index + "]", "'" + label
                + "' is not a pipeline of this run; pipelines are " + String.join(", ",
                ex.pipelines().stream().map(Pipeline::label).toList())));
    }
}
