package org.viewgain.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.testing.TestCohorts;

/**
 * A real open data set end to end through the command line: breast-cancer-wisconsin (Wolberg, Street &amp;
 * Mangasarian 1995, UCI, CC BY 4.0) as two tabular views, source = mean_* and target = worst_*, 30% of targets removed
 * at random.
 */
class BreastCancerEndToEndTest {
    @TempDir
    Path dir;

    @Test
    void givenBreastCancerViews_whenRunThroughCli_thenPlausibleAccuracyAndCompleteOutputs() throws IOException {
        TestCohorts.breastCancer(dir, 0.3, 2026);
        Path spec = TestCohorts.breastCancerSpec(dir, """
                imputers:
                  - { name: ridge, method: ridge, grid: { alpha: [0.1, 10] } }
                feature-sets: [source, target, source+imputed]
                classifiers:
                  - { name: forest, method: random-forest, fixed: { trees: 150 }, grid: { features-per-split: [sqrt, 0.5] } }
                validation: { outer: { folds: 5, repeats: 1 }, inner: { folds: 3 } }
                """);
        Path out = dir.resolve("results");
        CliTest.Outcome o = CliTest.run("run", spec.toString(), "--out", out.toString(), "--quiet");
        assertEquals(0, o.code(), o.err());
        Path run;
        try (var s = Files.list(out.resolve("bcw"))) {
            run = s.findFirst().orElseThrow();
        }
        for (String f : List.of("run.json", "folds.csv", "predictions.csv", "metrics.csv", "fold_metrics.csv",
                "hyperparameters.csv", "imputation.csv")) {
            assertTrue(Files.size(run.resolve(f)) > 0, f);
        }
        assertTrue(Files.readString(run.resolve("run.json")).contains("\"status\" : \"complete\""));
        Map<String, Double> ba = new HashMap<>();
        Map<String, Integer> n = new HashMap<>();
        List<String> lines = Files.readAllLines(run.resolve("metrics.csv"));
        List<String> head = List.of(lines.get(0).split(","));
        for (String line : lines.subList(1, lines.size())) {
            String[] c = line.split(",");
            if (c[head.indexOf("metric")].equals("balanced_accuracy")) {
                ba.put(c[head.indexOf("feature_set")], Double.parseDouble(c[head.indexOf("estimate")]));
                n.put(c[head.indexOf("feature_set")], Integer.parseInt(c[head.indexOf("n")]));
                double lo = Double.parseDouble(c[head.indexOf("ci_low")]);
                double hi = Double.parseDouble(c[head.indexOf("ci_high")]);
                assertTrue(lo < ba.get(c[1]) && ba.get(c[1]) < hi, "bootstrap interval around the estimate: " + line);
            }
        }
        // random-forest balanced accuracy on the mean_* view in 0.90-0.97: common practice, no source
        double source = ba.get("source");
        assertTrue(source >= 0.90 && source <= 0.97, "source balanced accuracy " + source);
        assertTrue(ba.get("target") > 0.90 && ba.get("source+imputed") > 0.90, ba.toString());
        assertEquals(569, n.get("source").intValue());
        assertEquals(569, n.get("source+imputed").intValue());
        assertTrue(n.get("target") > 350 && n.get("target") < 450, "about 70% have a target: " + n.get("target"));
        // imputation quality is reported for test subjects with an observed target only
        assertEquals(n.get("target") + 1, Files.readAllLines(run.resolve("imputation.csv")).size());
    }
}
