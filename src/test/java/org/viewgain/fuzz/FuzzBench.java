package org.viewgain.fuzz;

import static java.nio.charset.StandardCharsets.UTF_8;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.SplittableRandom;
import org.viewgain.cohort.SubjectsTable;
import org.viewgain.cohort.ViewLoader;
import org.viewgain.spec.SpecLoader;

/**
 * Fuzzing at scale, outside CI (issue 16): mutated inputs for every loader and for {@code viewgain check}, from the
 * corpus of {@code src/test/resources/fuzz/}, with the same mutations and the same clean-outcome rules as the jqwik
 * properties ({@link Outcomes}). Any other exception or a message breaking the rules is counted, and the input is
 * saved under the output folder for the regression corpus. Anything a library prints on stderr counts too.
 *
 * <p>Usage: {@code bench/fuzz.sh [INPUTS [SEED [OUT_DIR]]]}; prints one line per target and a total.
 */
public final class FuzzBench {
    private static final List<String> IDS = List.of("a1", "a2", "a3");
    private static final List<String> ARRAY_IDS = ArrayLoaderFuzzTest.IDS;
    private static final List<String> GROUPS = List.of("control", "patient");
    private static final String[] TARGETS = {"spec", "subjects", "matrix", "table", "array", "stacked", "order",
        "cli-spec", "cli-data"};
    /** Relative frequency of each target: the command line is 20 to 50 times slower than a loader call. */
    private static final int[] WEIGHTS = {20, 14, 14, 14, 14, 10, 6, 2, 2};

    private final SplittableRandom random;
    private final Path work;
    private final Path failures;
    private final Map<String, long[]> counts = new LinkedHashMap<>();
    private final List<String> failureLines = new ArrayList<>();
    private final Map<String, List<String>> texts = new LinkedHashMap<>();
    private final List<Path> specFiles = Corpus.files("spec");
    private final List<Path> subjectArrays;
    private final List<Path> stackedArrays;

    private FuzzBench(long seed, Path out) throws IOException {
        this.random = new SplittableRandom(seed);
        this.work = Files.createDirectories(out.resolve("work"));
        this.failures = Files.createDirectories(out.resolve("failures"));
        for (String t : TARGETS) {
            counts.put(t, new long[3]); // inputs, loaded, broken
        }
        for (String folder : List.of("spec", "subjects", "matrix", "table")) {
            texts.put(folder, Corpus.texts(folder));
        }
        subjectArrays = Corpus.files("arrays").stream().filter(p -> name(p).startsWith("subject-")).toList();
        stackedArrays = Corpus.files("arrays").stream().filter(p -> name(p).startsWith("stacked-")).toList();
    }

    public static void main(String[] args) throws IOException {
        int inputs = args.length > 0 ? Integer.parseInt(args[0]) : 100_000;
        long seed = args.length > 1 ? Long.parseLong(args[1]) : 2026;
        Path out = Path.of(args.length > 2 ? args[2] : "target/fuzz-bench");
        FuzzBench bench = new FuzzBench(seed, out);
        PrintStream o = System.out;
        long start = System.nanoTime();
        for (int i = 0; i < inputs; i++) {
            bench.one(i);
            if ((i + 1) % 10_000 == 0) {
                System.err.printf(Locale.ROOT, "[fuzz] %,d inputs, %.0f s%n", i + 1, (System.nanoTime() - start) / 1e9);
            }
        }
        double seconds = (System.nanoTime() - start) / 1e9;
        o.printf(Locale.ROOT, "%-9s %9s %9s %9s%n", "target", "inputs", "loaded", "broken");
        long total = 0;
        long broken = 0;
        for (Map.Entry<String, long[]> e : bench.counts.entrySet()) {
            long[] c = e.getValue();
            o.printf(Locale.ROOT, "%-9s %9d %9d %9d%n", e.getKey(), c[0], c[1], c[2]);
            total += c[0];
            broken += c[2];
        }
        o.printf(Locale.ROOT, "total     %9d inputs in %.1f s (%.0f per second), seed %d, %d uncaught or unclean%n",
                total, seconds, total / seconds, seed, broken);
        bench.failureLines.forEach(o::println);
        Corpus.delete(bench.work);
        System.exit(broken == 0 ? 0 : 1);
    }

