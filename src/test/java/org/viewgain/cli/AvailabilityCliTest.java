package org.viewgain.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.engine.Journal;
import org.viewgain.testing.TestCohorts;

/**
 * Runs with an availability curve: byte-identical tables on 1 and 4 threads, after {@code --resume} of a run cut off
 * among the curve's units, and after merging shards; the full-data level reproduces {@code metrics.csv},
 * {@code comparisons.csv} and {@code imputation_summary.csv}; {@code check} counts the curve's fits; a spec without
 * the key writes no {@code availability.csv}.
 */
class AvailabilityCliTest {
    @TempDir
    Path dir;

    static final String BODY = """
            imputers:
              - { name: ridge, method: ridge, grid: { alpha: [1, 10] } }
              - { name: nn, method: nearest-neighbours, fixed: { k: 3 } }
            feature-sets: [source, source+imputed]
            classifiers: [ { name: lr, method: logistic, grid: { lambda: [0.1, 1.0] } } ]
            validation: { outer: { folds: 3, repeats: 2 }, inner: { folds: 2 } }
            significance: { compare: ["source+imputed vs source"], bootstrap: 200 }
            """;
    static final String CURVE = "availability-curve: { fractions: [0.4, 0.7, 1.0], margin: 0.03 }\n";

    private Path spec(String body) {
        TestCohorts.synthetic(dir, 54, 6, 4, 1.0, 0.3, 0.2, 23);
        return TestCohorts.spec(dir, body);
    }

    private Path run(Path spec, String out, String... extra) throws IOException {
        List<String> args = new ArrayList<>(List.of("run", spec.toString(), "--out", dir.resolve(out).toString(),
                "--quiet"));
        args.addAll(List.of(extra));
        CliTest.Outcome o = CliTest.run(args.toArray(String[]::new));
        assertEquals(0, o.code(), o.err() + o.out());
        return RunTables.only(dir.resolve(out), "synthetic");
    }

