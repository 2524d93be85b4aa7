package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.viewgain.cli.Main;
import org.viewgain.folds.FitContext;
import org.viewgain.spec.SpecLoader;
import org.viewgain.testing.TestCohorts;
import picocli.CommandLine;

/**
 * Leakage canary for outside imputations: {@code viewgain folds} -> an outside program (a stub that averages the
 * targets of each task's training subjects) -> {@code viewgain run} with the {@code external} imputer gives exactly
 * the predictions and imputation errors of the built-in {@code mean} imputer; a file that breaks the task rules is
 * refused.
 */
class ExternalRoundTripTest {
    @TempDir
    Path dir;

    static final String BODY = """
            imputers:
              - { name: avg, method: mean }
              - { name: ext, method: external, fixed: { file: imputations.csv } }
            imputed-for-training: %s
            feature-sets: [imputed, source+imputed]
            classifiers:
              - { name: knn, method: knn, fixed: { k: 3 } }
            validation: { outer: { folds: 4, repeats: 2 }, inner: { folds: 3 } }
            """;

    record Outcome(int code, String out, String err) {
    }

    static Outcome cli(String... args) {
        CommandLine cl = Main.commandLine();
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        cl.setOut(new PrintWriter(out));
        cl.setErr(new PrintWriter(err));
        return new Outcome(cl.execute(args), out.toString(), err.toString());
    }

    Path spec(String mode) {
        TestCohorts.synthetic(dir, 40, 5, 4, 1.0, 0.3, 17);
        return TestCohorts.spec(dir, BODY.formatted(mode));
    }

    /** folds, the outside program, then the written imputations file. */
    Path foldsAndOutsideProgram(Path spec) throws IOException {
        Outcome f = cli("folds", spec.toString(), "--out", dir.resolve("tasks").toString());
        assertEquals(0, f.code(), f.err());
        Path file = dir.resolve("imputations.csv");
        AveragingProgram.run(dir.resolve("tasks"), file);
        return file;
    }

    Path runFolder(Path spec, Outcome o) throws IOException {
        assertEquals(0, o.code(), o.err());
        try (Stream<Path> s = Files.list(dir.resolve("results").resolve("synthetic"))) {
            return s.findFirst().orElseThrow();
        }
    }

    Outcome run(Path spec) {
        return cli("run", spec.toString(), "--out", dir.resolve("results").toString(), "--quiet", "--threads", "2");
    }

    @ParameterizedTest
    @ValueSource(strings = {"cross-fitted", "observed"})
    void givenOutsideProgramAveragingItsTrainingSubjects_whenRun_thenSameNumbersAsTheMeanImputer(String mode)
            throws IOException {
        Path spec = spec(mode);
        foldsAndOutsideProgram(spec);
        Path run = runFolder(spec, run(spec));
        Map<String, List<String>> byImputer = byImputer(run.resolve("predictions.csv"), 3);
        assertEquals(2, byImputer.size(), byImputer.keySet().toString());
        // 2 repeats x 40 subjects x 2 feature sets x 1 classifier
        assertEquals(160, byImputer.get("avg").size());
        assertEquals(byImputer.get("avg"), byImputer.get("ext"));
        Map<String, List<String>> quality = byImputer(run.resolve("imputation.csv"), 0);
        assertTrue(quality.get("avg").size() > 40, "test subjects with a target in 2 repeats");
        // The outside program averages the target files' exact values; the built-in imputer averages the view as
        // stored, in single precision (relative rounding <= 6e-8 per value), and quality is measured on each one's
        // unrounded result: equal to 1e-6, not bit for bit. Skill of a mean imputer against the mean is 0.
        assertNumericallyEqual(quality.get("avg"), quality.get("ext"), 1e-6);
    }

    static void assertNumericallyEqual(List<String> expected, List<String> actual, double tolerance) {
        assertEquals(expected.size(), actual.size());
        for (int r = 0; r < expected.size(); r++) {
            String[] e = expected.get(r).split(",", -1);
            String[] a = actual.get(r).split(",", -1);
            assertEquals(e.length, a.length, actual.get(r));
            for (int c = 0; c < e.length; c++) {
                if (e[c].matches("-?[0-9].*")) {
                    assertEquals(Double.parseDouble(e[c]), Double.parseDouble(a[c]), tolerance,
                            "row " + r + " column " + c + ": " + expected.get(r) + " vs " + actual.get(r));
                } else {
                    assertEquals(e[c], a[c], "row " + r + " column " + c);
                }
            }
        }
    }

