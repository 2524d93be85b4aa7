package org.viewgain.report;

import java.io.IOException;
import java.util.List;
import org.viewgain.engine.Analysis;
import org.viewgain.engine.RunResults;

/**
 * Writes every table of a finished run into its folder from its {@link Analysis} (computed before, once); the run
 * controller then marks run.json complete. Nothing here computes a statistic: the tables lay out the analysis and
 * the run's data.
 */
public final class RunWriter {
    private RunWriter() {
    }

    /** Writes the tables. */
    public static void write(RunFolder folder, Analysis a) throws IOException {
        RunResults res = a.results();
        folder.write("folds.csv", ResultTables.folds(res));
        folder.write("predictions.csv", ResultTables.predictions(res));
        folder.write("metrics.csv", ResultTables.metrics(a.metrics()));
        folder.write("fold_metrics.csv", ResultTables.foldMetrics(a.foldMetrics()));
        folder.write("hyperparameters.csv", ResultTables.hyperparameters(res));
        folder.write("hyperparameter_values.csv", ResultTables.hyperparameterValues(res));
        folder.write("imputation.csv", ResultTables.imputation(res));
        folder.write("imputation_edges.csv", ResultTables.imputationEdges(a.imputationEdges()));
        folder.write("imputation_summary.csv", ResultTables.imputationSummary(a.imputationSummary()));
        if (a.comparisons() != null) {
            folder.write("comparisons.csv", SignificanceTables.comparisons(a.comparisons()));
        }
        if (a.availability() != null) {
            folder.write(AvailabilityTable.FILE, AvailabilityTable.of(a.availability()));
        }
        if (!res.permutations().isEmpty()) {
            folder.write("permutations.csv", SignificanceTables.permutations(res.permutations()));
            folder.write("permutation_null.csv", SignificanceTables.permutationNull(res.permutations()));
        }
        folder.write("separation.csv", SignificanceTables.separation(a.separation()));
        folder.write("confusion.csv", ResultTables.confusion(a.confusion(),
                res.experiment().spec().cohort().groups()));
        folder.write("importance.csv", ResultTables.importance(a.importance()));
        folder.write("duplicates.csv", ResultTables.duplicates(res));
        List<MissingTargets.Row> missing = MissingTargets.of(res.experiment());
        if (!missing.isEmpty()) {
            folder.write("missingness.csv", MissingTargets.table(missing));
        }
        if (a.siteMetrics() != null) {
            folder.write("site_metrics.csv", ResultTables.siteMetrics(a.siteMetrics()));
        }
    }
}
