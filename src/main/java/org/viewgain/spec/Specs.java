package org.viewgain.spec;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;

/** The records a spec file is read into. Collections are copied; records are immutable. */
public final class Specs {
    private Specs() {
    }

    /**
     * The subjects table and how to read it.
     *
     * @param groups   allowed group labels; their order gives class indices
     * @param positive the group treated as positive in two-group metrics (null for three or more groups)
     * @param site     site column or null
     * @param duplicateThreshold source-view correlation above which two subjects are reported as possible duplicates
     */
    public record Cohort(Path subjects, String id, String group, List<String> groups, String positive, String site,
                         List<String> covariates, double duplicateThreshold) {
        /** The default of {@code cohort.duplicate-threshold}. */
        public static final double DEFAULT_DUPLICATE_THRESHOLD = 0.999;

        public Cohort {
            groups = List.copyOf(groups);
            covariates = List.copyOf(covariates);
            // a backstop behind the loader's messages; written so that NaN fails too
            require(duplicateThreshold >= 0 && duplicateThreshold <= 1, "duplicate threshold", duplicateThreshold);
        }

        /** A cohort with the default duplicate threshold. */
        public Cohort(Path subjects, String id, String group, List<String> groups, String positive, String site,
                      List<String> covariates) {
            this(subjects, id, group, groups, positive, site, covariates, DEFAULT_DUPLICATE_THRESHOLD);
        }

        public int positiveIndex() {
            return positive == null ? -1 : groups.indexOf(positive);
        }
    }

    /** Layouts a view can be given in. */
    public enum Layout {
        /** One matrix file per subject (text, .npy or .mat). */
        MATRICES,
        /** The whole cohort in one .npy or .mat array, with a subject-order list. */
        STACKED,
        /** An edge table, one CSV row per subject. */
        TABLE
    }

    /**
     * Where a view is and how to read it.
     *
     * @param location        a path pattern with {@code {subject}} for matrices, the array file of a stacked view,
     *                        or the CSV file for a table
     * @param idColumn        the subject column of a table (null: the first column)
     * @param tolerance       largest allowed |m[i][j] - m[j][i]| of a matrix
     * @param variable        the variable of .mat files (null: each file's only numeric variable)
     * @param subjectOrder    a stacked view's list of subject ids, one per line, in the order of its slices
     * @param labels          a file of region names, one per line (null: from the files, or R1..Rn)
     * @param subjectAxisLast a stacked view's subjects are on its last axis (regions x regions x subjects)
     */
    public record View(String name, Layout layout, Path location, String idColumn, boolean missingAllowed,
                       double tolerance, String variable, Path subjectOrder, Path labels, boolean subjectAxisLast) {
        public View {
            require(tolerance >= 0, "symmetry tolerance", tolerance);
        }

        /** A view without array options (text matrices or a table). */
        public View(String name, Layout layout, Path location, String idColumn, boolean missingAllowed,
                    double tolerance) {
            this(name, layout, location, idColumn, missingAllowed, tolerance, null, null, null, false);
        }

        /** The input files whose content does not depend on the subject (all but a matrices pattern). */
        public List<Path> sharedFiles() {
            List<Path> out = new java.util.ArrayList<>();
            if (layout != Layout.MATRICES) {
                out.add(location);
            }
            if (subjectOrder != null) {
                out.add(subjectOrder);
            }
            if (labels != null) {
                out.add(labels);
            }
            return List.copyOf(out);
        }
    }

    /**
     * How views become features, and the steps fitted inside every fit, in this order: covariate adjustment,
     * harmonization, scaling, selection.
     *
     * @param select    top-k selection, or null for none
     * @param adjust    covariates regressed out of every feature (names from {@code cohort.covariates}); may be empty
     * @param harmonize ComBat, or none
     */
    public record Features(List<String> extract, Scaling scale, Selection select, List<String> adjust,
                           Harmonization harmonize) {
        public Features {
            extract = List.copyOf(extract);
            adjust = List.copyOf(adjust);
            require(scale != null && harmonize != null, "scale and harmonize", scale + ", " + harmonize);
        }

        /** Extraction and scaling only. */
        public Features(List<String> extract, Scaling scale) {
            this(extract, scale, null, List.of(), Harmonization.NONE);
        }

        /** Whether ComBat harmonizes the sites inside every fit. */
        public boolean harmonized() {
            return harmonize != Harmonization.NONE;
        }
    }

