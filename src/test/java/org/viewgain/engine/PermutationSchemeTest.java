package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertNotSame;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
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
import org.viewgain.folds.FoldPlan;
import org.viewgain.spec.BadInputException;
import org.viewgain.spec.FeatureSet;
import org.viewgain.spec.SpecLoader;
import org.viewgain.testing.TestCohorts;

/**
 * The permutation scheme that keeps the observed statistic exchangeable with the permuted ones (Ojala &amp; Garriga
 * 2010, test 1; Good, Permutation Tests, 2nd ed., 2000, ch. 3 on exchangeability within blocks): labels shuffled within
 * sites among the subjects a pipeline uses; the stratified outer plan and the inner folds re-drawn from the permuted
 * labels; imputations that never depend on labels.
 */
class PermutationSchemeTest {
    @TempDir
    Path dir;

    static final String BODY = """
            imputers: [ { name: ridge, method: ridge, fixed: { alpha: 5 } } ]
            feature-sets: [source, source+imputed, target]
            classifiers: [ { name: lr, method: logistic, fixed: { lambda: 1.0 } } ]
            validation: { outer: { scheme: %s, folds: 4, repeats: 2 }, inner: { folds: 3 } }
            significance: { permutations: %d, bootstrap: 0 }
            """;

    Experiment experiment(String scheme, int permutations, Methods methods) {
        TestCohorts.synthetic(dir, 48, 6, 4, 0.0, 0.3, 17);
        String body = BODY.formatted(scheme, permutations);
        if (!scheme.equals("stratified-k-fold")) {
            body = body.replace("folds: 4, repeats: 2", "");
        }
        return Setup.prepare(SpecLoader.load(TestCohorts.spec(dir, body)), methods);
    }

    @Test
    void givenSites_whenLabelsPermuted_thenEverySiteKeepsItsLabelCountsInEachPopulation() {
        Experiment ex = experiment("stratified-k-fold", 0, Methods.standard());
        int[] y = ex.data().y();
        int moved = 0;
        for (int k = 1; k <= 20; k++) {
            for (FeatureSet fs : List.of(FeatureSet.SOURCE, FeatureSet.TARGET)) {
                int[] perm = PermutedLabels.of(ex, k, fs);
                Map<String, Integer> before = new HashMap<>();
                Map<String, Integer> after = new HashMap<>();
                for (int i = 0; i < y.length; i++) {
                    if (!ex.inPopulation(fs, i)) {
                        // outside the pipeline's population a subject keeps its real label
                        assertEquals(y[i], perm[i]);
                        continue;
                    }
                    String site = ex.data().subjects().get(i).site();
                    before.merge(site + "|" + y[i], 1, Integer::sum);
                    after.merge(site + "|" + perm[i], 1, Integer::sum);
                    moved += perm[i] != y[i] ? 1 : 0;
                }
                // no label crosses a site: every (site, group) count of the population is kept
                assertEquals(before, after, "permutation " + k + ", " + fs.label());
            }
        }
        assertTrue(moved > 100, "the permutations moved only " + moved + " labels");
        // the same k gives the same labels (seeded), another k others
        assertArrayEquals(PermutedLabels.of(ex, 3, FeatureSet.SOURCE), PermutedLabels.of(ex, 3, FeatureSet.SOURCE));
        assertNotEquals(java.util.Arrays.toString(PermutedLabels.of(ex, 3, FeatureSet.SOURCE)),
                java.util.Arrays.toString(PermutedLabels.of(ex, 4, FeatureSet.SOURCE)));
    }

