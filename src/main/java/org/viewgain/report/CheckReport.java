package org.viewgain.report;

import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.viewgain.cohort.Subject;
import org.viewgain.engine.ComparisonPairs;
import org.viewgain.engine.Duplicates;
import org.viewgain.engine.Experiment;
import org.viewgain.engine.Pipeline;
import org.viewgain.folds.FoldPlan;
import org.viewgain.stats.CorrectedTTest;

/** The plain-text cohort and plan summary printed by {@code viewgain check} and at the start of a run. */
public final class CheckReport {
    private CheckReport() {
    }

    public static String text(Experiment ex) {
        StringBuilder b = new StringBuilder();
        List<String> groups = ex.spec().cohort().groups();
        var d = ex.data();
        b.append("experiment ").append(ex.spec().experiment()).append(" (seed ").append(ex.spec().seed())
                .append(")\n\n");
        b.append(String.format("%-14s %8s %14s %14s%n", "group", "subjects", "target seen", "target missing"));
        for (int g = 0; g < groups.size(); g++) {
            int n = 0;
            int seen = 0;
            for (int i = 0; i < d.n(); i++) {
                if (d.y()[i] == g) {
                    n++;
                    seen += d.hasTarget(i) ? 1 : 0;
                }
            }
            b.append(String.format("%-14s %8d %14s %14s%n", groups.get(g), n, d.target() == null ? "-" : seen,
                    d.target() == null ? "-" : n - seen));
        }
        b.append(String.format("%-14s %8d%n", "all", d.n()));
        if (ex.spec().cohort().site() != null) {
            Map<String, int[]> bySite = new TreeMap<>();
            for (int i = 0; i < d.n(); i++) {
                Subject s = d.subjects().get(i);
                bySite.computeIfAbsent(s.site(), k -> new int[groups.size()])[d.y()[i]]++;
            }
            b.append("\nsubjects per site and group\n");
            bySite.forEach((site, counts) -> {
                b.append(String.format("  %-12s", site));
                for (int g = 0; g < groups.size(); g++) {
                    b.append(String.format(" %s=%d", groups.get(g), counts[g]));
                }
                b.append('\n');
            });
        }
        b.append("\nviews\n");
        b.append("  source: ").append(describe(d.source())).append('\n');
        if (d.target() != null) {
            b.append("  target: ").append(describe(d.target())).append('\n');
        }
        b.append("  features per subject: source ").append(d.sourceNames().size());
        if (d.target() != null) {
            b.append(", target ").append(d.targetNames().size());
        }
        b.append(" (extract: ").append(String.join(", ", ex.spec().features().extract())).append(")\n");
        b.append("  fitted inside every fit: ").append(steps(ex)).append('\n');
        b.append(MissingTargets.text(ex));
        FoldPlan plan = ex.plan();
        b.append("\nfolds: ").append(plan.scheme()).append(", ").append(plan.repeats()).append(" repeat(s); inner ")
                .append(ex.spec().validation().innerFolds()).append(" folds, tuned by ")
                .append(ex.spec().validation().tuneBy().spec()).append('\n');
        for (int r = 0; r < Math.min(plan.repeats(), 1); r++) {
            b.append("  test fold sizes (repeat 1):");
            for (int f = 0; f < plan.folds(r); f++) {
                b.append(' ').append(plan.test(r, f).length);
            }
            b.append('\n');
        }
        b.append(powerWarning(ex).replace("[viewgain] warning: ", "  note: "));
        b.append("\npipelines: ").append(ex.pipelines().size()).append('\n');
        for (Pipeline p : ex.pipelines()) {
            b.append("  ").append(p.label()).append('\n');
        }
        b.append("model fits in this run: ").append(ex.modelFits()).append('\n');
        b.append(availability(ex));
        b.append(IndependentText.text(ex));
        b.append('\n').append(duplicates(ex, 20));
        b.append(costWarning(ex).replace("[viewgain] warning: ", ""));
        return b.toString();
    }

