package org.viewgain.demo;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.SplittableRandom;

/**
 * Writes an invented cohort of any size in the demo layout, for benchmarks: {@code subjects.csv} (subject, group,
 * site), {@code views/thickness/{subject}.csv} for everyone and {@code views/area/{subject}.csv} for about 70% of
 * subjects (the rest are missing at random, independently of group). Both views express a few latent factors
 * through region loadings; the first factor is shifted by group, strongly in the target view and weakly in the
 * source view. No real subjects; the output is a function of the arguments alone (byte for byte).
 */
public final class ScaleCohort {
    static final int FACTORS = 4;
    static final double TARGET_MISSING = 0.3;
    private static final double GROUP_SHIFT = 1.0;

    private ScaleCohort() {
    }

    /**
     * Writes the cohort into {@code dir} (created if needed): {@code subjects} subjects in two balanced groups
     * ({@code control}, {@code patient}) at two sites, and {@code regions} x {@code regions} symmetric matrices
     * with a region-name header row and five decimals.
     *
     * @throws IllegalArgumentException when {@code subjects < 4} or {@code regions < 2}
     */
    public static void write(Path dir, int subjects, int regions, long seed) {
        if (!(subjects >= 4 && regions >= 2)) {
            throw new IllegalArgumentException("need at least 4 subjects and 2 regions, got " + subjects + " and "
                    + regions);
        }
        write(dir, subjects, regions, seed, seed, "s", TARGET_MISSING, GROUP_SHIFT);
    }

    /**
     * Writes a cohort drawn from the population of {@code populationSeed} (the views' loadings and means) with the
     * subjects of {@code peopleSeed}: two cohorts with one population seed and two people seeds are a development
     * and an independent cohort of one invented population. Equal seeds give exactly {@link #write(Path, int, int,
     * long)}'s cohort.
     *
     * @param prefix        the start of every subject id ({@code s} gives s00001, ...)
     * @param targetMissing the fraction of subjects without a target file (1 for a cohort that never acquired it)
     * @param groupShift    the group difference in the first latent factor (0: no group signal anywhere)
     */
    public static void write(Path dir, int subjects, int regions, long populationSeed, long peopleSeed,
                             String prefix, double targetMissing, double groupShift) {
        if (!(subjects >= 4 && regions >= 2)) {
            throw new IllegalArgumentException("need at least 4 subjects and 2 regions, got " + subjects + " and "
                    + regions);
        }
        SplittableRandom pop = new SplittableRandom(populationSeed);
        Loadings source = new Loadings(pop.split(), regions, 0.3, 1.0);
        Loadings target = new Loadings(pop.split(), regions, 1.5, 0.4);
        SplittableRandom root = populationSeed == peopleSeed ? pop : new SplittableRandom(peopleSeed);
        SplittableRandom people = root.split();
        boolean[] missing = pick(subjects, (int) Math.round(targetMissing * subjects), root.split());
        boolean[] patient = pick(subjects, subjects / 2, root.split());
        String header = header(regions);
        try {
            Path thickness = Files.createDirectories(dir.resolve("views").resolve("thickness"));
            Path area = Files.createDirectories(dir.resolve("views").resolve("area"));
            try (BufferedWriter w = Files.newBufferedWriter(dir.resolve("subjects.csv"), StandardCharsets.UTF_8)) {
                w.write("subject,group,site\n");
                for (int s = 0; s < subjects; s++) {
                    w.write(id(prefix, s) + "," + (patient[s] ? "patient" : "control") + ","
                            + (s % 2 == 0 ? "north" : "south") + "\n");
                }
            }
            for (int s = 0; s < subjects; s++) {
                SplittableRandom rnd = people.split();
                double[] z = new double[FACTORS];
                for (int k = 0; k < FACTORS; k++) {
                    z[k] = rnd.nextGaussian() + (k == 0 ? (patient[s] ? 0.5 : -0.5) * groupShift : 0);
                }
                writeMatrix(thickness.resolve(id(prefix, s) + ".csv"), header, source.draw(z, s % 2 == 1, rnd));
                double[][] t = target.draw(z, false, rnd);
                Path file = area.resolve(id(prefix, s) + ".csv");
                if (missing[s]) {
                    Files.deleteIfExists(file);
                } else {
                    writeMatrix(file, header, t);
                }
            }
        } catch (IOException e) {
            throw new UncheckedIOException("cannot write the scale cohort to " + dir, e);
        }
    }

