package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.spec.BadInputException;
import org.viewgain.spec.SpecLoader;
import org.viewgain.testing.TestCohorts;

/**
 * The availability curve's subsets (nested, inside the training block, site-stratified, blind to labels and test
 * subjects) and its planted-truth behaviour: on an invented cohort whose target is a noisy linear function of the
 * source (so imputation works), the imputation error falls as more target scans are kept.
 */
class AvailabilityTest {
    @TempDir
    Path dir;

    static final String BODY = """
            imputers: [ { name: ridge, method: ridge, grid: { alpha: [0.1, 10] } } ]
            feature-sets: [source, source+imputed]
            classifiers: [ { name: lr, method: logistic } ]
            validation: { outer: { folds: 4, repeats: 2 }, inner: { folds: 2 } }
            availability-curve: { fractions: [0.1, 0.3, 0.6, 1.0] }
            """;

    private Experiment prepare(Path at, String body) {
        return Setup.prepare(SpecLoader.load(TestCohorts.spec(at, body)));
    }

    @Test
    void givenCurve_whenSubsetsDrawn_thenNestedInsideTheTrainingTargetsAndOfTheDocumentedSize() {
        TestCohorts.synthetic(dir, 80, 6, 5, 1.0, 0.25, 3);
        Experiment ex = prepare(dir, BODY);
        for (int r = 0; r < ex.plan().repeats(); r++) {
            for (int f = 0; f < ex.plan().folds(r); f++) {
                int[] withTarget = Arrays.stream(ex.plan().train(r, f)).filter(ex.data()::hasTarget).toArray();
                Set<Integer> previous = new HashSet<>();
                for (int l = 0; l < 4; l++) {
                    int[] keep = Availability.subset(ex, l, r, f);
                    Set<Integer> now = new HashSet<>();
                    Arrays.stream(keep).forEach(now::add);
                    assertEquals(Math.max(1, Math.round(ex.spec().availability().fractions().get(l)
                            * withTarget.length)), keep.length);
                    assertTrue(now.containsAll(previous), "level " + (l + 1) + " holds level " + l + "'s subjects");
                    for (int i : keep) {
                        assertTrue(Arrays.binarySearch(withTarget, i) >= 0, "only training subjects with a target");
                    }
                    previous = now;
                }
                assertEquals(withTarget.length, previous.size(), "fraction 1 keeps every training target");
            }
        }
    }

    @Test
    void givenSites_whenSubsetsDrawn_thenEachSiteNearItsShareAtEveryPrefix() throws IOException {
        TestCohorts.synthetic(dir, 90, 4, 3, 1.0, 0.2, 8);
        Experiment two = prepare(dir, BODY);
        assertSiteShares(two, 1.0); // two sites: within one subject (see Availability)
        // three sites: rewrite the site column, subject i at site i mod 3
        List<String> lines = Files.readAllLines(dir.resolve("subjects.csv"));
        List<String> out = new ArrayList<>(List.of(lines.get(0)));
        for (int i = 1; i < lines.size(); i++) {
            String[] c = lines.get(i).split(",");
            out.add(c[0] + "," + c[1] + ",site" + (i % 3));
        }
        Files.write(dir.resolve("subjects.csv"), out);
        assertSiteShares(prepare(dir, BODY), 2.0);
    }

    private static void assertSiteShares(Experiment ex, double within) {
        for (int r = 0; r < ex.plan().repeats(); r++) {
            for (int f = 0; f < ex.plan().folds(r); f++) {
                int[] order = Availability.order(ex, r, f);
                Map<String, Integer> total = new HashMap<>();
                for (int i : order) {
                    total.merge(ex.data().subjects().get(i).site(), 1, Integer::sum);
                }
                Map<String, Integer> seen = new HashMap<>();
                for (int n = 1; n <= order.length; n++) {
                    seen.merge(ex.data().subjects().get(order[n - 1]).site(), 1, Integer::sum);
                    for (Map.Entry<String, Integer> e : total.entrySet()) {
                        double share = n * e.getValue() / (double) order.length;
                        int got = seen.getOrDefault(e.getKey(), 0);
                        assertTrue(Math.abs(got - share) < within, "prefix " + n + ", site " + e.getKey() + ": "
                                + got + " against a share of " + share);
                    }
                }
            }
        }
    }

