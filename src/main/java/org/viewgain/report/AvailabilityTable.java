package org.viewgain.report;

import java.util.List;
import org.viewgain.engine.AvailabilityRows;

/** {@code availability.csv}: the availability curve, one row per level, imputer, classifier and measure. */
final class AvailabilityTable {
    static final String FILE = "availability.csv";

    private AvailabilityTable() {
    }

    static CsvTable of(List<AvailabilityRows.Row> rows) {
        CsvTable t = new CsvTable("level", "fraction", "count", "full_data", "targets_mean", "targets_min",
                "targets_max", "imputer", "classifier", "measure", "estimate", "ci_low", "ci_high", "ci_method", "n");
        for (AvailabilityRows.Row r : rows) {
            CsvTable.Row row = t.row().integer(r.level()).number(r.fraction());
            if (r.count() < 0) {
                row.text("");
            } else {
                row.integer(r.count());
            }
            row.text(Boolean.toString(r.full())).number(r.targetsMean()).integer(r.targetsMin())
                    .integer(r.targetsMax()).text(r.imputer()).text(r.classifier()).text(r.measure())
                    .number(r.estimate()).number(r.ciLow()).number(r.ciHigh()).text(r.ciMethod()).integer(r.n());
        }
        return t;
    }
}
