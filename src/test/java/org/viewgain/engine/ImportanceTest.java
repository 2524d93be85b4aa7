package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.spec.SpecLoader;
import org.viewgain.testing.TestCohorts;

/**
 * What the models used: selection frequency over outer folds and repeats, and each final model's importance mapped
 * back through selection to the original feature names, on a cohort with a planted effect in source columns s1-s3.
 */
class ImportanceTest {
    @TempDir
    Path dir;

    static final String BODY = """
            %s
            feature-sets: [source]
            classifiers:
              - { name: forest, method: random-forest, fixed: { trees: 40 } }
              - { name: lr, method: logistic }
              - { name: lda, method: lda }
              - { name: svm, method: svm-linear }
              - { name: knn, method: knn, fixed: { k: 3 } }
              - { name: j48, method: weka, class: weka.classifiers.trees.J48 }
            validation: { outer: { folds: 5, repeats: 2 }, inner: { folds: 3 } }
            """;

    /** Runs every unit of the plan through the stage, as the runner does, and keeps what the models used. */
    static List<Importance.Fold> folds(Experiment ex) {
        ClassifierStage stage = new ClassifierStage(ex);
        List<Importance.Fold> out = new ArrayList<>();
        for (int r = 0; r < ex.plan().repeats(); r++) {
            for (int f = 0; f < ex.plan().folds(r); f++) {
                int[] inner = InnerFolds.of(ex, r, f);
                for (Pipeline p : ex.pipelines()) {
                    out.add(stage.run(p, 0, ex.plan(), r, f, inner, null, ex.data().y()).importance());
                }
            }
        }
        return out;
    }

    @Test
    void givenSelectionOfThree_whenRun_thenFrequenciesSumToThreeAndModelImportanceOnlyOnSelectedFeatures() {
        TestCohorts.synthetic(dir, 80, 20, 2, 6.0, 0.0, 21);
        Experiment ex = Setup.prepare(SpecLoader.load(TestCohorts.spec(dir,
                BODY.formatted("features: { select: { method: t-test, keep: 3 } }"))));
        List<Importance.Fold> folds = folds(ex);
        Importance.Fold first = folds.get(0);
        assertEquals(3, first.inputNames().size());
        assertTrue(first.selected() && first.inputNames().get(0).startsWith("source:s"), first.toString());
        List<Importance.Row> rows = Importance.rows(ex, folds);
        Map<String, List<Importance.Row>> byClassifier = rows.stream()
                .collect(Collectors.groupingBy(r -> r.pipeline().classifier()));
        Map<String, String> expectedKind = Map.of("forest", "impurity", "lr", "abs_weight", "lda", "abs_weight",
                "svm", "abs_weight");
        for (String c : List.of("forest", "lr", "lda", "svm", "knn", "j48")) {
            List<Importance.Row> mine = byClassifier.get(c);
            List<Importance.Row> freq = mine.stream()
                    .filter(r -> r.kind().equals(Importance.SELECTION_FREQUENCY)).toList();
            // every final model saw exactly 3 features, so the frequencies add up to 3 (exact up to rounding)
            assertEquals(3.0, freq.stream().mapToDouble(Importance.Row::value).sum(), 1e-12, c);
            // the planted columns are chosen in at least 8 of 10 outer folds (common practice, no source)
            for (String planted : List.of("s1", "s2", "s3")) {
                double v = freq.stream().filter(r -> r.feature().equals(planted)).findFirst().orElseThrow().value();
                assertTrue(v >= 0.8, c + " " + planted + " " + v);
            }
            assertTrue(mine.stream().allMatch(r -> r.view().equals("source")), c);
            Set<String> kinds = mine.stream().map(Importance.Row::kind).collect(Collectors.toSet());
            String kind = expectedKind.get(c);
            assertEquals(kind == null ? Set.of(Importance.SELECTION_FREQUENCY)
                    : Set.of(Importance.SELECTION_FREQUENCY, kind), kinds, c);
            if (kind != null) {
                Set<String> selected = freq.stream().map(Importance.Row::feature).collect(Collectors.toSet());
                Set<String> weighted = mine.stream().filter(r -> r.kind().equals(kind))
                        .map(Importance.Row::feature).collect(Collectors.toSet());
                assertEquals(selected, weighted, c);
                assertTrue(mine.stream().filter(r -> r.kind().equals(kind)).allMatch(r -> r.value() >= 0), c);
            }
        }
    }

    @Test
    void givenNoSelection_whenRun_thenEveryFeatureHasModelImportanceAndNoSelectionRows() {
        TestCohorts.synthetic(dir, 60, 8, 2, 6.0, 0.0, 22);
        Experiment ex = Setup.prepare(SpecLoader.load(TestCohorts.spec(dir, BODY.formatted("")
                .replaceAll("(?m)^  - \\{ name: (forest|lda|svm|knn|j48).*\\n", ""))));
        List<Importance.Row> rows = Importance.rows(ex, folds(ex));
        assertEquals(8, rows.size());
        assertTrue(rows.stream().allMatch(r -> r.kind().equals("abs_weight")));
        // the strongest planted column outweighs every noise column on average (common practice, no source)
        double planted = rows.stream().filter(r -> r.feature().matches("s[123]"))
                .mapToDouble(Importance.Row::value).max().orElseThrow();
        double noise = rows.stream().filter(r -> !r.feature().matches("s[123]"))
                .mapToDouble(Importance.Row::value).max().orElseThrow();
        assertTrue(planted > noise, planted + " vs " + noise);
    }

    @Test
    void givenPermutedLabels_whenRun_thenNothingIsRecordedAsUsed() {
        TestCohorts.synthetic(dir, 40, 6, 2, 1.0, 0.0, 23);
        Experiment ex = Setup.prepare(SpecLoader.load(TestCohorts.spec(dir, BODY.formatted(""))));
        Pipeline p = ex.pipelines().get(0);
        assertNull(new ClassifierStage(ex).run(p, 1, ex.plan(), 0, 0, InnerFolds.of(ex, 0, 0), null, ex.data().y())
                .importance());
    }
}
