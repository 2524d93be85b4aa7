package org.viewgain.testing;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;

/**
 * Writes small invented cohorts with a known truth for engine tests: a subjects table and two edge-table views.
 * The target is a noisy linear function of the source; {@code effect} shifts the first few target columns (and,
 * at a fifth of the size, the first source columns) of group 1. With effect 0 the labels are independent of all
 * features.
 */
public final class TestCohorts {
    private TestCohorts() {
    }

    public static Path synthetic(Path dir, int n, int p, int q, double effect, double missing, long seed) {
        return synthetic(dir, n, p, q, effect, effect / 5, missing, seed);
    }

    /** As above with separate group shifts of the target and the source columns. */
    public static Path synthetic(Path dir, int n, int p, int q, double effect, double sourceEffect, double missing,
                                 long seed) {
        try {
            Files.createDirectories(dir);
            SplittableRandom rng = new SplittableRandom(seed);
            double[][] w = new double[p][q];
            for (double[] r : w) {
                for (int c = 0; c < q; c++) {
                    r[c] = rng.nextGaussian() / Math.sqrt(p);
                }
            }
            StringBuilder subjects = new StringBuilder("subject,group,site\n");
            StringBuilder src = new StringBuilder("subject");
            StringBuilder tgt = new StringBuilder("subject");
            for (int j = 0; j < p; j++) {
                src.append(",s").append(j + 1);
            }
            for (int j = 0; j < q; j++) {
                tgt.append(",t").append(j + 1);
            }
            src.append('\n');
            tgt.append('\n');
            for (int i = 0; i < n; i++) {
                String id = String.format(Locale.ROOT, "s%03d", i + 1);
                int g = i % 2;
                subjects.append(id).append(',').append(g == 1 ? "patient" : "control").append(',')
                        .append(rng.nextBoolean() ? "east" : "west").append('\n');
                double[] x = new double[p];
                src.append(id);
                for (int j = 0; j < p; j++) {
                    x[j] = rng.nextGaussian() + (j < 3 ? g * sourceEffect : 0);
                    src.append(',').append(String.format(Locale.ROOT, "%.6f", x[j]));
                }
                src.append('\n');
                if (rng.nextDouble() >= missing) {
                    tgt.append(id);
                    for (int c = 0; c < q; c++) {
                        double v = 0;
                        for (int j = 0; j < p; j++) {
                            v += x[j] * w[j][c];
                        }
                        v += 0.3 * rng.nextGaussian() + (c < 3 ? g * effect : 0);
                        tgt.append(',').append(String.format(Locale.ROOT, "%.6f", v));
                    }
                    tgt.append('\n');
                }
            }
            Files.writeString(dir.resolve("subjects.csv"), subjects);
            Files.writeString(dir.resolve("source.csv"), src);
            Files.writeString(dir.resolve("target.csv"), tgt);
            return dir;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** A spec over a synthetic cohort; {@code body} adds imputers, feature sets, classifiers and validation. */
    public static Path spec(Path dir, String body) {
        String text = """
                experiment: synthetic
                seed: 99
                cohort: { subjects: subjects.csv, groups: [control, patient], positive: patient, site: site }
                views:
                  source: { table: source.csv }
                  target: { table: target.csv, missing: allowed }
                """ + body;
        try {
            Path f = dir.resolve("spec.yaml");
            Files.writeString(f, text);
            return f;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /**
     * A spec (experiment {@code bcw}, seed 11) over the cohort {@link #breastCancer} wrote into {@code dir}: groups
     * benign and malignant (positive), source and target table views (target may be missing), then {@code body}.
     */
    public static Path breastCancerSpec(Path dir, String body) {
        String text = """
                experiment: bcw
                seed: 11
                cohort: { subjects: subjects.csv, id: subject, group: diagnosis, groups: [benign, malignant], positive: malignant }
                views:
                  source: { table: source.csv }
                  target: { table: target.csv, missing: allowed }
                """ + body;
        try {
            return Files.writeString(dir.resolve("spec.yaml"), text);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /**
     * The breast-cancer-wisconsin data set (test resource, source in its README) as two tabular views of one subject:
     * source = the 10 {@code mean_*} columns, target = the 10 {@code worst_*} columns, with the target removed for a
     * seeded random {@code missing} fraction of subjects.
     */
    public static Path breastCancer(Path dir, double missing, long seed) {
        try (var in = TestCohorts.class.getResourceAsStream("/reference/breast-cancer-wisconsin.csv")) {
            List<String> lines = new String(in.readAllBytes(), java.nio.charset.StandardCharsets.UTF_8).lines().toList();
            String[] head = lines.get(0).split(",");
            List<Integer> mean = new ArrayList<>();
            List<Integer> worst = new ArrayList<>();
            for (int c = 0; c < head.length; c++) {
                if (head[c].startsWith("mean_")) {
                    mean.add(c);
                } else if (head[c].startsWith("worst_")) {
                    worst.add(c);
                }
            }
            SplittableRandom rng = new SplittableRandom(seed);
            StringBuilder subjects = new StringBuilder("subject,diagnosis\n");
            StringBuilder src = new StringBuilder("subject");
            StringBuilder tgt = new StringBuilder("subject");
            mean.forEach(c -> src.append(',').append(head[c]));
            worst.forEach(c -> tgt.append(',').append(head[c]));
            src.append('\n');
            tgt.append('\n');
            for (String line : lines.subList(1, lines.size())) {
                String[] v = line.split(",");
                subjects.append(v[0]).append(',').append(v[1]).append('\n');
                src.append(v[0]);
                mean.forEach(c -> src.append(',').append(v[c]));
                src.append('\n');
                if (rng.nextDouble() >= missing) {
                    tgt.append(v[0]);
                    worst.forEach(c -> tgt.append(',').append(v[c]));
                    tgt.append('\n');
                }
            }
            Files.createDirectories(dir);
            Files.writeString(dir.resolve("subjects.csv"), subjects);
            Files.writeString(dir.resolve("source.csv"), src);
            Files.writeString(dir.resolve("target.csv"), tgt);
            return dir;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