    private void one(int i) {
        String target = pick();
        long[] c = counts.get(target);
        c[0]++;
        PrintStream err = System.err;
        ByteArrayOutputStream stray = new ByteArrayOutputStream();
        System.setErr(new PrintStream(stray, true, UTF_8));
        try {
            if (run(target)) {
                c[1]++;
            }
            if (stray.size() > 0) { // a library printing on stderr would break "every error line starts the same way"
                throw new AssertionError("printed on stderr: " + stray.toString(UTF_8)
                        .strip());
            }
        } catch (Throwable t) { // an uncaught exception or a message that breaks the rules (AssertionError)
            c[2]++;
            keep(target, i, t);
        } finally {
            System.setErr(err);
        }
    }

    private String pick() {
        int sum = 0;
        for (int w : WEIGHTS) {
            sum += w;
        }
        int r = random.nextInt(sum);
        for (int k = 0; k < WEIGHTS.length; k++) {
            r -= WEIGHTS[k];
            if (r < 0) {
                return TARGETS[k];
            }
        }
        return TARGETS[0];
    }

    private boolean run(String target) {
        return switch (target) {
            case "spec" -> {
                Path spec = work.resolve("spec.yaml");
                String text = edit(seed("spec"));
                write(spec, text);
                yield Outcomes.specLoadsOrRefuses(() -> SpecLoader.parse(text, spec), spec.toString());
            }
            case "subjects" -> {
                Path f = write(work.resolve("subjects.csv"), edit(seed("subjects")));
                yield Outcomes.loadsOrRefusesInOneLine(() -> SubjectsTable.load(f, "subject", "group", "site",
                        random.nextBoolean() ? List.of("age") : List.of(), GROUPS), f.toString());
            }
            case "matrix" -> {
                Path m = work.resolve("m");
                String seed = seed("matrix");
                for (String id : IDS) {
                    write(m.resolve(id + ".csv"), id.equals("a2") ? edit(seed) : seed);
                }
                yield Outcomes.loadsOrRefusesInOneLine(() -> ViewLoader.matrices("v", m.resolve("{subject}.csv"),
                        IDS, random.nextBoolean(), 1e-6), m.toString());
            }
            case "table" -> {
                Path f = write(work.resolve("table.csv"), edit(seed("table")));
                yield Outcomes.loadsOrRefusesInOneLine(() -> ViewLoader.edgeTable("v", f,
                        random.nextBoolean() ? "subject" : null, IDS, random.nextBoolean()), f.toString());
            }
            case "array" -> array();
            case "stacked", "order" -> stacked(target.equals("order"));
            default -> cli(target.equals("cli-spec"));
        };
    }

    private boolean array() {
        Path seed = pickFile(subjectArrays);
        String ext = ArrayLoaderFuzzTest.extension(seed);
        Path m = work.resolve("a");
        byte[] clean = ArrayLoaderFuzzTest.read(seed);
        for (String id : ARRAY_IDS) {
            ArrayLoaderFuzzTest.write(m.resolve(id + ext), id.equals("s2") ? byteEdit(clean) : clean);
        }
        return Outcomes.loadsOrRefusesInOneLine(() -> ViewLoader.matrices("v", m.resolve("{subject}" + ext),
                ArrayLoaderFuzzTest.variable(seed), null, ARRAY_IDS, random.nextBoolean(), 1e-6), m.toString());
    }

