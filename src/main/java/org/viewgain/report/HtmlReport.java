package org.viewgain.report;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;

/**
 * The self-contained HTML report of a run, built from run.json and the tables of its folder alone: one file, inline
 * style, charts as PNG data URIs, no script and no external address. Sections in reading order: the answer, the
 * cohort, charts, group separation, the protocol, cautions.
 */
public final class HtmlReport {
    /** The report's file name inside a run folder. */
    public static final String FILE = "report.html";

    private HtmlReport() {
    }

    /**
     * Writes {@code runDir/report.html} (replacing an earlier report atomically) and returns its path.
     *
     * @param redactIds replace subject ids by pseudonyms ({@code subject-0001}, ... in folds.csv order)
     */
    public static Path write(Path runDir, boolean redactIds) throws IOException {
        return write(runDir, redactIds, runDir.resolve(FILE));
    }

    /** Writes the report of {@code runDir} to {@code out} and returns {@code out}. */
    public static Path write(Path runDir, boolean redactIds, Path out) throws IOException {
        String html = render(runDir, redactIds);
        Path dir = out.toAbsolutePath().getParent();
        Files.createDirectories(dir);
        Path tmp = dir.resolve("." + out.getFileName() + ".tmp");
        Files.writeString(tmp, html, StandardCharsets.UTF_8);
        try {
            Files.move(tmp, out, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
        } catch (AtomicMoveNotSupportedException e) {
            Files.move(tmp, out, StandardCopyOption.REPLACE_EXISTING);
        }
        return out;
    }

    /** The report of {@code runDir} as HTML text. */
    public static String render(Path runDir, boolean redactIds) throws IOException {
        try (ChartBatch charts = ChartBatch.open()) {
            return charts.fill(build(runDir, redactIds));
        }
    }

    /** The report with every chart drawn in turn on the calling thread (to check the batch changes nothing). */
    static String renderInTurn(Path runDir, boolean redactIds) throws IOException {
        return build(runDir, redactIds);
    }

    /** The report's text, with a marker for each chart being drawn in the open {@link ChartBatch}. */
    private static String build(Path runDir, boolean redactIds) throws IOException {
        ReportData d = ReportData.read(runDir, redactIds);
        String experiment = d.run.path("experiment").asText("experiment");
        StringBuilder b = new StringBuilder(1 << 20);
        b.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n")
                .append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n")
                .append("<meta name=\"generator\" content=\"viewgain ").append(Html.esc(Provenance.toolVersion()))
                .append("\">\n<title>").append(Html.esc(experiment + " \u2013 viewgain report")).append("</title>\n")
                .append("<style>\n").append(Style.CSS).append("</style>\n</head>\n<body>\n");
        b.append(header(d, experiment));
        b.append("<main>\n");
        b.append(AnswerSection.html(d));
        b.append(CohortSection.html(d));
        b.append(ChartsSection.html(d));
        b.append(SeparationSection.html(d));
        b.append(IndependentSection.html(d));
        b.append(ProtocolSection.html(d));
        b.append(CautionsSection.html(d));
        b.append("</main>\n<footer>Written by viewgain ").append(Html.esc(Provenance.toolVersion()))
                .append(" from the tables of this run folder").append(d.redact.on()
                        ? "; subject ids replaced by pseudonyms" : "")
                .append(". For research use only; not a diagnosis.</footer>\n</body>\n</html>\n");
        return b.toString();
    }

    private static String header(ReportData d, String experiment) {
        StringBuilder b = new StringBuilder("<header class=\"top\"><h1>")
                .append(Html.esc(experiment)).append("</h1><div class=\"meta\">")
                .append(Html.esc("run " + d.runId() + " \u00b7 started " + Html.time(d.run.path("started_at").asText("?"))
                        + " \u00b7 viewgain " + d.run.path("tool_version").asText("?") + " \u00b7 seed "
                        + d.run.path("seed").asText("?")
                        + (d.run.has("subjects") ? " \u00b7 " + d.run.path("subjects").asText() + " subjects" : "")
                        + (d.redact.on() ? " \u00b7 ids pseudonymised" : "")))
                .append("</div></header>\n");
        b.append("<div class=\"ruo\">Research use only \u2013 not a diagnosis. See the cautions at the end.</div>\n");
        String status = d.run.path("status").asText("");
        if (!status.equals("complete")) {
            b.append("<div class=\"status-bad\">This run is not complete (status: ")
                    .append(Html.esc(status.isEmpty() ? "unknown" : status))
                    .append("); its tables may be partial.</div>\n");
        }
        b.append("<nav class=\"toc\"><a href=\"#answer\">1 Answer</a><a href=\"#cohort\">2 Cohort</a>"
                + "<a href=\"#charts\">3 Charts</a><a href=\"#separation\">4 Separation</a>"
                + "<a href=\"#protocol\">5 Protocol</a><a href=\"#cautions\">6 Cautions</a></nav>\n");
        return b.toString();
    }
}
