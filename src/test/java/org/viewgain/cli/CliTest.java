package org.viewgain.cli;

import org.viewgain.testing.CliRunner;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Exit codes and messages of the command line. */
class CliTest {
    @TempDir
    Path dir;

    record Outcome(int code, String out, String err) {
    }

    static Outcome run(String... args) {
        CliRunner.Outcome o = CliRunner.run(args);
        return new Outcome(o.code(), o.out(), o.err());
    }

    Path cohort() throws IOException {
        StringBuilder subjects = new StringBuilder("subject,group\n");
        StringBuilder src = new StringBuilder("subject,x1,x2\n");
        for (int i = 1; i <= 12; i++) {
            subjects.append("a").append(i).append(i % 2 == 0 ? ",patient\n" : ",control\n");
            src.append("a").append(i).append(',').append(i % 3).append(',').append(i % 2 + i % 5).append('\n');
        }
        Files.writeString(dir.resolve("subjects.csv"), subjects);
        Files.writeString(dir.resolve("src.csv"), src);
        return dir;
    }

    static final String SPEC = """
            experiment: tiny
            cohort: { subjects: subjects.csv, groups: [control, patient], positive: patient }
            views: { source: { table: src.csv } }
            feature-sets: [source]
            classifiers: [ { name: k, method: knn, fixed: { k: 1 } } ]
            validation: { outer: { folds: 2 }, inner: { folds: 2 } }
            """;

    @Test
    void givenHelpAndVersion_whenAsked_thenEveryCommandAnswersWithZero() {
        for (String cmd : new String[] {"check", "run", "demo"}) {
            Outcome o = run(cmd, "--help");
            assertEquals(0, o.code(), cmd);
            assertTrue(o.out().contains("Usage: viewgain " + cmd), o.out());
            assertEquals(0, run(cmd, "--version").code());
        }
        Outcome v = run("--version");
        assertEquals(0, v.code());
        assertTrue(v.out().startsWith("viewgain "), v.out());
    }

    @Test
    void givenMalformedSpec_whenRun_thenExit2WithOneLineNamingKeyAndLine() throws IOException {
        cohort();
        Path spec = dir.resolve("bad.yaml");
        Files.writeString(spec, SPEC.replace("feature-sets", "feature-set"));
        Outcome o = run("run", spec.toString(), "--out", dir.resolve("results").toString(), "--quiet");
        assertEquals(2, o.code(), o.err());
        assertEquals(1, o.err().strip().lines().count(), o.err());
        assertTrue(o.err().contains("bad.yaml:4: feature-set: unknown key"), o.err());
        assertTrue(!o.err().contains("Exception") && !o.err().contains("\tat "), o.err());
        assertTrue(!Files.exists(dir.resolve("results")), "nothing may be written for a bad spec");
    }

    @Test
    void givenMalformedCsv_whenChecked_thenExit2NamingFileAndLine() throws IOException {
        cohort();
        Files.writeString(dir.resolve("src.csv"), Files.readString(dir.resolve("src.csv")).replace("a2,2,", "a2,oops,"));
        Path spec = dir.resolve("spec.yaml");
        Files.writeString(spec, SPEC);
        Outcome o = run("check", spec.toString());
        assertEquals(2, o.code(), o.err());
        assertEquals(1, o.err().strip().lines().count(), o.err());
        assertTrue(o.err().contains("src.csv") && o.err().contains("line 3") && o.err().contains("a2"), o.err());
    }

    @Test
    void givenGoodSpec_whenCheckedThenRun_thenSummaryAndANewFolderPerRun() throws IOException {
        cohort();
        Path spec = dir.resolve("spec.yaml");
        Files.writeString(spec, SPEC);
        Outcome c = run("check", spec.toString());
        assertEquals(0, c.code(), c.err());
        assertTrue(c.out().contains("model fits in this run: 2"), c.out());
        Path results = dir.resolve("results");
        Outcome r1 = run("run", spec.toString(), "--out", results.toString(), "--quiet", "--threads", "1");
        Outcome r2 = run("run", spec.toString(), "--out", results.toString(), "--quiet", "--threads", "1");
        assertEquals(0, r1.code(), r1.err());
        assertEquals(0, r2.code(), r2.err());
        assertEquals("", r1.err());
        try (Stream<Path> runs = Files.list(results.resolve("tiny"))) {
            assertEquals(2, runs.count());
        }
        assertTrue(r1.out().contains("balanced acc."), r1.out());
    }

    @Test
    void givenZeroThreads_whenRun_thenUsageErrorExit2() throws IOException {
        cohort();
        Path spec = dir.resolve("spec.yaml");
        Files.writeString(spec, SPEC);
        Outcome o = run("run", spec.toString(), "--threads", "0", "--out", dir.resolve("r").toString());
        assertEquals(2, o.code());
        assertTrue(o.err().contains("--threads must be at least 1"), o.err());
    }
}
