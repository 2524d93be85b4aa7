package org.viewgain.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.math.BigDecimal;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.jsoup.nodes.Element;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The HTML report of a real (small) run, parsed: sections, numbers against the tables, self-containment. */
class HtmlReportTest {
    static final List<String> SECTIONS = List.of("answer", "cohort", "charts", "separation", "protocol", "cautions");
    static final List<String> CHARTS = List.of("chart-metrics", "chart-roc", "chart-folds", "chart-null",
            "chart-calibration", "chart-imputation", "chart-importance");

    @TempDir
    static Path shared;
    static Path run;

    @TempDir
    Path dir;

    @BeforeAll
    static void runOnce() throws IOException {
        run = ReportFixtures.run(shared);
    }

    private Path fullRun() throws IOException {
        Path r = ReportFixtures.copy(run, dir.resolve("full"));
        ReportFixtures.comparisons(r);
        ReportFixtures.optionalTables(r);
        return r;
    }

    @Test
    void givenRunWithEveryTable_whenReported_thenEverySectionAndChartIsPresentAndNothingIsMissing() throws IOException {
        Document doc = Jsoup.parse(HtmlReport.write(fullRun(), false).toFile());
        for (String id : SECTIONS) {
            assertNotNull(doc.getElementById(id), "section " + id);
        }
        for (String id : CHARTS) {
            Element block = doc.getElementById(id);
            assertNotNull(block, id);
            boolean hasImage = !block.select("img[src^=data:image/png;base64,]").isEmpty();
            assertTrue(hasImage || id.equals("chart-calibration") && block.text().contains("not probabilities"), id);
        }
        assertTrue(doc.select("p.absent").stream().noneMatch(p -> p.text().startsWith("Not computed")),
                doc.select("p.absent").text());
        // The svm's decision values are not probabilities, so calibration must say so.
        assertTrue(doc.getElementById("chart-calibration").text().contains("svm"));
        assertTrue(doc.getElementById("cautions").text().contains("Varoquaux 2018"));
        assertTrue(doc.getElementById("separation").text().contains("not cross-validated"));
    }

    @Test
    void givenForestAndSvm_whenReported_thenCalibrationTableEqualsMetricsCsvAndSvmIsNamedBlank() throws IOException {
        Path r = fullRun();
        Element block = Jsoup.parse(HtmlReport.render(r, false)).getElementById("chart-calibration");
        // one reliability diagram: the forest's (the svm gives decision values)
        assertEquals(1, block.select("img[src^=data:image/png;base64,]").size());
        CsvRows metrics = CsvRows.readIfPresent(r, "metrics.csv");
        int checked = 0;
        for (String m : List.of("brier", "calibration_intercept", "calibration_slope")) {
            List<String> csv = metrics.where(x -> x.s("metric").equals(m) && x.s("classifier").equals("forest"))
                    .stream().map(x -> x.s("estimate")).toList();
            List<String> shown = block.select("table.calibration span.num[data-col=" + m + ".estimate]").stream()
                    .map(e -> e.attr("data-value")).toList();
            assertEquals(csv, shown, m);
            checked += shown.size();
        }
        assertEquals(3 * metrics.where(x -> x.s("metric").equals("brier") && x.s("classifier").equals("forest"))
                .size(), checked);
        assertTrue(block.select("table.calibration td").stream().noneMatch(td -> td.text().contains("svm")));
        assertTrue(block.text().contains("Platt scaling") && block.text().contains("blank"), block.text());
        assertTrue(block.text().contains("Van Calster et al. 2016"));
    }

    @Test
    void givenMetricsCsvWithoutCalibrationRows_whenReported_thenDiagramStillDrawnAndTheTableNamedAbsent()
            throws IOException {
        // a run folder written before metrics.csv had calibration rows
        Path r = fullRun();
        Path metrics = r.resolve("metrics.csv");
        Files.write(metrics, Files.readAllLines(metrics).stream()
                .filter(l -> !l.contains(",brier,") && !l.contains(",calibration_")).toList());
        Element block = Jsoup.parse(HtmlReport.render(r, false)).getElementById("chart-calibration");
        assertEquals(1, block.select("img[src^=data:image/png;base64,]").size());
        assertTrue(block.select("table.calibration").isEmpty());
        assertTrue(block.text().contains("no calibration rows"), block.text());
    }