    @Test
    void givenOtherLabelsAndOtherTestSubjects_whenSubsetsDrawn_thenByteIdentical() throws IOException {
        TestCohorts.synthetic(dir, 80, 6, 5, 1.0, 0.25, 3);
        Experiment ex = prepare(dir, BODY);
        int r = 1;
        int f = 2;
        int[] test = ex.plan().test(r, f);
        Set<String> testIds = new HashSet<>();
        Arrays.stream(test).forEach(i -> testIds.add(ex.data().id(i)));
        // the same cohort with every group flipped, and the test subjects' views replaced (half their targets gone)
        Path other = Files.createDirectories(dir.resolve("other"));
        List<String> subjects = new ArrayList<>();
        for (String line : Files.readAllLines(dir.resolve("subjects.csv"))) {
            subjects.add(line.contains(",control,") ? line.replace(",control,", ",patient,")
                    : line.replace(",patient,", ",control,"));
        }
        Files.write(other.resolve("subjects.csv"), subjects);
        for (String view : new String[] {"source.csv", "target.csv"}) {
            List<String> rows = new ArrayList<>();
            int dropped = 0;
            for (String line : Files.readAllLines(dir.resolve(view))) {
                String id = line.split(",")[0];
                if (!testIds.contains(id)) {
                    rows.add(line);
                } else if (view.equals("source.csv") || dropped++ % 2 == 0) {
                    rows.add(id + line.substring(id.length()).replaceAll("[0-9]", "7"));
                }
            }
            Files.write(other.resolve(view), rows);
        }
        Experiment changed = prepare(other, BODY);
        assertFalse(Arrays.equals(ex.data().y(), changed.data().y()), "the labels did change");
        // the same outer plan as the run's: the subsets are drawn given the plan's training block
        Experiment samePlan = new Experiment(changed.spec(), changed.data(), ex.plan(), changed.imputers(),
                changed.classifiers(), changed.pipelines(), changed.scaler(), changed.prep(), changed.duplicates());
        assertArrayEquals(Availability.order(ex, r, f), Availability.order(samePlan, r, f));
        for (int l = 0; l < 4; l++) {
            assertArrayEquals(Availability.subset(ex, l, r, f), Availability.subset(samePlan, l, r, f));
        }
        // and a changed training subject does change them: the check can fail
        int[] order = Availability.order(ex, r, f);
        java.util.BitSet one = new java.util.BitSet();
        one.set(order[0]);
        Experiment lost = new Experiment(ex.spec(), ex.data().withoutTargets(one), ex.plan(), ex.imputers(),
                ex.classifiers(), ex.pipelines(), ex.scaler(), ex.prep(), ex.duplicates());
        assertFalse(Arrays.equals(Availability.order(ex, r, f), Availability.order(lost, r, f)));
    }

    @Test
    void givenPlantedTruth_whenCurveRuns_thenImputationErrorFallsWithTheLevelInEveryOuterFold() {
        TestCohorts.synthetic(dir, 100, 10, 6, 1.0, 0.2, 17);
        Experiment ex = prepare(dir, BODY);
        RunResults res = new Runner(ex, 2, Progress.NONE).run();
        List<RunResults.AvailabilityLevel> levels = res.availability();
        assertEquals(4, levels.size(), "fraction 1 is the last level, not repeated");
        assertTrue(levels.get(3).full() && !levels.get(0).full());
        // the full-data level is the run's own results
        assertEquals(res.imputation(), levels.get(3).quality().stream()
                .sorted(java.util.Comparator.comparingInt(RunResults.ImputationRow::repeat)
                        .thenComparingInt(RunResults.ImputationRow::fold)).toList());
        double[] overall = new double[4];
        for (int l = 0; l < 4; l++) {
            overall[l] = levels.get(l).quality().stream().mapToDouble(RunResults.ImputationRow::mae).average()
                    .orElseThrow();
        }
        for (int l = 1; l < 4; l++) {
            assertTrue(overall[l] < overall[l - 1], "MAE falls level by level: " + Arrays.toString(overall));
        }
        for (int r = 0; r < ex.plan().repeats(); r++) {
            for (int f = 0; f < ex.plan().folds(r); f++) {
                final int rr = r;
                final int ff = f;
                double smallest = levels.get(0).quality().stream().filter(q -> q.repeat() == rr && q.fold() == ff)
                        .mapToDouble(RunResults.ImputationRow::mae).average().orElseThrow();
                double largest = levels.get(3).quality().stream().filter(q -> q.repeat() == rr && q.fold() == ff)
                        .mapToDouble(RunResults.ImputationRow::mae).average().orElseThrow();
                assertTrue(largest < smallest, "repeat " + (r + 1) + ", fold " + (f + 1) + ": " + largest
                        + " against " + smallest);
            }
        }
    }

    @Test
    void givenCountAboveTheTargetsOfAFold_whenPrepared_thenOneLineNamingTheFold() {
        TestCohorts.synthetic(dir, 40, 4, 3, 1.0, 0.2, 5);
        BadInputException e = org.junit.jupiter.api.Assertions.assertThrows(BadInputException.class,
                () -> prepare(dir, BODY.replace("fractions: [0.1, 0.3, 0.6, 1.0]", "counts: [4, 40]")));
        assertTrue(e.getMessage().contains("availability-curve.counts[1]: 40 exceeds the"), e.getMessage());
        assertEquals(1, e.getMessage().lines().count());
        BadInputException small = org.junit.jupiter.api.Assertions.assertThrows(BadInputException.class,
                () -> prepare(dir, BODY.replace("0.1, 0.3", "0.05, 0.3")));
        assertTrue(small.getMessage().contains("availability-curve.fractions[0]: 0.05 keeps 1 of the"),
                small.getMessage());
    }

    @Test
    void givenALevelWithHiddenTargets_whenItsDistanceTableIsAsked_thenTheRunsOwnTableIsShared() {
        // the label-free source distances do not change when targets are hidden, and a level's subjects with a
        // target are among the run's: one table per run, not one per level and outer fold
        TestCohorts.synthetic(dir, 80, 6, 5, 1.0, 0.25, 3);
        Experiment ex = prepare(dir, BODY);
        var table = ex.data().sourceDistances();
        assertTrue(table != null, "a run with a target view has a table");
        int[] keep = Availability.subset(ex, 0, 0, 0);
        Experiment level = Availability.masked(ex, 0, 0, keep);
        long before = java.util.stream.IntStream.range(0, ex.data().n()).filter(ex.data()::hasTarget).count();
        long after = java.util.stream.IntStream.range(0, ex.data().n()).filter(level.data()::hasTarget).count();
        assertTrue(after < before, "the level hides targets");
        org.junit.jupiter.api.Assertions.assertSame(table, level.data().sourceDistances());
    }
}
