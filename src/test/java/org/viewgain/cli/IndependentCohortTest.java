package org.viewgain.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.demo.ScaleCohort;

/**
 * Final pipelines applied to an independent cohort, end to end on planted-truth cohorts (simulations with known
 * truth, invented data): a development cohort with 70% observed targets and an independent cohort of the same
 * invented population that never acquired the target.
 */
class IndependentCohortTest {
    @TempDir
    Path dir;

    static final String SPEC = """
            experiment: indep
            seed: 11
            cohort: { subjects: dev/subjects.csv, groups: [control, patient], positive: patient, site: site }
            views:
              source: { matrices: "dev/views/thickness/{subject}.csv" }
              target: { matrices: "dev/views/area/{subject}.csv", missing: allowed }
            imputers: [ { name: ridge, method: ridge, grid: { alpha: [1, 100] } } ]
            feature-sets: [source, source+imputed]
            classifiers: [ { name: svm, method: svm-linear, grid: { C: [0.01, 1] } } ]
            validation: { outer: { folds: 3 }, inner: { folds: 3 } }
            significance: { bootstrap: 200 }
            independent-cohort:
              name: later-clinic
              subjects: ext/subjects.csv
              group: group
              site: site
              views: { source: { matrices: "ext/views/thickness/{subject}.csv" } }
            """;

    /** Writes the two cohorts (population seed 5) and the spec; returns the spec. */
    Path cohorts(double shift, int dev, int ext) throws IOException {
        ScaleCohort.write(dir.resolve("dev"), dev, 10, 5, 5, "d", 0.3, shift);
        ScaleCohort.write(dir.resolve("ext"), ext, 10, 5, 6, "e", 1.0, shift);
        Path spec = dir.resolve("spec.yaml");
        Files.writeString(spec, SPEC);
        return spec;
    }

    static Map<String, Double> metric(Path run, String file, String metric) throws IOException {
        Map<String, Double> out = new HashMap<>();
        List<String> lines = Files.readAllLines(run.resolve(file));
        for (String l : lines.subList(1, lines.size())) {
            String[] c = l.split(",");
            if (c[4].equals(metric)) {
                out.put(c[1] + "/" + c[2] + "/" + c[3], Double.parseDouble(c[5]));
            }
        }
        return out;
    }

    @Test
    void givenPlantedGain_whenRunWithAnIndependentCohort_thenSourcePlusImputedBeatsSourceThere() throws IOException {
        Path spec = cohorts(2.0, 150, 200);
        CliTest.Outcome o = CliTest.run("run", spec.toString(), "--out", dir.resolve("out").toString(), "--quiet",
                "--threads", "2", "--verbose");
        assertEquals(0, o.code(), o.err());
        Path run = RunTables.only(dir.resolve("out"), "indep");
        assertTrue(Files.isRegularFile(run.resolve("bundle/manifest.json")));
        assertTrue(Files.isRegularFile(run.resolve("external_predictions.csv")));
        Map<String, Double> auc = metric(run, "external_metrics.csv", "auc");
        System.out.println(auc);
        System.out.println(Files.readString(run.resolve("external_comparisons.csv")));
    }
}
