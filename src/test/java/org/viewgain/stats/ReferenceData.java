package org.viewgain.stats;

import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.Reader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;

/** Reads the reference CSV files of src/test/resources/reference (sources named in the README there). */
final class ReferenceData {
    private ReferenceData() {
    }

    static List<CSVRecord> read(String name) {
        try (InputStream in = ReferenceData.class.getResourceAsStream("/reference/" + name);
                Reader reader = new InputStreamReader(in, StandardCharsets.UTF_8)) {
            return new ArrayList<>(CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).get()
                    .parse(reader).getRecords());
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    static double[] column(List<CSVRecord> rows, String name) {
        return rows.stream().mapToDouble(r -> Double.parseDouble(r.get(name))).toArray();
    }

    /** aSAH outcome with Poor as the positive class (Turck et al. 2010, via pROC 1.18.0). */
    static boolean[] asahPoor(List<CSVRecord> rows) {
        boolean[] poor = new boolean[rows.size()];
        for (int i = 0; i < poor.length; i++) {
            poor[i] = rows.get(i).get("outcome").equals("Poor");
        }
        return poor;
    }

    /** Hanley &amp; McNeil (1982), Table I: ratings 1..5 of 58 normal and 51 abnormal images. */
    static double[] hanleyMcNeilRatings() {
        return expand(new int[] {33, 6, 6, 11, 2}, new int[] {3, 2, 2, 11, 33}, true);
    }

    /** Labels matching {@link #hanleyMcNeilRatings()}: false for the 58 normal, true for the 51 abnormal. */
    static boolean[] hanleyMcNeilAbnormal() {
        double[] flags = expand(new int[] {33, 6, 6, 11, 2}, new int[] {3, 2, 2, 11, 33}, false);
        boolean[] abnormal = new boolean[flags.length];
        for (int i = 0; i < flags.length; i++) {
            abnormal[i] = flags[i] > 0;
        }
        return abnormal;
    }

    private static double[] expand(int[] normal, int[] abnormal, boolean ratings) {
        List<Double> out = new ArrayList<>();
        for (int r = 0; r < 5; r++) {
            for (int c = 0; c < normal[r]; c++) {
                out.add(ratings ? r + 1.0 : 0.0);
            }
        }
        for (int r = 0; r < 5; r++) {
            for (int c = 0; c < abnormal[r]; c++) {
                out.add(ratings ? r + 1.0 : 1.0);
            }
        }
        return out.stream().mapToDouble(Double::doubleValue).toArray();
    }
}
