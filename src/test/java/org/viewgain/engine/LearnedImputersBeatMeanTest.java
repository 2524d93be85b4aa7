package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.report.CsvTable;
import org.viewgain.report.ResultTables;
import org.viewgain.spec.SpecLoader;
import org.viewgain.testing.TestCohorts;

/**
 * Every learned imputer beats the {@code mean} imputer on MAE (imputation_summary.csv, outer-test subjects) on the
 * demo cohort and on the breast-cancer-wisconsin views (Wolberg, Street &amp; Mangasarian 1995, UCI): both have a
 * target view that depends on the source view, so any imputer that learns anything must do better than the
 * training mean. Small settings (3 outer folds, 1 repeat, fixed hyperparameters) keep it to seconds.
 */
class LearnedImputersBeatMeanTest {
    @TempDir
    Path dir;

    static final List<String> LEARNED = List.of("nn", "ridge", "pls", "mkn");

    static final String IMPUTERS = """
            imputers:
              - { name: avg,   method: mean }
              - { name: nn,    method: nearest-neighbours, fixed: { k: 10 } }
              - { name: ridge, method: ridge, fixed: { alpha: 10 } }
              - { name: pls,   method: pls, fixed: { components: 3 } }
              - { name: mkn,   method: multi-kernel-neighbours }
            imputed-for-training: observed
            feature-sets: [source+imputed]
            classifiers:
              - { name: knn, method: knn, fixed: { k: 5 } }
            validation: { outer: { folds: 3, repeats: 1 }, inner: { folds: 2 } }
            """;

    /** mae_mean per imputer from the summary table of a run. */
    static Map<String, Double> maeMean(Path spec) throws IOException {
        Experiment ex = Setup.prepare(SpecLoader.load(spec));
        RunResults res = new Runner(ex, 2, Progress.NONE).run();
        CsvTable summary = ResultTables.imputationSummary(ImputationAggregates.summary(res));
        StringWriter w = new StringWriter();
        summary.write(w);
        List<String> lines = w.toString().lines().toList();
        assertTrue(lines.get(0).startsWith("imputer,n_subject_folds,n_folds,mae_mean,"), lines.get(0));
        Map<String, Double> out = new LinkedHashMap<>();
        for (String l : lines.subList(1, lines.size())) {
            String[] c = l.split(",", -1);
            out.put(c[0], Double.parseDouble(c[3]));
        }
        return out;
    }

    static void assertAllBeatMean(Map<String, Double> mae) {
        assertEquals(5, mae.size(), mae.toString());
        for (String m : LEARNED) {
            assertTrue(mae.get(m) < mae.get("avg"), m + " vs mean: " + mae);
        }
    }

    @Test
    void givenDemoCohort_whenEveryImputerRuns_thenEachLearnedImputerHasLowerMaeThanMean() throws IOException {
        Path demo = Path.of("demo-data").toAbsolutePath();
        String text = Files.readString(Path.of("experiment-specs", "demo.yaml")).replace("../demo-data", demo.toString());
        String head = text.substring(0, text.indexOf("imputers:"));
        Path spec = dir.resolve("demo.yaml");
        Files.writeString(spec, head + IMPUTERS);
        assertAllBeatMean(maeMean(spec));
    }

    @Test
    void givenBreastCancerViews_whenEveryImputerRuns_thenEachLearnedImputerHasLowerMaeThanMean() throws IOException {
        TestCohorts.breastCancer(dir, 0.3, 2026);
        assertAllBeatMean(maeMean(TestCohorts.breastCancerSpec(dir, IMPUTERS)));
    }
}
