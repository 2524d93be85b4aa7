package org.viewgain.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.testing.CliRunner;
import picocli.CommandLine;

/** Messages that find the real mistake (issue 16): exit code 2, one line starting "viewgain: ", the likely cause. */
class MessagesCliTest {
    @TempDir
    Path dir;

    private static final String SPEC = """
            experiment: tiny
            cohort:
              subjects: subjects.csv
              groups: [control, patient]
              positive: patient
            views:
              source: { matrices: "m/{subject}.txt" }
            feature-sets: [source]
            classifiers: [ { name: k, method: knn, fixed: { k: 1 } } ]
            validation: { outer: { folds: 2 }, inner: { folds: 2 } }
            """;

    /** A valid cohort of 12 subjects with 3-region whitespace matrices; returns the spec. */
    private Path cohort(String spec) throws IOException {
        StringBuilder subjects = new StringBuilder("subject,group,age\n");
        for (int i = 1; i <= 12; i++) {
            subjects.append("a").append(i).append(i % 2 == 0 ? ",patient," : ",control,").append(20 + i).append('\n');
            write("m/a" + i + ".txt", "0 0." + i + " 2\n0." + i + " 0 3\n2 3 0\n");
        }
        write("subjects.csv", subjects.toString());
        return write("spec.yaml", spec);
    }

    private Path write(String name, String text) throws IOException {
        Path p = dir.resolve(name);
        Files.createDirectories(p.getParent());
        return Files.writeString(p, text);
    }

    /** Runs the command, expects exit 2 and error lines that all start "viewgain: " and hold every fragment. */
    private static String refused(String[] args, String... fragments) {
        CliRunner.Outcome o = CliRunner.run(args);
        assertEquals(2, o.code(), o.err());
        List<String> lines = o.err().strip().lines().toList();
        assertFalse(lines.isEmpty());
        for (String l : lines) {
            assertTrue(l.startsWith("viewgain: "), () -> "every error line starts the same way: " + o.err());
        }
        assertFalse(o.err().matches("(?s).*[A-Z]\\w*(Exception|Error)\\b.*"), () -> "no Java class names: " + o.err());
        for (String f : fragments) {
            assertTrue(o.err().contains(f), () -> "lacks '" + f + "': " + o.err());
        }
        return o.err();
    }

    @Test
    void givenValidCohort_whenChecked_thenFine() throws IOException {
        CliRunner.Outcome o = CliRunner.run("check", cohort(SPEC).toString());
        assertEquals(0, o.code(), o.err()); // the cohort the other tests break is itself valid
    }

    @Test
    void givenTabIndentedLine8_whenChecked_thenTabsAndLine8() throws IOException {
        Path spec = cohort(SPEC.replace("  source: {", "\tsource: {"));
        refused(new String[] {"check", spec.toString()}, "spec.yaml:7: not valid YAML at column 1: a tab character",
                "spaces");
    }

    @Test
    void givenSemicolonOrTabSubjectsTable_whenChecked_thenSaysTheSeparator() throws IOException {
        Path spec = cohort(SPEC);
        String csv = Files.readString(dir.resolve("subjects.csv"));
        write("subjects.csv", csv.replace(',', ';'));
        refused(new String[] {"check", spec.toString()}, "subjects table", "subjects.csv, line 1",
                "separated by semicolons", "comma-separated");
        write("subjects.csv", csv.replace(',', '\t'));
        refused(new String[] {"check", spec.toString()}, "subjects.csv, line 1", "separated by tabs");
    }