    @Test
    void givenStratifiedFolds_whenLabelsPermuted_thenThePlanIsRedrawnBalancedForThePermutedLabels() {
        Experiment ex = experiment("stratified-k-fold", 0, Methods.standard());
        assertSame(ex.plan(), ex.planFor(ex.data().y()));
        for (int k = 1; k <= 10; k++) {
            int[] labels = PermutedLabels.of(ex, k, FeatureSet.SOURCE);
            FoldPlan plan = ex.planFor(labels);
            assertNotSame(ex.plan(), plan);
            for (int r = 0; r < plan.repeats(); r++) {
                final int folds = plan.folds(r);
                // every (group, target observed, site) stratum of the permuted labels is dealt evenly: counts
                // differ by at most one
                Map<String, int[]> perFold = new HashMap<>();
                for (int i = 0; i < labels.length; i++) {
                    String stratum = labels[i] + "|" + ex.data().hasTarget(i) + "|"
                            + ex.data().subjects().get(i).site();
                    perFold.computeIfAbsent(stratum, s -> new int[folds])[plan.foldOf(r, i)]++;
                }
                for (int[] counts : perFold.values()) {
                    int max = java.util.Arrays.stream(counts).max().orElseThrow();
                    int min = java.util.Arrays.stream(counts).min().orElseThrow();
                    assertTrue(max - min <= 1, "permutation " + k + ": " + java.util.Arrays.toString(counts));
                }
                // and so are the permutation's inner folds in every outer training set
                for (int f = 0; f < plan.folds(r); f++) {
                    int[] inner = InnerFolds.of(ex, plan, labels, r, f);
                    int[][] byGroup = new int[2][3];
                    for (int i : plan.train(r, f)) {
                        byGroup[labels[i]][inner[i]]++;
                    }
                    for (int[] g : byGroup) {
                        int max = java.util.Arrays.stream(g).max().orElseThrow();
                        int min = java.util.Arrays.stream(g).min().orElseThrow();
                        assertTrue(max - min <= 1, java.util.Arrays.toString(g));
                    }
                }
            }
        }
    }

    @Test
    void givenTheSameTrainingSets_whenGroupLabelsDiffer_thenImputationsAndTheirFoldsAreByteIdentical()
            throws IOException {
        Experiment ex = experiment("stratified-k-fold", 0, Methods.standard());
        // a second cohort: the same views, the group column shuffled (what a permutation does to the labels)
        Path other = dir.resolve("shuffled");
        Files.createDirectories(other);
        for (String f : List.of("source.csv", "target.csv")) {
            Files.copy(dir.resolve(f), other.resolve(f));
        }
        List<String> lines = new ArrayList<>(Files.readAllLines(dir.resolve("subjects.csv")));
        List<String> groups = new ArrayList<>();
        for (String line : lines.subList(1, lines.size())) {
            groups.add(line.split(",")[1]);
        }
        java.util.Collections.shuffle(groups, new java.util.Random(5));
        for (int t = 1; t < lines.size(); t++) {
            String[] v = lines.get(t).split(",");
            lines.set(t, v[0] + "," + groups.get(t - 1) + "," + v[2]);
        }
        Files.write(other.resolve("subjects.csv"), lines);
        Files.copy(dir.resolve("spec.yaml"), other.resolve("spec.yaml"));
        Experiment shuffled = Setup.prepare(SpecLoader.load(other.resolve("spec.yaml")));
        assertNotEquals(java.util.Arrays.toString(ex.data().y()), java.util.Arrays.toString(shuffled.data().y()));
        for (int r = 0; r < ex.plan().repeats(); r++) {
            for (int f = 0; f < ex.plan().folds(r); f++) {
                assertArrayEquals(ImputationFolds.of(ex, ex.plan(), r, f),
                        ImputationFolds.of(shuffled, ex.plan(), r, f));
                ImputedFold a = new ImputationStage(ex).run(ex.imputer("ridge"), 0, ex.plan(), r, f);
                ImputedFold b = new ImputationStage(shuffled).run(shuffled.imputer("ridge"), 0, ex.plan(), r, f);
                for (int i = 0; i < ex.data().n(); i++) {
                    assertArrayEquals(a.imputed()[i], b.imputed()[i], "subject " + i);
                }
            }
        }
    }

