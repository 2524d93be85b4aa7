package org.viewgain.report;

import java.io.IOException;
import java.util.List;
import org.viewgain.engine.Evaluation;
import org.viewgain.engine.RunResults;

/** Writes every table of a finished run into its folder, then marks run.json complete. */
public final class RunWriter {
    private RunWriter() {
    }

    /** Writes the tables; run.json is written last with status complete. */
    public static void write(RunFolder folder, RunResults res, Provenance prov, List<Evaluation.MetricRow> metrics)
            throws IOException {
        folder.write("folds.csv", ResultTables.folds(res));
        folder.write("predictions.csv", ResultTables.predictions(res));
        folder.write("metrics.csv", ResultTables.metrics(metrics));
        folder.write("fold_metrics.csv", ResultTables.foldMetrics(Evaluation.foldMetrics(res)));
        folder.write("hyperparameters.csv", ResultTables.hyperparameters(res));
        folder.write("hyperparameter_values.csv", ResultTables.hyperparameterValues(res));
        folder.write("imputation.csv", ResultTables.imputation(res));
        folder.write("imputation_edges.csv", ResultTables.imputationEdges(res));
        folder.write("imputation_summary.csv", ResultTables.imputationSummary(res));
        if (!org.viewgain.engine.ComparisonPairs.of(res.experiment()).isEmpty()) {
            folder.write("comparisons.csv", SignificanceTables.comparisons(org.viewgain.engine.Comparisons.of(res)));
        }
        if (!res.availability().isEmpty()) {
            folder.write(AvailabilityTable.FILE, AvailabilityTable.of(res));
        }
        if (!res.permutations().isEmpty()) {
            folder.write("permutations.csv", SignificanceTables.permutations(res.permutations()));
            folder.write("permutation_null.csv", SignificanceTables.permutationNull(res.permutations()));
        }
        folder.write("separation.csv", SignificanceTables.separation(org.viewgain.engine.Separation.of(res)));
        folder.write("confusion.csv", ResultTables.confusion(res));
        folder.write("importance.csv", ResultTables.importance(
                org.viewgain.engine.Importance.rows(res.experiment(), res.importance())));
        folder.write("duplicates.csv", ResultTables.duplicates(res));
        List<MissingTargets.Row> missing = MissingTargets.of(res.experiment());
        if (!missing.isEmpty()) {
            folder.write("missingness.csv", MissingTargets.table(missing));
        }
        if (res.experiment().spec().cohort().site() != null) {
            folder.write("site_metrics.csv", ResultTables.siteMetrics(res));
        }
        prov.put("status", "complete");
        folder.writeText("run.json", prov.toJson());
    }
}
