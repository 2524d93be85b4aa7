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
import net.jqwik.api.lifecycle.AfterContainer;
import net.jqwik.api.lifecycle.BeforeContainer;
import net.jqwik.api.statistics.Statistics;
import net.jqwik.api.statistics.StatisticsReport;
import org.viewgain.cohort.ViewLoader;

/**
 * Fuzzes the binary array readers (.npy, .mat) through {@link ViewLoader#matrices} and {@link ViewLoader#stacked}
 * with byte-mutated seeds from {@code src/test/resources/fuzz/arrays/}: each input loads or is refused with a
 * one-line message naming the file. Seeds are fixed so that a run is reproducible.
 */
@StatisticsReport(StatisticsReport.StatisticsReportMode.OFF)
class ArrayLoaderFuzzTest {
    static final List<String> IDS = List.of("s1", "s2", "s3");
    private static Path dir;

    @BeforeContainer
    static void makeFolder() throws IOException {
        dir = Files.createTempDirectory("viewgain-fuzz-arrays");
        Files.writeString(dir.resolve("order.txt"), "s3\ns1\ns2\n");
    }

    @AfterContainer
    static void removeFolder() {
        Corpus.delete(dir);
    }

    /** The variable a seed is read with: the word before {@code .mat} ({@code stacked-thickness.mat}), else none. */
    static String variable(Path seed) {
        String n = seed.getFileName().toString();
        return n.endsWith(".mat") ? n.substring(n.lastIndexOf('-') + 1, n.length() - 4) : null;
    }

    static String extension(Path seed) {
        String n = seed.getFileName().toString();
        return n.substring(n.lastIndexOf('.'));
    }

    @Provide
    Arbitrary<Path> subjectSeeds() {
        return Arbitraries.of(seeds("subject-"));
    }

    @Provide
    Arbitrary<Path> stackedSeeds() {
        return Arbitraries.of(seeds("stacked-"));
    }

    @Provide
    Arbitrary<List<ByteEdit>> edits() {
        return ByteEdit.lists(3);
    }

    private static List<Path> seeds(String prefix) {
        return Corpus.files("arrays").stream().filter(p -> p.getFileName().toString().startsWith(prefix)).toList();
    }

    @Example
    void givenTheSeeds_whenLoaded_thenEveryOneLoads() {
        for (Path seed : seeds("subject-")) {
            Path m = writeSubjects(seed, null, 0);
            assertDoesNotThrow(() -> ViewLoader.matrices("v", m, variable(seed), null, IDS, false, 0), seed::toString);
        }
        for (Path seed : seeds("stacked-")) {
            assertDoesNotThrow(() -> ViewLoader.stacked("v", seed, variable(seed), dir.resolve("order.txt"), null,
                    false, IDS, false, 0), seed::toString);
        }
    }

    @Property(tries = 500, seed = "7104", edgeCases = EdgeCasesMode.NONE)
    void givenMutatedSubjectArrays_whenLoaded_thenLoadsOrOneLineNamingTheFile(
            @ForAll("subjectSeeds") Path seed, @ForAll("edits") List<ByteEdit> edits, @ForAll boolean missingAllowed) {
        Path m = writeSubjects(seed, edits, edits.get(0).value() % IDS.size());
        boolean loaded = Outcomes.loadsOrRefusesInOneLine(() -> ViewLoader.matrices("v", m, variable(seed), null,
                IDS, missingAllowed, 1e-6), m.getParent().toString());
        Statistics.label("loaded").collect(loaded).coverage(c -> c.check(false).percentage(p -> p > 30));
    }

    @Property(tries = 300, seed = "7105", edgeCases = EdgeCasesMode.NONE)
    void givenMutatedStackedArrays_whenLoaded_thenLoadsOrOneLineNamingTheFile(
            @ForAll("stackedSeeds") Path seed, @ForAll("edits") List<ByteEdit> edits, @ForAll boolean subjectLast,
            @ForAll boolean missingAllowed) {
        Path f = dir.resolve("stacked" + extension(seed));
        write(f, ByteEdit.applyAll(read(seed), edits));
        boolean loaded = Outcomes.loadsOrRefusesInOneLine(() -> ViewLoader.stacked("v", f, variable(seed),
                dir.resolve("order.txt"), null, subjectLast, IDS, missingAllowed, 1e-6), f.toString());
        Statistics.label("loaded").collect(loaded).coverage(c -> c.check(false).percentage(p -> p > 30));
    }

    /** Every subject gets the seed; subject {@code mutated} gets it edited (when edits are given). */
    private static Path writeSubjects(Path seed, List<ByteEdit> edits, int mutated) {
        Path m = dir.resolve("m");
        byte[] clean = read(seed);
        for (int i = 0; i < IDS.size(); i++) {
            Path f = m.resolve(IDS.get(i) + extension(seed));
            write(f, edits != null && i == mutated ? ByteEdit.applyAll(clean, edits) : clean);
        }
        return m.resolve("{subject}" + extension(seed));
    }

    static byte[] read(Path p) {
        try {
            return Files.readAllBytes(p);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    static void write(Path p, byte[] b) {
        try {
            Files.createDirectories(p.getParent());
            Files.write(p, b);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
