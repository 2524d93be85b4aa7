package org.viewgain.report;

import java.util.List;
import org.viewgain.engine.Evaluation;
import org.viewgain.engine.Experiment;
import org.viewgain.engine.RunResults;
import org.viewgain.folds.FoldPlan;
import org.viewgain.engine.Confusion;
import org.viewgain.engine.Duplicates;
import org.viewgain.engine.Importance;
import org.viewgain.engine.ImputationAggregates;
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

    /** Per imputer and target feature: the pooled mean absolute error ({@code ImputationAggregates.edges}). */
    public static CsvTable imputationEdges(List<ImputationAggregates.EdgeRow> rows) {
        CsvTable t = new CsvTable("imputer", "feature", "mae");
        for (ImputationAggregates.EdgeRow r : rows) {
            t.row().text(r.imputer()).text(r.feature()).number(r.mae());
        }
        return t;
    }

    /** Per imputer: counts and mean quality measures ({@code ImputationAggregates.summary}). */
    public static CsvTable imputationSummary(List<ImputationAggregates.SummaryRow> rows) {
        CsvTable t = new CsvTable("imputer", "n_subject_folds", "n_folds", "mae_mean", "mae_sd", "rmse_mean",
                "pearson_r_mean", "strength_mae_mean", "skill_mean");
        for (ImputationAggregates.SummaryRow r : rows) {
            t.row().text(r.imputer()).integer(r.subjectFolds()).integer(r.folds()).number(r.maeMean())
                    .number(r.maeSd()).number(r.rmseMean()).number(r.pearsonMean()).number(r.strengthMaeMean())
                    .number(r.skillMean());
        }
        return t;
    }

    /** confusion.csv: every truth x predicted cell per pipeline and repeat. */
    public static CsvTable confusion(List<Confusion.Cell> cells, List<String> groups) {
        CsvTable t = new CsvTable("imputer", "feature_set", "classifier", "repetition", "truth", "predicted", "count");
        for (Confusion.Cell c : cells) {
            t.row().text(c.pipeline().imputer()).text(c.pipeline().featureSet().label()).text(c.pipeline().classifier())
                    .integer(c.repeat() + 1).text(groups.get(c.truth())).text(groups.get(c.predicted()))
                    .integer(c.count());
        }
        return t;
    }

    /** site_metrics.csv: metrics of each pipeline within each site (mean over repeats). */
    public static CsvTable siteMetrics(List<SiteMetrics.Row> rows) {
        CsvTable t = new CsvTable("imputer", "feature_set", "classifier", "site", "metric", "estimate", "n");
        for (SiteMetrics.Row m : rows) {
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