    @Test
    void givenFoldsFiles_whenEngineFitsImputers_thenEachFitTrainsOnExactlyTheListedSubjects() throws IOException {
        Path spec = spec("cross-fitted");
        foldsAndOutsideProgram(spec);
        Map<String, List<String>> listed = new TreeMap<>();
        for (String[] c : rows(dir.resolve("tasks").resolve("tasks.csv"))) {
            if (c[5].equals("train")) {
                listed.computeIfAbsent(c[0] + "/" + c[1] + "/" + c[2] + "/" + c[3], k -> new ArrayList<>()).add(c[4]);
            }
        }
        Recording rec = new Recording();
        Experiment ex = Setup.prepare(SpecLoader.load(spec), rec);
        new Runner(ex, 1, Progress.NONE).run();
        Map<String, List<String>> fitted = new TreeMap<>();
        for (Recording.Fit fit : rec.all()) {
            if (fit.kind().equals("imputer")) {
                FitContext c = fit.ctx();
                String task = c.role() == FitContext.Role.FINAL ? "final" : "cross-fit";
                String key = (c.repeat() + 1) + "/" + (c.outerFold() + 1) + "/" + task + "/" + (c.innerFold() + 1);
                List<String> old = fitted.put(key, fit.ids());
                assertTrue(old == null || old.equals(fit.ids()), "both imputers train on the same subjects: " + key);
            }
        }
        // 2 repeats x 4 folds x (final + 3 cross-fit tasks)
        assertEquals(32, listed.size());
        assertEquals(listed, fitted);
    }

    @Test
    void givenRowForATrainingSubject_whenRun_thenRefusedAsALeak() throws IOException {
        Path spec = spec("cross-fitted");
        Path file = foldsAndOutsideProgram(spec);
        String trainee = null;
        for (String[] c : rows(dir.resolve("tasks").resolve("tasks.csv"))) {
            if (c[0].equals("1") && c[1].equals("1") && c[2].equals("final") && c[5].equals("train")) {
                trainee = c[4];
                break;
            }
        }
        List<String> lines = new ArrayList<>(Files.readAllLines(file));
        String copy = lines.stream().filter(l -> l.startsWith("1,1,final,0,")).findFirst().orElseThrow();
        lines.add(copy.replaceFirst("^1,1,final,0,[^,]+,", "1,1,final,0," + trainee + ","));
        Files.write(file, lines);
        Outcome o = run(spec);
        assertEquals(2, o.code(), o.err());
        assertTrue(o.err().contains("imputations.csv:" + lines.size() + ": subject '" + trainee
                + "' is a training subject of repeat 1, fold 1, task final"), o.err());
    }

    @Test
    void givenMissingRowOrNaN_whenRun_thenRefusedNamingFileAndSubject() throws IOException {
        Path spec = spec("cross-fitted");
        Path file = foldsAndOutsideProgram(spec);
        List<String> good = Files.readAllLines(file);
        List<String> missing = new ArrayList<>(good);
        String[] gone = missing.remove(1).split(",");
        Files.write(file, missing);
        Outcome o = run(spec);
        assertEquals(2, o.code(), o.err());
        assertTrue(o.err().contains("imputations.csv: no row for repeat " + gone[0] + ", fold " + gone[1]), o.err());
        assertTrue(o.err().contains("subject '" + gone[4] + "'"), o.err());

        List<String> nan = new ArrayList<>(good);
        String[] c = nan.get(7).split(",");
        c[6] = "NaN";
        nan.set(7, String.join(",", c));
        Files.write(file, nan);
        o = run(spec);
        assertEquals(2, o.code(), o.err());
        assertTrue(o.err().contains("imputations.csv:8: subject '" + c[4] + "', column 't2': expected a finite"),
                o.err());
    }

    @Test
    void givenNonEmptyFolder_whenFoldsWritten_thenRefusedAndNothingChanged() throws IOException {
        Path spec = spec("observed");
        Files.createDirectories(dir.resolve("tasks"));
        Files.writeString(dir.resolve("tasks").resolve("keep.txt"), "mine");
        Outcome o = cli("folds", spec.toString(), "--out", dir.resolve("tasks").toString());
        assertEquals(2, o.code());
        assertTrue(o.err().contains("is not empty"), o.err());
        try (Stream<Path> s = Files.list(dir.resolve("tasks"))) {
            assertEquals(1, s.count());
        }
    }

