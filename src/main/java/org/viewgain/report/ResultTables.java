package org.viewgain.report;

import java.util.List;
import org.viewgain.engine.Evaluation;
import org.viewgain.engine.Experiment;
import org.viewgain.engine.RunResults;
import org.viewgain.folds.FoldPlan;
import org.viewgain.engine.Confusion;
import org.viewgain.engine.Duplicates;
import org.viewgain.engine.Importance;
import org.viewgain.engine.SiteMetrics;

/** The tidy tables of a run, one fact per row, snake_case columns; repeats and folds are numbered from 1. */
public final class ResultTables {
    private ResultTables() {
    }

    public static CsvTable folds(RunResults res) {
        Experiment ex = res.experiment();
        FoldPlan plan = res.plan();
        CsvTable t = new CsvTable("repetition", "subject", "group", "site", "fold", "has_target");
        for (int r = 0; r < plan.repeats(); r++) {
            for (int i = 0; i < plan.size(); i++) {
                var s = ex.data().subjects().get(i);
                t.row().integer(r + 1).text(s.id()).text(s.group()).text(s.site() == null ? "" : s.site())
                        .integer(plan.foldOf(r, i) + 1).text(ex.data().hasTarget(i) ? "true" : "false");
            }
        }
        return t;
    }

    public static CsvTable predictions(RunResults res) {
        List<String> groups = res.experiment().spec().cohort().groups();
        CsvTable t = new CsvTable("repetition", "fold", "subject", "imputer", "feature_set", "classifier", "truth",
                "predicted", "score", "score_kind");
        for (RunResults.Prediction p : res.predictions()) {
            t.row().integer(p.repeat() + 1).integer(p.fold() + 1).text(res.experiment().data().id(p.subject()))
                    .text(p.pipeline().imputer()).text(p.pipeline().featureSet().label())
                    .text(p.pipeline().classifier()).text(groups.get(p.truth())).text(groups.get(p.predicted()))
                    .number(p.score())
                    .text(res.experiment().classifier(p.pipeline().classifier()).method().scoreKind());
        }
        return t;
    }

    public static CsvTable metrics(List<Evaluation.MetricRow> rows) {
        CsvTable t = new CsvTable("imputer", "feature_set", "classifier", "metric", "estimate", "sd_over_repeats",
                "ci_low", "ci_high", "ci_method", "repeats", "n");
        for (Evaluation.MetricRow m : rows) {
            t.row().text(m.pipeline().imputer()).text(m.pipeline().featureSet().label()).text(m.pipeline().classifier())
                    .text(m.metric()).number(m.estimate()).number(m.sdOverRepeats()).number(m.ciLow())
                    .number(m.ciHigh()).text(m.ciMethod()).integer(m.repeats()).integer(m.n());
        }
        return t;
    }

    public static CsvTable foldMetrics(List<Evaluation.FoldMetricRow> rows) {
        CsvTable t = new CsvTable("imputer", "feature_set", "classifier", "repetition", "fold", "metric", "estimate",
                "n");
        for (Evaluation.FoldMetricRow m : rows) {
            t.row().text(m.pipeline().imputer()).text(m.pipeline().featureSet().label()).text(m.pipeline().classifier())
                    .integer(m.repeat() + 1).integer(m.fold() + 1).text(m.metric()).number(m.value()).integer(m.n());
        }
        return t;
    }

    public static CsvTable hyperparameters(RunResults res) {
        CsvTable t = new CsvTable("repetition", "fold", "stage", "imputer", "feature_set", "classifier", "chosen",
                "inner_score", "tuned_by", "grid_size", "unconverged_fits");
        String tuneBy = res.experiment().spec().validation().tuneByColumn();
        for (RunResults.Choice c : res.choices()) {
            t.row().integer(c.repeat() + 1).integer(c.fold() + 1).text(c.stage()).text(c.imputer())
                    .text(c.featureSet()).text(c.classifier()).text(c.params()).number(c.innerScore())
                    .text(c.stage().equals("imputer") ? "mae" : tuneBy).integer(c.gridSize())
                    .integer(c.unconverged());
        }
        return t;
    }

