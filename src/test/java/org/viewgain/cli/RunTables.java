package org.viewgain.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;

/** Helpers of the resume, shard and merge tests: find a run folder and compare its tables byte for byte. */
final class RunTables {
    private RunTables() {
    }

    /** The only run folder under {@code root/experiment}. */
    static Path only(Path root, String experiment) throws IOException {
        try (Stream<Path> s = Files.list(root.resolve(experiment))) {
            List<Path> runs = s.filter(Files::isDirectory).toList();
            assertEquals(1, runs.size(), runs.toString());
            return runs.get(0);
        }
    }

    /** Names of the CSV tables of a run folder, sorted. */
    static List<String> tables(Path run) throws IOException {
        try (Stream<Path> s = Files.list(run)) {
            return s.map(p -> p.getFileName().toString()).filter(n -> n.endsWith(".csv")).sorted().toList();
        }
    }

    /** Asserts that two run folders hold the same tables with the same bytes (run.json and the report aside). */
    static void assertSameTables(Path expected, Path actual) throws IOException {
        List<String> names = tables(expected);
        assertEquals(names, tables(actual));
        for (String n : names) {
            assertArrayEquals(Files.readAllBytes(expected.resolve(n)), Files.readAllBytes(actual.resolve(n)), n);
        }
    }
}