    @Test
    void givenComparisons_whenReported_thenEveryAnswerNumberEqualsItsCsvCell() throws IOException {
        Path r = fullRun();
        Document doc = Jsoup.parse(HtmlReport.render(r, false));
        CsvRows comparisons = CsvRows.readIfPresent(r, "comparisons.csv");
        CsvRows perms = CsvRows.readIfPresent(r, "permutations.csv");
        List<Element> rows = doc.select("#answer table.answer tr[data-test]");
        assertEquals(comparisons.rows().size(), rows.size());
        int checked = 0;
        for (Element tr : rows) {
            List<CsvRows.Row> match = comparisons.where(c -> AnswerSection.a(c).equals(tr.attr("data-a"))
                    && AnswerSection.bKey(c).equals(tr.attr("data-b")) && c.s("test").equals(tr.attr("data-test"))
                    && c.s("metric").equals(tr.attr("data-metric")));
            assertEquals(1, match.size(), tr.toString());
            CsvRows.Row c = match.get(0);
            // the metric cell names the quantity the row's numbers are of (comparisons.csv, column quantity)
            assertTrue(!c.s("quantity").isEmpty() && tr.select("td").get(1).text()
                    .contains(Names.quantity(c.s("quantity"))), tr.toString());
            int nonEmpty = 0;
            for (String col : List.of("estimate_a", "estimate_b", "difference", "ci_low", "ci_high", "p_value",
                    "p_adjusted", "prob_a_better", "prob_equivalent", "prob_b_better")) {
                nonEmpty += c.s(col).isEmpty() ? 0 : 1;
            }
            int spans = 0;
            for (Element span : tr.select("span.num")) {
                String col = span.attr("data-col");
                String expected = col.equals("permutation_p") ? permutationP(perms, tr.attr("data-a"),
                        tr.attr("data-b"), span.attr("data-value")) : c.s(col);
                assertEquals(expected, span.attr("data-value"), col);
                assertShownAs(Double.parseDouble(expected), span.text());
                spans += col.equals("permutation_p") ? 0 : 1;
                checked++;
            }
            assertEquals(nonEmpty, spans, "every number of the row is shown: " + tr);
        }
        assertTrue(checked > 40, "numbers checked: " + checked);
        // The plain sentence names the verdict of the corrected t-test (adjusted p 0.00084 <= 0.05).
        String first = doc.select("#answer-forest ul.verdicts li").first().text();
        assertTrue(first.contains("source+imputed (ridge) is "), first);
        assertTrue(first.contains("probability that A is better 0.610"), first);
        assertTrue(first.contains("balanced accuracy (mean over outer folds)"), first);
        assertTrue(first.contains("AUC (scores averaged over repeats)"), first);
    }

    @Test
    void givenComparisonsWithoutQuantityColumn_whenReported_thenRenderedWithoutQuantityWords() throws IOException {
        // run folders written before comparisons.csv had a quantity column are still read
        Path r = fullRun();
        Path csv = r.resolve("comparisons.csv");
        List<String> lines = Files.readAllLines(csv);
        int q = List.of(lines.get(0).split(",", -1)).indexOf("quantity");
        StringBuilder old = new StringBuilder();
        for (String line : lines) {
            List<String> cells = new java.util.ArrayList<>(List.of(line.split(",", -1)));
            cells.remove(q);
            old.append(String.join(",", cells)).append('\n');
        }
        Files.writeString(csv, old);
        Document doc = Jsoup.parse(HtmlReport.render(r, false));
        String answer = doc.getElementById("answer").text();
        assertTrue(answer.contains("balanced accuracy "), answer);
        assertTrue(!answer.contains("mean over outer folds") && !answer.contains("()"), answer);
        assertEquals(CsvRows.readIfPresent(r, "comparisons.csv").rows().size(),
                doc.select("#answer table.answer tr[data-test]").size());
    }

    /** The permutation p shown in a badge is that of one of the two pipelines of the row. */
    private static String permutationP(CsvRows perms, String a, String b, String shown) {
        for (CsvRows.Row p : perms.rows()) {
            String k = Names.key(p);
            if ((k.equals(a) || k.equals(b)) && p.s("p_value").equals(shown)) {
                return shown;
            }
        }
        return "(no permutation row of " + a + " or " + b + ")";
    }

    @Test
    void givenNoComparisons_whenReported_thenAnswerShowsMetricsEstimatesAndSaysTestsWereNotComputed()
            throws IOException {
        Path r = ReportFixtures.copy(run, dir.resolve("plain"));
        Files.deleteIfExists(r.resolve("comparisons.csv"));
        Document doc = Jsoup.parse(HtmlReport.render(r, false));
        CsvRows metrics = CsvRows.readIfPresent(r, "metrics.csv");
        assertTrue(doc.getElementById("answer").text().contains("Not computed in this run: paired comparisons"));
        List<Element> spans = doc.select("#answer table.pairs span.num");
        assertTrue(spans.size() >= 16, "spans: " + spans.size());
        for (Element span : spans) {
            String[] mc = span.attr("data-col").split("\\.", 2);
            Element tr = span.closest("tr");
            String key = mc[1].endsWith("_a") ? tr.attr("data-a") : tr.attr("data-b");
            String col = mc[1].replaceAll("_[ab]$", "");
            String expected = metrics.where(m -> Names.key(m).equals(key) && m.s("metric").equals(mc[0])).get(0)
                    .s(col.equals("estimate") ? "estimate" : col);
            assertEquals(expected, span.attr("data-value"), span.attr("data-col"));
            assertShownAs(Double.parseDouble(expected), span.text());
        }
    }