    /**
     * The same choices in long form, one row per chosen parameter ({@code chosen} of hyperparameters.csv split at
     * {@code ;} and the first {@code =}), so that a data frame can filter on a parameter and its value.
     */
    public static CsvTable hyperparameterValues(RunResults res) {
        CsvTable t = new CsvTable("repetition", "fold", "stage", "imputer", "feature_set", "classifier", "parameter",
                "value");
        for (RunResults.Choice c : res.choices()) {
            if (c.params() == null || c.params().isEmpty()) {
                continue;
            }
            for (String part : c.params().split(";")) {
                int eq = part.indexOf('=');
                if (eq <= 0) {
                    continue;
                }
                t.row().integer(c.repeat() + 1).integer(c.fold() + 1).text(c.stage()).text(c.imputer())
                        .text(c.featureSet()).text(c.classifier()).text(part.substring(0, eq))
                        .text(part.substring(eq + 1));
            }
        }
        return t;
    }

    /** Imputation quality per imputer, repeat, fold and outer-test subject with an observed target. */
    public static CsvTable imputation(RunResults res) {
        CsvTable t = new CsvTable("imputer", "repetition", "fold", "subject", "mae", "rmse", "pearson_r",
                "strength_mae", "skill");
        for (RunResults.ImputationRow q : res.imputation()) {
            t.row().text(q.imputer()).integer(q.repeat() + 1).integer(q.fold() + 1)
                    .text(res.experiment().data().id(q.subject())).number(q.mae()).number(q.rmse())
                    .number(q.pearsonR()).number(q.strengthMae()).number(q.skill());
        }
        return t;
    }

    /**
     * Per imputer and target feature (base-vector order, e.g. {@code R1~R2}): the mean absolute error over all
     * outer-test subjects with an observed target, pooled over folds and repeats.
     */
    public static CsvTable imputationEdges(RunResults res) {
        CsvTable t = new CsvTable("imputer", "feature", "mae");
        var target = res.experiment().data().target();
        if (target == null) {
            return t;
        }
        List<String> names = target.baseNames();
        for (String imputer : imputerNames(res)) {
            double[] sum = new double[names.size()];
            long n = 0;
            for (RunResults.EdgeErrors e : res.edgeErrors()) {
                if (e.imputer().equals(imputer)) {
                    for (int c = 0; c < sum.length; c++) {
                        sum[c] += e.sum()[c];
                    }
                    n += e.subjects();
                }
            }
            for (int c = 0; c < sum.length && n > 0; c++) {
                t.row().text(imputer).text(names.get(c)).number(sum[c] / n);
            }
        }
        return t;
    }

    /**
     * Per imputer: the number of subject-fold rows and of outer folds, the mean of each quality measure over the
     * subject-fold rows (non-finite values, e.g. an undefined correlation, left out), and {@code mae_sd}, the standard
     * deviation over outer folds and repeats of the fold's mean MAE.
     */
    public static CsvTable imputationSummary(RunResults res) {
        CsvTable t = new CsvTable("imputer", "n_subject_folds", "n_folds", "mae_mean", "mae_sd", "rmse_mean",
                "pearson_r_mean", "strength_mae_mean", "skill_mean");
        for (String imputer : imputerNames(res)) {
            List<RunResults.ImputationRow> rows = res.imputation().stream()
                    .filter(q -> q.imputer().equals(imputer)).toList();
            if (rows.isEmpty()) {
                continue;
            }
            java.util.Map<Long, double[]> perFold = new java.util.LinkedHashMap<>();
            for (RunResults.ImputationRow q : rows) {
                double[] acc = perFold.computeIfAbsent(((long) q.repeat() << 32) | q.fold(), k -> new double[2]);
                acc[0] += q.mae();
                acc[1]++;
            }
            double[] foldMae = perFold.values().stream().mapToDouble(a -> a[0] / a[1]).toArray();
            t.row().text(imputer).integer(rows.size()).integer(foldMae.length)
                    .number(finiteMean(rows, RunResults.ImputationRow::mae)).number(sd(foldMae))
                    .number(finiteMean(rows, RunResults.ImputationRow::rmse))
                    .number(finiteMean(rows, RunResults.ImputationRow::pearsonR))
                    .number(finiteMean(rows, RunResults.ImputationRow::strengthMae))
                    .number(finiteMean(rows, RunResults.ImputationRow::skill));
        }
        return t;
    }