    @Test
    void givenALabelFreePlan_whenPermuted_thenImputersAreNotRefitted_andGivenAStratifiedPlan_thenOncePerPermutation() {
        // leave-one-out: every permutation keeps the run's training sets, so it reuses the run's imputations
        Recording loo = new Recording();
        Experiment exLoo = experiment("leave-one-out", 3, loo);
        new Runner(exLoo, 2, Progress.NONE).run();
        assertEquals(0, loo.all().stream().filter(f -> f.kind().equals("imputer") && f.ctx().permutation() > 0)
                .count());
        // stratified: each permutation fits the imputer once per fit of its plan (final + 3 cross-fits per outer
        // fold, 8 outer folds), shared by the pipelines that use it, never once per pipeline
        Recording strat = new Recording();
        Experiment ex = experiment("stratified-k-fold", 3, strat);
        new Runner(ex, 2, Progress.NONE).run();
        for (int k = 1; k <= 3; k++) {
            final int kk = k;
            long fits = strat.all().stream().filter(f -> f.kind().equals("imputer") && f.ctx().permutation() == kk)
                    .count();
            assertEquals(8 * (1 + 3), fits, "permutation " + k);
        }
    }

    @Test
    void givenAnExternalImputerAndStratifiedFolds_whenPermutationsAsked_thenRefusedNamingTheKey() throws IOException {
        TestCohorts.synthetic(dir, 48, 6, 4, 0.0, 0.3, 17);
        Files.writeString(dir.resolve("imputed.csv"), "repeat,fold,task,subject\n");
        Path spec = TestCohorts.spec(dir, """
                imputers: [ { name: outside, method: external, fixed: { file: imputed.csv } } ]
                feature-sets: [source, source+imputed]
                classifiers: [ { name: lr, method: logistic } ]
                validation: { outer: { folds: 4 }, inner: { folds: 3 } }
                significance: { permutations: 9 }
                """);
        BadInputException e = assertThrows(BadInputException.class, () -> Setup.prepare(SpecLoader.load(spec)));
        assertTrue(e.getMessage().contains("significance.permutations"), e.getMessage());
        assertTrue(e.getMessage().contains("leave-one-out"), e.getMessage());
    }

    /**
     * Batches hold several permutations per pipeline when their imputations are small (so the threads are not left
     * idle at each batch's end) and one when a permutation's imputations are large (1,000 subjects x 71,556 target
     * edges x 5 folds x 2 imputers: about 2.9 GB). The rule, by hand.
     */
    @Test
    void givenImputationSizes_whenBatched_thenSeveralPermutationsOnlyWithinTheMemoryBudget() {
        // nested-160x35: 6 pipelines, 16 jobs per batch on 2 threads, 1 imputer x 10 folds x 160 x 595 floats
        assertEquals(3, Permutations.perPipeline(16, 6, 10L * 160 * 595 * 4));
        // demo-chance: 10 pipelines -> 2 each
        assertEquals(2, Permutations.perPipeline(16, 10, 2L * 10 * 120 * 276 * 4));
        // a wide cohort: one permutation at a time, whatever the jobs would allow
        assertEquals(1, Permutations.perPipeline(16, 6, 2L * 5 * 1000 * 71_556 * 4));
        // just over half the budget: one; a quarter: four
        assertEquals(1, Permutations.perPipeline(64, 1, Permutations.IMPUTATION_BUDGET / 2 + 1));
        assertEquals(4, Permutations.perPipeline(64, 1, Permutations.IMPUTATION_BUDGET / 4));
        assertEquals(1, Permutations.perPipeline(2, 10, 1));
        // the jobs a batch aims at: 16 on 2 threads, never fewer than 2
        assertEquals(16, Permutations.jobsPerBatch(2));
        assertEquals(8, Permutations.jobsPerBatch(1));
        assertEquals(2, Permutations.jobsPerBatch(0));
    }
}
