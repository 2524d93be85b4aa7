package org.viewgain.cohort;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import net.jqwik.api.EdgeCasesMode;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.LongRange;
import net.jqwik.api.statistics.Statistics;
import net.jqwik.api.statistics.StatisticsReport;
import org.junit.jupiter.api.Test;
import org.viewgain.spec.BadInputException;

/**
 * The allocation-light reader of comma-separated matrix files ({@link MatrixFile#commaSeparated}) gives what the
 * general reader ({@link MatrixFile#general}: rows and cells first, then every check with its message) gives, for
 * every text: the same region names and the same values bit for bit, or the same error, or it declines and leaves
 * the file to the general reader. The texts are invented: small symmetric matrices with headers, corner cells, row
 * names, padding, blank lines and every line-break spelling, some spoilt (a bad cell, an asymmetry, a NaN diagonal,
 * a short or long row, a missing row, repeated names).
 */
@StatisticsReport(StatisticsReport.StatisticsReportMode.OFF)
class MatrixFileFastPathTest {
    private static final Path FILE = Path.of("views/s01.csv");

    static String text(long seed) {
        SplittableRandom r = new SplittableRandom(seed);
        int n = 2 + r.nextInt(5);
        double[][] m = new double[n][n];
        int[][] format = new int[n][n]; // one spelling per pair, so that the matrix stays symmetric
        for (int i = 0; i < n; i++) {
            for (int j = i; j < n; j++) {
                format[i][j] = r.nextInt(4);
                double v = r.nextInt(4) == 0 ? r.nextInt(100) : (r.nextDouble() - 0.5) * Math.pow(10, r.nextInt(9) - 4);
                m[i][j] = v;
                m[j][i] = v;
            }
        }
        List<String> names = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            names.add(r.nextInt(20) == 0 && i > 0 ? names.get(0) : "R" + (i + 1));
        }
        boolean header = r.nextBoolean();
        boolean rowNames = r.nextBoolean();
        String[] breaks = {"\n", "\r\n", "\r"};
        String br = breaks[r.nextInt(3)];
        List<List<String>> lines = new ArrayList<>();
        if (header) {
            List<String> h = new ArrayList<>();
            if (rowNames || r.nextInt(4) == 0) {
                h.add(r.nextBoolean() ? "" : "region");
            }
            h.addAll(names);
            lines.add(h);
        }
        for (int i = 0; i < n; i++) {
            List<String> row = new ArrayList<>();
            if (rowNames) {
                row.add(names.get(i));
            }
            for (int j = 0; j < n; j++) {
                String cell = switch (format[Math.min(i, j)][Math.max(i, j)]) {
                    case 0 -> String.format(Locale.ROOT, "%.6f", m[i][j]);
                    case 1 -> String.format(Locale.ROOT, "%.3e", m[i][j]);
                    case 2 -> Double.toString(m[i][j]);
                    default -> String.format(Locale.ROOT, "%.17g", m[i][j]);
                };
                row.add(r.nextInt(10) == 0 ? " " + cell + "\t" : cell);
            }
            lines.add(row);
        }
        if (r.nextInt(3) == 0) { // spoil it
            List<String> row = lines.get(lines.size() - 1 - r.nextInt(n));
            int c = row.size() - 1 - r.nextInt(n);
            switch (r.nextInt(8)) {
                case 0 -> row.set(c, "abc");
                case 1 -> row.set(c, "");
                case 2 -> row.set(c, "1e999");
                case 3 -> row.set(c, row.get(c) + "1");
                case 4 -> row.add("0.5");
                case 5 -> row.remove(row.size() - 1);
                case 6 -> lines.remove(lines.size() - 1);
                default -> row.set(c, "NaN");
            }
        }
        StringBuilder sb = new StringBuilder();
        for (List<String> l : lines) {
            if (r.nextInt(10) == 0) {
                sb.append(r.nextBoolean() ? "" : " , ").append(br);
            }
            sb.append(String.join(",", l)).append(br);
        }
        return r.nextBoolean() ? sb.toString() : sb.toString().strip();
    }

    /** The outcome of one reader: names and values, or the error's message, or null when it declined. */
    record Outcome(List<String> names, double[][] values, String error) {
    }

    static Outcome fast(String text) {
        try {
            MatrixFile.Parsed p = MatrixFile.commaSeparated("view source, subject s01", "s01", FILE, text, 1e-9);
            return p == null ? null : new Outcome(p.names(), p.values(), null);
        } catch (BadInputException e) {
            return new Outcome(null, null, e.getMessage());
        }
    }

    static Outcome general(String text) {
        try {
            MatrixFile.Parsed p = MatrixFile.general("view source, subject s01", "source", "s01", FILE, text, 1e-9);
            return new Outcome(p.names(), p.values(), null);
        } catch (BadInputException e) {
            return new Outcome(null, null, e.getMessage());
        }
    }

    static void assertSame(Outcome expected, Outcome got, String text) {
        assertEquals(expected.error(), got.error(), text);
        assertEquals(expected.names(), got.names(), text);
        if (expected.values() != null) {
            assertEquals(expected.values().length, got.values().length, text);
            for (int i = 0; i < expected.values().length; i++) {
                assertArrayEquals(expected.values()[i], got.values()[i], 0.0, text);
                for (int j = 0; j < expected.values().length; j++) {
                    assertEquals(Double.doubleToRawLongBits(expected.values()[i][j]),
                            Double.doubleToRawLongBits(got.values()[i][j]), text);
                }
            }
        }
    }

    @Property(tries = 5000, seed = "1503", edgeCases = EdgeCasesMode.NONE)
    void givenMatrixTexts_whenReadBothWays_thenTheSameNamesValuesOrError(@ForAll @LongRange(min = 0) long seed) {
        String text = text(seed);
        Outcome fast = fast(text);
        Outcome general = general(text);
        String kind = fast == null ? "declined" : fast.error() != null ? "same error" : "read";
        Statistics.label("fast reader").collect(kind);
        // the fast reader reads most texts and declines some, so both branches are compared (common practice,
        // no source)
        Statistics.label("fast reader").coverage(c -> {
            c.check("read").percentage(p -> p > 50);
            c.check("declined").percentage(p -> p > 10);
            c.check("same error").percentage(p -> p > 0.5);
        });
        if (fast != null) {
            assertSame(general, fast, text);
        }
    }

    @Test
    void givenAPlainFileAndALabelledOne_whenRead_thenTheFastReaderReadsThem() {
        String plain = "0,0.5,1e-3\n0.5,0,2\n1e-3,2,0\n";
        String labelled = ",a,b\r\na, 1 ,-2.5\r\nb,-2.5,1\r\n";
        for (String t : List.of(plain, labelled)) {
            Outcome fast = fast(t);
            assertNotNull(fast, t);
            assertSame(general(t), fast, t);
        }
        assertEquals(List.of("a", "b"), fast(labelled).names());
        assertEquals(-2.5, fast(labelled).values()[1][0], 0.0);
    }
}