    /** What the spec's availability curve adds to the run, or nothing without a curve. */
    static String availability(Experiment ex) {
        org.viewgain.spec.AvailabilityCurve c = ex.spec().availability();
        if (c == null) {
            return "";
        }
        List<String> levels = new java.util.ArrayList<>();
        for (int l = 0; l < c.size(); l++) {
            levels.add(c.label(l));
        }
        long fits = org.viewgain.engine.Availability.modelFits(ex);
        return "availability curve: " + (c.byFraction() ? "fractions " : "counts ") + String.join(", ", levels)
                + " of the training subjects with a target; it adds " + fits + " model fits (" + String.format(
                java.util.Locale.ROOT, "%.1f", fits / (double) ex.modelFits()) + " times the run's; a level that"
                + " keeps every target reuses the run's fits)\n";
    }

    /** The steps of {@code features} in the order they are fitted. */
    static String steps(Experiment ex) {
        var f = ex.spec().features();
        List<String> s = new java.util.ArrayList<>();
        if (!f.adjust().isEmpty()) {
            s.add("covariate adjustment (" + String.join(", ", f.adjust()) + ")");
        }
        if (f.harmonized()) {
            s.add(f.harmonize().label() + " by site");
        }
        if (ex.scaler() != null) {
            s.add(ex.scaler().name());
        }
        if (f.select() != null) {
            s.add("selection " + f.select().method() + " keep " + (f.select().keep().size() == 1
                    ? f.select().keep().get(0) : f.select().keep() + " (tuned)"));
        }
        s.add("classifier");
        return String.join(" -> ", s);
    }

    /** Possible duplicate scans, at most {@code limit} listed; one line when there are none. */
    public static String duplicates(Experiment ex, int limit) {
        double threshold = ex.spec().cohort().duplicateThreshold();
        List<Duplicates.Pair> pairs = ex.duplicates();
        if (pairs.isEmpty()) {
            return "possible duplicate scans: none (no two source views correlate above " + threshold + ")\n";
        }
        StringBuilder b = new StringBuilder();
        b.append("possible duplicate scans: ").append(pairs.size()).append(" pair(s) of subjects whose source views")
                .append(" correlate above ").append(threshold)
                .append("; the same person in training and test inflates accuracy\n");
        for (int k = 0; k < Math.min(limit, pairs.size()); k++) {
            Duplicates.Pair d = pairs.get(k);
            b.append(String.format(java.util.Locale.ROOT, "  %s ~ %s (r = %.6f)%n", ex.data().id(d.a()),
                    ex.data().id(d.b()), d.correlation()));
        }
        if (pairs.size() > limit) {
            b.append("  ... and ").append(pairs.size() - limit).append(" more (all are listed in duplicates.csv)\n");
        }
        return b.toString();
    }

    /**
     * The warning a run prints to stderr before it starts, within the development cohort and between it and the
     * independent cohort; empty when there are no possible duplicates.
     */
    public static String duplicateWarning(Experiment ex) {
        String within = ex.duplicates().isEmpty() ? "" : "[viewgain] warning: " + duplicates(ex, 5);
        boolean across = ex.independent() != null && !ex.independent().duplicates().isEmpty();
        return within + (across ? "[viewgain] warning: " + IndependentText.duplicates(ex, 5) : "");
    }

