package org.viewgain.cohort;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.viewgain.spec.BadInputException;

/**
 * Text files of one entry per line: a subject-order list (the subject of each slice of a stacked array) and a
 * region labels file. Entries are stripped; blank lines are skipped; an entry may not appear twice.
 */
final class LineLists {
    /** The entries and the 1-based line of each. */
    record Entries(List<String> values, List<Integer> lines) {
        Entries {
            values = List.copyOf(values);
            lines = List.copyOf(lines);
        }
    }

    private LineLists() {
    }

    /** Reads the list; {@code role} names it in messages ("view source subject-order list"). */
    static Entries read(Path file, String role) {
        String text = CsvText.text(file, role);
        String[] lines = text.split("\r\n|\r|\n", -1);
        List<String> values = new ArrayList<>();
        List<Integer> at = new ArrayList<>();
        Map<String, Integer> seen = new HashMap<>();
        for (int i = 0; i < lines.length; i++) {
            String s = lines[i].strip();
            if (s.isEmpty()) {
                continue;
            }
            if (s.contains(",") || s.contains("\t") || s.contains(";")) {
                throw new BadInputException(role + " " + file + ", line " + (i + 1) + ": " + CsvText.show(s)
                        + " holds a separator; write one entry per line and nothing else");
            }
            Integer earlier = seen.putIfAbsent(s, i + 1);
            if (earlier != null) {
                throw new BadInputException(role + " " + file + ", line " + (i + 1) + ": " + CsvText.show(s)
                        + " appears twice (lines " + earlier + " and " + (i + 1) + ")");
            }
            values.add(s);
            at.add(i + 1);
        }
        if (values.isEmpty()) {
            throw new BadInputException(role + " " + file + " is empty: expected one entry per line");
        }
        return new Entries(values, at);
    }

    /** Region names from a labels file, which must list exactly {@code regions} names. */
    static List<String> labels(Path file, String view, int regions) {
        String role = "view " + view + " labels file";
        Entries e = read(file, role);
        if (e.values().size() != regions) {
            throw new BadInputException(role + " " + file + ": " + e.values().size() + " names, but the matrices"
                    + " have " + regions + " regions");
        }
        return e.values();
    }
}
