package org.viewgain.engine;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.ToDoubleFunction;

/** The imputation quality of a run aggregated per imputer and per target feature, for its tables. */
public final class ImputationAggregates {
    private ImputationAggregates() {
    }

    /** One imputer's mean absolute error on one target feature (base-vector order, e.g. {@code R1~R2}). */
    public record EdgeRow(String imputer, String feature, double mae) {
    }

    /**
     * One imputer: the number of subject-fold rows and of outer folds, the mean of each quality measure over the
     * subject-fold rows (non-finite values, e.g. an undefined correlation, left out), and {@code maeSd}, the standard
     * deviation over outer folds and repeats of the fold's mean MAE.
     */
    public record SummaryRow(String imputer, int subjectFolds, int folds, double maeMean, double maeSd,
                             double rmseMean, double pearsonMean, double strengthMaeMean, double skillMean) {
    }

    /**
     * Per imputer and target feature: the mean absolute error over all outer-test subjects with an observed target,
     * pooled over folds and repeats (nothing without a target view).
     */
    public static List<EdgeRow> edges(RunResults res) {
        List<EdgeRow> out = new ArrayList<>();
        var target = res.experiment().data().target();
        if (target == null) {
            return out;
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
                out.add(new EdgeRow(imputer, names.get(c), sum[c] / n));
            }
        }
        return out;
    }

    /** Per imputer with quality rows, in spec order: see {@link SummaryRow}. */
    public static List<SummaryRow> summary(RunResults res) {
        List<SummaryRow> out = new ArrayList<>();
        for (String imputer : imputerNames(res)) {
            List<RunResults.ImputationRow> rows = res.imputation().stream()
                    .filter(q -> q.imputer().equals(imputer)).toList();
            if (rows.isEmpty()) {
                continue;
            }
            Map<Long, double[]> perFold = new LinkedHashMap<>();
            for (RunResults.ImputationRow q : rows) {
                double[] acc = perFold.computeIfAbsent(((long) q.repeat() << 32) | q.fold(), k -> new double[2]);
                acc[0] += q.mae();
                acc[1]++;
            }
            double[] foldMae = perFold.values().stream().mapToDouble(a -> a[0] / a[1]).toArray();
            out.add(new SummaryRow(imputer, rows.size(), foldMae.length,
                    finiteMean(rows, RunResults.ImputationRow::mae), Evaluation.sd(foldMae),
                    finiteMean(rows, RunResults.ImputationRow::rmse),
                    finiteMean(rows, RunResults.ImputationRow::pearsonR),
                    finiteMean(rows, RunResults.ImputationRow::strengthMae),
                    finiteMean(rows, RunResults.ImputationRow::skill)));
        }
        return out;
    }

    /** Imputer names in spec order. */
    private static List<String> imputerNames(RunResults res) {
        return res.experiment().imputers().stream().map(Resolved.Imputer::name).toList();
    }

    /** Mean of the finite values; NaN when there are none. */
    private static double finiteMean(List<RunResults.ImputationRow> rows, ToDoubleFunction<RunResults.ImputationRow> f) {
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
}
