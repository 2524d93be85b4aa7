package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.spec.SpecLoader;
import org.viewgain.testing.TestCohorts;

/**
 * The bundle round trip at the level that matters: the final pipelines as trained in memory (never frozen) predict
 * an independent cohort bit for bit as the pipelines read back from a bundle written to disk. Every freezable kind
 * is in the spec: standardize and t-test selection steps, the mean, nearest-neighbours, ridge, pls and multi-kernel
 * imputers, and the three freezable classifiers (ComBat and covariate adjustment: IndependentCohortTest). The independent cohort reuses the development cohort's subject ids with other values, so
 * the nearest-neighbours imputer's shared distance table must not be read for them (invented data, a simulation).
 */
class FinalPipelineRoundTripTest {
    @TempDir
    Path dir;

    @Test
    void givenTrainedFinalPipelines_whenWrittenAsABundleAndReadBack_thenPredictionsEqualBitForBit()
            throws IOException {
        TestCohorts.synthetic(dir, 48, 12, 6, 1.0, 0.3, 21);
        TestCohorts.synthetic(dir.resolve("ext"), 30, 12, 6, 1.0, 1.0, 22);
        Path spec = TestCohorts.spec(dir, """
                features: { scale: standardize, select: { method: t-test, keep: [8] } }
                imputers:
                  - { name: avg, method: mean }
                  - { name: knn, method: nearest-neighbours, grid: { k: [3, 7] } }
                  - { name: ridge, method: ridge, grid: { alpha: [1, 100] } }
                  - { name: pls, method: pls, grid: { components: [1, 2] } }
                  - { name: mkn, method: multi-kernel-neighbours, fixed: { neighbours: 5 } }
                feature-sets: [source, source+imputed]
                classifiers:
                  - { name: forest, method: random-forest, fixed: { trees: 25 } }
                  - { name: lin, method: svm-linear, grid: { C: [0.01, 1] } }
                  - { name: rbf, method: svm-rbf, grid: { C: [1, 10] } }
                validation: { outer: { folds: 3 }, inner: { folds: 3 } }
                independent-cohort:
                  subjects: ext/subjects.csv
                  group: group
                  views: { source: { table: ext/source.csv } }
                """);
        Experiment ex = Setup.prepare(SpecLoader.load(spec));
        IndependentData ind = ex.independent();
        assertEquals(ex.data().id(0), ind.id(0), "the two cohorts share ids (the test relies on it)");

        FinalStage stage = new FinalStage(ex);
        Map<String, ImputationStage.Final> imputers = new TreeMap<>();
        List<FinalPipelines.Entry> entries = new ArrayList<>();
        List<FrozenPipeline> live = new ArrayList<>();
        for (Pipeline p : ex.pipelines()) {
            ImputationStage.Final imp = p.featureSet().needsImputer()
                    ? imputers.computeIfAbsent(p.imputer(), n -> stage.imputer(ex.imputer(n))) : null;
            ClassifierStage.Trained t = stage.train(p, imp);
            live.add(stage.live(p, t, imp));
            entries.add(new FinalPipelines.Entry(p, stage.unit(p, t)));
        }
        Map<String, byte[]> parts = new TreeMap<>();
        Map<String, String> chosen = new TreeMap<>();
        imputers.forEach((n, f) -> {
            parts.put(n, FinalStage.imputerPart(f, n));
            chosen.put(n, f.imputed().chosen().toString());
        });
        Bundle.write(dir.resolve("bundle"), new FinalPipelines(ex, entries, parts, chosen), "0".repeat(64));
        List<FrozenPipeline> read = Bundle.read(dir.resolve("bundle")).pipelines();

        assertEquals(live.size(), read.size());
        assertEquals(3 * 6, live.size(), "source x 3 classifiers + source+imputed x 5 imputers x 3 classifiers");
        int scored = 0;
        for (int k = 0; k < live.size(); k++) {
            assertEquals(live.get(k).pipeline(), read.get(k).pipeline());
            List<FrozenPipeline.Prediction> a = live.get(k).predict(ind);
            List<FrozenPipeline.Prediction> b = read.get(k).predict(ind);
            assertEquals(ind.n(), a.size());
            assertEquals(a.size(), b.size());
            for (int i = 0; i < a.size(); i++) {
                String where = live.get(k).pipeline().label() + " subject " + i;
                assertEquals(a.get(i).predicted(), b.get(i).predicted(), where);
                assertEquals(Double.doubleToRawLongBits(a.get(i).score()),
                        Double.doubleToRawLongBits(b.get(i).score()), where);
                assertArrayEquals(a.get(i).scores(), b.get(i).scores(), 0.0, where);
                scored += Double.isNaN(a.get(i).score()) ? 0 : 1;
            }
            if (live.get(k).imputer() != null) {
                int[] all = java.util.stream.IntStream.range(0, ind.n()).toArray();
                double[][] ia = live.get(k).impute(ind, all);
                double[][] ib = read.get(k).impute(ind, all);
                for (int i = 0; i < all.length; i++) {
                    assertArrayEquals(ia[i], ib[i], 0.0, live.get(k).pipeline().label() + " imputed " + i);
                }
            }
        }
        assertTrue(scored == live.size() * ind.n(), "every pipeline gives a score per subject");
    }

