package org.viewgain.spec;

import com.fasterxml.jackson.core.JsonProcessingException;
import java.io.IOException;
import org.yaml.snakeyaml.error.Mark;
import org.yaml.snakeyaml.error.MarkedYAMLException;

/**
 * One line for a YAML syntax error: the line and column where the parser found the problem, the parser's own
 * problem in plain words (tabs, a colon where none is allowed, an unclosed bracket or quote), and what it was
 * reading when it started (with that line) when that is elsewhere.
 */
final class YamlProblem {
    private YamlProblem() {
    }

    static String describe(IOException e, String fileName) {
        MarkedYAMLException marked = null;
        for (Throwable c = e; c != null && marked == null; c = c.getCause()) {
            if (c instanceof MarkedYAMLException m) {
                marked = m;
            }
        }
        if (marked != null && marked.getProblemMark() != null) {
            Mark at = marked.getProblemMark();
            StringBuilder sb = new StringBuilder(fileName).append(':').append(at.getLine() + 1)
                    .append(": not valid YAML at column ").append(at.getColumn() + 1).append(": ")
                    .append(plain(marked.getProblem()));
            Mark ctx = marked.getContextMark();
            if (marked.getContext() != null && ctx != null && ctx.getLine() != at.getLine()) {
                sb.append("; ").append(marked.getContext()).append(" started on line ").append(ctx.getLine() + 1);
            }
            return IoMessages.withoutClassNames(sb.toString());
        }
        int line = 0;
        if (e instanceof JsonProcessingException jpe && jpe.getLocation() != null) {
            line = jpe.getLocation().getLineNr();
        }
        String msg = e instanceof JsonProcessingException jpe ? jpe.getOriginalMessage() : e.getMessage();
        String first = msg == null ? "unreadable" : msg.lines().findFirst().orElse(msg).trim();
        if (first.startsWith("Duplicate field ")) {
            first = "the key " + first.substring("Duplicate field ".length()) + " appears twice in the same mapping";
        }
        return fileName + (line > 0 ? ":" + line : "") + ": not valid YAML: " + IoMessages.withoutClassNames(first);
    }

    /** The parser's problem with the likely cause said in words a spec writer knows. */
    static String plain(String problem) {
        if (problem == null) {
            return "unreadable";
        }
        String p = problem.replace("\\t(TAB)", "tab").replace("<stream end>", "the end of the file");
        if (problem.contains("(TAB)")) {
            return "a tab character; YAML allows only spaces for indentation, replace the tab by spaces";
        }
        if (problem.startsWith("mapping values are not allowed here")) {
            return p + ": a 'key: value' where it cannot be; check this line's indentation against the line above,"
                    + " or quote a value that contains ': '";
        }
        if (problem.contains("found unexpected end of stream")) {
            return p + " (a quote that is never closed?)";
        }
        return p;
    }
}
