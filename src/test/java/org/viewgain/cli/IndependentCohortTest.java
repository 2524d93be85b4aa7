package org.viewgain.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.demo.ScaleCohort;

/**
 * Final pipelines applied to an independent cohort, end to end on planted-truth cohorts (simulations with known
 * truth, invented data): a development cohort with 70% observed targets and an independent cohort of the same
 * invented population that never acquired the target.
 */
class IndependentCohortTest {
    @TempDir
    Path dir;

    static final String SPEC = """
            experiment: indep
            seed: 11
            cohort: { subjects: dev/subjects.csv, groups: [control, patient], positive: patient, site: site }
            views:
              source: { matrices: "dev/views/thickness/{subject}.csv" }
              target: { matrices: "dev/views/area/{subject}.csv", missing: allowed }
            imputers: [ { name: ridge, method: ridge, grid: { alpha: [1, 100] } } ]
            feature-sets: [source, source+imputed]
            classifiers: [ { name: svm, method: svm-linear, grid: { C: [0.01, 1] } } ]
            validation: { outer: { folds: 3 }, inner: { folds: 3 } }
            significance: { bootstrap: 200 }
            independent-cohort:
              name: later-clinic
              subjects: ext/subjects.csv
              group: group
              site: site
              views: { source: { matrices: "ext/views/thickness/{subject}.csv" } }
            """;

    /** Writes the two cohorts (population seed 5) and the spec; returns the spec. */
    Path cohorts(double shift, int dev, int ext) throws IOException {
        ScaleCohort.write(dir.resolve("dev"), dev, 10, 5, 5, "d", 0.3, shift);
        ScaleCohort.write(dir.resolve("ext"), ext, 10, 5, 6, "e", 1.0, shift);
        Path spec = dir.resolve("spec.yaml");
        Files.writeString(spec, SPEC);
        return spec;
    }

    static Map<String, Double> metric(Path run, String file, String metric) throws IOException {
        Map<String, Double> out = new HashMap<>();
        List<String> lines = Files.readAllLines(run.resolve(file));
        for (String l : lines.subList(1, lines.size())) {
            String[] c = l.split(",");
            if (c[4].equals(metric)) {
                out.put(c[1] + "/" + c[2] + "/" + c[3], Double.parseDouble(c[5]));
            }
        }
        return out;
    }

    static final String COHORT = """
            name: later-clinic
            subjects: ext/subjects.csv
            group: group
            site: site
            views: { source: { matrices: "ext/views/thickness/{subject}.csv" } }
            """;

    Path run(Path spec, String out, String... extra) throws IOException {
        String[] args = new String[] {"run", spec.toString(), "--out", dir.resolve(out).toString(), "--quiet"};
        String[] all = java.util.Arrays.copyOf(args, args.length + extra.length);
        System.arraycopy(extra, 0, all, args.length, extra.length);
        CliTest.Outcome o = CliTest.run(all);
        assertEquals(0, o.code(), o.err());
        return RunTables.only(dir.resolve(out), "indep");
    }

    static double p(Path run, String test) throws IOException {
        for (String l : Files.readAllLines(run.resolve("external_comparisons.csv"))) {
            String[] c = l.split(",");
            if (c[3].equals(test)) {
                return Double.parseDouble(c[7]);
            }
        }
        throw new AssertionError("no " + test);
    }

    @Test
    void givenPlantedGain_whenRunWithAnIndependentCohort_thenSourcePlusImputedBeatsSourceThere() throws IOException {
        // planted truth: the group shifts a latent factor that the target view expresses strongly (scale 1.5) and
        // the source view weakly (0.3); the independent cohort never acquired the target
        Path run = run(cohorts(2.0, 150, 200), "out", "--threads", "2");
        assertTrue(Files.isRegularFile(run.resolve("bundle/manifest.json")));
        assertEquals(2 * 200 + 1, Files.readAllLines(run.resolve("external_predictions.csv")).size());
        Map<String, Double> auc = metric(run, "external_metrics.csv", "auc");
        double gain = auc.get("ridge/source+imputed/svm") - auc.get("none/source/svm");
        assertTrue(gain > 0, auc.toString());
        assertFalse(Files.exists(run.resolve("external_imputation.csv")), "no target was observed there");
        String report = Files.readString(run.resolve("report.html"));
        assertTrue(report.contains("later-clinic"), "the report has a section for the independent cohort");
    }

    @Test
    void givenNoGroupSignal_whenRunWithAnIndependentCohort_thenNoGainThere() throws IOException {
        Path run = run(cohorts(0.0, 120, 200), "out");
        Map<String, Double> auc = metric(run, "external_metrics.csv", "auc");
        for (double a : auc.values()) {
            // 200 subjects, 100 per group: the AUC's null standard error is about 0.04 (Hanley & McNeil 1982)
            assertTrue(Math.abs(a - 0.5) < 0.15, auc.toString());
        }
        assertTrue(p(run, "delong_auc") > 0.01, "no planted gain, so no clear difference");
    }

    @Test
    void givenABundle_whenAppliedToTheSameCohort_thenPredictionsEqualTheRunsByteForByte() throws IOException {
        Path run = run(cohorts(1.0, 90, 60), "out");
        Path cohort = Files.writeString(dir.resolve("cohort.yaml"), COHORT);
        CliTest.Outcome o = CliTest.run("apply", run.resolve("bundle").toString(), cohort.toString(), "--out",
                dir.resolve("applied").toString());
        assertEquals(0, o.code(), o.err());
        for (String t : List.of("external_predictions.csv", "external_metrics.csv", "external_comparisons.csv")) {
            assertEquals(Files.readString(run.resolve(t)), Files.readString(dir.resolve("applied").resolve(t)), t);
        }
    }

