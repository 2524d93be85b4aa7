package org.viewgain.cohort;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.viewgain.cohort.TestFiles.expectBadInput;

import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.junit.jupiter.api.Test;

/**
 * Round trips through files written by independent writers: numpy 2.4.6 ({@code numpy.lib.format.write_array}) and
 * scipy 1.17.1 ({@code scipy.io.savemat}), from {@code src/test/resources/cohort/arrays/generate.py}; provenance in
 * the README.md beside it. Every expected value below comes from that script's formulas.
 */
class ArrayViewLoaderTest {
    private static final List<String> IDS = List.of("s1", "s2", "s3");

    private static Path arrays(String name) {
        return TestFiles.resource("arrays/" + name);
    }

    /** generate.py, matrix(K): upper triangle of m[i][j] = K + (i+1)(j+1)/8, row-major i<j, 4 regions. */
    private static double[] floatUpper(int k) {
        return new double[] {k + 2 / 8.0, k + 3 / 8.0, k + 4 / 8.0, k + 6 / 8.0, k + 8 / 8.0, k + 12 / 8.0};
    }

    /** generate.py, int_matrix(K): upper triangle of m[i][j] = 10K + (i+1)(j+1). */
    private static double[] intUpper(int k) {
        return new double[] {10 * k + 2, 10 * k + 3, 10 * k + 4, 10 * k + 6, 10 * k + 8, 10 * k + 12};
    }

    @ParameterizedTest
    @ValueSource(strings = {"npy-f8-le-c-v1", "npy-f8-be-fortran-v2", "npy-f4-le-c-v3", "mat-v5"})
    void givenPerSubjectFloatFiles_whenLoaded_thenValuesOfTheWritingScript(String folder) {
        View v = ViewLoader.matrices("thick", arrays(folder).resolve("{subject}" + (folder.startsWith("mat")
                ? ".mat" : ".npy")), IDS, false, 0.0);
        assertEquals(List.of("R1~R2", "R1~R3", "R1~R4", "R2~R3", "R2~R4", "R3~R4"), v.baseNames());
        for (int k = 1; k <= 3; k++) {
            // generate.py matrix(k); every value is a multiple of 1/8, exact in float32 and in View's single precision
            assertArrayEquals(floatUpper(k), v.base("s" + k), 0.0, folder + " s" + k);
        }
    }

    @ParameterizedTest
    @ValueSource(strings = {"npy-i4-be-c-v1", "npy-i8-le-fortran-v1"})
    void givenPerSubjectIntegerFiles_whenLoaded_thenValuesOfTheWritingScript(String folder) {
        View v = ViewLoader.matrices("thick", arrays(folder).resolve("{subject}.npy"), IDS, false, 0.0);
        for (int k = 1; k <= 3; k++) {
            assertArrayEquals(intUpper(k), v.base("s" + k), 0.0, folder + " s" + k); // generate.py int_matrix(k)
        }
    }

    @Test
    void givenCompressedMatWithTwoVariables_whenVariableNamed_thenLoadedElseRefusedNamingBoth() {
        Path pattern = arrays("mat-v5-compressed").resolve("{subject}.mat");
        View v = ViewLoader.matrices("thick", pattern, "conn", null, IDS, false, 0.0);
        assertArrayEquals(floatUpper(2), v.base("s2"), 0.0); // generate.py: savemat(do_compression=True), conn = matrix(2)
        expectBadInput(() -> ViewLoader.matrices("thick", pattern, IDS, false, 0.0), "subject s1", "s1.mat",
                "several numeric variables", "conn", "age", "views.thick.variable");
        expectBadInput(() -> ViewLoader.matrices("thick", pattern, "area", null, IDS, false, 0.0),
                "no variable 'area'", "conn (4 x 4");
    }

    @Test
    void givenRawNonSymmetricArrays_whenRead_thenElementOrderOfTheWritingScript() {
        // generate.py: a[i][j] = 10*i + j on a 2 x 3 array; the float file holds 1.5 times it, in Fortran order
        NumericArray f = NpyFile.read(arrays("raw-2x3-f8-le-fortran-v1.npy"), "f");
        NumericArray i2 = NpyFile.read(arrays("raw-2x3-i2-be-c-v1.npy"), "i");
        NumericArray u1 = NpyFile.read(arrays("raw-2x3-u1-fortran-v1.npy"), "u");
        for (NumericArray a : List.of(f, i2, u1)) {
            assertArrayEquals(new int[] {2, 3}, a.shape());
        }
        assertEquals(1.5 * 12, f.get(new int[] {1, 2}), 0.0);
        assertEquals(1.5 * 1, f.get(new int[] {0, 1}), 0.0);
        assertEquals(10, i2.get(new int[] {1, 0}), 0.0);
        assertEquals(2, i2.get(new int[] {0, 2}), 0.0);
        assertEquals(11, u1.get(new int[] {1, 1}), 0.0);
        assertEquals(2, u1.get(new int[] {0, 2}), 0.0);
    }