    /**
     * Predicting builds feature rows a chunk of subjects at a time and imputes once per imputer: the predictions
     * equal those of the whole cohort's rows passed through the steps and the model in one go, and those of each
     * subject alone, bit for bit (a subject's prediction does not depend on who else is applied).
     */
    @Test
    void givenACohortOfSeveralChunks_whenPredicted_thenEqualToOneBatchAndToEachSubjectAlone() throws IOException {
        TestCohorts.synthetic(dir, 40, 10, 5, 1.0, 0.3, 23);
        TestCohorts.synthetic(dir.resolve("ext"), 300, 10, 5, 1.0, 1.0, 24);
        Path spec = TestCohorts.spec(dir, """
                features: { scale: standardize, select: { method: t-test, keep: [6] } }
                imputers:
                  - { name: ridge, method: ridge, fixed: { alpha: 10 } }
                feature-sets: [source, source+imputed]
                classifiers:
                  - { name: forest, method: random-forest, fixed: { trees: 15 } }
                  - { name: rbf, method: svm-rbf, fixed: { C: 1 } }
                validation: { outer: { folds: 3 }, inner: { folds: 3 } }
                independent-cohort:
                  subjects: ext/subjects.csv
                  group: group
                  views: { source: { table: ext/source.csv } }
                """);
        Experiment ex = Setup.prepare(SpecLoader.load(spec));
        IndependentData ind = ex.independent();
        FinalStage stage = new FinalStage(ex);
        int[] all = FrozenPipeline.everyone(ind);
        int pipelines = 0;
        for (Pipeline p : ex.pipelines()) {
            ImputationStage.Final imp = p.featureSet().needsImputer() ? stage.imputer(ex.imputer(p.imputer())) : null;
            FrozenPipeline fp = stage.live(p, stage.train(p, imp), imp);
            double[][] imputed = imp == null ? null : fp.impute(ind, all);
            List<FrozenPipeline.Prediction> chunked = fp.predict(ind, imputed);
            org.viewgain.cohort.Rows x = fp.rows(ind, all, imputed);
            for (org.viewgain.prep.Transform.Fitted s : fp.steps()) {
                x = s.apply(x);
            }
            org.viewgain.classify.Predictions whole = fp.model().predict(x);
            assertEquals(ind.n(), chunked.size());
            for (int i = 0; i < all.length; i++) {
                String where = p.label() + " subject " + i;
                assertEquals(whole.labels()[i], chunked.get(i).predicted(), where);
                assertArrayEquals(whole.scores()[i], chunked.get(i).scores(), 0.0, where);
            }
            for (int i : new int[] {0, 129, 299}) {
                org.viewgain.cohort.Rows one = fp.rows(ind, new int[] {i}, imputed);
                for (org.viewgain.prep.Transform.Fitted s : fp.steps()) {
                    one = s.apply(one);
                }
                assertArrayEquals(chunked.get(i).scores(), fp.model().predict(one).scores()[0], 0.0,
                        p.label() + " subject " + i + " alone");
                if (imputed != null) {
                    assertArrayEquals(imputed[i], fp.impute(ind, new int[] {i})[0], 0.0,
                            p.label() + " subject " + i + " imputed alone");
                }
            }
            pipelines++;
        }
        assertEquals(4, pipelines);
    }
}