    @Test
    void givenSemicolonMatrixOrDecimalCommas_whenChecked_thenSaysSoNamingSubjectAndLine() throws IOException {
        Path spec = cohort(SPEC);
        write("m/a3.txt", "0;0,5;2\n0,5;0;3\n2;3;0\n");
        refused(new String[] {"check", spec.toString()}, "subject a3", "a3.txt", "line 1",
                "separated by semicolons (';') with decimal commas");
        write("m/a3.txt", "0 0,5 2\n0,5 0 3\n2 3 0\n");
        refused(new String[] {"check", spec.toString()}, "subject a3", "line 1", "decimal commas", "0.5");
        write("m/a3.txt", "0 0.3 2\n0.3 0 3\n2 3 0\n");
        String csv = Files.readString(dir.resolve("subjects.csv"));
        write("subjects.csv", csv.replace("a5,control,25", "a5,control,25,5"));
        refused(new String[] {"check", spec.toString()}, "subjects.csv, line 6",
                "expected 3 cells as in the header, found 4", "decimal comma, as in 25,5");
    }

    @Test
    void givenMissingSpecOrFolder_whenChecked_thenNoExceptionNames() throws IOException {
        refused(new String[] {"check", dir.resolve("nope.yaml").toString()}, "nope.yaml", "no such file");
        refused(new String[] {"check", dir.toString()}, "cannot read the spec file", "folder");
    }

    @Test
    void givenMisspelledCommandOrOption_whenRun_thenNearestSuggested() {
        refused(new String[] {"rnu", "spec.yaml"}, "unknown command 'rnu'; did you mean 'run'?");
        refused(new String[] {"chekc", "spec.yaml"}, "did you mean 'check'?");
        refused(new String[] {"help", "rnu"}, "unknown command 'rnu'; did you mean 'run'?");
        refused(new String[] {"run", "--thread", "2", "x.yaml"}, "unknown option '--thread'",
                "did you mean '--threads'?", "see 'viewgain run --help'");
        refused(new String[] {"check"}, "missing required parameter", "see 'viewgain check --help'");
    }

    @Test
    void givenSpecWithSeveralProblems_whenChecked_thenEveryLineStartsTheSameWay() throws IOException {
        Path spec = cohort(SPEC.replace("experiment: tiny", "experiment: tiny\ncolour: red\nseed: x"));
        String err = refused(new String[] {"check", spec.toString()}, "problems in the spec", "colour", "seed");
        assertTrue(err.lines().count() >= 3, err);
    }

    @Test
    void givenSlurmWithVerbose_whenRun_thenAcceptedAndScriptsWritten() throws IOException {
        Path spec = cohort(SPEC);
        CliRunner.Outcome o = CliRunner.run("slurm", spec.toString(), "--shards", "2", "--out",
                dir.resolve("cluster").toString(), "--verbose");
        assertEquals(0, o.code(), o.err()); // issue 16: "slurm --verbose" was refused
        assertTrue(Files.exists(dir.resolve("cluster/submit.sh")));
    }

    /** README, "Commands": "Every command takes --help and --version; --verbose adds stack traces". */
    @Test
    void givenReadmeCommandTable_whenCompared_thenEveryCommandAcceptsTheOptionsItNames() throws IOException {
        String readme = Files.readString(Path.of("README.md"));
        CommandLine root = Main.commandLine();
        Matcher row = Pattern.compile("\\| `viewgain (\\w+)([^`]*)` \\|").matcher(readme);
        List<String> seen = new ArrayList<>();
        while (row.find()) {
            CommandLine cl = root.getSubcommands().get(row.group(1));
            assertTrue(cl != null, row.group(1));
            List<String> options = new ArrayList<>(List.of("--help", "--version", "--verbose"));
            Matcher opt = Pattern.compile("--[a-z-]+").matcher(row.group(2));
            while (opt.find()) {
                options.add(opt.group());
            }
            for (String o : options) {
                assertTrue(cl.getCommandSpec().optionsMap().containsKey(o), () -> row.group(1) + " lacks " + o);
            }
            seen.add(row.group(1));
        }
        assertTrue(seen.containsAll(List.of("check", "run", "demo", "merge", "slurm", "report", "folds")), seen::toString);
    }
}
