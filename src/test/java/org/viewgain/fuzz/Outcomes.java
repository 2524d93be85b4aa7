package org.viewgain.fuzz;

import org.viewgain.testing.CliRunner;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.viewgain.spec.BadInputException;

/**
 * The property every fuzzed input must satisfy: it loads, or it is refused with a {@link BadInputException} whose
 * message names the file. Any other exception escapes and fails the property (jqwik then shrinks the input).
 */
final class Outcomes {
    /** The header line of a spec refused for several problems at once (one problem per following line). */
    private static final String MANY = "\\d+ problems in the spec:";

    private Outcomes() {
    }

    /** Data loaders: a refusal is exactly one line and contains {@code named} (the file or its folder). */
    static boolean loadsOrRefusesInOneLine(Runnable load, String named) {
        try {
            load.run();
            return true;
        } catch (BadInputException e) {
            String m = e.getMessage();
            assertNotNull(m);
            assertEquals(List.of(m), m.lines().toList(), "one line");
            assertTrue(m.contains(named), () -> "names " + named + ": " + m);
            return false;
        }
    }

    /**
     * The spec loader: one problem is one line naming the spec file; several problems (reported together, by
     * design) are a count line followed by one line per problem, each naming the spec file.
     */
    static boolean specLoadsOrRefuses(Runnable load, String specFile) {
        try {
            load.run();
            return true;
        } catch (BadInputException e) {
            assertSpecMessage(e.getMessage(), specFile);
            return false;
        }
    }

    static void assertSpecMessage(String message, String specFile) {
        assertNotNull(message);
        List<String> lines = message.lines().toList();
        assertTrue(lines.size() == 1 || lines.get(0).matches(MANY), () -> "one line or a count line: " + message);
        for (String line : lines.size() == 1 ? lines : lines.subList(1, lines.size())) {
            assertTrue(line.startsWith(specFile), () -> "every problem names " + specFile + ": " + message);
        }
    }

    /** What the command line printed and returned. */
    record Cli(int code, String out, String err) {
    }

    /** Runs the command line in-process, capturing its output (as the CLI tests do). */
    static Cli cli(String... args) {
        CliRunner.Outcome o = CliRunner.run(args);
        return new Cli(o.code(), o.out(), o.err());
    }

    /**
     * A CLI outcome is clean: exit 0 with nothing on stderr, or exit 2 with a message (one line per problem, no stack
     * trace) whose every line mentions {@code named} or another path (a mutated spec may point elsewhere).
     */
    static boolean cliIsClean(Cli o, String named) {
        assertTrue(o.code() == 0 || o.code() == 2, () -> "exit 0 or 2, got " + o.code() + ": " + o.err());
        if (o.code() == 0) {
            assertEquals("", o.err());
            return true;
        }
        String err = o.err().strip();
        assertTrue(err.startsWith("viewgain: "), err);
        assertTrue(!err.contains("\tat ") && !err.contains("the run failed"), () -> "no stack trace: " + err);
        assertSpecOrDataMessage(err.substring("viewgain: ".length()), named);
        return false;
    }

    private static void assertSpecOrDataMessage(String message, String named) {
        List<String> lines = message.lines().toList();
        if (lines.size() > 1) {
            assertTrue(lines.get(0).matches(MANY), () -> "several lines only for several spec problems: " + message);
        }
        assertTrue(lines.stream().skip(lines.size() > 1 ? 1 : 0).allMatch(l -> l.contains(named) || l.contains("/")),
                () -> "every line names " + named + ": " + message);
    }
}
