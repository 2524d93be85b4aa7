package org.viewgain.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.testing.TestCohorts;

/**
 * A linear SVM cut off at one pass (on breast-cancer-wisconsin it needs hundreds to reach tolerance 1e-6) is counted
 * in every fold, warned about on stderr and in the report; with its defaults nothing is counted or said.
 */
class ConvergenceCliTest {
    @TempDir
    Path dir;

    static final String TAIL = """
            features: { scale: standardize }
            feature-sets: [source]
            validation: { outer: { folds: 3 }, inner: { folds: 2 } }
            """;

    List<String> column(Path run, String name) throws Exception {
        List<String> lines = Files.readAllLines(run.resolve("hyperparameters.csv"));
        int c = List.of(lines.get(0).split(",")).indexOf(name);
        assertTrue(c >= 0, lines.get(0));
        return lines.subList(1, lines.size()).stream().map(l -> l.split(",")[c]).toList();
    }

    @Test
    void givenOnePassSvm_whenRun_thenEveryFitIsCountedAndWarnedAbout() throws Exception {
        TestCohorts.breastCancer(dir, 0.3, 5);
        Path spec = TestCohorts.breastCancerSpec(dir, "classifiers: [ { name: svm, method: svm-linear, grid: { C: [0.1, 1] }, "
                + "fixed: { iterations: 1, tolerance: 0.000001 } } ]\n" + TAIL);
        CliTest.Outcome o = CliTest.run("run", spec.toString(), "--out", dir.resolve("cut").toString(), "--quiet");
        assertEquals(0, o.code(), o.err());
        assertTrue(o.err().contains("warning: some model fits stopped at their iteration limit before converging "
                + "(svm: 15 fits)"), o.err());
        Path run = RunTables.only(dir.resolve("cut"), "bcw");
        // per outer fold: 2 grid points x 2 inner folds + the final fit = 5, none of which can converge in one pass
        assertEquals(List.of("5", "5", "5"), column(run, "unconverged_fits"));
        String report = Files.readString(run.resolve("report.html"));
        assertTrue(report.contains("stopped at their solver's iteration limit before converging: source \u00b7 svm (15)"),
                report.substring(Math.max(0, report.indexOf("iteration limit") - 300)));
    }

    @Test
    void givenDefaultSvm_whenRun_thenNothingIsCountedOrSaid() throws Exception {
        TestCohorts.breastCancer(dir, 0.3, 5);
        Path spec = TestCohorts.breastCancerSpec(dir, "classifiers: [ { name: svm, method: svm-linear, grid: { C: [0.1, 1] } } ]\n"
                + TAIL);
        CliTest.Outcome o = CliTest.run("run", spec.toString(), "--out", dir.resolve("ok").toString(), "--quiet");
        assertEquals(0, o.code(), o.err());
        assertFalse(o.err().contains("iteration limit"), o.err());
        Path run = RunTables.only(dir.resolve("ok"), "bcw");
        assertEquals(List.of("0", "0", "0"), column(run, "unconverged_fits"));
        assertFalse(Files.readString(run.resolve("report.html")).contains("iteration limit"));
    }
}
