package org.viewgain.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.testing.TestCohorts;

/** A rescanned subject is listed by {@code check} and written to duplicates.csv by {@code run}, with the new tables. */
class DuplicateScanCliTest {
    @TempDir
    Path dir;

    @Test
    void givenARescannedSubject_whenCheckedAndRun_thenListedAndWrittenWithSiteAndConfusionTables() throws IOException {
        TestCohorts.synthetic(dir, 40, 30, 4, 1.0, 0.0, 2);
        Path source = dir.resolve("source.csv");
        List<String> lines = Files.readAllLines(source);
        // s012 becomes a copy of s005's values (its own id kept): correlation exactly 1
        String copy = "s012" + lines.get(5).substring(lines.get(5).indexOf(','));
        lines.set(12, copy);
        Files.write(source, lines);
        Path spec = TestCohorts.spec(dir, """
                features: { select: { method: variance, keep: 10 } }
                feature-sets: [source]
                classifiers: [ { name: lr, method: logistic } ]
                validation: { outer: { folds: 4 }, inner: { folds: 2 } }
                """);
        CliTest.Outcome c = CliTest.run("check", spec.toString());
        assertEquals(0, c.code(), c.err());
        assertTrue(c.out().contains("possible duplicate scans: 1 pair(s)") && c.out().contains("s005 ~ s012 (r = 1.000000)"),
                c.out());
        assertTrue(c.out().contains("fitted inside every fit: standardize -> selection variance keep 10 -> classifier"),
                c.out());
        Path out = dir.resolve("results");
        CliTest.Outcome r = CliTest.run("run", spec.toString(), "--out", out.toString(), "--quiet");
        assertEquals(0, r.code(), r.err());
        Path run;
        try (var s = Files.list(out.resolve("synthetic"))) {
            run = s.findFirst().orElseThrow();
        }
        assertEquals(List.of("subject_a,subject_b,correlation", "s005,s012,1"),
                Files.readAllLines(run.resolve("duplicates.csv")));
        List<String> sites = Files.readAllLines(run.resolve("site_metrics.csv"));
        assertEquals("imputer,feature_set,classifier,site,metric,estimate,n", sites.get(0));
        assertEquals(1 + 2 * 7, sites.size());
        assertEquals(1 + 4, Files.readAllLines(run.resolve("confusion.csv")).size());
    }

    @Test
    void givenATableOfMixedUnits_whenChecked_thenOnlyTheRealCopyIsListed() throws IOException {
        // breast-cancer-wisconsin's ten mean_* columns range from ~0.05 (smoothness) to ~650 (area): on raw values
        // 95,853 of 161,596 pairs correlated above 0.999 (measured 2026-12-02), all of them different patients
        TestCohorts.breastCancer(dir, 0.3, 5);
        Path source = dir.resolve("source.csv");
        List<String> lines = Files.readAllLines(source);
        String idOf40 = lines.get(40).substring(0, lines.get(40).indexOf(','));
        String idOf7 = lines.get(7).substring(0, lines.get(7).indexOf(','));
        lines.set(40, idOf40 + lines.get(7).substring(lines.get(7).indexOf(',')));
        Files.write(source, lines);
        Path spec = TestCohorts.breastCancerSpec(dir, """
                feature-sets: [source]
                classifiers: [ { name: lr, method: logistic } ]
                validation: { outer: { folds: 4 }, inner: { folds: 2 } }
                """);
        CliTest.Outcome c = CliTest.run("check", spec.toString());
        assertEquals(0, c.code(), c.err());
        assertTrue(c.out().contains("possible duplicate scans: 1 pair(s)"), c.out());
        assertTrue(c.out().contains(idOf7 + " ~ " + idOf40 + " (r = 1.000000)")
                || c.out().contains(idOf40 + " ~ " + idOf7 + " (r = 1.000000)"), c.out());
    }
}
