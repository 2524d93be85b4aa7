package org.viewgain.report;

/** Section 3, the charts: each from its own table, each replaced by a plain note when its table is absent. */
final class ChartsSection {
    private ChartsSection() {
    }

    static String html(ReportData d) {
        StringBuilder b = new StringBuilder("<section id=\"charts\"><h2>3. Charts</h2>\n");
        b.append(sub("chart-metrics", "Balanced accuracy and AUC per pipeline", MetricChart.html(d)));
        b.append(sub("chart-roc", "ROC curves per feature set", PredictionCharts.roc(d)));
        b.append(sub("chart-folds", "Per fold: source against source+imputed", FoldLines.html(d)));
        b.append(sub("chart-null", "Permutation null distributions", NullHistograms.html(d)));
        b.append(sub("chart-calibration", "Calibration", ReliabilityCharts.html(d)));
        b.append(sub("chart-imputation", "Imputation error", ImputationCharts.summary(d)
                + ImputationCharts.heatmaps(d)));
        b.append(sub("chart-importance", "Top features and their view", ImportanceChart.html(d)));
        String curve = AvailabilityChart.html(d);
        if (!curve.isEmpty()) {
            b.append(sub("chart-availability", "How many target scans are enough", curve));
        }
        return b.append("</section>\n").toString();
    }

    private static String sub(String id, String title, String body) {
        return "<div class=\"chart-block\" id=\"" + id + "\"><h3>" + Html.esc(title) + "</h3>\n" + body + "</div>\n";
    }
}
