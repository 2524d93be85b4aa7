package org.viewgain.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.File;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.engine.Journal;
import org.viewgain.testing.TestCohorts;

/**
 * A run killed with SIGKILL part-way and resumed with {@code --resume} gives the same tables, byte for byte, as an
 * uninterrupted run; a changed input file makes the journal refuse to resume.
 */
class ResumeTest {
    @TempDir
    Path dir;

    static final String BODY = """
            imputers: [ { name: ridge, method: ridge, grid: { alpha: [1, 10] } } ]
            feature-sets: [source, target, source+imputed]
            classifiers: [ { name: lr, method: logistic, grid: { lambda: [0.1, 1.0] } } ]
            validation: { outer: { folds: 4, repeats: 2 }, inner: { folds: 2 } }
            significance: { permutations: 59, early-stop: 4, metric: auc, compare: ["source+imputed vs source"] }
            """;

    Path spec() {
        TestCohorts.synthetic(dir, 60, 8, 6, 1.0, 0.2, 31);
        return TestCohorts.spec(dir, BODY);
    }

    static long lines(Path f) {
        try {
            return Files.exists(f) ? Files.readString(f).chars().filter(c -> c == '\n').count() : 0;
        } catch (IOException e) {
            return 0;
        }
    }

    @Test
    void givenRunKilledMidway_whenResumed_thenTablesAreByteIdenticalToAnUninterruptedRun() throws Exception {
        Path spec = spec();
        Path whole = dir.resolve("whole");
        assertEquals(0, CliTest.run("run", spec.toString(), "--out", whole.toString(), "--quiet").code());
        Path killedRoot = dir.resolve("killed");
        Process child = new ProcessBuilder(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                "-cp", System.getProperty("java.class.path"), "org.viewgain.cli.Main", "run", spec.toString(),
                "--out", killedRoot.toString(), "--threads", "2", "--quiet")
                .redirectOutput(File.createTempFile("child", ".out", dir.toFile()))
                .redirectErrorStream(true).start();
        Path journal = null;
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(60);
        while (System.nanoTime() < deadline && child.isAlive()) {
            // the experiment folder appears a moment before the run folder inside it: wait for both
            Path experiment = killedRoot.resolve("synthetic");
            List<Path> runs = List.of();
            if (Files.isDirectory(experiment)) {
                try (var s = Files.list(experiment)) {
                    runs = s.filter(Files::isDirectory).toList();
                }
            }
            if (runs.size() == 1) {
                journal = runs.get(0).resolve(Journal.FILE);
                if (lines(journal) >= 12) {
                    break;
                }
            }
            Thread.sleep(5);
        }
        child.destroyForcibly();
        child.waitFor(20, TimeUnit.SECONDS);
        assertTrue(journal != null && lines(journal) >= 12, "the child never journaled 12 units");
        Path run = journal.getParent();
        String status = Files.readString(run.resolve("run.json"));
        assertTrue(status.contains("\"status\" : \"running\""), "killed before the end, so not complete: " + status);
        assertTrue(!Files.exists(run.resolve("predictions.csv")));
        CliTest.Outcome resumed = CliTest.run("run", "--resume", run.toString(), "--quiet");
        assertEquals(0, resumed.code(), resumed.err());
        assertTrue(Files.readString(run.resolve("run.json")).contains("\"status\" : \"complete\""));
        RunTables.assertSameTables(RunTables.only(whole, "synthetic"), run);
        assertTrue(RunTables.tables(run).containsAll(List.of("predictions.csv", "metrics.csv", "fold_metrics.csv",
                "comparisons.csv", "permutations.csv", "permutation_null.csv", "hyperparameters.csv")));
    }

    @Test
    void givenTornLastLine_whenResumed_thenItIsIgnoredAndTheRunFinishes() throws Exception {
        Path spec = spec();
        Path whole = dir.resolve("whole");
        assertEquals(0, CliTest.run("run", spec.toString(), "--out", whole.toString(), "--quiet").code());
        Path run = RunTables.only(whole, "synthetic");
        // simulate a crash: keep the header and five units, tear the sixth line in the middle, run.json says running
        List<String> lines = Files.readAllLines(run.resolve(Journal.FILE));
        Path copy = dir.resolve("copy");
        Files.createDirectories(copy);
        Files.writeString(copy.resolve(Journal.FILE), String.join("\n", lines.subList(0, 6)) + "\n"
                + lines.get(6).substring(0, lines.get(6).length() / 2));
        Files.writeString(copy.resolve("run.json"), Files.readString(run.resolve("run.json"))
                .replace("\"status\" : \"complete\"", "\"status\" : \"running\""));
        CliTest.Outcome resumed = CliTest.run("run", "--resume", copy.toString(), "--quiet");
        assertEquals(0, resumed.code(), resumed.err());
        RunTables.assertSameTables(run, copy);
        // a damaged line that is not the last cannot be trusted
        Path bad = dir.resolve("bad");
        Files.createDirectories(bad);
        Files.writeString(bad.resolve(Journal.FILE), String.join("\n", lines.subList(0, 3)).replaceFirst(
                "\"unit\":\"", "\"unit\":\"x") + "\n" + lines.get(3) + "\n");
        Files.copy(copy.resolve("run.json"), bad.resolve("run.json"));
        Files.writeString(bad.resolve("run.json"), Files.readString(bad.resolve("run.json"))
                .replace("\"status\" : \"complete\"", "\"status\" : \"running\""));
        CliTest.Outcome refused = CliTest.run("run", "--resume", bad.toString(), "--quiet");
        assertEquals(2, refused.code(), refused.err());
        assertTrue(refused.err().contains("damaged"), refused.err());
    }

    @Test
    void givenChangedDataFile_whenResumed_thenRefusedWithOneLineAndExit2() throws Exception {
        Path spec = spec();
        Path whole = dir.resolve("whole");
        assertEquals(0, CliTest.run("run", spec.toString(), "--out", whole.toString(), "--quiet").code());
        Path run = RunTables.only(whole, "synthetic");
        CliTest.Outcome done = CliTest.run("run", "--resume", run.toString(), "--quiet");
        assertEquals(2, done.code(), "a complete run is not resumed: " + done.err());
        Files.writeString(run.resolve("run.json"), Files.readString(run.resolve("run.json"))
                .replace("\"status\" : \"complete\"", "\"status\" : \"failed\""));
        Path source = dir.resolve("source.csv");
        String text = Files.readString(source);
        Files.writeString(source, text.replaceFirst("\n([^,\n]+),", "\n$1,9"));
        CliTest.Outcome o = CliTest.run("run", "--resume", run.toString(), "--quiet");
        assertEquals(2, o.code(), o.err());
        assertEquals(1, o.err().strip().lines().count(), o.err());
        assertTrue(o.err().contains("source.csv") && o.err().contains("cannot be resumed"), o.err());
        // a run folder is never overwritten: a second shard run into the same folder is refused
        assertEquals(0, CliTest.run("run", spec.toString(), "--shard", "1/2", "--out", dir.resolve("s").toString(),
                "--quiet").code());
        assertEquals(2, CliTest.run("run", spec.toString(), "--shard", "1/2", "--out", dir.resolve("s").toString(),
                "--quiet").code());
    }
}