    private static List<CSVRecord> csv(Path f) throws IOException {
        try (var p = CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).get()
                .parse(Files.newBufferedReader(f))) {
            return p.getRecords();
        }
    }

    @Test
    void givenCurve_whenRunOnOneAndFourThreads_thenTablesByteIdenticalAndFullLevelReconciles() throws IOException {
        Path spec = spec(BODY + CURVE);
        Path one = run(spec, "one", "--threads", "1");
        Path four = run(spec, "four", "--threads", "4");
        RunTables.assertSameTables(one, four);
        List<CSVRecord> curve = csv(one.resolve("availability.csv"));
        // 3 levels x 2 imputers x (2 imputation measures + 1 classifier x 4 measures)
        assertEquals(3 * 2 * 6, curve.size());
        Map<String, String> metrics = new HashMap<>();
        for (CSVRecord r : csv(one.resolve("metrics.csv"))) {
            metrics.put(r.get("imputer") + "/" + r.get("feature_set") + "/" + r.get("classifier") + "/"
                    + r.get("metric"), r.get("estimate") + " " + r.get("ci_low") + " " + r.get("ci_high"));
        }
        Map<String, String> gains = new HashMap<>();
        for (CSVRecord r : csv(one.resolve("comparisons.csv"))) {
            if (r.get("test").equals("corrected-t") || r.get("test").equals("delong")) {
                gains.put(r.get("imputer_a") + "/" + r.get("metric"), r.get("difference") + " " + r.get("ci_low")
                        + " " + r.get("ci_high"));
            }
        }
        Map<String, String> summary = new HashMap<>();
        for (CSVRecord r : csv(one.resolve("imputation_summary.csv"))) {
            summary.put(r.get("imputer") + "/imputation_mae", r.get("mae_mean"));
            summary.put(r.get("imputer") + "/imputation_skill", r.get("skill_mean"));
        }
        int checked = 0;
        for (CSVRecord r : curve) {
            if (!r.get("full_data").equals("true")) {
                assertEquals("false", r.get("full_data"));
                continue;
            }
            assertEquals("3", r.get("level"));
            String cells = r.get("estimate") + " " + r.get("ci_low") + " " + r.get("ci_high");
            String m = r.get("measure");
            String expected = switch (m) {
                case "balanced_accuracy", "auc" -> metrics.get(r.get("imputer") + "/source+imputed/lr/" + m);
                case "balanced_accuracy_gain" -> gains.get(r.get("imputer") + "/balanced_accuracy");
                case "auc_gain" -> gains.get(r.get("imputer") + "/auc");
                default -> summary.get(r.get("imputer") + "/" + m);
            };
            assertEquals(expected, m.startsWith("imputation") ? r.get("estimate") : cells, m);
            checked++;
        }
        assertEquals(12, checked);
        assertTrue(Files.readString(one.resolve("report.html")).contains("id=\"chart-availability\""));
    }

    @Test
    void givenRunCutOffAmongTheCurveUnits_whenResumed_thenTablesByteIdentical() throws IOException {
        Path spec = spec(BODY + CURVE);
        Path whole = run(spec, "whole", "--threads", "2");
        Path cut = Files.createDirectories(dir.resolve("cut/synthetic/run"));
        List<String> journal = Files.readAllLines(whole.resolve(Journal.FILE));
        int firstCurve = 0;
        while (!journal.get(firstCurve).contains("\"unit\":\"a")) {
            firstCurve++;
        }
        // the plain units and a few of the curve's survive, then a torn line as a kill would leave it
        List<String> kept = new ArrayList<>(journal.subList(0, firstCurve + 5));
        Files.write(cut.resolve(Journal.FILE), kept);
        String torn = journal.get(firstCurve + 5);
        Files.writeString(cut.resolve(Journal.FILE), torn.substring(0, torn.length() / 2),
                java.nio.file.StandardOpenOption.APPEND);
        Files.writeString(cut.resolve("run.json"), Files.readString(whole.resolve("run.json"))
                .replace("\"status\" : \"complete\"", "\"status\" : \"running\""));
        CliTest.Outcome o = CliTest.run("run", "--resume", cut.toString(), "--quiet");
        assertEquals(0, o.code(), o.err());
        RunTables.assertSameTables(whole, cut);
    }

    @Test
    void givenShards_whenMerged_thenTablesByteIdenticalToOneRun() throws IOException {
        Path spec = spec(BODY + CURVE);
        Path whole = run(spec, "whole");
        List<String> shards = new ArrayList<>();
        for (int i = 1; i <= 3; i++) {
            CliTest.Outcome o = CliTest.run("run", spec.toString(), "--shard", i + "/3", "--out",
                    dir.resolve("cluster").toString(), "--quiet", "--threads", "1");
            assertEquals(0, o.code(), o.err());
            shards.add(dir.resolve("cluster/shard-" + i + "-of-3").toString());
        }
        for (String s : shards) {
            assertTrue(Files.readString(Path.of(s, Journal.FILE)).contains("\"unit\":\"ac/"), s);
        }
        CliTest.Outcome merged = CliTest.run("merge", shards.get(2), shards.get(0), shards.get(1), "--out",
                dir.resolve("merged").toString(), "--quiet");
        assertEquals(0, merged.code(), merged.err());
        RunTables.assertSameTables(whole, RunTables.only(dir.resolve("merged"), "synthetic"));
    }

    @Test
    void givenCurve_whenChecked_thenFitsItAddsArePrinted_andWithoutKeyNoTable() throws IOException {
        Path spec = spec(BODY + CURVE.replace("[0.4, 0.7, 1.0]", "[0.5]"));
        CliTest.Outcome o = CliTest.run("check", spec.toString());
        assertEquals(0, o.code(), o.err());
        // one level re-fitted in each of the 6 outer folds: per fold, ridge 2 grid points x 2 cross-fits + 1 = 5 and
        // nn 2 cross-fits + 1 = 3 (cross-fitted); per imputer, lr with 2 grid points 2 x 2 + 1 = 5 plus 2 nested
        // imputations for tuning (5 or 3 fits each): 5 + 3 + (5 + 10) + (5 + 6) = 34 per fold, 204 in all
        String line = o.out().lines().filter(l -> l.startsWith("availability curve:")).findFirst().orElse("");
        assertTrue(line.contains("fractions 0.5") && line.contains("adds 204 model fits"), o.out());
        // a level too small for the imputers' inner splits is refused before anything runs, in one line
        CliTest.Outcome small = CliTest.run("run", spec(BODY + CURVE.replace("[0.4, 0.7, 1.0]", "[0.2, 1.0]"))
                .toString(), "--out", dir.resolve("small").toString());
        assertEquals(2, small.code());
        assertTrue(small.err().contains("availability-curve.fractions[0]: 0.2 keeps")
                && small.err().contains("an imputer needs at least 1"), small.err());
        assertFalse(Files.exists(dir.resolve("small")));
        Path plain = run(spec(BODY), "plain");
        assertFalse(Files.exists(plain.resolve("availability.csv")));
        assertFalse(Files.readString(plain.resolve("report.html")).contains("chart-availability"));
        try (Stream<String> lines = Files.lines(plain.resolve(Journal.FILE))) {
            assertTrue(lines.noneMatch(l -> l.contains("\"unit\":\"a")));
        }
    }
}
