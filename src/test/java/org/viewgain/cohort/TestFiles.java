package org.viewgain.cohort;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.URISyntaxException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.function.Executable;
import org.viewgain.spec.BadInputException;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Test helpers: write small files, find test resources, expect one-line messages. */
final class TestFiles {
    private TestFiles() {
    }

    static Path write(Path dir, String name, String content) {
        try {
            Path p = dir.resolve(name);
            Files.createDirectories(p.getParent());
            Files.writeString(p, content, StandardCharsets.UTF_8);
            return p;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    static Path resource(String name) {
        try {
            return Path.of(TestFiles.class.getResource("/cohort/" + name).toURI());
        } catch (URISyntaxException e) {
            throw new IllegalStateException(e);
        }
    }

    /** Runs the call, expects a BadInputException with a one-line message containing every fragment. */
    static String expectBadInput(Executable call, String... fragments) {
        BadInputException e = assertThrows(BadInputException.class, call);
        String m = e.getMessage();
        assertFalse(m.contains("\n") || m.contains("\r"), () -> "message is not one line: " + m);
        for (String f : fragments) {
            assertTrue(m.contains(f), () -> "message lacks '" + f + "': " + m);
        }
        return m;
    }
}
