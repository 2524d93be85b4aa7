package org.viewgain.engine;

import java.util.List;

/**
 * What a finished run found, computed once, between the engine and the writers: the metrics with their intervals,
 * the per-fold metrics, the paired comparisons, the separation test, the confusion counts, the importance, the site
 * metrics, the availability curve's rows and the aggregated imputation quality. The tables and the printed summary
 * are written from this record and the run's data ({@link #results}); they compute nothing themselves.
 *
 * @param comparisons the paired comparisons, or null when the spec asks for none (no table is written)
 * @param siteMetrics per-site metrics, or null without a site column (no table is written)
 * @param availability the availability curve's rows, or null without a curve (no table is written)
 */
public record Analysis(RunResults results, List<Evaluation.MetricRow> metrics,
                       List<Evaluation.FoldMetricRow> foldMetrics, List<Comparisons.Row> comparisons,
                       List<Separation.Row> separation, List<Confusion.Cell> confusion, List<Importance.Row> importance,
                       List<SiteMetrics.Row> siteMetrics, List<AvailabilityRows.Row> availability,
                       List<ImputationAggregates.EdgeRow> imputationEdges,
                       List<ImputationAggregates.SummaryRow> imputationSummary) {
    public Analysis {
        metrics = List.copyOf(metrics);
        foldMetrics = List.copyOf(foldMetrics);
        comparisons = comparisons == null ? null : List.copyOf(comparisons);
        separation = List.copyOf(separation);
        confusion = List.copyOf(confusion);
        importance = List.copyOf(importance);
        siteMetrics = siteMetrics == null ? null : List.copyOf(siteMetrics);
        availability = availability == null ? null : List.copyOf(availability);
        imputationEdges = List.copyOf(imputationEdges);
        imputationSummary = List.copyOf(imputationSummary);
    }

    /** Computes everything a run's tables show, once. */
    public static Analysis of(RunResults res) {
        Experiment ex = res.experiment();
        return new Analysis(res, Evaluation.metrics(res), Evaluation.foldMetrics(res),
                ComparisonPairs.of(ex).isEmpty() ? null : Comparisons.of(res), Separation.of(res),
                Confusion.cells(res), Importance.rows(ex, res.importance()),
                ex.spec().cohort().site() == null ? null : SiteMetrics.rows(res),
                res.availability().isEmpty() ? null : AvailabilityRows.of(res), ImputationAggregates.edges(res),
                ImputationAggregates.summary(res));
    }
}