    @ParameterizedTest
    @ValueSource(strings = {"stacked.npy", "stacked-f4-be-fortran-v2.npy", "stacked.mat"})
    void givenStackedCohortWithOrderAndLabels_whenLoaded_thenEachSubjectGetsItsSliceAndNames(String file) {
        String variable = file.endsWith(".mat") ? "thickness" : null;
        View v = ViewLoader.stacked("thick", arrays(file), variable, arrays("order.txt"), arrays("labels.txt"), false,
                IDS, false, 0.0);
        assertEquals(List.of("lh-frontal", "lh-parietal", "rh-frontal", "rh-parietal"), v.regionNames());
        assertEquals(IDS, List.copyOf(v.subjects()), "the subjects table's order, not order.txt's");
        for (int k = 1; k <= 3; k++) {
            // generate.py: slice j of the stack is matrix(K) of the j-th subject of order.txt (s3, s1, s2)
            assertArrayEquals(floatUpper(k), v.base("s" + k), 0.0, file + " s" + k);
        }
    }

    @Test
    void givenStackedMatWithSubjectsLast_whenLoadedWithSubjectAxisLast_thenSameValues() {
        View v = ViewLoader.stacked("thick", arrays("stacked-last.mat"), null, arrays("order.txt"), null, true,
                IDS, false, 0.0);
        assertArrayEquals(floatUpper(3), v.base("s3"), 0.0); // generate.py: np.moveaxis(stack, 0, 2), regions x regions x subjects
        expectBadInput(() -> ViewLoader.stacked("thick", arrays("stacked-last.mat"), null, arrays("order.txt"), null,
                false, IDS, false, 0.0), "stacked-last.mat", "4 x 4 x 3", "subject-axis: last");
    }

    @Test
    void givenSubjectMissingFromTheOrderList_whenLoaded_thenMissingOnlyIfAllowed(@org.junit.jupiter.api.io.TempDir
                                                                                 Path dir) {
        List<String> four = List.of("s1", "s2", "s3", "s4");
        View v = ViewLoader.stacked("thick", arrays("stacked.npy"), null, arrays("order.txt"), null, false, four,
                true, 0.0);
        assertFalse(v.has("s4"));
        expectBadInput(() -> ViewLoader.stacked("thick", arrays("stacked.npy"), null, arrays("order.txt"), null,
                false, four, false, 0.0), "stacked file", "stacked.npy", "no matrix for subject s4", "order.txt");
        Path shortOrder = TestFiles.write(dir, "order.txt", "s3\ns1\n");
        expectBadInput(() -> ViewLoader.stacked("thick", arrays("stacked.npy"), null, shortOrder, null, false, IDS,
                true, 0.0), "3 subjects along the first axis", "lists 2");
        Path unknown = TestFiles.write(dir, "unknown.txt", "s3\nx9\ns2\n");
        expectBadInput(() -> ViewLoader.stacked("thick", arrays("stacked.npy"), null, unknown, null, false, IDS,
                true, 0.0), "unknown.txt, line 2", "'x9' is not in the subjects table");
        Path badLabels = TestFiles.write(dir, "labels.txt", "a\nb\nc\n");
        expectBadInput(() -> ViewLoader.stacked("thick", arrays("stacked.npy"), null, arrays("order.txt"), badLabels,
                false, IDS, true, 0.0), "labels file", "3 names, but the matrices have 4 regions");
    }

    @Test
    void givenMatlabV73OrV4File_whenLoaded_thenOneLineSayingHowToSaveItAgain() {
        // v73.mat: the v7.3 header written as bytes by generate.py; v4.mat: scipy savemat(format="4")
        expectBadInput(() -> MatrixFile.read("thick", "s1", arrays("v73.mat"), null, 0.0), "subject s1", "v73.mat",
                "MATLAB v7.3 file (HDF5)", "'-v7'");
        expectBadInput(() -> MatrixFile.read("thick", "s1", arrays("v4.mat"), null, 0.0), "v4.mat",
                "not a MATLAB 5/7 MAT-file", "'-v7'");
    }

    @Test
    void givenMatWhoseVariableClaimsMoreBytesThanTheFile_whenLoaded_thenOneLineAndNothingOnStderr(
            @org.junit.jupiter.api.io.TempDir Path dir) throws java.io.IOException {
        byte[] b = java.nio.file.Files.readAllBytes(arrays("mat-v5/s1.mat"));
        // MAT-file level 5: the first element's tag follows the 128-byte header; its size is the uint32 at 132..135
        // ('IM' at 126: little-endian); 0xF0FFFFFF claims about 4 GB
        b[132] = (byte) 0xFF;
        b[133] = (byte) 0xFF;
        b[134] = (byte) 0xFF;
        b[135] = (byte) 0xF0;
        Path f = java.nio.file.Files.write(dir.resolve("s1.mat"), b);
        java.io.PrintStream err = System.err;
        java.io.ByteArrayOutputStream stray = new java.io.ByteArrayOutputStream();
        System.setErr(new java.io.PrintStream(stray, true));
        try {
            expectBadInput(() -> MatrixFile.read("thick", "s1", f, null, 0.0), "s1.mat", "damaged or cut short",
                    "the variable at byte 128 claims 4043309055 bytes");
        } finally {
            System.setErr(err);
        }
        assertEquals("", stray.toString(), "MFL's own warning is not printed");
    }

    @Test
    void givenStackedFileAsPerSubjectMatrix_whenLoaded_thenSuggestsAStackedView() {
        expectBadInput(() -> MatrixFile.read("thick", "s1", arrays("stacked.npy"), null, 0.0), "stacked.npy",
                "found shape 3 x 4 x 4", "'stacked' view");
    }
}
