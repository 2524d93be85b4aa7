package org.viewgain.fuzz;

import static org.junit.jupiter.api.Assertions.assertDoesNotThrow;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.EdgeCasesMode;
import net.jqwik.api.Example;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.Tuple;
import net.jqwik.api.lifecycle.AfterContainer;
import net.jqwik.api.lifecycle.BeforeContainer;
import net.jqwik.api.statistics.Statistics;
import net.jqwik.api.statistics.StatisticsReport;
import org.viewgain.cohort.SubjectsTable;
import org.viewgain.cohort.ViewLoader;

/**
 * Fuzzes the data loaders ({@link SubjectsTable#load}, {@link ViewLoader#matrices}, {@link ViewLoader#edgeTable})
 * with mutated corpus files, some of them not even UTF-8: each either loads or is refused with a one-line message
 * naming the file. Seeds are fixed so that a run is reproducible.
 */
@StatisticsReport(StatisticsReport.StatisticsReportMode.OFF)
class DataLoaderFuzzTest {
    private static final List<String> IDS = List.of("a1", "a2", "a3");
    private static final List<String> GROUPS = List.of("control", "patient");
    private static Path dir;

    @BeforeContainer
    static void makeFolder() throws IOException {
        dir = Files.createTempDirectory("viewgain-fuzz-data");
    }

    @AfterContainer
    static void removeFolder() {
        Corpus.delete(dir);
    }

    @Provide
    Arbitrary<List<Edit>> edits() {
        return Edit.lists(4);
    }

    /** Mostly -1 (valid UTF-8), sometimes a byte position whose high bit is flipped. */
    @Provide
    Arbitrary<Integer> rawFlips() {
        return Arbitraries.frequencyOf(Tuple.of(6, Arbitraries.just(-1)),
                Tuple.of(1, Arbitraries.integers().between(0, 100_000)));
    }

    @Provide
    Arbitrary<String> subjectsSeeds() {
        return Arbitraries.of(Corpus.texts("subjects"));
    }

    @Provide
    Arbitrary<String> matrixSeeds() {
        return Arbitraries.of(Corpus.texts("matrix"));
    }

    @Provide
    Arbitrary<String> tableSeeds() {
        return Arbitraries.of(Corpus.texts("table"));
    }

    @Example
    void givenTheCorpusFiles_whenLoaded_thenEveryOneLoads() {
        for (String text : Corpus.texts("subjects")) {
            Path f = dir.resolve("subjects.csv");
            Corpus.write(f, text);
            assertDoesNotThrow(() -> SubjectsTable.load(f, "subject", "group", "site", List.of("age"), GROUPS), text);
        }
        for (String text : Corpus.texts("matrix")) {
            for (String id : IDS) {
                Corpus.write(dir.resolve("m").resolve(id + ".csv"), text);
            }
            assertDoesNotThrow(() -> ViewLoader.matrices("v", dir.resolve("m/{subject}.csv"), IDS, false, 0), text);
        }
        for (String text : Corpus.texts("table")) {
            Path f = dir.resolve("table.csv");
            Corpus.write(f, text);
            assertDoesNotThrow(() -> ViewLoader.edgeTable("v", f, "subject", IDS, true), text);
        }
    }

    @Property(tries = 400, seed = "7101", edgeCases = EdgeCasesMode.NONE)
    void givenMutatedSubjectsTables_whenLoaded_thenLoadsOrOneLineNamingTheFile(
            @ForAll("subjectsSeeds") String seed, @ForAll("edits") List<Edit> edits,
            @ForAll("rawFlips") int rawFlip, @ForAll boolean withCovariate) {
        Path f = dir.resolve("subjects.csv");
        Corpus.write(f, Edit.applyAll(seed, edits), rawFlip);
        List<String> covariates = withCovariate ? List.of("age") : List.of();
        boolean loaded = Outcomes.loadsOrRefusesInOneLine(
                () -> SubjectsTable.load(f, "subject", "group", "site", covariates, GROUPS),
                f.toString());
        bothOutcomes(loaded);
    }

    @Property(tries = 400, seed = "7102", edgeCases = EdgeCasesMode.NONE)
    void givenMutatedMatrixFiles_whenLoaded_thenLoadsOrOneLineNamingTheFile(
            @ForAll("matrixSeeds") String seed, @ForAll("edits") List<Edit> edits, @ForAll("rawFlips") int rawFlip,
            @ForAll boolean missingAllowed, @ForAll boolean deleteOne) {
        Path m = dir.resolve("m");
        int mutated = Math.floorMod(edits.get(0).at(), IDS.size());
        for (int i = 0; i < IDS.size(); i++) {
            Path f = m.resolve(IDS.get(i) + ".csv");
            if (i == mutated) {
                Corpus.write(f, Edit.applyAll(seed, edits), rawFlip);
            } else if (deleteOne && i == (mutated + 1) % IDS.size()) {
                deleteIfExists(f);
            } else {
                Corpus.write(f, seed);
            }
        }
        double tolerance = rawFlip < 0 ? 1e-6 : 0;
        boolean loaded = Outcomes.loadsOrRefusesInOneLine(
                () -> ViewLoader.matrices("v", m.resolve("{subject}.csv"), IDS,
                missingAllowed, tolerance), m.toString());
        bothOutcomes(loaded);
    }

    @Property(tries = 400, seed = "7103", edgeCases = EdgeCasesMode.NONE)
    void givenMutatedEdgeTables_whenLoaded_thenLoadsOrOneLineNamingTheFile(
            @ForAll("tableSeeds") String seed, @ForAll("edits") List<Edit> edits, @ForAll("rawFlips") int rawFlip,
            @ForAll boolean missingAllowed, @ForAll boolean namedId) {
        Path f = dir.resolve("table.csv");
        Corpus.write(f, Edit.applyAll(seed, edits), rawFlip);
        boolean loaded = Outcomes.loadsOrRefusesInOneLine(
                () -> ViewLoader.edgeTable("v", f, namedId ? "subject" : null, IDS,
                missingAllowed), f.toString());
        bothOutcomes(loaded);
    }

    /** The mutations must exercise both outcomes, or the fuzzer is degenerate (common practice, no source). */
    private static void bothOutcomes(boolean loaded) {
        Statistics.label("loaded").collect(loaded).coverage(c -> {
            c.check(true).percentage(p -> p > 3);
            c.check(false).percentage(p -> p > 30);
        });
    }

    private static void deleteIfExists(Path f) {
        try {
            Files.deleteIfExists(f);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