    /**
     * A warning when the run compares pipelines on a stratified k-fold plan with fewer folds or repeats than the
     * 10 x 10 that Bouckaert &amp; Frank (2004) recommend for the corrected t-test; empty otherwise.
     */
    public static String powerWarning(Experiment ex) {
        FoldPlan plan = ex.plan();
        int folds = ex.spec().validation().folds();
        int repeats = plan.repeats();
        if (!plan.scheme().equals("stratified-k-fold") || ComparisonPairs.of(ex).isEmpty()
                || !CorrectedTTest.fewResamples(folds, repeats)) {
            return "";
        }
        return "[viewgain] warning: with " + folds + " folds x " + repeats + " repeat(s) the corrected t-test of the "
                + "paired comparisons has little power (it is conservative, and found a planted gain of 0.12 in "
                + "balanced accuracy in 29% of invented cohorts at 5 x 2 against 75% at 10 x 10; docs/benchmarks.md),"
                + " so a p above alpha will not mean 'no difference'. Bouckaert & "
                + "Frank (2004) recommend 10 repeats of 10-fold cross-validation: set validation.outer.folds: "
                + CorrectedTTest.RECOMMENDED_FOLDS + " (at most the smallest group) and validation.outer.repeats: "
                + CorrectedTTest.RECOMMENDED_REPEATS + "\n";
    }

    /** Features per subject above which Smile's forest is flagged (measured, docs/benchmarks.md). */
    static final int WIDE_FOR_SMILE_FOREST = 2_000;

    /**
     * A warning when Smile's random forest will meet wide inputs: its trees re-sort every feature at every split, so
     * a fit costs about features x subjects x depth whatever {@code features-per-split} is (400 subjects x 9,900
     * features did not finish in 30 minutes; docs/benchmarks.md). Empty when no such pipeline is planned.
     */
    public static String costWarning(Experiment ex) {
        return forestWarning(ex) + kernelWarning(ex);
    }

    /** Training rows above which {@code svm-rbf}'s kernel matrix (8 n^2 bytes per concurrent fit) is flagged. */
    static final int KERNEL_ROWS = 8_000;

    /**
     * A warning when {@code svm-rbf} will hold a kernel matrix of more than {@value #KERNEL_ROWS} training rows
     * (8 n^2 bytes each, one per concurrent fit: 512 MB at 8,000 rows); empty otherwise.
     */
    static String kernelWarning(Experiment ex) {
        int rows = 0;
        for (org.viewgain.engine.Pipeline p : ex.pipelines()) {
            if (ex.classifier(p.classifier()).method().method().equals("svm-rbf")) {
                rows = Math.max(rows, ex.data().n());
            }
        }
        return kernelWarning(rows);
    }

    static String kernelWarning(int rows) {
        if (rows <= KERNEL_ROWS) {
            return "";
        }
        long mb = 8L * rows * rows / (1L << 20);
        return "[viewgain] warning: svm-rbf keeps an n x n kernel matrix of its training rows: up to " + rows
                + " rows need up to " + mb + " MB per concurrent fit; give the JVM enough heap (JAVA_OPTS=-Xmx...), "
                + "use fewer --threads, or smile-svm-rbf, which keeps no matrix\n";
    }

    private static String forestWarning(Experiment ex) {
        int widest = 0;
        for (org.viewgain.engine.Pipeline p : ex.pipelines()) {
            if (ex.classifier(p.classifier()).method().method().equals("smile-random-forest")) {
                widest = Math.max(widest, ex.data().featureNames(p.featureSet()).size());
            }
        }
        if (ex.prep().selects()) {
            widest = Math.min(widest, ex.prep().keep().stream().mapToInt(Integer::intValue).max().orElse(widest));
        }
        if (widest <= WIDE_FOR_SMILE_FOREST) {
            return "";
        }
        return "[viewgain] warning: smile-random-forest will see up to " + widest + " features per subject; its "
                + "trees re-sort every feature at every split, so this can take hours (docs/benchmarks.md). "
                + "Consider the default random-forest, or features.select\n";
    }

    static String describe(org.viewgain.cohort.View v) {
        return (v.isGraph() ? "graph of " + v.regions() + " regions (" + v.baseNames().size() + " edges)"
                : "table of " + v.baseNames().size() + " columns") + ", present for " + v.subjects().size()
                + " subjects";
    }
}
