package org.viewgain.engine;

import java.util.ArrayList;
import java.util.List;
import org.viewgain.classify.ClassifierMethod;
import org.viewgain.classify.Predictions;
import org.viewgain.cohort.Extractors;
import org.viewgain.cohort.Rows;
import org.viewgain.cohort.View;
import org.viewgain.folds.FitContext;
import org.viewgain.imputation.ViewImputer;
import org.viewgain.prep.Transform;
import org.viewgain.spec.FeatureSet;

/**
 * A final pipeline ready to apply to subjects it never saw: the imputer (null for feature sets without imputed
 * features), the fitted steps and the classifier, with the development cohort's shape. Built from a run's final fit
 * or read back from a bundle; both predict through this class, so their predictions agree bit for bit.
 */
public record FrozenPipeline(Pipeline pipeline, CohortShape shape, ViewImputer.Fitted imputer,
                             List<Transform.Fitted> steps, ClassifierMethod.Model model) {
    public FrozenPipeline {
        steps = List.copyOf(steps);
        for (Transform.Fitted s : steps) {
            java.util.SortedSet<String> sites = org.viewgain.prep.FrozenSteps.sites(s);
            if (!sites.isEmpty() && !List.copyOf(sites).equals(shape.sites())) {
                throw new IllegalArgumentException("pipeline " + pipeline.label() + " harmonizes the sites " + sites
                        + " but the cohort shape lists " + shape.sites());
            }
            if (!org.viewgain.prep.FrozenSteps.readsCovariates(s, shape.covariates())) {
                throw new IllegalArgumentException("pipeline " + pipeline.label() + " has a step fitted on other"
                        + " covariates than the cohort shape's " + shape.covariates());
            }
        }
    }

    /** One subject's prediction: position in the cohort, predicted class, positive score and scores per class. */
    public record Prediction(int subject, int predicted, double score, double[] scores) {
    }

    /**
     * The subjects of the cohort this pipeline applies to: everyone, or for feature sets with observed target
     * features those with an observed target.
     */
    public int[] population(IndependentData d) {
        return java.util.stream.IntStream.range(0, d.n())
                .filter(i -> !pipeline.featureSet().needsObservedTarget() || d.hasTarget(i)).toArray();
    }

    /** Subjects whose feature rows are built and predicted at once; every step and model works row by row. */
    private static final int CHUNK = 128;

    /** Predicts every subject of its population, in cohort order. */
    public List<Prediction> predict(IndependentData d) {
        return predict(d, pipeline.featureSet().needsImputer() ? impute(d, everyone(d)) : null);
    }

    /**
     * Predicts every subject of its population, in cohort order, with the imputations of its imputer for every
     * subject of the cohort ({@link #impute} of {@link #everyone}; null for feature sets without imputed features),
     * so that pipelines sharing an imputer impute once. Rows are built a chunk of subjects at a time, so the whole
     * cohort's feature matrix is never held: the steps and models work row by row, so chunks change no value.
     */
    public List<Prediction> predict(IndependentData d, double[][] imputedForEveryone) {
        if (pipeline.featureSet().needsImputer() != (imputedForEveryone != null)) {
            throw new IllegalArgumentException("imputations are needed exactly when the feature set has imputed"
                    + " features (" + pipeline.label() + ")");
        }
        int[] who = population(d);
        // steps that read sites or covariates read the applied cohort's; IndependentData.load admitted only the
        // development sites and required the covariate columns
        List<Transform.Fitted> applied = steps;
        if (steps.stream().anyMatch(s -> s instanceof Transform.PerSubject)) {
            java.util.Map<String, String> sites = d.siteById();
            java.util.Map<String, double[]> covariates = d.covariatesById(shape.covariates());
            applied = steps.stream()
                    .map(s -> s instanceof Transform.PerSubject b ? b.forCohort(sites, covariates) : s).toList();
        }
        List<String> names = null;
        int positive = shape.groups().size() == 2 ? shape.groups().indexOf(shape.positive()) : -1;
        List<Prediction> out = new ArrayList<>(who.length);
        for (int from = 0; from < who.length; from += CHUNK) {
            int[] chunk = java.util.Arrays.copyOfRange(who, from, Math.min(who.length, from + CHUNK));
            Rows x = rows(d, chunk, imputedForEveryone, names);
            names = x.featureNames();
            for (Transform.Fitted s : applied) {
                x = s.applyInPlace(x); // the chunk's rows were built for this pass alone
            }
            Predictions pr = model.predict(x);
            for (int t = 0; t < chunk.length; t++) {
                double[] scores = pr.hasScores() ? pr.scores()[t] : null;
                double score = scores == null ? Double.NaN
                        : positive >= 0 ? scores[positive] : scores[pr.labels()[t]];
                out.add(new Prediction(chunk[t], pr.labels()[t], score, scores));
            }
        }
        return out;
    }

    /** Every subject of the cohort, in order. */
    public static int[] everyone(IndependentData d) {
        return java.util.stream.IntStream.range(0, d.n()).toArray();
    }

    /** The imputed target base vectors of the given subjects (null without an imputer), before rounding. */
    public double[][] impute(IndependentData d, int[] who) {
        if (imputer == null) {
            return null;
        }
        double[][] base = new double[who.length][];
        List<String> ids = new ArrayList<>(who.length);
        for (int t = 0; t < who.length; t++) {
            base[t] = d.source().base(d.id(who[t]));
            ids.add(d.id(who[t]));
        }
        Rows src = new Rows(ids, base, d.source().baseNames());
        return imputer.impute(new FitContext(0, ImputationStage.FINAL, ImputationStage.FINAL, FitContext.WHOLE,
                FitContext.Role.FINAL, 0L), src);
    }

    /**
     * Feature rows as the development run built them: source features, then imputed (rounded to single precision
     * as every imputation the run keeps) or observed target features, each extracted as the development data were.
     */
    Rows rows(IndependentData d, int[] who, double[][] imputedForEveryone) {
        return rows(d, who, imputedForEveryone, null);
    }

    /** As {@link #rows(IndependentData, int[], double[][])}, with the column names of an earlier chunk, or null. */
    private Rows rows(IndependentData d, int[] who, double[][] imputedForEveryone, List<String> known) {
        FeatureSet fs = pipeline.featureSet();
        List<String> extract = shape.extract();
        View targetShape = fs.needsImputer() ? shape.targetShape() : d.target();
        double[][] x = new double[who.length][];
        List<String> ids = new ArrayList<>(who.length);
        for (int t = 0; t < who.length; t++) {
            int i = who[t];
            ids.add(d.id(i));
            List<double[]> parts = new ArrayList<>();
            if (fs.usesSource()) {
                parts.add(stored(extract, d.source(), d.source().base(d.id(i))));
            }
            if (fs.needsImputer()) {
                double[] base = widen(ImputedFold.compact(imputedForEveryone[i]));
                parts.add(Extractors.apply(extract, targetShape, base));
            } else if (fs != FeatureSet.SOURCE) {
                parts.add(stored(extract, d.target(), d.target().base(d.id(i))));
            }
            int width = parts.stream().mapToInt(a -> a.length).sum();
            double[] row = new double[width];
            int at = 0;
            for (double[] a : parts) {
                System.arraycopy(a, 0, row, at, a.length);
                at += a.length;
            }
            x[t] = row;
        }
        int width = x.length == 0 ? 0 : x[0].length;
        List<String> names = known != null && known.size() == width ? known : new ArrayList<>(width);
        for (int c = names.size(); c < width; c++) {
            names.add("f" + c);
        }
        return new Rows(ids, x, names);
    }

    /** Observed features as {@code DataLoader} keeps them: extracted, then held in single precision. */
    private static double[] stored(List<String> extract, View view, double[] base) {
        if (extract.equals(List.of(Extractors.EDGES))) {
            return base; // already the widened single-precision values
        }
        return widen(ImputedFold.compact(Extractors.apply(extract, view, base)));
    }

    private static double[] widen(float[] f) {
        double[] d = new double[f.length];
        for (int c = 0; c < f.length; c++) {
            d[c] = f[c];
        }
        return d;
    }
}
