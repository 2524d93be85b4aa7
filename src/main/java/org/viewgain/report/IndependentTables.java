package org.viewgain.report;

import java.io.IOException;
import org.viewgain.engine.Bundle;
import org.viewgain.engine.Duplicates;
import org.viewgain.engine.Experiment;
import org.viewgain.engine.IndependentData;
import org.viewgain.engine.FinalPipelines;
import org.viewgain.engine.IndependentResults;

/**
 * The outputs of final pipelines: {@code bundle/}, {@code final_pipelines.csv}, and for an independent cohort
 * {@code external_predictions.csv}, {@code external_metrics.csv} (labels given), {@code external_comparisons.csv}
 * (labels given, source+imputed and source both run), {@code external_imputation.csv} (some targets observed) and
 * {@code external_duplicates.csv}.
 * Columns are documented in docs/report.md.
 */
public final class IndependentTables {
    private IndependentTables() {
    }

    /** Writes the bundle and the final pipelines' table of a run. */
    public static void writeFinals(RunFolder folder, FinalPipelines f, String specSha256) throws IOException {
        Bundle.write(folder.dir().resolve(Bundle.DIR), f, specSha256);
        CsvTable t = new CsvTable("imputer", "feature_set", "classifier", "chosen", "inner_score", "imputer_chosen");
        for (FinalPipelines.Entry e : f.entries()) {
            var p = e.pipeline();
            t.row().text(p.imputer()).text(p.featureSet().label()).text(p.classifier()).text(e.chosen())
                    .number(e.innerScore())
                    .text(f.imputerChoices().getOrDefault(p.imputer(), ""));
        }
        folder.write("final_pipelines.csv", t);
    }

    /**
     * Writes {@code external_duplicates.csv}: pairs of an independent and a development subject whose source views
     * correlate above {@code cohort.duplicate-threshold} (header only when there are none).
     */
    public static void writeDuplicates(RunFolder folder, Experiment ex) throws IOException {
        IndependentData ind = ex.independent();
        CsvTable t = new CsvTable("cohort", "independent_subject", "development_subject", "correlation");
        for (Duplicates.Pair d : ind.duplicates()) {
            t.row().text(ind.spec().name()).text(ind.id(d.b())).text(ex.data().id(d.a())).number(d.correlation());
        }
        folder.write("external_duplicates.csv", t);
    }

    /** Writes the independent cohort's tables into {@code folder}. */
    public static void write(RunFolder folder, IndependentResults r) throws IOException {
        CsvTable p = new CsvTable("cohort", "subject", "imputer", "feature_set", "classifier", "truth", "predicted",
                "score");
        for (IndependentResults.Row x : r.predictions()) {
            p.row().text(r.cohort()).text(x.subject()).text(x.pipeline().imputer())
                    .text(x.pipeline().featureSet().label()).text(x.pipeline().classifier())
                    .text(x.truth() == null ? "" : x.truth()).text(x.predicted()).number(x.score());
        }
        folder.write("external_predictions.csv", p);
        if (!r.metrics().isEmpty()) {
            CsvTable m = new CsvTable("cohort", "imputer", "feature_set", "classifier", "metric", "estimate", "ci_low",
                    "ci_high", "ci_method", "n");
            for (IndependentResults.Metric x : r.metrics()) {
                m.row().text(r.cohort()).text(x.pipeline().imputer()).text(x.pipeline().featureSet().label())
                        .text(x.pipeline().classifier()).text(x.metric()).number(x.estimate()).number(x.low())
                        .number(x.high()).text(x.method()).integer(x.n());
            }
            folder.write("external_metrics.csv", m);
        }
        if (!r.comparisons().isEmpty()) {
            CsvTable c = new CsvTable("cohort", "a", "b", "test", "estimate_a", "estimate_b", "statistic", "p", "n");
            for (IndependentResults.Comparison x : r.comparisons()) {
                c.row().text(r.cohort()).text(x.a().label()).text(x.b().label()).text(x.test())
                        .number(x.estimateA()).number(x.estimateB()).number(x.statistic()).number(x.p())
                        .integer(x.n());
            }
            folder.write("external_comparisons.csv", c);
        }
        if (!r.quality().isEmpty()) {
            CsvTable q = new CsvTable("cohort", "imputer", "subject", "mae", "rmse", "pearson_r");
            for (IndependentResults.Quality x : r.quality()) {
                q.row().text(r.cohort()).text(x.imputer()).text(x.subject()).number(x.mae()).number(x.rmse())
                        .number(x.pearsonR());
            }
            folder.write("external_imputation.csv", q);
        }
    }
}