    /**
     * {@code args}: folder, subjects, regions, seed (default 1); optionally then a people seed, an id prefix and the
     * fraction of subjects without a target (an independent cohort of the seed's population, as in {@link
     * #write(Path, int, int, long, long, String, double, double)} with the usual group shift).
     */
    public static void main(String[] args) {
        if (args.length != 3 && args.length != 4 && args.length != 7) {
            throw new IllegalArgumentException("usage: ScaleCohort DIR SUBJECTS REGIONS [SEED [PEOPLE_SEED PREFIX"
                    + " TARGET_MISSING]]");
        }
        long seed = args.length > 3 ? Long.parseLong(args[3]) : 1L;
        if (args.length == 7) {
            write(Path.of(args[0]), Integer.parseInt(args[1]), Integer.parseInt(args[2]), seed,
                    Long.parseLong(args[4]), args[5], Double.parseDouble(args[6]), GROUP_SHIFT);
        } else {
            write(Path.of(args[0]), Integer.parseInt(args[1]), Integer.parseInt(args[2]), seed);
        }
    }

    static String id(int s) {
        return id("s", s);
    }

    static String id(String prefix, int s) {
        return String.format("%s%05d", prefix, s + 1);
    }

    /** A uniform random subset of exactly {@code count} of {@code n} indices. */
    private static boolean[] pick(int n, int count, SplittableRandom rnd) {
        int[] order = new int[n];
        for (int i = 0; i < n; i++) {
            order[i] = i;
        }
        boolean[] chosen = new boolean[n];
        for (int i = 0; i < count; i++) {
            int j = i + rnd.nextInt(n - i);
            int t = order[i];
            order[i] = order[j];
            order[j] = t;
            chosen[order[i]] = true;
        }
        return chosen;
    }

    private static String header(int regions) {
        StringBuilder sb = new StringBuilder();
        for (int r = 0; r < regions; r++) {
            sb.append(r == 0 ? "" : ",").append(String.format("R%03d", r + 1));
        }
        return sb.append('\n').toString();
    }

    private static void writeMatrix(Path file, String header, double[][] m) throws IOException {
        int n = m.length;
        StringBuilder sb = new StringBuilder(header.length() + n * n * 8);
        sb.append(header);
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                if (j > 0) {
                    sb.append(',');
                }
                appendFiveDecimals(sb, i == j ? 0 : m[Math.min(i, j)][Math.max(i, j)]);
            }
            sb.append('\n');
        }
        Files.writeString(file, sb, StandardCharsets.UTF_8);
    }

    /** Values lie in (0, 1): fixed five decimals without String.format (a large cohort has ~10^8 cells). */
    static void appendFiveDecimals(StringBuilder sb, double v) {
        long scaled = Math.round(v * 1e5);
        sb.append(scaled / 100_000).append('.');
        String frac = Long.toString(100_000 + scaled % 100_000);
        sb.append(frac, 1, 6);
    }

    /** How one view expresses the latent factors: region loadings, edge means, group scale and noise. */
    private static final class Loadings {
        private final double[][] region;
        private final double[] rowMean;
        private final double groupScale;
        private final double noise;

        Loadings(SplittableRandom rnd, int regions, double groupScale, double noise) {
            region = new double[regions][FACTORS];
            rowMean = new double[regions];
            for (int r = 0; r < regions; r++) {
                for (int k = 0; k < FACTORS; k++) {
                    region[r][k] = rnd.nextGaussian();
                }
                rowMean[r] = 0.3 * rnd.nextGaussian();
            }
            this.groupScale = groupScale;
            this.noise = noise;
        }

        /** The upper triangle (i < j) of one subject's matrix, logistic-squashed into (0, 1); rows jagged. */
        double[][] draw(double[] z, boolean siteShift, SplittableRandom rnd) {
            int n = region.length;
            double[] score = new double[n];
            for (int r = 0; r < n; r++) {
                for (int k = 0; k < FACTORS; k++) {
                    score[r] += region[r][k] * z[k] * (k == 0 ? groupScale : 1.0);
                }
            }
            double[][] m = new double[n][n];
            for (int i = 0; i < n; i++) {
                for (int j = i + 1; j < n; j++) {
                    double eta = rowMean[i] + rowMean[j] + 0.3 * ((score[i] + score[j]) / Math.sqrt(2)
                            + noise * rnd.nextGaussian()) + (siteShift ? 0.2 : 0);
                    m[i][j] = 1 / (1 + Math.exp(-eta));
                }
            }
            return m;
        }
    }
}
