package org.viewgain.demo;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;

/**
 * Writes an invented demo cohort (no real subjects): 120 subjects, 60 {@code patient} and 60 {@code control}, at
 * sites {@code north} and {@code south}, with a source view ({@code thickness}) for everyone and a target view
 * ({@code area}) missing for about 30% of subjects at random, independently of group. A group effect is planted in
 * a few latent directions, clear in the target view and weak in the source view. The output is a function of the
 * seed alone (byte for byte).
 */
public final class DemoCohort {
    /** The seed of the committed copy in {@code demo-data/}. */
    public static final long DEFAULT_SEED = 2026;

    private DemoCohort() {
    }

    /**
     * Writes {@code subjects.csv} (columns subject, group, site, age, sex with sex coded 0/1) and one matrix per
     * subject in {@code views/thickness/{subject}.csv} and, where observed, {@code views/area/{subject}.csv}
     * (region-name header row, comma separated, six decimals). Area files of subjects whose target is missing are
     * deleted if present, so regenerating into the same folder gives exactly the generator's output.
     */
    public static void write(Path dir, long seed) {
        SplittableRandom root = new SplittableRandom(seed);
        DemoModel model = new DemoModel(root.split());
        List<DemoModel.Person> people = model.cohort(root.split(), root.split());
        try {
            Path thickness = Files.createDirectories(dir.resolve("views").resolve("thickness"));
            Path area = Files.createDirectories(dir.resolve("views").resolve("area"));
            try (BufferedWriter w = Files.newBufferedWriter(dir.resolve("subjects.csv"), StandardCharsets.UTF_8)) {
                w.write("subject,group,site,age,sex\n");
                for (DemoModel.Person p : people) {
                    w.write(p.id() + "," + p.group() + "," + p.site() + ","
                            + String.format(Locale.ROOT, "%.1f", p.age()) + "," + p.sex() + "\n");
                }
            }
            for (DemoModel.Person p : people) {
                writeMatrix(thickness.resolve(p.id() + ".csv"), model.regions(), p.source());
                Path target = area.resolve(p.id() + ".csv");
                if (p.targetObserved()) {
                    writeMatrix(target, model.regions(), p.target());
                } else {
                    Files.deleteIfExists(target);
                }
            }
        } catch (IOException e) {
            throw new UncheckedIOException("cannot write the demo cohort to " + dir, e);
        }
    }

    /** Writes the demo cohort into {@code args[0]} (default {@code demo-data}) with seed {@code args[1]} (2026). */
    public static void main(String[] args) {
        Path dir = Path.of(args.length > 0 ? args[0] : "demo-data");
        long seed = args.length > 1 ? Long.parseLong(args[1]) : DEFAULT_SEED;
        write(dir, seed);
    }

    private static void writeMatrix(Path file, List<String> regions, double[] upper) throws IOException {
        int n = regions.size();
        String[][] cells = new String[n][n];
        int k = 0;
        for (int i = 0; i < n; i++) {
            cells[i][i] = "0.000000";
            for (int j = i + 1; j < n; j++) {
                String v = sixDecimals(upper[k++]);
                cells[i][j] = v;
                cells[j][i] = v;
            }
        }
        StringBuilder sb = new StringBuilder(n * n * 9 + 400);
        sb.append(String.join(",", regions)).append('\n');
        for (String[] row : cells) {
            sb.append(String.join(",", row)).append('\n');
        }
        Files.writeString(file, sb, StandardCharsets.UTF_8);
    }

    /** Fixed six decimals, rounded half away from zero; much faster than String.format for ~10^5 cells. */
    static String sixDecimals(double v) {
        long scaled = Math.round(Math.abs(v) * 1e6);
        String frac = Long.toString(1_000_000 + scaled % 1_000_000).substring(1);
        return (v < 0 && scaled != 0 ? "-" : "") + (scaled / 1_000_000) + "." + frac;
    }
}