    @Test
    void givenAForestAndALinearSvm_whenPredictionsWritten_thenScoreKindSaysProbabilityOrDecisionValue()
            throws IOException {
        CsvRows p = CsvRows.readIfPresent(run, "predictions.csv");
        assertTrue(p.rows().stream().filter(r -> r.s("classifier").equals("forest"))
                .allMatch(r -> r.s("score_kind").equals("probability")));
        assertTrue(p.rows().stream().filter(r -> r.s("classifier").equals("svm"))
                .allMatch(r -> r.s("score_kind").equals("decision_value")));
        assertTrue(p.rows().stream().anyMatch(r -> r.s("classifier").equals("svm")));
        // one name for the value column of every table of estimates (the fixtures keep older runs' 'value')
        for (String table : List.of("metrics.csv", "fold_metrics.csv", "importance.csv")) {
            assertTrue(CsvRows.readIfPresent(run, table).has("estimate"), table);
            assertFalse(CsvRows.readIfPresent(run, table).has("value"), table);
        }
    }

    @Test
    void givenChoices_whenWritten_thenTheLongTableHasOneRowPerChosenParameter() throws IOException {
        CsvRows wide = CsvRows.readIfPresent(run, "hyperparameters.csv");
        CsvRows longForm = CsvRows.readIfPresent(run, "hyperparameter_values.csv");
        int parameters = 0;
        for (CsvRows.Row r : wide.rows()) {
            parameters += r.s("chosen").split(";").length;
        }
        assertEquals(parameters, longForm.rows().size());
        // the fixture's svm has grid C: [0.1, 1]; every chosen C is one of them
        List<CsvRows.Row> c = longForm.where(r -> r.s("classifier").equals("svm") && r.s("parameter").equals("C"));
        assertFalse(c.isEmpty());
        assertTrue(c.stream().allMatch(r -> r.d("value") == 0.1 || r.d("value") == 1.0));
        // tuned_by spelt as the metric columns are
        assertTrue(wide.rows().stream().allMatch(r -> r.s("tuned_by").equals("mae")
                || r.s("tuned_by").equals("balanced_accuracy")));
    }

    @Test
    void givenChartsDrawnOnAllCores_whenReported_thenTheSameBytesAsDrawingThemInTurn() throws IOException {
        Path r = fullRun();
        String parallel = HtmlReport.render(r, false);
        assertEquals(HtmlReport.renderInTurn(r, false), parallel);
        assertFalse(parallel.contains("\u0000"), "no marker left");
        assertTrue(parallel.contains("data:image/png;base64,"));
    }

    @Test
    void givenImputations_whenReported_thenTheTableShowsSkillAgainstTheMeanImputerAsInTheCsv() throws IOException {
        Path r = fullRun();
        Document doc = Jsoup.parse(HtmlReport.render(r, false));
        Element table = doc.selectFirst("table.imputation");
        assertNotNull(table);
        List<String> head = table.select("thead th").eachText();
        int col = head.indexOf("skill vs mean");
        assertTrue(col > 0, head.toString());
        // the mean of imputation.csv's skill column for the fixture's one imputer (ridge), to 3 decimals
        double sum = 0;
        int n = 0;
        for (CsvRows.Row row : CsvRows.readIfPresent(r, "imputation.csv").rows()) {
            if (Double.isFinite(row.d("skill"))) {
                sum += row.d("skill");
                n++;
            }
        }
        assertEquals(Html.f3(sum / n), table.select("tbody tr").get(0).select("td").get(col).text());
    }

    @Test
    void givenAnyRun_whenReported_thenTimesAreShownToTheSecond() throws IOException {
        String html = HtmlReport.render(fullRun(), false);
        // run.json keeps the instant with its fraction; the report shows it to the second, in UTC
        assertTrue(java.util.regex.Pattern.compile("started \\d{4}-\\d\\d-\\d\\d \\d\\d:\\d\\d:\\d\\d UTC")
                .matcher(html).find());
        assertFalse(java.util.regex.Pattern.compile("\\d\\d:\\d\\d:\\d\\d\\.\\d").matcher(html).find(),
                "no fractions of a second");
        assertEquals("2026-12-03 06:40:32 UTC", Html.time("2026-12-03T06:40:32.123456Z"));
    }

