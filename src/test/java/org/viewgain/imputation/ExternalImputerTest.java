package org.viewgain.imputation;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.spec.BadInputException;
import org.viewgain.spec.Params;

/**
 * The external imputer on hand-written files: rows come back for the task of the fit context, and each kind of bad
 * file (leak, missing row, non-finite value, wrong columns, duplicate, unknown subject) is refused with one line
 * naming the file, line and subject or column.
 */
class ExternalImputerTest {
    @TempDir
    Path dir;

    static final FitContext FINAL = new FitContext(0, 0, 1, FitContext.WHOLE, FitContext.Role.FINAL, 1L);
    static final FitContext CROSS = new FitContext(0, 0, 1, 1, FitContext.Role.CROSS_FIT, 1L);

    static final String GOOD = """
            repetition,fold,task,inner,subject,t1,t2
            1,2,final,0,c,1.5,-2
            1,2,final,,d,3,4e-1
            1,2,cross-fit,2,b,7,8
            """;

    Path file(String text) throws IOException {
        Path f = dir.resolve("imputations.csv");
        Files.writeString(f, text);
        return f;
    }

    static Rows rows(String... ids) {
        double[][] x = new double[ids.length][];
        for (int i = 0; i < ids.length; i++) {
            x[i] = new double[] {i, -i};
        }
        return new Rows(List.of(ids), x, List.of("t1", "t2"));
    }

    static Params params(Path f) {
        return new ExternalImputer().resolve(Map.of("file", f.toString()));
    }

    double[][] run(Path f, FitContext ctx, Rows train, Rows news) {
        ViewImputer.Fitted fitted = new ExternalImputer().fit(ctx, train, train, params(f));
        return fitted.impute(ctx, news);
    }

    String refusal(String text, FitContext ctx, Rows train, Rows news) throws IOException {
        Path f = file(text);
        BadInputException e = assertThrows(BadInputException.class, () -> run(f, ctx, train, news));
        assertEquals(1, e.getMessage().lines().count(), e.getMessage());
        assertTrue(e.getMessage().contains(f.toString()), e.getMessage());
        return e.getMessage();
    }

    @Test
    void givenGoodFile_whenFinalAndCrossFitTasksImpute_thenTheirRowsInTheAskedOrder() throws IOException {
        Path f = file(GOOD);
        assertArrayEquals(new double[][] {{3, 0.4}, {1.5, -2}}, run(f, FINAL, rows("a", "b"), rows("d", "c")));
        assertArrayEquals(new double[][] {{7, 8}}, run(f, CROSS, rows("a", "c", "d"), rows("b")));
    }

    @Test
    void givenOneInstance_whenManyThreadsFitAtOnce_thenSameRowsForAll() throws Exception {
        Path f = file(GOOD);
        ExternalImputer imp = new ExternalImputer();
        ExecutorService pool = Executors.newFixedThreadPool(2);
        try {
            List<Future<double[][]>> got = pool.invokeAll(java.util.Collections.nCopies(8,
                    () -> imp.fit(FINAL, rows("a"), rows("a"), params(f)).impute(FINAL, rows("c", "d"))));
            for (Future<double[][]> g : got) {
                assertArrayEquals(new double[][] {{1.5, -2}, {3, 0.4}}, g.get());
            }
        } finally {
            pool.shutdownNow();
        }
    }

    @Test
    void givenRowForATrainingSubject_whenFitted_thenRefusedNamingLineAndSubject() throws IOException {
        String m = refusal(GOOD, FINAL, rows("a", "c"), rows("d"));
        assertTrue(m.contains(":2:") && m.contains("'c'") && m.contains("training subject"), m);
    }

    @Test
    void givenMissingRow_whenImputed_thenRefusedNamingTaskAndSubject() throws IOException {
        String m = refusal(GOOD, FINAL, rows("a"), rows("c", "d", "e"));
        assertTrue(m.contains("no row for repeat 1, fold 2, task final, subject 'e'"), m);
        String n = refusal(GOOD, CROSS.at(0, FitContext.Role.CROSS_FIT, 1L), rows("a"), rows("b"));
        assertTrue(n.contains("task cross-fit 1, subject 'b'") && n.contains("no rows for this task"), n);
    }

    @Test
    void givenNonFiniteOrNonDecimalValue_whenRead_thenRefusedNamingLineSubjectAndColumn() throws IOException {
        for (String bad : List.of("NaN", "Infinity", "-inf", "", "0x1p3", "1d", "abc", "1e999")) {
            String m = refusal(GOOD.replace("3,4e-1", "3," + bad), FINAL, rows("a"), rows("c", "d"));
            assertTrue(m.contains(":3:") && m.contains("subject 'd'") && m.contains("column 't2'")
                    && m.contains("finite number"), bad + ": " + m);
        }
    }

    @Test
    void givenWrongColumns_whenRead_thenRefusedNamingTheColumn() throws IOException {
        String m = refusal(GOOD.replace("t1,t2", "t1,t3"), FINAL, rows("a"), rows("c", "d"));
        assertTrue(m.contains("column 7 is 't3'") && m.contains("'t2'"), m);
        m = refusal(GOOD.replace("t1,t2", "t1"), FINAL, rows("a"), rows("c", "d"));
        assertTrue(m.contains(":2:") && m.contains("7 cells, expected 6"), m);
        m = refusal(GOOD.replace("task,inner", "inner,task"), FINAL, rows("a"), rows("c", "d"));
        assertTrue(m.contains(":1:") && m.contains("column 3 must be 'task'"), m);
        m = refusal("repeat,fold,task,inner,subject,t1,t2,t9\n1,2,final,0,c,1,2,3\n", FINAL, rows("a"), rows("c"));
        assertTrue(m.contains("3 target feature columns, expected 2"), m);
    }

    @Test
    void givenDuplicateRow_whenRead_thenRefusedNamingBothLines() throws IOException {
        String m = refusal(GOOD + "1,2,final,0,c,1,1\n", FINAL, rows("a"), rows("c", "d"));
        assertTrue(m.contains(":5:") && m.contains("duplicate") && m.contains("'c'") && m.contains("line 2"), m);
    }

    @Test
    void givenRowForASubjectTheTaskDoesNotImpute_whenImputed_thenRefusedAsUnknown() throws IOException {
        String m = refusal(GOOD + "1,2,final,0,zz,1,1\n", FINAL, rows("a"), rows("c", "d"));
        assertTrue(m.contains(":5:") && m.contains("unknown subject 'zz'"), m);
    }

    @Test
    void givenBadKeyCells_whenRead_thenRefusedNamingLine() throws IOException {
        assertTrue(refusal(GOOD.replace("1,2,cross-fit", "1,2,crossfit"), FINAL, rows("a"), rows("c", "d"))
                .contains(":4: task 'crossfit'"));
        assertTrue(refusal(GOOD.replace("1,2,final,0,c", "0,2,final,0,c"), FINAL, rows("a"), rows("c", "d"))
                .contains(":2: column repetition is '0'"));
        assertTrue(refusal(GOOD.replace("cross-fit,2", "cross-fit,"), FINAL, rows("a"), rows("c", "d"))
                .contains(":4: column inner"));
    }

    @Test
    void givenMissingFile_whenFitted_thenRefusedNamingIt() {
        Path f = dir.resolve("nowhere.csv");
        BadInputException e = assertThrows(BadInputException.class, () -> run(f, FINAL, rows("a"), rows("c")));
        assertTrue(e.getMessage().contains("not found") && e.getMessage().contains("nowhere.csv"), e.getMessage());
    }
}
