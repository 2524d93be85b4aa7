package org.viewgain.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.engine.Experiment;
import org.viewgain.engine.Progress;
import org.viewgain.engine.RunResults;
import org.viewgain.engine.Runner;
import org.viewgain.engine.Setup;
import org.viewgain.spec.SpecLoader;
import org.viewgain.testing.IrisCohort;
import weka.core.Attribute;
import weka.core.DenseInstance;
import weka.core.Instances;

/**
 * Three groups end to end through the command line on Fisher's iris (Fisher 1936; UCI, CC BY 4.0): macro metrics,
 * the confusion matrix, the predicted group's score in predictions.csv, and the macro AUC checked against Weka 3.8.6's
 * {@code Evaluation.areaUnderROC(k)} (one class against the rest) averaged without weights over the three classes,
 * computed on the same per-class scores.
 */
class IrisEndToEndTest {
    @TempDir
    Path dir;

    static final String BODY = """
            features: { select: { method: anova, keep: [2, 4] } }
            feature-sets: [source]
            classifiers:
              - { name: forest, method: random-forest, fixed: { trees: 60 } }
              - { name: lr, method: logistic, grid: { lambda: [0.01, 1] } }
            validation: { outer: { folds: 5 }, inner: { folds: 3 } }
            """;

    static Map<String, String> metric(Path run, String name) throws IOException {
        Map<String, String> out = new HashMap<>();
        for (String line : Files.readAllLines(run.resolve("metrics.csv"))) {
            String[] c = line.split(",", -1);
            if (c[3].equals(name)) {
                out.put(c[2], c[4]);
            }
        }
        return out;
    }

    /** Weka's one-vs-rest ROC area of each class, averaged without weights. */
    static double wekaMacroAuc(List<RunResults.Prediction> ps, List<String> groups) throws Exception {
        ArrayList<Attribute> atts = new ArrayList<>();
        atts.add(new Attribute("x"));
        atts.add(new Attribute("group", groups));
        Instances header = new Instances("scores", atts, ps.size());
        header.setClassIndex(1);
        weka.classifiers.Evaluation eval = new weka.classifiers.Evaluation(header);
        for (RunResults.Prediction p : ps) {
            DenseInstance inst = new DenseInstance(1.0, new double[] {0, p.truth()});
            inst.setDataset(header);
            eval.evaluateModelOnceAndRecordPrediction(p.scores().clone(), inst);
        }
        double sum = 0;
        for (int k = 0; k < groups.size(); k++) {
            sum += eval.areaUnderROC(k);
        }
        return sum / groups.size();
    }

    @Test
    void givenIrisWithThreeGroups_whenRunThroughCli_thenMacroMetricsConfusionAndWekaMacroAuc() throws Exception {
        IrisCohort.write(dir);
        Path spec = IrisCohort.spec(dir, BODY);
        Path out = dir.resolve("results");
        CliTest.Outcome o = CliTest.run("run", spec.toString(), "--out", out.toString(), "--quiet");
        assertEquals(0, o.code(), o.err());
        Path run;
        try (var s = Files.list(out.resolve("iris"))) {
            run = s.findFirst().orElseThrow();
        }
        // confusion.csv: 3 x 3 cells per pipeline, every subject counted once
        List<String> confusion = Files.readAllLines(run.resolve("confusion.csv"));
        assertEquals("imputer,feature_set,classifier,repetition,truth,predicted,count", confusion.get(0));
        assertEquals(1 + 2 * 9, confusion.size());
        long forestTotal = confusion.stream().skip(1).filter(l -> l.contains(",forest,"))
                .mapToLong(l -> Long.parseLong(l.substring(l.lastIndexOf(',') + 1))).sum();
        assertEquals(150, forestTotal);
        // accuracy of a random forest on iris about 0.95 (common practice, no source); no site column, no site table
        double accuracy = Double.parseDouble(metric(run, "accuracy").get("forest"));
        assertTrue(accuracy > 0.9, "forest accuracy " + accuracy);
        assertFalse(Files.exists(run.resolve("site_metrics.csv")));

        // The same spec and seed in-process give the same predictions, with every group's score.
        Experiment ex = Setup.prepare(SpecLoader.load(spec));
        List<RunResults.Prediction> all = new Runner(ex, 1, Progress.NONE).run().predictions();
        List<String> groups = ex.spec().cohort().groups();
        Map<String, String> auc = metric(run, "auc");
        for (String classifier : List.of("forest", "lr")) {
            List<RunResults.Prediction> ps = all.stream()
                    .filter(p -> p.pipeline().classifier().equals(classifier)).toList();
            assertEquals(150, ps.size());
            for (RunResults.Prediction p : ps) {
                // with three groups the score column is the predicted group's score
                assertEquals(p.scores()[p.predicted()], p.score(), 0.0);
            }
            // tolerance 1e-9: both are the exact Mann-Whitney area (ties counted one half), only summed differently
            assertEquals(wekaMacroAuc(ps, groups), Double.parseDouble(auc.get(classifier)), 1e-9, classifier);
        }
        List<String> predictions = Files.readAllLines(run.resolve("predictions.csv"));
        assertEquals(1 + 300, predictions.size());
    }
}