    private boolean stacked(boolean editOrder) {
        Path seed = pickFile(stackedArrays);
        Path f = work.resolve("stacked" + ArrayLoaderFuzzTest.extension(seed));
        byte[] clean = ArrayLoaderFuzzTest.read(seed);
        ArrayLoaderFuzzTest.write(f, editOrder ? clean : byteEdit(clean));
        Path order = write(work.resolve("order.txt"), editOrder ? edit("s3\ns1\ns2\n") : "s3\ns1\ns2\n");
        Path labels = random.nextInt(4) == 0 ? write(work.resolve("labels.txt"), editOrder ? edit("a\nb\nc\nd\n")
                : "a\nb\nc\nd\n") : null;
        String named = editOrder ? work.toString() : f.toString();
        return Outcomes.loadsOrRefusesInOneLine(() -> ViewLoader.stacked("v", f, ArrayLoaderFuzzTest.variable(seed),
                order, labels, random.nextInt(8) == 0, ARRAY_IDS, random.nextBoolean(), 1e-6), named);
    }

    private boolean cli(boolean editSpec) {
        Path dir = work.resolve("cohort");
        Corpus.delete(dir);
        Corpus.writeCohort(dir);
        Path seed = pickFile(specFiles);
        Path spec = dir.resolve(name(seed));
        if (editSpec) {
            write(spec, edit(Corpus.read(seed)));
        } else {
            write(spec, Corpus.read(seed));
            List<String> files = name(seed).startsWith("array") ? List.of("subjects.csv", "arrays/order.txt")
                    : List.of("subjects.csv", "src.csv", "tgt.csv", "mats/a3.csv", "tmats/a1.csv");
            Path data = dir.resolve(files.get(random.nextInt(files.size())));
            write(data, edit(Corpus.read(data)));
        }
        return Outcomes.cliIsClean(Outcomes.cli("check", spec.toString()), dir.toString());
    }

    private String seed(String folder) {
        List<String> list = texts.get(folder);
        return list.get(random.nextInt(list.size()));
    }

    private Path pickFile(List<Path> files) {
        return files.get(random.nextInt(files.size()));
    }

    /** One to four random {@link Edit}s, as the jqwik properties draw them. */
    private String edit(String text) {
        int n = 1 + random.nextInt(4);
        List<Edit> edits = new ArrayList<>();
        for (int k = 0; k < n; k++) {
            Edit.Op[] ops = Edit.Op.values();
            edits.add(new Edit(ops[random.nextInt(ops.length)], random.nextInt(1 << 20), random.nextInt(1 << 16)));
        }
        return Edit.applyAll(text, edits);
    }

    private byte[] byteEdit(byte[] clean) {
        int n = 1 + random.nextInt(3);
        List<ByteEdit> edits = new ArrayList<>();
        for (int k = 0; k < n; k++) {
            ByteEdit.Kind[] kinds = ByteEdit.Kind.values();
            int at = random.nextInt(4) == 0 ? random.nextInt(100_000) : random.nextInt(161);
            edits.add(new ByteEdit(kinds[random.nextInt(kinds.length)], at, random.nextInt(256),
                    ByteEdit.HEADER_TEXT.get(random.nextInt(ByteEdit.HEADER_TEXT.size()))));
        }
        return ByteEdit.applyAll(clean, edits);
    }

    /** Copies the input files of a broken try to the failures folder and records one line. */
    private void keep(String target, int i, Throwable t) {
        Path to = failures.resolve(target + "-" + i);
        try (var s = Files.walk(work)) {
            for (Path p : s.filter(Files::isRegularFile).toList()) {
                Path dst = to.resolve(work.relativize(p).toString());
                Files.createDirectories(dst.getParent());
                Files.copy(p, dst, java.nio.file.StandardCopyOption.REPLACE_EXISTING);
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        StackTraceElement top = t.getStackTrace().length > 0 ? t.getStackTrace()[0] : null;
        String line = target + " #" + i + ": " + t.getClass().getSimpleName() + ": "
                + String.valueOf(t.getMessage()).lines().findFirst().orElse("") + " at " + top + " -> " + to;
        if (failureLines.size() < 50) {
            failureLines.add(line);
        }
    }

    private static String name(Path p) {
        return p.getFileName().toString();
    }

    private static Path write(Path p, String text) {
        Corpus.write(p, text);
        return p;
    }
}
