package org.viewgain.demo;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.cohort.Subject;
import org.viewgain.cohort.SubjectsTable;
import org.viewgain.cohort.View;
import org.viewgain.cohort.ViewLoader;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

class DemoCohortTest {
    private static final long SEED = 2026;

    @TempDir
    static Path shared;

    private static List<Subject> subjects;
    private static View source;
    private static View target;

    @BeforeAll
    static void generateAndLoad() {
        DemoCohort.write(shared, SEED);
        subjects = SubjectsTable.load(shared.resolve("subjects.csv"), "subject", "group", "site",
                List.of("age", "sex"), List.of("patient", "control"));
        List<String> ids = subjects.stream().map(Subject::id).toList();
        source = ViewLoader.matrices("thickness", shared.resolve("views/thickness/{subject}.csv"), ids, false, 0.0);
        target = ViewLoader.matrices("area", shared.resolve("views/area/{subject}.csv"), ids, true, 0.0);
    }

    private static List<Path> files(Path root) throws IOException {
        try (Stream<Path> s = Files.walk(root)) {
            return s.filter(Files::isRegularFile).filter(p -> p.toString().endsWith(".csv"))
                    .map(root::relativize).sorted().toList();
        }
    }

    private static void assertSameFiles(Path a, Path b) throws IOException {
        List<Path> fa = files(a);
        assertEquals(fa, files(b));
        for (Path f : fa) {
            assertArrayEquals(Files.readAllBytes(a.resolve(f)), Files.readAllBytes(b.resolve(f)), f.toString());
        }
    }

    @Test
    void givenSameSeed_whenRegenerated_thenByteIdenticalFiles(@TempDir Path again) throws IOException {
        DemoCohort.write(again, SEED);
        assertSameFiles(shared, again);
    }

    @Test
    void givenOtherSeed_whenGenerated_thenDifferentValues(@TempDir Path other) throws IOException {
        DemoCohort.write(other, SEED + 1);
        assertFalse(Files.readString(other.resolve("views/thickness/sub-001.csv"))
                .equals(Files.readString(shared.resolve("views/thickness/sub-001.csv"))));
    }

    @Test
    void givenCommittedDemoData_whenCompared_thenItIsTheGeneratorsOutputForSeed2026() throws IOException {
        // Maven runs tests in the project folder, where demo-data/ is committed.
        assertSameFiles(Path.of("demo-data"), shared);
    }

    @Test
    void givenValues_whenWrittenWithSixDecimals_thenFixedNotationRoundedAtTheSixthDecimal() {
        // Expected strings follow printf's %.6f for these values (C standard fixed notation), exact.
        assertEquals("0.500000", DemoCohort.sixDecimals(0.5));
        assertEquals("0.000000", DemoCohort.sixDecimals(1e-7));
        assertEquals("1.000000", DemoCohort.sixDecimals(0.9999996));
        assertEquals("-0.250000", DemoCohort.sixDecimals(-0.25));
        assertEquals("12.034000", DemoCohort.sixDecimals(12.034));
    }

    @Test
    void givenDemoCohort_whenLoaded_thenShapeAndMissingnessAsDescribed() {
        assertEquals(120, subjects.size());
        assertEquals(60, subjects.stream().filter(s -> s.group().equals("patient")).count());
        assertEquals("sub-001", subjects.get(0).id());
        assertTrue(subjects.stream().allMatch(s -> s.site().equals("north") || s.site().equals("south")));
        assertEquals(24, source.regions());
        assertEquals(source.regionNames(), target.regionNames());
        assertEquals(120, source.subjects().size());
        assertEquals(84, target.subjects().size()); // 30% of 120 missing
        // Missing at random with respect to group: both groups keep a comparable share (common practice, no source).
        long patientsObserved = subjects.stream().filter(s -> s.group().equals("patient"))
                .filter(s -> target.has(s.id())).count();
        assertTrue(patientsObserved >= 30 && patientsObserved <= 54, "observed patients " + patientsObserved);
        for (Subject s : subjects) {
            for (double v : source.base(s.id())) {
                assertTrue(v > 0 && v < 1, "similarity out of 0..1 for " + s.id());
            }
        }
    }

    @Test
    void givenPlantedGroupEffect_whenMeanAbsoluteEffectSizeCompared_thenLargerInTargetThanSource() {
        // The planted truth: group-shifted factors load strongly on target edges, weakly on source edges. The mean
        // over edges of |Cohen's d| on the subjects with both views must be clearly larger in the target view; the
        // factor 1.5 is a margin well inside the planted contrast (common practice, no source).
        List<Subject> both = subjects.stream().filter(s -> target.has(s.id())).toList();
        double dSource = meanAbsEffectSize(source, both);
        double dTarget = meanAbsEffectSize(target, both);
        assertTrue(dTarget > 1.5 * dSource, "target " + dTarget + " vs source " + dSource);
    }

    private static double meanAbsEffectSize(View view, List<Subject> who) {
        List<double[]> patients = new ArrayList<>();
        List<double[]> controls = new ArrayList<>();
        for (Subject s : who) {
            (s.group().equals("patient") ? patients : controls).add(view.base(s.id()));
        }
        double sum = 0;
        for (int e = 0; e < view.width(); e++) {
            double[] a = column(patients, e);
            double[] b = column(controls, e);
            double pooled = Math.sqrt(((a.length - 1) * var(a) + (b.length - 1) * var(b)) / (a.length + b.length - 2));
            sum += Math.abs(mean(a) - mean(b)) / pooled;
        }
        return sum / view.width();
    }

    private static double[] column(List<double[]> rows, int e) {
        return rows.stream().mapToDouble(r -> r[e]).toArray();
    }

    private static double mean(double[] x) {
        double s = 0;
        for (double v : x) {
            s += v;
        }
        return s / x.length;
    }

    private static double var(double[] x) {
        double m = mean(x);
        double s = 0;
        for (double v : x) {
            s += (v - m) * (v - m);
        }
        return s / (x.length - 1);
    }
}
