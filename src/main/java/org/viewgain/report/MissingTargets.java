package org.viewgain.report;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.TreeSet;
import org.viewgain.engine.Experiment;
import org.viewgain.spec.FeatureSet;
import org.viewgain.stats.ChiSquareIndependence;
import org.viewgain.stats.FisherExact;
import org.viewgain.stats.FreemanHalton;
import org.viewgain.stats.RankSum;
import org.viewgain.stats.TestResult;

/**
 * Are target views missing at random with respect to group, site and covariates? For group and site: Fisher's exact
 * test when there are two levels (Agresti 2002, section 3.5), its Freeman-Halton extension for more (Freeman &amp;
 * Halton 1951), and Pearson's chi-square test of independence only when there are too many tables to enumerate (an
 * approximation, flagged when an expected count is below 5). For each covariate: the Wilcoxon rank-sum test of its
 * values in subjects with and without a target, chosen over a logistic regression because it assumes no linear
 * log-odds, is unchanged by monotone recoding (age in years or months), and stays defined when the covariate
 * separates the two sets completely (where the logistic estimate diverges). Written to {@code missingness.csv},
 * printed by {@code check} and warned about by {@code run}.
 */
public final class MissingTargets {
    private MissingTargets() {
    }

    /**
     * One level of a grouping variable, or one covariate (level empty), with counts of subjects whose target was
     * observed or missing, the covariate's medians in each (NaN for group and site), and the variable's test.
     */
    public record Row(String variable, String level, int observed, int missing, double medianObserved,
                      double medianMissing, String test, double statistic, double pValue, String caveat) {
    }

    /** The audit; empty when there is no target view or every subject has one. */
    public static List<Row> of(Experiment ex) {
        var d = ex.data();
        boolean[] has = new boolean[d.n()];
        int missing = 0;
        for (int i = 0; i < d.n(); i++) {
            has[i] = d.hasTarget(i);
            missing += has[i] ? 0 : 1;
        }
        List<Row> out = new ArrayList<>();
        if (d.target() == null || missing == 0) {
            return out;
        }
        List<String> groups = ex.spec().cohort().groups();
        String[] group = new String[d.n()];
        for (int i = 0; i < d.n(); i++) {
            group[i] = groups.get(d.y()[i]);
        }
        out.addAll(categorical("group", group, has, groups));
        if (ex.spec().cohort().site() != null) {
            String[] site = d.subjects().stream().map(s -> s.site()).toArray(String[]::new);
            out.addAll(categorical("site", site, has, new ArrayList<>(new TreeSet<>(Arrays.asList(site)))));
        }
        for (String c : ex.spec().cohort().covariates()) {
            List<Double> yes = new ArrayList<>();
            List<Double> no = new ArrayList<>();
            for (int i = 0; i < d.n(); i++) {
                double v = d.subjects().get(i).covariate(c);
                if (!Double.isNaN(v)) {
                    (has[i] ? yes : no).add(v);
                }
            }
            double[] a = yes.stream().mapToDouble(Double::doubleValue).toArray();
            double[] b = no.stream().mapToDouble(Double::doubleValue).toArray();
            RankSum.Result r = RankSum.test(a, b);
            out.add(new Row(c, "", a.length, b.length, median(a), median(b), "rank-sum", r.z(), r.p(), ""));
        }
        return out;
    }

    private static List<Row> categorical(String variable, String[] value, boolean[] has, List<String> levels) {
        long[][] table = new long[levels.size()][2];
        for (int i = 0; i < value.length; i++) {
            table[levels.indexOf(value[i])][has[i] ? 0 : 1]++;
        }
        String test;
        double statistic = Double.NaN;
        double p;
        String caveat = "";
        if (levels.size() == 2) {
            test = "fisher-exact";
            p = FisherExact.twoSided((int) table[0][0], (int) table[0][1], (int) table[1][0], (int) table[1][1]);
        } else {
            long[] observed = new long[levels.size()];
            long[] missing = new long[levels.size()];
            for (int l = 0; l < levels.size(); l++) {
                observed[l] = table[l][0];
                missing[l] = table[l][1];
            }
            test = "freeman-halton";
            p = FreemanHalton.p(observed, missing);
            if (Double.isNaN(p)) { // too many tables to enumerate: the large-sample approximation
                test = "chi-square";
                TestResult t = ChiSquareIndependence.test(table);
                statistic = t.statistic();
                p = t.p();
                caveat = ChiSquareIndependence.smallExpected(table) ? "expected count below 5: approximate" : "";
            }
        }
        List<Row> out = new ArrayList<>();
        for (int l = 0; l < levels.size(); l++) {
            out.add(new Row(variable, levels.get(l), (int) table[l][0], (int) table[l][1], Double.NaN, Double.NaN,
                    test, statistic, p, caveat));
        }
        return out;
    }

