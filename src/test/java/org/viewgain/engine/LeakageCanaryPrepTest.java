package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.folds.FitContext;
import org.viewgain.spec.SpecLoader;
import org.viewgain.testing.Covariates;
import org.viewgain.testing.TestCohorts;

/**
 * The leakage canary of {@link LeakageCanaryTest} extended to the steps of {@code features}: covariate adjustment,
 * ComBat and selection (with a tuned keep) are recorded like the scaler, and none of them may see an outer-test
 * subject or an inner-validation subject of its own inner fold; selection must get the true labels of its rows.
 */
class LeakageCanaryPrepTest {
    @TempDir
    Path dir;

    static final String COHORT = """
            experiment: canary
            seed: 4
            cohort: { subjects: subjects.csv, groups: [control, patient], positive: patient, site: site,
                      covariates: [age, sex] }
            views:
              source: { table: source.csv }
              target: { table: target.csv, missing: allowed }
            features: { adjust: [age, sex], harmonize: combat, select: { method: t-test, keep: [2, 5] } }
            imputers:
              - { name: ridge, method: ridge, fixed: { alpha: 5 } }
            feature-sets: [source, target, source+imputed]
            classifiers:
              - { name: lr, method: logistic, grid: { lambda: [0.1, 10] } }
            validation: { outer: { folds: 4, repeats: 2 }, inner: { folds: 3 } }
            """;

    @Test
    void givenRecordingSteps_whenRun_thenNoAdjustmentHarmonizationOrSelectionSeesAHeldOutSubject() throws Exception {
        TestCohorts.synthetic(dir, 48, 8, 6, 1.0, 0.2, 12);
        Covariates.addAgeAndSex(dir, 3);
        java.nio.file.Files.writeString(dir.resolve("spec.yaml"), COHORT);
        Recording rec = new Recording();
        Experiment ex = Setup.prepare(SpecLoader.load(dir.resolve("spec.yaml")), rec);
        new Runner(ex, 1, Progress.NONE).run();
        List<Recording.Fit> fits = rec.all();
        List<String> leaks = LeakageCanaryTest.leaks(ex, fits);
        assertTrue(leaks.isEmpty(), () -> leaks.size() + " leaks, first: " + leaks.get(0));
        Set<String> kinds = new HashSet<>();
        fits.forEach(f -> kinds.add(f.kind() + ":" + f.ctx().role()));
        assertTrue(kinds.containsAll(List.of("adjuster:TUNE", "adjuster:FINAL", "harmonizer:TUNE",
                "harmonizer:FINAL", "selector:TUNE", "selector:FINAL", "scaler:TUNE", "scaler:FINAL")), kinds.toString());
        // one thread: the final fit of every unit runs its steps in the documented order, right before the classifier
        List<String> order = fits.stream().filter(f -> f.ctx().role() == FitContext.Role.FINAL
                && !f.kind().equals("imputer")).map(Recording.Fit::kind).toList();
        List<String> expected = List.of("adjuster", "harmonizer", "scaler", "selector", "classifier");
        assertEquals(0, order.size() % expected.size());
        for (int k = 0; k < order.size(); k++) {
            assertEquals(expected.get(k % expected.size()), order.get(k), "final fit step " + k);
        }
        // adjuster and harmonizer are label-free (recorded without labels); the selector got labels, checked above
        assertTrue(fits.stream().filter(f -> f.kind().equals("selector")).allMatch(f -> f.labels() != null));
    }
}
