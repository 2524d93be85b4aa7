package org.viewgain.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.function.IntPredicate;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The missing-target audit on invented cohorts of 60 subjects (30 controls, 30 patients, two sites balanced across
 * groups, a covariate age): targets missing mostly in patients and in older subjects are flagged by {@code check},
 * {@code run} (stderr and missingness.csv) and the report; targets missing evenly are not.
 */
class MissingTargetsCliTest {
    @TempDir
    Path dir;

    /** Writes the cohort; {@code missing} picks the subjects without a target; they are 12 years older when aged. */
    static Path cohort(Path dir, IntPredicate missing, boolean older) throws IOException {
        return cohort(dir, missing, older, new String[] {"east", "west"});
    }

    static Path cohort(Path dir, IntPredicate missing, boolean older, String[] sites) throws IOException {
        Files.createDirectories(dir);
        StringBuilder subjects = new StringBuilder("subject,group,site,age\n");
        StringBuilder src = new StringBuilder("subject,s1,s2,s3\n");
        StringBuilder tgt = new StringBuilder("subject,t1,t2\n");
        for (int i = 0; i < 60; i++) {
            String id = String.format(Locale.ROOT, "m%02d", i);
            int age = 40 + i * 7 % 23 + (older && missing.test(i) ? 12 : 0);
            subjects.append(id).append(',').append(i % 2 == 1 ? "patient" : "control").append(',')
                    .append(sites[i / 2 % sites.length]).append(',').append(age).append('\n');
            src.append(id).append(',').append(i % 7).append(',').append(i % 5).append(',').append(i % 3).append('\n');
            if (!missing.test(i)) {
                tgt.append(id).append(',').append(i % 4).append(',').append(i % 6).append('\n');
            }
        }
        Files.writeString(dir.resolve("subjects.csv"), subjects);
        Files.writeString(dir.resolve("source.csv"), src);
        Files.writeString(dir.resolve("target.csv"), tgt);
        return Files.writeString(dir.resolve("spec.yaml"), """
                experiment: missing
                seed: 3
                cohort: { subjects: subjects.csv, groups: [control, patient], positive: patient, site: site,
                          covariates: [age] }
                views:
                  source: { table: source.csv }
                  target: { table: target.csv, missing: allowed }
                feature-sets: [source, source+target]
                classifiers: [ { name: k, method: knn, fixed: { k: 3 } } ]
                validation: { outer: { folds: 5 }, inner: { folds: 2 } }
                significance: { compare: [], bootstrap: 0 }
                """);
    }

    /** The first two controls (i = 0, 2) and the first 20 patients (i = 1, 3, ..., 39) lack a target. */
    static boolean notAtRandom(int i) {
        return i % 2 == 0 ? i < 4 : i < 40;
    }

    @Test
    void givenTargetsMissingMostlyInOlderPatients_whenChecked_thenGroupAndAgeFlaggedWithCounts() throws IOException {
        Path spec = cohort(dir, MissingTargetsCliTest::notAtRandom, true);
        CliTest.Outcome c = CliTest.run("check", spec.toString());
        assertEquals(0, c.code(), c.err());
        // group: controls 2 of 30 missing, patients 20 of 30; Fisher's exact test on [[28, 2], [10, 20]], two-sided
        // p = 1.908207101652247e-06 (scipy 1.17.1 fisher_exact, reference library), printed to 2 digits
        assertTrue(c.out().contains("group: control 2/30 patient 20/30; Fisher's exact test p = 1.9e-06"), c.out());
        // site: east and west each hold 11 of the 22 missing (1 + 10), [[19, 11], [19, 11]] -> p = 1 (by hand: the
        // observed table is the most likely one, so every table counts)
        assertTrue(c.out().contains("site: east 11/30 west 11/30; Fisher's exact test p = 1.000"), c.out());
        // age: every subject without a target is 12 years older than the rule 40 + (7 i mod 23) gives the others
        assertTrue(c.out().contains("age: median"), c.out());
        assertTrue(c.out().contains("associated with group, age"), c.out());
        assertTrue(c.out().contains("complete-case feature sets (source+target) describe a selected subgroup"),
                c.out());
    }

    @Test
    void givenTargetsMissingEvenly_whenChecked_thenNoWarning() throws IOException {
        // 5 controls (i = 0, 12, 24, 36, 48) and 6 patients (i = 1, 11, ..., 51) lack a target; Fisher's exact test on
        // [[25, 5], [24, 6]] gives p = 1 (scipy 1.17.1)
        Path spec = cohort(dir, i -> i % 2 == 0 ? i % 12 == 0 : i % 10 == 1, false);
        CliTest.Outcome c = CliTest.run("check", spec.toString());
        assertEquals(0, c.code(), c.err());
        assertTrue(c.out().contains("group: control 5/30 patient 6/30; Fisher's exact test p = 1.000"), c.out());
        assertTrue(c.out().contains("no association at level 0.05"), c.out());
        assertFalse(c.out().contains("selected subgroup"), c.out());
    }

    @Test
    void givenThreeSites_whenChecked_thenFreemanHaltonExactTest() throws IOException {
        Path spec = cohort(dir, MissingTargetsCliTest::notAtRandom, false, new String[] {"east", "west", "north"});
        CliTest.Outcome c = CliTest.run("check", spec.toString());
        assertEquals(0, c.code(), c.err());
        // sites of subject i: (i / 2) mod 3; the 22 without a target fall 8, 8 and 6 into east, west and north (by
        // hand: controls 0 and 2 in east and west, patients j = i / 2 = 0..19 by j mod 3: 7, 7, 6). Freeman & Halton
        // 1951 on observed (12, 14, 12) and missing (8, 6, 8): p = 0.8395542842389955, recomputed by a separate
        // enumeration in Python (exact integer binomials), printed to 3 decimals
        assertTrue(c.out().contains("site: east 8/20 north 6/20 west 8/20; Freeman-Halton exact test p = 0.840"),
                c.out());
    }

    @Test
    void givenTargetsMissingNotAtRandom_whenRun_thenWarnedTabledAndReported() throws IOException {
        Path spec = cohort(dir, MissingTargetsCliTest::notAtRandom, true);
        Path out = dir.resolve("out");
        CliTest.Outcome r = CliTest.run("run", spec.toString(), "--out", out.toString(), "--quiet");
        assertEquals(0, r.code(), r.err());
        assertTrue(r.err().contains("warning: whether the target view is missing is associated with group, age"),
                r.err());
        Path run;
        try (Stream<Path> s = Files.walk(out)) {
            run = s.filter(p -> p.getFileName().toString().equals("run.json")).findFirst().orElseThrow().getParent();
        }
        String csv = Files.readString(run.resolve("missingness.csv"));
        assertTrue(csv.startsWith("variable,level,target_observed,target_missing,median_observed,median_missing,"
                + "test,statistic,p_value,caveat\n"), csv);
        assertTrue(csv.contains("\ngroup,control,28,2,,,fisher-exact,,"), csv);
        assertTrue(csv.contains("\ngroup,patient,10,20,,,fisher-exact,,"), csv);
        assertTrue(csv.contains("\nage,,38,22,"), csv);
        String html = Files.readString(run.resolve("report.html"));
        assertTrue(html.contains("id=\"missing-targets\""), "audit table in the cohort section");
        assertTrue(html.contains("Whether the target view is missing is associated with group, age"), "warning");
    }
}
