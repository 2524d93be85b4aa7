package org.viewgain.testing;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

/**
 * Fisher's iris (test resource {@code reference/iris.csv}; Fisher 1936, UCI, CC BY 4.0, source in its README) as a
 * three-group cohort: {@code subjects.csv} (id, species) and a tabular source view {@code source.csv} of the four
 * measurements.
 */
public final class IrisCohort {
    /** The cohort keys of a spec over this cohort. */
    public static final String COHORT = "cohort: { subjects: subjects.csv, id: id, group: species, "
            + "groups: [setosa, versicolor, virginica] }\nviews: { source: { table: source.csv } }\n";

    private IrisCohort() {
    }

    public static Path write(Path dir) {
        try (var in = IrisCohort.class.getResourceAsStream("/reference/iris.csv")) {
            List<String> lines = new String(in.readAllBytes(), StandardCharsets.UTF_8).lines().toList();
            StringBuilder subjects = new StringBuilder("id,species\n");
            StringBuilder source = new StringBuilder("id,sepal_length,sepal_width,petal_length,petal_width\n");
            for (String line : lines.subList(1, lines.size())) {
                String[] v = line.split(",");
                subjects.append(v[0]).append(',').append(v[1]).append('\n');
                source.append(v[0]).append(',').append(v[2]).append(',').append(v[3]).append(',').append(v[4])
                        .append(',').append(v[5]).append('\n');
            }
            Files.createDirectories(dir);
            Files.writeString(dir.resolve("subjects.csv"), subjects);
            Files.writeString(dir.resolve("source.csv"), source);
            return dir;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** Writes {@code spec.yaml}: experiment iris, the cohort above, then {@code body}. */
    public static Path spec(Path dir, String body) {
        try {
            Path f = dir.resolve("spec.yaml");
            Files.writeString(f, "experiment: iris\nseed: 5\n" + COHORT + body);
            return f;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
