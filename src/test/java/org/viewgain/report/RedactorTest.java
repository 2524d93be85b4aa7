package org.viewgain.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Base64;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Pseudonyms for subject ids, and ids read back from tables as text. */
class RedactorTest {
    @TempDir
    Path dir;

    @Test
    void givenIds_whenRedacted_thenPseudonymsFollowFoldsOrderAndFreeTextIsScrubbedLongestFirst() {
        Redactor r = new Redactor(true, List.of("P12", "P1", "x-7"));
        assertEquals("subject-0001", r.id("P12"));
        assertEquals("subject-0002", r.id("P1"));
        assertEquals("views/subject-0001.csv and views/subject-0002.csv", r.text("views/P12.csv and views/P1.csv"));
        assertEquals("subject-0004", r.id("new"));
        assertEquals("P12", new Redactor(false, List.of("P12")).id("P12"));
    }

    @Test
    void givenAbsolutePaths_whenRedacted_thenOnlyFileNamesRemainAndRelativePathsAreKept() {
        Redactor r = new Redactor(true, List.of("P12"));
        assertEquals("spec \u2026/demo.yaml; views \u2026/P12.csv".replace("P12", "subject-0001"),
                r.text("spec /home/dr-someone/clinic-x/demo.yaml; views /data/site-a/P12.csv"));
        assertEquals("\u2026/cohort.csv", r.text("C:\\Users\\someone\\cohort.csv"));
        assertEquals("../demo-data/views/{subject}.csv", r.text("../demo-data/views/{subject}.csv"));
        // without --redact-ids nothing changes
        assertEquals("/home/dr-someone/demo.yaml", new Redactor(false, List.of()).text("/home/dr-someone/demo.yaml"));
    }

    @Test
    void givenBase64ThatContainsAnId_whenScrubbed_thenIdGoneAndBytesUnchangedAfterWhitespaceRemoval() {
        byte[] bytes = new byte[300];
        for (int i = 0; i < bytes.length; i++) {
            bytes[i] = (byte) (i * 31 + 7);
        }
        String b64 = Base64.getEncoder().encodeToString(bytes);
        String id = b64.substring(40, 44);
        String id2 = b64.substring(100, 106);
        String out = new Redactor(true, List.of(id, id2)).base64(b64);
        assertFalse(out.contains(id) || out.contains(id2), out);
        assertArrayEquals(bytes, Base64.getMimeDecoder().decode(out));
    }

    @Test
    void givenFormulaGuardedCellsAndLeadingZeros_whenRead_thenTextComesBackAsWritten() throws Exception {
        Files.writeString(dir.resolve("t.csv"), "\uFEFFsubject,score\n007,0.5\n'=cmd,\n'-3,Inf\n");
        CsvRows t = CsvRows.readIfPresent(dir, "t.csv");
        assertEquals(List.of("007", "=cmd", "-3"), t.rows().stream().map(r -> r.s("subject")).toList());
        assertTrue(Double.isNaN(t.rows().get(1).d("score")));
        assertEquals(Double.POSITIVE_INFINITY, t.rows().get(2).d("score"));
        assertEquals("", t.rows().get(0).s("absent_column"));
        assertEquals(null, CsvRows.readIfPresent(dir, "missing.csv"));
    }
}
