package org.viewgain.testing;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;

/** Adds invented covariates {@code age} (years) and {@code sex} (0/1) to a cohort's {@code subjects.csv}. */
public final class Covariates {
    private Covariates() {
    }

    public static void addAgeAndSex(Path dir, long seed) {
        try {
            Path f = dir.resolve("subjects.csv");
            List<String> lines = Files.readAllLines(f);
            SplittableRandom rng = new SplittableRandom(seed);
            StringBuilder b = new StringBuilder(lines.get(0)).append(",age,sex\n");
            for (String line : lines.subList(1, lines.size())) {
                b.append(line).append(String.format(Locale.ROOT, ",%.1f,%d%n", 20 + 60 * rng.nextDouble(),
                        rng.nextInt(2)));
            }
            Files.writeString(f, b);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
