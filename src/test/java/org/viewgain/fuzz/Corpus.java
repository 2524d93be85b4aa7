package org.viewgain.fuzz;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.URISyntaxException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.stream.Stream;

/**
 * The seed corpus in {@code src/test/resources/fuzz/} and the tiny cohort its specs point at. Writing mutated text
 * keeps its characters where UTF-8 can encode them; a lone surrogate becomes '?', and {@link #write(Path, String,
 * int)} can also corrupt one raw byte so that files that are not UTF-8 are tried too.
 */
final class Corpus {
    static final int SUBJECTS = 12;

    private Corpus() {
    }

    static Path folder(String name) {
        try {
            return Path.of(Corpus.class.getResource("/fuzz/" + name).toURI());
        } catch (URISyntaxException e) {
            throw new IllegalStateException(e);
        }
    }

    /** Files of a corpus folder in name order. */
    static List<Path> files(String name) {
        try (Stream<Path> s = Files.list(folder(name))) {
            return s.filter(Files::isRegularFile).sorted(Comparator.comparing(Path::toString)).toList();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** The texts of a corpus folder, in name order. */
    static List<String> texts(String name) {
        return files(name).stream().map(Corpus::read).toList();
    }

    static String read(Path p) {
        try {
            return new String(Files.readAllBytes(p), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** Writes text as UTF-8; when {@code rawFlip >= 0}, also flips the high bit of byte {@code rawFlip % length}. */
    static void write(Path file, String text, int rawFlip) {
        byte[] b = text.getBytes(StandardCharsets.UTF_8);
        if (rawFlip >= 0 && b.length > 0) {
            b[rawFlip % b.length] ^= (byte) 0x80;
        }
        try {
            Files.createDirectories(file.getParent());
            Files.write(file, b);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    static void write(Path file, String text) {
        write(file, text, -1);
    }

    /**
     * Writes the cohort the corpus specs use into {@code dir}: {@code subjects.csv} (subject, group, site, age) for
     * a1..a12 in two groups and two sites, table views {@code src.csv} and {@code tgt.csv} (target missing for a4, a9)
     * and 4-region matrix views {@code mats/} and {@code tmats/} (target missing for a5).
     */
    static void writeCohort(Path dir) {
        StringBuilder subjects = new StringBuilder("subject,group,site,age\n");
        StringBuilder src = new StringBuilder("subject,x1,x2,x3\n");
        StringBuilder tgt = new StringBuilder("subject,y1,y2\n");
        for (int i = 1; i <= SUBJECTS; i++) {
            String id = "a" + i;
            subjects.append(id).append(i % 2 == 0 ? ",patient," : ",control,").append(i % 4 < 2 ? "s1," : "s2,")
                    .append(20 + i).append('\n');
            src.append(id).append(',').append(i % 3).append(',').append(i % 2 + i % 5).append(',').append(0.1 * i)
                    .append('\n');
            if (i != 4 && i != 9) {
                tgt.append(id).append(',').append(i % 2).append(',').append(i % 7).append('\n');
            }
            write(dir.resolve("mats").resolve(id + ".csv"), matrix(i));
            if (i != 5) {
                write(dir.resolve("tmats").resolve(id + ".csv"), matrix(i + 100));
            }
        }
        write(dir.resolve("subjects.csv"), subjects.toString());
        write(dir.resolve("src.csv"), src.toString());
        write(dir.resolve("tgt.csv"), tgt.toString());
        copyArrays(dir.resolve("arrays"));
    }

    /**
     * The numpy/scipy-written views of the same ids a1..a12 (src/test/resources/cohort/arrays/cohort12, provenance
     * there): {@code thickness.npy} stacked in the order of {@code order.txt}, {@code area/{subject}.mat} for a1..a10.
     */
    private static void copyArrays(Path to) {
        try {
            Path from = Path.of(Corpus.class.getResource("/cohort/arrays/cohort12").toURI());
            try (Stream<Path> s = Files.walk(from)) {
                for (Path p : s.filter(Files::isRegularFile).toList()) {
                    Path t = to.resolve(from.relativize(p).toString());
                    Files.createDirectories(t.getParent());
                    Files.copy(p, t, java.nio.file.StandardCopyOption.REPLACE_EXISTING);
                }
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        } catch (URISyntaxException e) {
            throw new IllegalStateException(e);
        }
    }

    private static String matrix(int k) {
        StringBuilder sb = new StringBuilder("A,B,C,D\n");
        for (int i = 0; i < 4; i++) {
            for (int j = 0; j < 4; j++) {
                double v = i == j ? 0 : ((Math.min(i, j) * 7 + Math.max(i, j) * 3 + k) % 11) / 10.0;
                sb.append(j == 0 ? "" : ",").append(String.format(Locale.ROOT, "%.2f", v));
            }
            sb.append('\n');
        }
        return sb.toString();
    }

    /** Deletes a folder tree (temporary folders of a property run). */
    static void delete(Path dir) {
        if (dir == null || !Files.exists(dir)) {
            return;
        }
        try (Stream<Path> s = Files.walk(dir)) {
            s.sorted(Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