    @Test
    void givenObservedMode_whenFoldsWritten_thenOnlyFinalTasksAndTrainingSubjectsWithoutTargetAreImputed()
            throws IOException {
        Path spec = spec("observed");
        foldsAndOutsideProgram(spec);
        Map<String, String> hasTarget = new HashMap<>();
        Map<String, String> foldOf = new HashMap<>();
        for (String[] c : rows(dir.resolve("tasks").resolve("folds.csv"))) {
            hasTarget.put(c[1], c[3]);
            foldOf.put(c[0] + "/" + c[1], c[2]);
        }
        int imputed = 0;
        for (String[] c : rows(dir.resolve("tasks").resolve("tasks.csv"))) {
            assertEquals("final", c[2]);
            assertEquals("0", c[3]);
            boolean inTest = foldOf.get(c[0] + "/" + c[4]).equals(c[1]);
            if (c[5].equals("train")) {
                assertTrue(!inTest && hasTarget.get(c[4]).equals("true"), String.join(",", c));
            } else {
                assertTrue(inTest || hasTarget.get(c[4]).equals("false"), String.join(",", c));
                imputed++;
            }
        }
        long withoutTarget = hasTarget.values().stream().filter("false"::equals).count();
        // per repeat: every subject once as a test subject, plus each one without a target in the 3 other folds
        assertEquals(2 * (40 + 3 * withoutTarget), imputed);
    }

    /** Data lines of a CSV grouped by the value of one column, that column removed. */
    static Map<String, List<String>> byImputer(Path csv, int column) throws IOException {
        Map<String, List<String>> out = new LinkedHashMap<>();
        for (String[] c : rows(csv)) {
            List<String> rest = new ArrayList<>(List.of(c));
            String key = rest.remove(column);
            out.computeIfAbsent(key, k -> new ArrayList<>()).add(String.join(",", rest));
        }
        return out;
    }

    static List<String[]> rows(Path csv) throws IOException {
        List<String> lines = Files.readAllLines(csv);
        return lines.subList(1, lines.size()).stream().map(l -> l.split(",", -1)).toList();
    }

    /**
     * The outside program: reads the task files of {@code viewgain folds} and the target table, and imputes every
     * task's subjects with the average target of the task's training subjects (summed in the listed order).
     */
    static final class AveragingProgram {
        private AveragingProgram() {
        }

        static void run(Path tasksDir, Path outFile) throws IOException {
            List<String> features = rows(tasksDir.resolve("target_features.csv")).stream().map(c -> c[1]).toList();
            Map<String, double[]> target = new HashMap<>();
            for (String[] c : rows(tasksDir.resolve("inputs.csv"))) {
                if (!c[2].isEmpty() && target.isEmpty()) {
                    List<String> lines = Files.readAllLines(Path.of(c[2]));
                    List<String> head = List.of(lines.get(0).split(","));
                    assertEquals(features, head.subList(1, head.size()));
                    for (String l : lines.subList(1, lines.size())) {
                        String[] v = l.split(",");
                        double[] x = new double[v.length - 1];
                        for (int j = 1; j < v.length; j++) {
                            x[j - 1] = Double.parseDouble(v[j]);
                        }
                        target.put(v[0], x);
                    }
                }
            }
            Map<String, List<String[]>> tasks = new LinkedHashMap<>();
            for (String[] c : rows(tasksDir.resolve("tasks.csv"))) {
                tasks.computeIfAbsent(c[0] + "," + c[1] + "," + c[2] + "," + c[3], k -> new ArrayList<>()).add(c);
            }
            StringBuilder out = new StringBuilder("repetition,fold,task,inner,subject," + String.join(",", features)
                    + "\n");
            for (Map.Entry<String, List<String[]>> t : tasks.entrySet()) {
                double[] mean = new double[features.size()];
                int n = 0;
                for (String[] c : t.getValue()) {
                    if (c[5].equals("train")) {
                        double[] x = target.get(c[4]);
                        for (int j = 0; j < mean.length; j++) {
                            mean[j] += x[j];
                        }
                        n++;
                    }
                }
                for (int j = 0; j < mean.length; j++) {
                    mean[j] /= n;
                }
                for (String[] c : t.getValue()) {
                    if (c[5].equals("impute")) {
                        out.append(t.getKey()).append(',').append(c[4]);
                        for (double v : mean) {
                            out.append(',').append(v);
                        }
                        out.append('\n');
                    }
                }
            }
            Files.writeString(outFile, out);
        }
    }
}