    /**
     * Keep the top k features by a score fitted on the training rows.
     *
     * @param method {@code t-test}, {@code anova} or {@code variance}
     * @param keep   the k values; more than one is a grid searched together with the classifier's grid
     */
    public record Selection(String method, List<Integer> keep) {
        public Selection {
            keep = List.copyOf(keep);
            require(!keep.isEmpty() && keep.stream().allMatch(k -> k >= 1), "features to keep", keep);
        }
    }

    /**
     * An imputer or classifier entry: a user-chosen name, the method, fixed values and a grid.
     *
     * @param settings the method's own settings given beside {@code method} (the {@code weka} method's {@code class}
     *                 and {@code options}); empty for other methods
     * @param path     key path of the entry (for messages)
     */
    public record Method(String name, String method, Map<String, Object> fixed, Map<String, List<Object>> grid,
                         Map<String, String> settings, String path) {
        public Method {
            // insertion order matters: it fixes the order of grid points (and so the tie-breaking of tuning)
            fixed = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(fixed));
            grid = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(grid));
            settings = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(settings));
        }
    }

    /** Outer resampling schemes. */
    public enum Scheme {
        STRATIFIED_K_FOLD("stratified-k-fold"), LEAVE_ONE_OUT("leave-one-out"), LEAVE_SITE_OUT("leave-site-out");

        private final String label;

        Scheme(String label) {
            this.label = label;
        }

        public String label() {
            return label;
        }
    }

    /** Nested cross-validation settings. */
    public record Validation(Scheme scheme, int folds, int repeats, int innerFolds, Metric tuneBy) {
        public Validation {
            require(scheme != null && tuneBy != null, "scheme and tune-by", scheme);
            require(folds >= 2 && repeats >= 1 && innerFolds >= 2, "folds, repeats, inner folds",
                    folds + ", " + repeats + ", " + innerFolds);
        }

        /** {@link #tuneBy} as the tables and metric maps spell it ({@code balanced_accuracy}). */
        public String tuneByColumn() {
            return tuneBy.column();
        }
    }

    /**
     * Throws unless {@code ok}: the records' backstop behind the loader's one-line messages (which give each key its
     * default after reporting it, so a loaded spec never trips it). Conditions are written in positive form, so that
     * NaN fails them.
     */
    static void require(boolean ok, String what, Object value) {
        if (!ok) {
            throw new IllegalArgumentException(what + " out of range: " + value);
        }
    }

    /** How features are scaled inside every fit ({@code features.scale}). */
    public enum Scaling {
        STANDARDIZE("standardize"), NONE("none");

        private final String label;

        Scaling(String label) {
            this.label = label;
        }

        public String label() {
            return label;
        }
    }

    /** Site harmonization inside every fit ({@code features.harmonize}). */
    public enum Harmonization {
        COMBAT("combat"), NONE("none");

        private final String label;

        Harmonization(String label) {
            this.label = label;
        }

        public String label() {
            return label;
        }
    }

    /** Multiple-testing adjustment across a run's comparisons ({@code significance.adjust}). */
    public enum Adjustment {
        HOLM("holm"), BENJAMINI_HOCHBERG("benjamini-hochberg"), BONFERRONI("bonferroni"), NONE("none");

        private final String label;

        Adjustment(String label) {
            this.label = label;
        }

        public String label() {
            return label;
        }
    }

    /** The member of a closed vocabulary a spelling names (the loader has checked it is one of {@link #labels}). */
    public static <E extends Enum<E>> E byLabel(Class<E> type, String label, java.util.function.Function<E, String> of) {
        for (E e : type.getEnumConstants()) {
            if (of.apply(e).equals(label)) {
                return e;
            }
        }
        throw new IllegalArgumentException("no " + type.getSimpleName() + " '" + label + "'");
    }

    /** The spellings of a closed vocabulary, in declaration order. */
    public static <E extends Enum<E>> List<String> labels(Class<E> type, java.util.function.Function<E, String> of) {
        return java.util.Arrays.stream(type.getEnumConstants()).map(of).toList();
    }

    /**
     * A metric a spec can tune by or test with ({@code validation.tune-by}, {@code significance.metric}), with its
     * spelling in the spec and as the tables and metric maps spell it.
     */
    public enum Metric {
        BALANCED_ACCURACY("balanced-accuracy", "balanced_accuracy"), AUC("auc", "auc"), ACCURACY("accuracy", "accuracy");

        private final String spec;
        private final String column;

        Metric(String spec, String column) {
            this.spec = spec;
            this.column = column;
        }

        /** The spelling in a spec, e.g. {@code balanced-accuracy}. */
        public String spec() {
            return spec;
        }

        /** The spelling in tables and metric maps, e.g. {@code balanced_accuracy}. */
        public String column() {
            return column;
        }
    }

    /** How training subjects get the imputed target features. */
    public enum TrainingImputation {
        /** From imputers fitted on the other training subjects (K-fold cross-fitting). */
        CROSS_FITTED("cross-fitted"),
        /** The observed target where there is one, else the fold's imputer output. */
        OBSERVED("observed");

        private final String label;

        TrainingImputation(String label) {
            this.label = label;
        }

        public String label() {
            return label;
        }
    }

    /**
     * Significance settings.
     *
     * @param permutations label permutations per pipeline (0: no permutation test)
     * @param earlyStop    Besag-Clifford h: stop a pipeline once h permuted scores reached the observed one (0: never)
     * @param metric       the statistic of the permutation test
     * @param alpha        level used to mark pipelines and comparisons
     * @param compare      comparisons, each {@code A vs B} (feature sets or full pipeline labels)
     * @param adjust       multiple-testing adjustment across the comparisons of a run
     * @param rope         half-width of the region of practical equivalence (Bayesian test), in metric units
     * @param bootstrap    replicates of the subject-level bootstrap intervals
     * @param confidence   level of every interval
     */
    public record Significance(int permutations, int earlyStop, Metric metric, double alpha, List<String> compare,
                               Adjustment adjust, double rope, int bootstrap, double confidence) {
        public Significance {
            compare = List.copyOf(compare);
            require(permutations >= 0 && earlyStop >= 0 && bootstrap >= 0, "permutations, early stop, bootstrap",
                    permutations + ", " + earlyStop + ", " + bootstrap);
            require(alpha > 0 && alpha < 1, "alpha", alpha);
            require(rope >= 0, "rope", rope);
            require(confidence > 0 && confidence < 1, "confidence", confidence);
        }

        /** {@link #metric} as the tables and metric maps spell it ({@code balanced_accuracy}). */
        public String metricColumn() {
            return metric.column();
        }
    }

    /**
     * A cohort the frozen pipelines are applied to after cross-validation ({@code independent-cohort} in a run spec,
     * the whole file of {@code viewgain apply}): its own subjects table and source view, optionally a target view,
     * group labels and sites. Its regions (or a table's columns) must equal the development cohort's, in order.
     *
     * @param name    a short name for tables and the report
     * @param group   the group column, or null when the cohort has no labels
     * @param site    the site column, or null
     * @param target  the target view, or null when the cohort never acquired it
     * @param where   the key path of the section, for messages
     */
    public record Independent(String name, Path subjects, String id, String group, String site, View source,
                              View target, String where) {
        /** Whether group labels are given. */
        public boolean labelled() {
            return group != null;
        }
    }
}
