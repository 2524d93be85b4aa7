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
        return cohorts(shift, dev, ext, 5);
    }

    /**
     * The same with the development cohort's people from {@code people} and the independent's from the next seed,
     * in a folder of their own (the root for seed 5).
     */
    Path cohorts(double shift, int dev, int ext, long people) throws IOException {
        Path base = people == 5 ? dir : dir.resolve("pair-" + people);
        ScaleCohort.write(base.resolve("dev"), dev, 10, 5, people, "d", 0.3, shift);
        ScaleCohort.write(base.resolve("ext"), ext, 10, 5, people + 1, "e", 1.0, shift);
        Path spec = base.resolve("spec.yaml");
        Files.writeString(spec, SPEC);
        return spec;
    }

    static Map<String, Double> metric(Path run, String file, String metric) throws IOException {
        Map<String, Double> out = new HashMap<>();
        List<String> lines = Files.readAllLines(run.resolve(file));
        for (String l : lines.subList(1, lines.size())) {
            String[] c = l.split(",");
            if (c[4].equals(metric)) {
                out.put(c[1] + "/" + c[2] + "/" + c[3], c[5].isEmpty() ? Double.NaN : Double.parseDouble(c[5]));
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

    /**
     * The signed z of DeLong's test of source+imputed against source on the independent cohort: positive when
     * source+imputed has the larger AUC, |z| from the two-sided p.
     */
    static double delongZ(Path run) throws IOException {
        for (String l : Files.readAllLines(run.resolve("external_comparisons.csv"))) {
            String[] c = l.split(",");
            if (c[3].equals("delong_auc")) {
                double z = new org.apache.commons.math3.distribution.NormalDistribution()
                        .inverseCumulativeProbability(1 - Double.parseDouble(c[7]) / 2);
                return Math.signum(Double.parseDouble(c[4]) - Double.parseDouble(c[5])) * z;
            }
        }
        throw new AssertionError("no delong_auc row");
    }

    /**
     * Three independent pairs of cohorts (development: 150 subjects, 70% with a target; independent: 200 subjects,
     * none) from one invented population, each pair with its own people: returns Stouffer's combination of the
     * three DeLong z values (Stouffer et al. 1949; one-sided level 0.05 at z = 1.645), after checking each run.
     */
    double combinedZ(double shift, java.util.function.Consumer<Path> eachRun) throws IOException {
        double sum = 0;
        for (long seed : new long[] {5, 7, 9}) {
            Path run = run(cohorts(shift, 150, 200, seed), "out-" + seed);
            eachRun.accept(run);
            sum += delongZ(run);
        }
        return sum / Math.sqrt(3);
    }

    @Test
    void givenPlantedGain_whenRunWithIndependentCohorts_thenSourcePlusImputedBeatsSourceThere() throws IOException {
        // planted truth: the group shifts a latent factor that the target view expresses strongly (scale 1.5) and
        // the source view weakly (0.3); the ridge imputer, fitted on development targets without labels, recovers
        // the factor's direction, so source+imputed should gain a little AUC in every pair. Measured on these seeds
        // at shift 1.5: gains 0.018, 0.015, 0.016, two-sided DeLong p 0.002, 0.077, 0.041 (combined z about 3.9)
        double z = combinedZ(1.5, run -> {
            try {
                Map<String, Double> auc = metric(run, "external_metrics.csv", "auc");
                assertTrue(auc.get("ridge/source+imputed/svm") > auc.get("none/source/svm"), auc.toString());
                assertEquals(200 * 2 + 1, Files.readAllLines(run.resolve("external_predictions.csv")).size());
                assertFalse(Files.exists(run.resolve("external_imputation.csv")), "no target was observed there");
            } catch (IOException e) {
                throw new java.io.UncheckedIOException(e);
            }
        });
        assertTrue(z > 1.645, "combined one-sided evidence of a gain: z = " + z);
        Path run = RunTables.only(dir.resolve("out-5"), "indep");
        assertTrue(Files.isRegularFile(run.resolve("bundle/manifest.json")));
        assertTrue(Files.readString(run.resolve("report.html")).contains("later-clinic"),
                "the report has a section for the independent cohort");
    }

    @Test
    void givenNoGroupSignal_whenRunWithIndependentCohorts_thenNoGainThere() throws IOException {
        // the null scenario: no group signal in either view, so neither feature set can beat the other
        double z = combinedZ(0.0, run -> {
            try {
                for (double a : metric(run, "external_metrics.csv", "auc").values()) {
                    // 200 subjects, 100 per group: the AUC's null standard error is about 0.04 (Hanley & McNeil 1982)
                    assertTrue(Math.abs(a - 0.5) < 0.15, "AUC " + a);
                }
            } catch (IOException e) {
                throw new java.io.UncheckedIOException(e);
            }
        });
        assertTrue(z < 1.645, "no combined evidence of a gain: z = " + z);
    }

    /** {@code apply} of the run's bundle to the cohort file writes the run's external tables byte for byte. */
    void assertApplyGivesTheRunsTables(Path run, Path cohort) throws IOException {
        CliTest.Outcome o = CliTest.run("apply", run.resolve("bundle").toString(), cohort.toString(), "--out",
                dir.resolve("applied").toString());
        assertEquals(0, o.code(), o.err());
        for (String t : List.of("external_predictions.csv", "external_metrics.csv", "external_comparisons.csv")) {
            assertEquals(Files.readString(run.resolve(t)), Files.readString(dir.resolve("applied").resolve(t)), t);
        }
    }

    @Test
    void givenABundle_whenAppliedToTheSameCohort_thenPredictionsEqualTheRunsByteForByte() throws IOException {
        Path spec = cohorts(1.0, 90, 60);
        String svm = "classifiers: [ { name: svm, method: svm-linear, grid: { C: [0.01, 1] } } ]";
        assertTrue(SPEC.contains(svm));
        Files.writeString(spec, SPEC.replace(svm, "classifiers: [ { name: svm, method: svm-linear, grid: { C: [0.01, 1] }"
                + " }, { name: forest, method: random-forest, fixed: { trees: 40 } } ]"));
        Path run = run(spec, "out");
        // calibration rows: numbers for the forest's probabilities, blank for the SVM's decision values
        assertTrue(metric(run, "external_metrics.csv", "brier").get("none/source/forest") > 0);
        assertTrue(Files.readAllLines(run.resolve("external_metrics.csv")).stream()
                .anyMatch(l -> l.startsWith("later-clinic,none,source,svm,calibration_slope,,")));
        assertTrue(Files.readString(run.resolve("report.html")).contains("Calibration on the independent cohort"));
        Path cohort = Files.writeString(dir.resolve("cohort.yaml"), COHORT);
        assertApplyGivesTheRunsTables(run, cohort);
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

    /**
     * ComBat in a bundle: fitted on the whole development cohort (sites north and south), frozen with those sites'
     * parameters and applied to independent subjects of the same sites; {@code apply} gives the run's tables byte for
     * byte. An independent subject from a site the development cohort lacks, or a cohort without a site column, is
     * refused with one line before anything is written (by {@code run} and by {@code apply}).
     */
    @Test
    void givenComBat_whenRunAndApplied_thenKnownSitesHarmonizedAndAnUnseenSiteRefused() throws IOException {
        Path spec = cohorts(1.0, 90, 60);
        Files.writeString(spec, SPEC.replace("validation:", "features: { harmonize: combat }\nvalidation:"));
        Path run = run(spec, "out");
        com.fasterxml.jackson.databind.JsonNode m = new com.fasterxml.jackson.databind.ObjectMapper()
                .readTree(run.resolve("bundle/manifest.json").toFile());
        assertEquals("[\"north\",\"south\"]", m.get("shape").get("sites").toString());
        String first = m.get("pipelines").get(0).get("steps").get(0).asText();
        assertEquals("combat", new org.viewgain.frozen.FrozenIn(first,
                Files.readAllBytes(run.resolve("bundle").resolve(first))).kind(), "the first step is ComBat");
        Path cohort = Files.writeString(dir.resolve("cohort.yaml"), COHORT);
        assertApplyGivesTheRunsTables(run, cohort);

        Path subjects = dir.resolve("ext/subjects.csv");
        List<String> lines = new java.util.ArrayList<>(Files.readAllLines(subjects));
        assertTrue(lines.get(2).endsWith(",south"), lines.get(2));
        String moved = lines.get(2).split(",")[0];
        lines.set(2, lines.get(2).replace(",south", ",west"));
        Files.write(subjects, lines);
        CliTest.Outcome o = CliTest.run("apply", run.resolve("bundle").toString(), cohort.toString(), "--out",
                dir.resolve("a1").toString());
        assertEquals(2, o.code(), o.err());
        assertTrue(o.err().strip().lines().count() == 1 && o.err().contains("subjects.csv line 3: subject '" + moved
                + "' is from site 'west', which the development cohort does not have (north, south)"), o.err());
        assertFalse(Files.exists(dir.resolve("a1")));
        o = CliTest.run("run", spec.toString(), "--out", dir.resolve("r1").toString(), "--quiet");
        assertEquals(2, o.code(), o.err());
        assertTrue(o.err().strip().lines().count() == 1 && o.err().contains("site 'west'"), o.err());
        assertFalse(Files.exists(dir.resolve("r1")));

        Files.writeString(cohort, COHORT.replace("site: site\n", ""));
        o = CliTest.run("apply", run.resolve("bundle").toString(), cohort.toString(), "--out",
                dir.resolve("a2").toString());
        assertEquals(2, o.code(), o.err());
        assertTrue(o.err().strip().lines().count() == 1 && o.err().contains(": site: required"), o.err());
        assertFalse(Files.exists(dir.resolve("a2")));
    }

    /** Adds an {@code age} column (invented values from the subject's position) to a subjects table. */
    static void addAge(Path subjects) throws IOException {
        List<String> lines = new java.util.ArrayList<>(Files.readAllLines(subjects));
        lines.set(0, lines.get(0) + ",age");
        for (int i = 1; i < lines.size(); i++) {
            lines.set(i, lines.get(i) + "," + (40 + (i * 7) % 31));
        }
        Files.write(subjects, lines);
    }

    /**
     * Covariate adjustment and ComBat with age as a protected covariate, in a bundle: the independent cohort's own
     * ages are read from its subjects table (the same column name), and {@code apply} gives the run's tables byte for
     * byte. A cohort without the column is refused with one line naming the file and the column.
     */
    @Test
    void givenCovariateAdjustment_whenRunAndApplied_thenSameTablesAndAMissingColumnRefused() throws IOException {
        Path spec = cohorts(1.0, 90, 60);
        addAge(dir.resolve("dev/subjects.csv"));
        addAge(dir.resolve("ext/subjects.csv"));
        Files.writeString(spec, SPEC.replace("site: site }", "site: site, covariates: [age] }")
                .replace("validation:", "features: { adjust: [age], harmonize: combat }\nvalidation:"));
        Path run = run(spec, "out");
        com.fasterxml.jackson.databind.JsonNode m = new com.fasterxml.jackson.databind.ObjectMapper()
                .readTree(run.resolve("bundle/manifest.json").toFile());
        assertEquals("[\"age\"]", m.get("shape").get("covariates").toString());
        assertEquals(3, m.get("pipelines").get(0).get("steps").size(), "adjust, combat, standardize");
        Path cohort = Files.writeString(dir.resolve("cohort.yaml"), COHORT);
        assertApplyGivesTheRunsTables(run, cohort);
        Path subjects = dir.resolve("ext/subjects.csv");
        Files.write(subjects, Files.readAllLines(subjects).stream().map(l -> l.substring(0, l.lastIndexOf(',')))
                .toList());
        CliTest.Outcome o = CliTest.run("apply", run.resolve("bundle").toString(), cohort.toString(), "--out",
                dir.resolve("a1").toString());
        assertEquals(2, o.code(), o.err());
        assertTrue(o.err().strip().lines().count() == 1 && o.err().contains("subjects.csv")
                && o.err().contains("'age'"), o.err());
        assertFalse(Files.exists(dir.resolve("a1")));
    }
}