    @Test
    void givenATamperedBundleOrOtherRegions_whenApplied_thenRefusedWithOneLineAndNothingWritten()
            throws IOException {
        Path run = run(cohorts(1.0, 90, 60), "out");
        Path cohort = Files.writeString(dir.resolve("cohort.yaml"), COHORT);
        Path copy = dir.resolve("tampered");
        copyTree(run.resolve("bundle"), copy);
        Path model = copy.resolve("parts/pipeline-01-model.part");
        byte[] b = Files.readAllBytes(model);
        b[b.length - 1] ^= 1;
        Files.write(model, b);
        CliTest.Outcome o = CliTest.run("apply", copy.toString(), cohort.toString(), "--out",
                dir.resolve("a1").toString());
        assertEquals(2, o.code());
        assertTrue(o.err().contains("SHA-256 differs") && o.err().strip().lines().count() == 1, o.err() + o.out());
        assertFalse(Files.exists(dir.resolve("a1")));

        Path other = dir.resolve("other");
        copyTree(run.resolve("bundle"), other);
        Path manifest = other.resolve("manifest.json");
        Files.writeString(manifest, Files.readString(manifest).replace("\"tool_version\" : \"",
                "\"tool_version\" : \"0.0.1-"));
        o = CliTest.run("apply", other.toString(), cohort.toString(), "--out", dir.resolve("a2").toString());
        assertEquals(2, o.code());
        assertTrue(o.err().contains("made by viewgain 0.0.1-"), o.err());
        assertFalse(Files.exists(dir.resolve("a2")));

        ScaleCohort.write(dir.resolve("ext"), 20, 9, 5, 7, "x", 1.0, 1.0); // 9 regions instead of 10
        Files.writeString(cohort, COHORT.replace("ext/", "ext/").replace("name: later-clinic", "name: nine"));
        o = CliTest.run("apply", run.resolve("bundle").toString(), cohort.toString(), "--out",
                dir.resolve("a3").toString());
        assertEquals(2, o.code());
        assertTrue(o.err().contains(": views.source: it has 9 regions"), o.err());
        assertFalse(Files.exists(dir.resolve("a3")));
    }

    @Test
    void givenOneAndFourThreads_andShards_whenRun_thenTablesAndBundleAreByteIdentical() throws IOException {
        Path spec = cohorts(1.0, 90, 60);
        Path one = run(spec, "one", "--threads", "1");
        Path four = run(spec, "four", "--threads", "4");
        RunTables.assertSameTables(one, four);
        assertSameBundle(one, four);
        for (int s = 1; s <= 2; s++) {
            CliTest.Outcome o = CliTest.run("run", spec.toString(), "--shard", s + "/2", "--out",
                    dir.resolve("shards").toString(), "--quiet", "--threads", "2");
            assertEquals(0, o.code(), o.err());
        }
        CliTest.Outcome o = CliTest.run("merge", dir.resolve("shards/shard-1-of-2").toString(),
                dir.resolve("shards/shard-2-of-2").toString(), "--out", dir.resolve("merged").toString(), "--quiet");
        assertEquals(0, o.code(), o.err());
        Path merged = RunTables.only(dir.resolve("merged"), "indep");
        RunTables.assertSameTables(one, merged);
        assertSameBundle(one, merged);
    }

    static void assertSameBundle(Path a, Path b) throws IOException {
        try (var s = Files.walk(a.resolve("bundle"))) {
            for (Path p : s.filter(Files::isRegularFile).toList()) {
                Path rel = a.relativize(p);
                org.junit.jupiter.api.Assertions.assertArrayEquals(Files.readAllBytes(p),
                        Files.readAllBytes(b.resolve(rel)), rel.toString());
            }
        }
    }

    static void copyTree(Path from, Path to) throws IOException {
        try (var s = Files.walk(from)) {
            for (Path p : s.toList()) {
                Files.copy(p, to.resolve(from.relativize(p).toString()));
            }
        }
    }

    @Test
    void givenAnIndependentSubjectWhoIsADevelopmentSubject_whenCheckedAndRun_thenWarnedAndListed() throws IOException {
        Path spec = cohorts(2.0, 60, 30);
        // the independent cohort's first subject is a development subject's scan under another id
        Path devFile = dir.resolve("dev/views/thickness/d00001.csv");
        Path extFile = dir.resolve("ext/views/thickness/e00001.csv");
        assertTrue(Files.isRegularFile(devFile) && Files.isRegularFile(extFile), "ScaleCohort's file names");
        Files.copy(devFile, extFile, java.nio.file.StandardCopyOption.REPLACE_EXISTING);
        CliTest.Outcome check = CliTest.run(new String[] {"check", spec.toString()});
        assertEquals(0, check.code(), check.err());
        assertTrue(check.out().contains("possible duplicates of development subjects: 1 pair(s)"), check.out());
        assertTrue(check.out().contains("e00001 (independent) ~ d00001 (development) (r = 1.000000)"), check.out());
        CliTest.Outcome o = CliTest.run(new String[] {"run", spec.toString(), "--out", dir.resolve("dup").toString(),
            "--quiet"});
        assertEquals(0, o.code(), o.err());
        assertTrue(o.err().contains("warning: possible duplicates of development subjects"), o.err());
        Path run = RunTables.only(dir.resolve("dup"), "indep");
        List<String> rows = Files.readAllLines(run.resolve("external_duplicates.csv"));
        assertEquals("cohort,independent_subject,development_subject,correlation", rows.get(0));
        assertEquals(2, rows.size(), rows.toString());
        assertTrue(rows.get(1).startsWith("later-clinic,e00001,d00001,"), rows.toString());
        assertTrue(Files.readString(run.resolve("report.html")).contains("Possible duplicates:"));
    }
}
