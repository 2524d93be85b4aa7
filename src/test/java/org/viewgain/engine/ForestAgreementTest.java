package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.spec.SpecLoader;
import org.viewgain.testing.IrisCohort;
import org.viewgain.testing.TestCohorts;

/**
 * Weka's random forest and Smile's random forest, run by the engine on the same fold plan, agree in accuracy on
 * iris (Fisher 1936) and breast-cancer-wisconsin (Wolberg, Street &amp; Mangasarian 1995), both UCI, CC BY 4.0; and a
 * Weka classifier's predictions do not depend on the thread count.
 */
class ForestAgreementTest {
    @TempDir
    Path dir;

    static final String CLASSIFIERS = """
            feature-sets: [source]
            classifiers:
              - { name: smile, method: random-forest, fixed: { trees: 100 } }
              - { name: weka, method: weka, class: weka.classifiers.trees.RandomForest, options: "-I 100" }
            validation: { outer: { folds: 5, repeats: 2 }, inner: { folds: 3 } }
            """;

    static Map<String, Double> accuracy(Experiment ex, RunResults res) {
        return Evaluation.metrics(res).stream().filter(r -> r.metric().equals("accuracy"))
                .collect(Collectors.toMap(r -> r.pipeline().classifier(), Evaluation.MetricRow::estimate));
    }

    @Test
    void givenIris_whenBothForestsRunOnTheSameFolds_thenAccuraciesAgreeWithinFourPoints() {
        IrisCohort.write(dir);
        Experiment ex = Setup.prepare(SpecLoader.load(IrisCohort.spec(dir, CLASSIFIERS)));
        Map<String, Double> acc = accuracy(ex, new Runner(ex, 2, Progress.NONE).run());
        // both near 0.95 on iris (common practice, no source); "within a few points": 0.04
        assertTrue(acc.get("smile") > 0.9 && acc.get("weka") > 0.9, acc.toString());
        assertEquals(acc.get("smile"), acc.get("weka"), 0.04, acc.toString());
    }

    @Test
    void givenBreastCancer_whenBothForestsRunOnTheSameFolds_thenAccuraciesAgreeWithinThreePoints() throws IOException {
        TestCohorts.breastCancer(dir, 0.0, 1);
        Path spec = dir.resolve("spec.yaml");
        Files.writeString(spec, """
                experiment: bcw
                seed: 3
                cohort: { subjects: subjects.csv, group: diagnosis, groups: [benign, malignant], positive: malignant }
                views: { source: { table: source.csv } }
                """ + CLASSIFIERS.replace("repeats: 2", "repeats: 1").replace("100", "50"));
        Experiment ex = Setup.prepare(SpecLoader.load(spec));
        Map<String, Double> acc = accuracy(ex, new Runner(ex, 2, Progress.NONE).run());
        // random forests on the ten mean_* columns reach about 0.93-0.96 (common practice, no source)
        assertTrue(acc.get("smile") > 0.9 && acc.get("weka") > 0.9, acc.toString());
        assertEquals(acc.get("smile"), acc.get("weka"), 0.03, acc.toString());
    }

    @Test
    void givenAWekaClassifier_whenRunOnOneAndFourThreads_thenPredictionsAreIdentical() {
        IrisCohort.write(dir);
        Experiment ex = Setup.prepare(SpecLoader.load(IrisCohort.spec(dir, """
                feature-sets: [source]
                classifiers:
                  - { name: weka, method: weka, class: weka.classifiers.trees.RandomForest, options: "-I 20",
                      grid: { "-K": [1, 3] } }
                  - { name: wlog, method: weka, class: weka.classifiers.functions.Logistic, grid: { "-R": [1.0e-8, 1.0] } }
                validation: { outer: { folds: 5, repeats: 2 }, inner: { folds: 3 } }
                """)));
        List<RunResults.Prediction> one = new Runner(ex, 1, Progress.NONE).run().predictions();
        List<RunResults.Prediction> four = new Runner(ex, 4, Progress.NONE).run().predictions();
        assertEquals(one.size(), four.size());
        assertEquals(2 * 2 * 150, one.size());
        for (int k = 0; k < one.size(); k++) {
            RunResults.Prediction a = one.get(k);
            RunResults.Prediction b = four.get(k);
            assertEquals(a.pipeline(), b.pipeline());
            assertEquals(a.subject(), b.subject());
            assertEquals(a.predicted(), b.predicted());
            assertArrayEquals(a.scores(), b.scores(), 0.0);
        }
    }
}
