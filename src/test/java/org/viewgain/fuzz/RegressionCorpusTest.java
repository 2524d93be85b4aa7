package org.viewgain.fuzz;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.cohort.SubjectsTable;
import org.viewgain.cohort.ViewLoader;
import org.viewgain.spec.SpecLoader;

/**
 * Replays every input in {@code src/test/resources/fuzz/regressions/} that once broke a loader: each is now refused
 * cleanly (a one-line message naming the file; for a spec, one line per problem naming the spec), also through the
 * command line.
 */
class RegressionCorpusTest {
    private static final List<String> IDS = List.of("a1", "a2", "a3");

    @TempDir
    Path dir;

    @Test
    void givenEveryRegressionInput_whenLoaded_thenRefusedCleanly() {
        List<Path> files = Corpus.files("regressions");
        assertTrue(files.size() >= 7, "the regression corpus is in place");
        for (Path f : files) {
            String name = f.getFileName().toString();
            boolean loaded;
            if (name.startsWith("spec-")) {
                loaded = Outcomes.specLoadsOrRefuses(() -> SpecLoader.parse(Corpus.read(f), f), f.toString());
            } else if (name.startsWith("subjects-")) {
                loaded = Outcomes.loadsOrRefusesInOneLine(() -> SubjectsTable.load(f, "subject", "group", "site",
                        List.of(), List.of("control", "patient")), f.toString());
            } else if (name.startsWith("table-")) {
                loaded = Outcomes.loadsOrRefusesInOneLine(() -> ViewLoader.edgeTable("v", f, "subject", IDS, true),
                        f.toString());
            } else if (name.startsWith("matrix-")) {
                Path m = dir.resolve(name);
                IDS.forEach(id -> Corpus.write(m.resolve(id + ".csv"), Corpus.read(f)));
                loaded = Outcomes.loadsOrRefusesInOneLine(() -> ViewLoader.matrices("v", m.resolve("{subject}.csv"),
                        IDS, false, 1e-6), m.toString());
            } else if (name.startsWith("array-")) {
                Path m = dir.resolve(name + "-dir");
                String ext = ArrayLoaderFuzzTest.extension(f);
                IDS.forEach(id -> ArrayLoaderFuzzTest.write(m.resolve(id + ext), ArrayLoaderFuzzTest.read(f)));
                java.io.PrintStream err = System.err;
                java.io.ByteArrayOutputStream stray = new java.io.ByteArrayOutputStream();
                System.setErr(new java.io.PrintStream(stray, true));
                try {
                    loaded = Outcomes.loadsOrRefusesInOneLine(() -> ViewLoader.matrices("v",
                            m.resolve("{subject}" + ext), IDS, false, 1e-6), m.toString());
                } finally {
                    System.setErr(err);
                }
                assertTrue(stray.size() == 0, () -> name + ": nothing but our message, yet stderr got " + stray);
            } else {
                continue;
            }
            assertFalse(loaded, name + " is a bad input and must be refused");
        }
    }

    @Test
    void givenEveryRegressionSpec_whenCheckedThroughTheCli_thenExit2WithoutStackTrace() throws Exception {
        Corpus.writeCohort(dir);
        for (Path f : Corpus.files("regressions")) {
            if (f.getFileName().toString().startsWith("spec-")) {
                Path spec = Files.writeString(dir.resolve(f.getFileName()), Corpus.read(f));
                Outcomes.Cli o = Outcomes.cli("check", spec.toString());
                assertFalse(Outcomes.cliIsClean(o, dir.toString()), f + " must exit 2");
            }
        }
    }
}