    @Test
    void givenAnyRun_whenReported_thenNoExternalAddressNoScriptAndOneFile() throws IOException {
        String html = HtmlReport.render(fullRun(), false);
        Document doc = Jsoup.parse(html);
        assertTrue(doc.select("script, noscript, link, iframe, object, embed, base").isEmpty());
        for (Element e : doc.getAllElements()) {
            for (var a : e.attributes()) {
                String k = a.getKey().toLowerCase(java.util.Locale.ROOT);
                assertFalse(k.startsWith("on"), "event handler " + k);
                if (k.equals("src") || k.equals("href") || k.equals("srcset") || k.equals("action")
                        || k.equals("poster") || k.equals("data")) {
                    String v = a.getValue().strip();
                    assertTrue(v.startsWith("data:image/png;base64,") || v.startsWith("#"), k + "=" + v);
                }
            }
        }
        String css = doc.select("style").html();
        assertFalse(css.contains("url(") || css.contains("@import"), "style sheet fetches nothing");
        assertFalse(html.contains("http://") || html.contains("https://") || html.contains("//cdn"));
    }

    @Test
    void givenRedaction_whenReported_thenNoOriginalIdAppearsAndPseudonymsDo() throws IOException {
        Path r = fullRun();
        List<String> ids = ReportFixtures.ids(r);
        String plain = HtmlReport.render(r, false);
        assertTrue(ids.stream().anyMatch(plain::contains), "the plain report shows ids (else this test is void)");
        String redacted = Files.readString(HtmlReport.write(r, true));
        for (String id : ids) {
            assertFalse(redacted.contains(id), id);
        }
        assertTrue(redacted.contains("subject-00"), "pseudonyms shown");
        // Stable: the same run gives the same redacted report.
        assertEquals(redacted, HtmlReport.render(r, true));
    }

    @Test
    void givenOptionalTablesAbsent_whenReported_thenEachSaysNotComputedAndNothingFails() throws IOException {
        Path r = ReportFixtures.copy(run, dir.resolve("bare"));
        for (String optional : List.of("comparisons.csv", "permutations.csv", "permutation_null.csv", "importance.csv",
                "separation.csv",
                "imputation_edges.csv")) {
            Files.deleteIfExists(r.resolve(optional)); // a run of an older version, or with nothing to compare
        }
        Files.delete(r.resolve("fold_metrics.csv"));
        Files.delete(r.resolve("hyperparameters.csv"));
        String text = Jsoup.parse(HtmlReport.render(r, false)).text();
        for (String file : List.of("comparisons.csv", "permutations.csv", "permutation_null.csv", "separation.csv",
                "importance.csv", "imputation_edges.csv", "fold_metrics.csv", "hyperparameters.csv")) {
            assertTrue(text.contains("(" + file + " was not written)"), file);
        }
        // the flow table is derived from predictions.csv, so it never claims a missing cohort_flow.csv
        assertFalse(text.contains("cohort_flow.csv"), "no false note on cohort_flow.csv");
        assertTrue(text.contains("derived from the subjects with a prediction"), "the flow table says its source");
    }

    @Test
    void givenSeparationTable_whenReported_thenPseudoFAndPAreThoseOfTheTable() throws IOException {
        Document doc = Jsoup.parse(HtmlReport.render(fullRun(), false));
        List<Element> f = doc.select("#separation span.num[data-col=pseudo_f]");
        List<Element> p = doc.select("#separation span.num[data-col=p_value]");
        assertEquals(List.of("2.0", "4.4"), f.stream().map(e -> e.attr("data-value")).toList());
        assertEquals(List.of("2.000", "4.400"), f.stream().map(Element::text).toList());
        assertEquals(List.of("0.042", "0.001"), p.stream().map(Element::text).toList());
    }

    @Test
    void givenReportCommand_whenRun_thenWritesTheFileAndRejectsAFolderWithoutRunJson() throws IOException {
        Path r = ReportFixtures.copy(run, dir.resolve("cli"));
        Path out = dir.resolve("elsewhere/r.html");
        ReportFixtures.Outcome o = ReportFixtures.cli("report", r.toString(), "--redact-ids", "--out", out.toString());
        assertEquals(0, o.code(), o.err());
        assertTrue(Files.size(out) > 10_000);
        assertEquals(0, ReportFixtures.cli("report", r.toString()).code());
        assertTrue(Files.exists(r.resolve("report.html")));
        ReportFixtures.Outcome bad = ReportFixtures.cli("report", dir.toString());
        assertEquals(2, bad.code());
        assertTrue(bad.err().contains("run.json"), bad.err());
    }

    /**
     * The shown text is the value rounded to the digits shown: |shown - value| is at most half a unit in the last
     * shown digit (plus a little for binary rounding).
     */
    static void assertShownAs(double value, String shown) {
        String t = shown.strip();
        BigDecimal d = new BigDecimal(t.replace("+", ""));
        double unit = Math.pow(10, -d.scale());
        assertEquals(value, d.doubleValue(), unit / 2 + 1e-12, "shown '" + shown + "' for " + value);
    }
}
