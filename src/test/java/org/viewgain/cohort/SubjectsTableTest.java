package org.viewgain.cohort;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.viewgain.cohort.TestFiles.expectBadInput;
import static org.viewgain.cohort.TestFiles.write;

class SubjectsTableTest {
    private static final List<String> GROUPS = List.of("patient", "control");
    private static final String HEADER = "subject,group,site,age,sex\n";

    @TempDir
    Path dir;

    private List<Subject> load(Path csv) {
        return SubjectsTable.load(csv, "subject", "group", "site", List.of("age", "sex"), GROUPS);
    }

    @Test
    void givenWellFormedTable_whenLoaded_thenSubjectsInFileOrderWithTextIdsAndCovariates() {
        List<Subject> s = load(TestFiles.resource("subjects.csv"));
        assertEquals(List.of("007", "s2", "s3"), s.stream().map(Subject::id).toList());
        assertEquals(new Subject("007", "patient", "north", Map.of("age", 34.5, "sex", 1.0), 2), s.get(0));
        assertEquals(List.of("age", "sex"), List.copyOf(s.get(2).covariates().keySet()));
        assertEquals(47.25, s.get(2).covariate("age"), 0.0);
        assertEquals(4, s.get(2).line());
    }

    @Test
    void givenNoSiteColumnAndAnyGroup_whenLoaded_thenSiteIsNullAndGroupsAreFree() {
        Path csv = write(dir, "s.csv", "id,dx\n a , x \n\nb,y\n");
        List<Subject> s = SubjectsTable.load(csv, "id", "dx", null, List.of(), List.of());
        assertNull(s.get(0).site());
        assertEquals("a", s.get(0).id());
        assertEquals("x", s.get(0).group());
        assertEquals(4, s.get(1).line());
    }

    @Test
    void givenByteOrderMarkAndQuotedCells_whenLoaded_thenFirstColumnFoundAndQuotesRemoved() {
        Path csv = write(dir, "s.csv", "\uFEFFsubject,group,site,age,sex\n\"0,1\",patient,north,3,1\n");
        assertEquals("0,1", load(csv).get(0).id());
    }

    @Test
    void givenMissingFile_whenLoaded_thenMessageNamesFile() {
        expectBadInput(() -> load(dir.resolve("nope.csv")), "not found", "nope.csv");
    }

    @Test
    void givenMissingColumn_whenLoaded_thenMessageListsColumnsPresent() {
        Path csv = write(dir, "s.csv", "subject,group,site,age\nA,patient,north,3\n");
        expectBadInput(() -> load(csv), "s.csv", "'sex'", "[subject, group, site, age]");
    }

    @Test
    void givenDuplicateId_whenLoaded_thenMessageNamesBothLines() {
        Path csv = write(dir, "s.csv", HEADER + "A,patient,north,3,1\nB,control,north,3,1\nA,control,south,4,0\n");
        expectBadInput(() -> load(csv), "s.csv", "subject A", "lines 2 and 4");
    }

    @Test
    void givenEmptyId_whenLoaded_thenMessageNamesLine() {
        Path csv = write(dir, "s.csv", HEADER + "A,patient,north,3,1\n ,control,north,3,1\n");
        expectBadInput(() -> load(csv), "s.csv", "line 3", "empty subject id");
    }

    @Test
    void givenEmptyGroup_whenLoaded_thenMessageNamesLineAndSubject() {
        Path csv = write(dir, "s.csv", HEADER + "A,,north,3,1\n");
        expectBadInput(() -> load(csv), "s.csv", "line 2", "subject A", "empty group");
    }

    @Test
    void givenGroupNotAllowed_whenLoaded_thenMessageListsAllowedGroups() {
        Path csv = write(dir, "s.csv", HEADER + "A,patient,north,3,1\nB,Patient,north,3,1\n");
        expectBadInput(() -> load(csv), "line 3", "subject B", "'Patient'", "[patient, control]");
    }

    @Test
    void givenNonNumericCovariate_whenLoaded_thenMessageNamesCell() {
        Path csv = write(dir, "s.csv", HEADER + "A,patient,north,3,1\nB,control,north,forty,1\n");
        expectBadInput(() -> load(csv), "s.csv", "line 3", "subject B", "column 'age'", "'forty'");
    }

    @Test
    void givenNaNOrEmptyCovariate_whenLoaded_thenRejected() {
        Path nan = write(dir, "n.csv", HEADER + "A,patient,north,NaN,1\n");
        expectBadInput(() -> load(nan), "n.csv", "line 2", "column 'age'", "finite");
        Path empty = write(dir, "e.csv", HEADER + "A,patient,north,3,\n");
        expectBadInput(() -> load(empty), "e.csv", "line 2", "column 'sex'", "empty cell");
    }

    @Test
    void givenEmptySite_whenLoaded_thenMessageNamesSubject() {
        Path csv = write(dir, "s.csv", HEADER + "A,patient,,3,1\n");
        expectBadInput(() -> load(csv), "line 2", "subject A", "empty site");
    }

    @Test
    void givenEmptyFileOrHeaderOnly_whenLoaded_thenClearMessage() {
        Path empty = write(dir, "empty.csv", "\n\n");
        expectBadInput(() -> load(empty), "empty.csv", "is empty");
        Path header = write(dir, "header.csv", HEADER);
        expectBadInput(() -> load(header), "header.csv", "no subjects");
    }

    @Test
    void givenRaggedRowOrUnclosedQuote_whenLoaded_thenMessageNamesLine() {
        Path ragged = write(dir, "r.csv", HEADER + "A,patient,north,3\n");
        expectBadInput(() -> load(ragged), "r.csv", "line 2", "expected 5 cells");
        Path quote = write(dir, "q.csv", HEADER + "A,patient,north,3,1\n\"B,control,north,3,1\n");
        expectBadInput(() -> load(quote), "q.csv", "malformed");
    }

    @Test
    void givenDuplicateColumnName_whenLoaded_thenRejected() {
        Path csv = write(dir, "s.csv", "subject,group,site,age,sex,age\nA,patient,north,3,1,4\n");
        expectBadInput(() -> load(csv), "line 1", "'age'", "twice");
    }
}