    private static double median(double[] v) {
        if (v.length == 0) {
            return Double.NaN;
        }
        double[] s = v.clone();
        Arrays.sort(s);
        return s.length % 2 == 1 ? s[s.length / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
    }

    /** {@code missingness.csv}: one row per level of group and site and per covariate. */
    public static CsvTable table(List<Row> rows) {
        CsvTable t = new CsvTable("variable", "level", "target_observed", "target_missing", "median_observed",
                "median_missing", "test", "statistic", "p_value", "caveat");
        for (Row r : rows) {
            t.row().text(r.variable()).text(r.level()).integer(r.observed()).integer(r.missing())
                    .number(r.medianObserved()).number(r.medianMissing()).text(r.test()).number(r.statistic())
                    .number(r.pValue()).text(r.caveat());
        }
        return t;
    }

    /** The variables whose test has p at most alpha, in order, each once. */
    static List<String> associated(List<Row> rows, double alpha) {
        List<String> out = new ArrayList<>();
        for (Row r : rows) {
            if (r.pValue() <= alpha && !out.contains(r.variable())) {
                out.add(r.variable());
            }
        }
        return out;
    }

    /** The plain-text audit for {@code check}; one line when nothing is missing. */
    public static String text(Experiment ex) {
        if (ex.data().target() == null) {
            return "";
        }
        List<Row> rows = of(ex);
        if (rows.isEmpty()) {
            return "\nmissing targets: none (every subject has a target view)\n";
        }
        StringBuilder b = new StringBuilder("\nmissing targets, by variable (missing / subjects; two-sided test)\n");
        String variable = null;
        for (Row r : rows) {
            if (!r.variable().equals(variable)) {
                if (variable != null) {
                    b.append('\n');
                }
                variable = r.variable();
                b.append("  ").append(variable).append(':');
            }
            if (r.level().isEmpty()) {
                b.append(String.format(Locale.ROOT, " median %s with a target (n = %d), %s without (n = %d)",
                        CsvTable.formatNumber(r.medianObserved()), r.observed(),
                        CsvTable.formatNumber(r.medianMissing()), r.missing()));
            } else {
                b.append(' ').append(r.level()).append(' ').append(r.missing()).append('/')
                        .append(r.observed() + r.missing());
            }
            if (r.level().isEmpty() || r.equals(last(rows, variable))) {
                b.append("; ").append(testName(r.test())).append(" p = ").append(pText(r.pValue()));
                b.append(r.caveat().isEmpty() ? "" : " (" + r.caveat() + ")");
            }
        }
        b.append('\n');
        String w = warning(ex, rows);
        return b.append(w.isEmpty() ? "  no association at level " + CsvTable.formatNumber(alpha(ex))
                + " (which does not show that targets are missing at random)\n" : w.replace("[viewgain] ", "  "))
                .toString();
    }

    /** The warning {@code run} prints (and {@code check} ends with); empty when no test is significant. */
    public static String warning(Experiment ex) {
        return warning(ex, of(ex));
    }

    private static String warning(Experiment ex, List<Row> rows) {
        List<String> assoc = associated(rows, alpha(ex));
        if (assoc.isEmpty()) {
            return "";
        }
        List<String> complete = ex.spec().featureSets().stream().filter(FeatureSet::needsObservedTarget)
                .map(FeatureSet::label).toList();
        return "[viewgain] warning: whether the target view is missing is associated with "
                + String.join(", ", assoc) + " (p <= " + CsvTable.formatNumber(alpha(ex)) + ", unadjusted): "
                + (complete.isEmpty() ? "complete-case feature sets (target, source+target) would describe"
                : "the complete-case feature sets (" + String.join(", ", complete) + ") describe")
                + " a selected subgroup, not the cohort, and imputation's missing-at-random assumption is doubtful"
                + " (missingness.csv)\n";
    }

    private static Row last(List<Row> rows, String variable) {
        Row last = null;
        for (Row r : rows) {
            if (r.variable().equals(variable)) {
                last = r;
            }
        }
        return last;
    }

    static String testName(String test) {
        return switch (test) {
            case "fisher-exact" -> "Fisher's exact test";
            case "freeman-halton" -> "Freeman-Halton exact test";
            case "chi-square" -> "chi-square test";
            case "rank-sum" -> "Wilcoxon rank-sum test";
            default -> test;
        };
    }

    static String pText(double p) {
        return Double.isNaN(p) ? "undefined" : p < 0.001 ? String.format(Locale.ROOT, "%.1e", p)
                : String.format(Locale.ROOT, "%.3f", p);
    }

    private static double alpha(Experiment ex) {
        return ex.spec().significance().alpha();
    }
}
