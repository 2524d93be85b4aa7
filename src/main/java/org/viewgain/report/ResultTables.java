package org.viewgain.report;

import java.util.List;
import org.viewgain.engine.Confusion;
import org.viewgain.engine.Duplicates;
import org.viewgain.engine.Evaluation;
import org.viewgain.engine.Experiment;
import org.viewgain.engine.Importance;
import org.viewgain.engine.RunResults;
import org.viewgain.engine.SiteMetrics;
import org.viewgain.folds.FoldPlan;

/** The tidy tables of a run, one fact per row, snake_case columns; repeats and folds are numbered from 1. */
public final class ResultTables {
    private ResultTables() {
    }

    public static CsvTable folds(RunResults res) {
        Experiment ex = res.experiment();
        FoldPlan plan = res.plan();
        CsvTable t = new CsvTable("repeat", "subject", "group", "site", "fold", "has_target");
        for (int r = 0; r < plan.repeats(); r++) {
            for (int i = 0; i < plan.size(); i++) {
                var s = ex.data().subjects().get(i);
                t.row().integer(r + 1).text(s.id()).text(s.group()).text(s.site() == null ? "" : s.site())
                        .integer(plan.foldOf(r, i) + 1).text(ex.data().hasTarget(i) ? "yes" : "no");
            }
        }
        return t;
    }

    public static CsvTable predictions(RunResults res) {
        List<String> groups = res.experiment().spec().cohort().groups();
        CsvTable t = new CsvTable("repeat", "fold", "subject", "imputer", "feature_set", "classifier", "truth",
                "predicted", "score");
        for (RunResults.Prediction p : res.predictions()) {
            t.row().integer(p.repeat() + 1).integer(p.fold() + 1).text(res.experiment().data().id(p.subject()))
                    .text(p.pipeline().imputer()).text(p.pipeline().featureSet().label())
                    .text(p.pipeline().classifier()).text(groups.get(p.truth())).text(groups.get(p.predicted()))
                    .number(p.score());
        }
        return t;
    }

    public static CsvTable metrics(List<Evaluation.MetricRow> rows) {
        CsvTable t = new CsvTable("imputer", "feature_set", "classifier", "metric", "estimate", "sd_over_repeats",
                "repeats", "n");
        for (Evaluation.MetricRow m : rows) {
            t.row().text(m.pipeline().imputer()).text(m.pipeline().featureSet().label()).text(m.pipeline().classifier())
                    .text(m.metric()).number(m.estimate()).number(m.sdOverRepeats()).integer(m.repeats())
                    .integer(m.n());
        }
        return t;
    }

    public static CsvTable foldMetrics(List<Evaluation.FoldMetricRow> rows) {
        CsvTable t = new CsvTable("imputer", "feature_set", "classifier", "repeat", "fold", "metric", "value", "n");
        for (Evaluation.FoldMetricRow m : rows) {
            t.row().text(m.pipeline().imputer()).text(m.pipeline().featureSet().label()).text(m.pipeline().classifier())
                    .integer(m.repeat() + 1).integer(m.fold() + 1).text(m.metric()).number(m.value()).integer(m.n());
        }
        return t;
    }

    public static CsvTable hyperparameters(RunResults res) {
        CsvTable t = new CsvTable("repeat", "fold", "stage", "imputer", "feature_set", "classifier", "chosen",
                "inner_score", "tuned_by", "grid_size");
        String tuneBy = res.experiment().spec().validation().tuneBy();
        for (RunResults.Choice c : res.choices()) {
            t.row().integer(c.repeat() + 1).integer(c.fold() + 1).text(c.stage()).text(c.imputer())
                    .text(c.featureSet()).text(c.classifier()).text(c.params()).number(c.innerScore())
                    .text(c.stage().equals("imputer") ? "mae" : tuneBy).integer(c.gridSize());
        }
        return t;
    }

    public static CsvTable imputation(RunResults res) {
        CsvTable t = new CsvTable("imputer", "repeat", "fold", "subject", "mae", "rmse", "pearson_r",
                "strength_mae");
        for (RunResults.ImputationRow q : res.imputation()) {
            t.row().text(q.imputer()).integer(q.repeat() + 1).integer(q.fold() + 1)
                    .text(res.experiment().data().id(q.subject())).number(q.mae()).number(q.rmse())
                    .number(q.pearsonR()).number(q.strengthMae());
        }
        return t;
    }

    /** confusion.csv: every truth x predicted cell per pipeline and repeat. */
    public static CsvTable confusion(RunResults res) {
        List<String> groups = res.experiment().spec().cohort().groups();
        CsvTable t = new CsvTable("imputer", "feature_set", "classifier", "repeat", "truth", "predicted", "count");
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
        CsvTable t = new CsvTable("imputer", "feature_set", "classifier", "feature", "view", "kind", "value");
        for (Importance.Row r : rows) {
            t.row().text(r.pipeline().imputer()).text(r.pipeline().featureSet().label()).text(r.pipeline().classifier())
                    .text(r.feature()).text(r.view()).text(r.kind()).number(r.value());
        }
        return t;
    }

    /** duplicates.csv: pairs of subjects whose source views correlate above {@code cohort.duplicate-threshold}. */
    public static CsvTable duplicates(RunResults res) {
        Experiment ex = res.experiment();
        CsvTable t = new CsvTable("subject_a", "subject_b", "correlation");
        for (Duplicates.Pair d : ex.duplicates()) {
            t.row().text(ex.data().id(d.a())).text(ex.data().id(d.b())).number(d.correlation());
        }
        return t;
    }
}
