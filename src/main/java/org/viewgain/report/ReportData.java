package org.viewgain.report;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.dataformat.yaml.YAMLFactory;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import org.viewgain.spec.BadInputException;

/**
 * Everything the report shows, read from a finished run folder: run.json and the tidy tables. Optional tables that
 * a run did not write are null; nothing here needs the engine or the input data.
 */
final class ReportData {
    final Path dir;
    final JsonNode run;
    final JsonNode spec;
    final CsvRows folds;
    final CsvRows predictions;
    final CsvRows metrics;
    final CsvRows foldMetrics;
    final CsvRows hyperparameters;
    final CsvRows imputation;
    final CsvRows permutations;
    final CsvRows permutationNull;
    final CsvRows comparisons;
    final CsvRows separation;
    final CsvRows importance;
    final CsvRows imputationEdges;
    final CsvRows confusion;
    final CsvRows cohortFlow;
    final CsvRows missingness;
    final CsvRows availability;
    final Redactor redact;

    private ReportData(Path dir, boolean redactIds) throws IOException {
        this.dir = dir;
        RunFolder.existing(dir); // refuses a folder without run.json
        Path runJson = dir.resolve("run.json");
        ObjectMapper json = new ObjectMapper();
        run = json.readTree(runJson.toFile());
        int schema = run.path("schema_version").asInt(0);
        if (schema > Provenance.SCHEMA_VERSION) {
            throw new BadInputException(runJson + ": schema_version " + schema + " is newer than this viewgain reads ("
                    + Provenance.SCHEMA_VERSION + "); use a newer viewgain");
        }
        spec = parseSpec(run.path("spec_text").asText(""));
        folds = CsvRows.readIfPresent(dir, "folds.csv");
        predictions = CsvRows.readIfPresent(dir, "predictions.csv");
        metrics = CsvRows.readIfPresent(dir, "metrics.csv");
        foldMetrics = CsvRows.readIfPresent(dir, "fold_metrics.csv");
        hyperparameters = CsvRows.readIfPresent(dir, "hyperparameters.csv");
        imputation = CsvRows.readIfPresent(dir, "imputation.csv");
        permutations = CsvRows.readIfPresent(dir, "permutations.csv");
        permutationNull = CsvRows.readIfPresent(dir, "permutation_null.csv");
        comparisons = CsvRows.readIfPresent(dir, "comparisons.csv");
        separation = CsvRows.readIfPresent(dir, "separation.csv");
        importance = CsvRows.readIfPresent(dir, "importance.csv");
        imputationEdges = CsvRows.readIfPresent(dir, "imputation_edges.csv");
        confusion = CsvRows.readIfPresent(dir, "confusion.csv");
        cohortFlow = CsvRows.readIfPresent(dir, "cohort_flow.csv");
        missingness = CsvRows.readIfPresent(dir, "missingness.csv");
        availability = CsvRows.readIfPresent(dir, AvailabilityTable.FILE);
        redact = new Redactor(redactIds, subjectIds());
    }

    /** Reads a run folder; a folder without run.json is a user error. */
    static ReportData read(Path dir, boolean redactIds) throws IOException {
        return new ReportData(dir, redactIds);
    }

    /** Subject ids in order of first appearance: folds.csv, then predictions and imputation tables. */
    private List<String> subjectIds() {
        Set<String> ids = new LinkedHashSet<>();
        for (CsvRows t : new CsvRows[] {folds, predictions, imputation}) {
            if (t != null) {
                t.rows().forEach(r -> ids.add(r.s("subject")));
            }
        }
        ids.remove("");
        return new ArrayList<>(ids);
    }

    private static JsonNode parseSpec(String text) {
        try {
            JsonNode n = new ObjectMapper(new YAMLFactory()).readTree(text);
            return n == null ? new ObjectMapper().createObjectNode() : n;
        } catch (IOException | RuntimeException e) {
            return new ObjectMapper().createObjectNode();
        }
    }

    /** The significance level from the spec, 0.05 when not given. */
    double alpha() {
        double a = spec.path("significance").path("alpha").asDouble(0.05);
        return a > 0 && a < 1 ? a : 0.05;
    }

    /** The group treated as positive: the spec's {@code cohort.positive}, else the second group in the spec. */
    String positive() {
        String p = spec.path("cohort").path("positive").asText("");
        if (!p.isEmpty()) {
            return p;
        }
        JsonNode groups = spec.path("cohort").path("groups");
        return groups.size() >= 2 ? groups.get(1).asText() : "";
    }

    /** The run id: the name of the run folder. */
    String runId() {
        Path name = dir.toAbsolutePath().normalize().getFileName();
        return name == null ? "" : name.toString();
    }
}