    /** Imputer names in spec order. */
    private static List<String> imputerNames(RunResults res) {
        return res.experiment().imputers().stream().map(org.viewgain.engine.Resolved.Imputer::name).toList();
    }

    /** Mean of the finite values; NaN when there are none. */
    private static double finiteMean(List<RunResults.ImputationRow> rows,
                                     java.util.function.ToDoubleFunction<RunResults.ImputationRow> f) {
        double s = 0;
        int n = 0;
        for (RunResults.ImputationRow q : rows) {
            double v = f.applyAsDouble(q);
            if (Double.isFinite(v)) {
                s += v;
                n++;
            }
        }
        return n > 0 ? s / n : Double.NaN;
    }

    /** Sample standard deviation (n - 1); NaN for fewer than two values. */
    private static double sd(double[] v) {
        if (v.length < 2) {
            return Double.NaN;
        }
        double m = 0;
        for (double x : v) {
            m += x;
        }
        m /= v.length;
        double ss = 0;
        for (double x : v) {
            ss += (x - m) * (x - m);
        }
        return Math.sqrt(ss / (v.length - 1));
    }

    /** confusion.csv: every truth x predicted cell per pipeline and repeat. */
    public static CsvTable confusion(RunResults res) {
        List<String> groups = res.experiment().spec().cohort().groups();
        CsvTable t = new CsvTable("imputer", "feature_set", "classifier", "repetition", "truth", "predicted", "count");
        for (Confusion.Cell c : Confusion.cells(res)) {
            t.row().text(c.pipeline().imputer()).text(c.pipeline().featureSet().label()).text(c.pipeline().classifier())
                    .integer(c.repeat() + 1).text(groups.get(c.truth())).text(groups.get(c.predicted()))
                    .integer(c.count());
        }
        return t;
    }

    /** site_metrics.csv: metrics of each pipeline within each site (mean over repeats). */
    public static CsvTable siteMetrics(RunResults res) {
        CsvTable t = new CsvTable("imputer", "feature_set", "classifier", "site", "metric", "estimate", "n");
        for (SiteMetrics.Row m : SiteMetrics.rows(res)) {
            t.row().text(m.pipeline().imputer()).text(m.pipeline().featureSet().label()).text(m.pipeline().classifier())
                    .text(m.site()).text(m.metric()).number(m.estimate()).integer(m.n());
        }
        return t;
    }

    /** importance.csv: selection frequency and model importance per pipeline and feature. */
    public static CsvTable importance(List<Importance.Row> rows) {
        CsvTable t = new CsvTable("imputer", "feature_set", "classifier", "feature", "view", "kind", "estimate");
        for (Importance.Row r : rows) {
            t.row().text(r.pipeline().imputer()).text(r.pipeline().featureSet().label()).text(r.pipeline().classifier())
                    .text(r.feature()).text(r.view()).text(r.kind()).number(r.value());
        }
        return t;
    }

    public static CsvTable duplicates(RunResults res) {
        Experiment ex = res.experiment();
        CsvTable t = new CsvTable("subject_a", "subject_b", "correlation");
        for (Duplicates.Pair d : ex.duplicates()) {
            t.row().text(ex.data().id(d.a())).text(ex.data().id(d.b())).number(d.correlation());
        }
        return t;
    }
}
