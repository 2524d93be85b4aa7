package org.viewgain.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.testing.TestCohorts;

/**
 * Shards of a run merged with {@code viewgain merge} give the tables of one single-machine run byte for byte
 * (sequential stopping applied to the merged permutation statistics); a missing or doubled shard is refused; the
 * Slurm scripts are valid bash and call the launcher by absolute path.
 */
class ShardMergeTest {
    @TempDir
    Path dir;

    static final String BODY = """
            imputers: [ { name: ridge, method: ridge, grid: { alpha: [1, 10] } } ]
            feature-sets: [source, target, source+imputed]
            classifiers: [ { name: lr, method: logistic, grid: { lambda: [0.1, 1.0] } } ]
            validation: { outer: { folds: 3, repeats: 2 }, inner: { folds: 2 } }
            significance: { permutations: 19, early-stop: 3, metric: auc, compare: ["source+imputed vs source"] }
            """;

    @Test
    void givenThreeShards_whenMerged_thenTablesAreByteIdenticalToOneRun() throws Exception {
        TestCohorts.synthetic(dir, 48, 8, 6, 1.0, 0.2, 5);
        Path spec = TestCohorts.spec(dir, BODY);
        Path whole = dir.resolve("whole");
        assertEquals(0, CliTest.run("run", spec.toString(), "--out", whole.toString(), "--quiet").code());
        Path cluster = dir.resolve("cluster");
        for (int i = 1; i <= 3; i++) {
            CliTest.Outcome o = CliTest.run("run", spec.toString(), "--shard", i + "/3", "--out", cluster.toString(),
                    "--quiet", "--threads", "1");
            assertEquals(0, o.code(), o.err());
        }
        String s1 = cluster.resolve("shard-1-of-3").toString();
        String s2 = cluster.resolve("shard-2-of-3").toString();
        String s3 = cluster.resolve("shard-3-of-3").toString();
        CliTest.Outcome missing = CliTest.run("merge", s1, s3, "--out", dir.resolve("m0").toString(), "--quiet");
        assertEquals(2, missing.code());
        assertTrue(missing.err().contains("shard 2/3 is missing"), missing.err());
        CliTest.Outcome doubled = CliTest.run("merge", s1, s2, s2, s3, "--out", dir.resolve("m0").toString());
        assertEquals(2, doubled.code());
        assertTrue(doubled.err().contains("given twice"), doubled.err());
        assertTrue(!Files.exists(dir.resolve("m0")), "nothing is written for a refused merge");
        CliTest.Outcome merged = CliTest.run("merge", s3, s1, s2, "--out", dir.resolve("merged").toString(),
                "--quiet");
        assertEquals(0, merged.code(), merged.err());
        Path m = RunTables.only(dir.resolve("merged"), "synthetic");
        assertTrue(Files.readString(m.resolve("run.json")).contains("\"status\" : \"complete\""));
        RunTables.assertSameTables(RunTables.only(whole, "synthetic"), m);
        assertTrue(RunTables.tables(m).contains("permutations.csv") && RunTables.tables(m).contains("comparisons.csv"));
    }

    @Test
    void givenSlurmCommand_whenWritten_thenScriptsAreValidBashWithArrayAndDependentMerge() throws Exception {
        TestCohorts.synthetic(dir, 30, 4, 3, 1.0, 0.2, 5);
        Path spec = TestCohorts.spec(dir, BODY);
        Path launcher = Files.writeString(dir.resolve("viewgain"), "#!/bin/sh\n");
        Path out = dir.resolve("slurm job");
        CliTest.Outcome o = CliTest.run("slurm", spec.toString(), "--shards", "4", "--out", out.toString(),
                "--launcher", launcher.toString());
        assertEquals(0, o.code(), o.err());
        String array = Files.readString(out.resolve("array.sh"));
        assertTrue(array.contains("#SBATCH --array=1-4") && array.contains("SLURM_ARRAY_TASK_ID")
                && array.contains("'" + launcher.toAbsolutePath() + "'"), array);
        assertTrue(Files.readString(out.resolve("submit.sh")).contains("--dependency=afterok:"));
        assertTrue(Files.readString(out.resolve("merge.sh")).contains("shard-4-of-4"));
        for (String script : new String[] {"array.sh", "merge.sh", "submit.sh"}) {
            Process p = new ProcessBuilder("bash", "-n", out.resolve(script).toString()).redirectErrorStream(true)
                    .start();
            assertTrue(p.waitFor(20, TimeUnit.SECONDS));
            assertEquals(0, p.exitValue(), script + ": " + new String(p.getInputStream().readAllBytes()));
        }
        assertEquals(2, CliTest.run("slurm", spec.toString(), "--shards", "4", "--out", out.toString(),
                "--launcher", launcher.toString()).code(), "scripts are never overwritten");
    }
}
