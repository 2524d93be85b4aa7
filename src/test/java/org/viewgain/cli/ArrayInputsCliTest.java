package org.viewgain.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.testing.CliRunner;

/**
 * A whole run from a stacked .npy source view and per-subject .mat target files, written by numpy 2.4.6 and scipy
 * 1.17.1 (src/test/resources/cohort/arrays/generate.py, folder cohort12/), and the one-line refusals of bad ones.
 */
class ArrayInputsCliTest {
    @TempDir
    Path dir;

    private static final String SPEC = """
            experiment: arrays
            cohort: { subjects: subjects.csv, groups: [control, patient], positive: patient }
            views:
              source: { stacked: thickness.npy, subject-order: order.txt, labels: labels.txt }
              target: { matrices: "area/{subject}.mat", missing: allowed }
            imputers: [ { name: m, method: mean } ]
            feature-sets: [source, source+imputed]
            classifiers: [ { name: s, method: svm-linear } ]
            validation: { outer: { folds: 2 }, inner: { folds: 2 } }
            """;

    private Path cohort(String spec) throws IOException, URISyntaxException {
        Path from = Path.of(getClass().getResource("/cohort/arrays/cohort12").toURI());
        try (Stream<Path> files = Files.walk(from)) {
            for (Path p : files.filter(Files::isRegularFile).toList()) {
                Path to = dir.resolve(from.relativize(p).toString());
                Files.createDirectories(to.getParent());
                Files.copy(p, to, StandardCopyOption.REPLACE_EXISTING);
            }
        }
        Files.copy(from.resolveSibling("labels.txt"), dir.resolve("labels.txt"), StandardCopyOption.REPLACE_EXISTING);
        return Files.writeString(dir.resolve("spec.yaml"), spec);
    }

    @Test
    void givenStackedNpyAndMatFiles_whenCheckedAndRun_thenCompleteWithEveryInputHashed() throws Exception {
        Path spec = cohort(SPEC);
        CliRunner.Outcome check = CliRunner.run("check", spec.toString());
        assertEquals(0, check.code(), check.err());
        assertTrue(check.out().contains("spec and data are fine"), check.out());
        CliRunner.Outcome run = CliRunner.run("run", spec.toString(), "--quiet", "--threads", "1", "--out",
                dir.resolve("results").toString());
        assertEquals(0, run.code(), run.err());
        Path runDir;
        try (Stream<Path> s = Files.list(dir.resolve("results/arrays"))) {
            runDir = s.findFirst().orElseThrow();
        }
        String json = Files.readString(runDir.resolve("run.json"));
        for (String input : new String[] {"thickness.npy", "order.txt", "labels.txt", "area/a1.mat"}) {
            assertTrue(json.contains("\"" + input + "\""), () -> input + " is hashed in run.json");
        }
        // labels.txt names the regions (generate.py wrote them); they name the edges in importance.csv
        assertTrue(Files.readString(runDir.resolve("importance.csv")).contains("lh-frontal~lh-parietal"));
    }

    @Test
    void givenUnknownVariableOrV73File_whenChecked_thenExit2AndOneLineNamingFileAndCause() throws Exception {
        Path spec = cohort(SPEC.replace("missing: allowed }", "missing: allowed, variable: conn }"));
        CliRunner.Outcome o = CliRunner.run("check", spec.toString());
        assertEquals(2, o.code());
        assertEquals(1, o.err().strip().lines().count(), o.err());
        assertTrue(o.err().startsWith("viewgain: ") && o.err().contains("a1.mat")
                && o.err().contains("no variable 'conn'") && o.err().contains("area (4 x 4"), o.err());

        spec = cohort(SPEC);
        Path v73 = Path.of(getClass().getResource("/cohort/arrays/v73.mat").toURI());
        Files.copy(v73, dir.resolve("area/a2.mat"), StandardCopyOption.REPLACE_EXISTING);
        o = CliRunner.run("check", spec.toString());
        assertEquals(2, o.code());
        assertTrue(o.err().contains("subject a2") && o.err().contains("v7.3") && !o.err().contains("Exception"),
                o.err());
    }
}
