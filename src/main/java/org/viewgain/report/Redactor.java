package org.viewgain.report;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Replaces subject ids by stable pseudonyms ({@code subject-0001}, ... in order of first appearance in folds.csv) in
 * every text the report shows. When redaction is off every method returns its input unchanged.
 */
final class Redactor {
    private final boolean on;
    private final Map<String, String> pseudonyms = new LinkedHashMap<>();
    private final Pattern anyId;

    Redactor(boolean on, List<String> idsInOrder) {
        this.on = on;
        for (String id : idsInOrder) {
            if (!id.isEmpty() && !pseudonyms.containsKey(id)) {
                pseudonyms.put(id, String.format(Locale.ROOT, "subject-%04d", pseudonyms.size() + 1));
            }
        }
        List<String> longestFirst = new ArrayList<>(pseudonyms.keySet());
        longestFirst.sort(Comparator.comparingInt(String::length).reversed());
        StringBuilder alt = new StringBuilder();
        for (String id : longestFirst) {
            alt.append(alt.length() == 0 ? "" : "|").append(Pattern.quote(id));
        }
        anyId = on && alt.length() > 0 ? Pattern.compile(alt.toString()) : null;
    }

    /** The folder part of an absolute path (POSIX, or a Windows drive or share), up to its last separator. */
    private static final Pattern ABSOLUTE_DIRS = Pattern.compile(
            "(?<![\\w.~])(?:/|[A-Za-z]:[\\\\/]|\\\\\\\\)(?:[^\\s/\\\\\"'<>|,;]+[/\\\\])+");

    boolean on() {
        return on;
    }

    /** The pseudonym of a subject id (ids not in folds.csv get the next free number). */
    String id(String id) {
        if (!on) {
            return id;
        }
        return pseudonyms.computeIfAbsent(id, k -> String.format(Locale.ROOT, "subject-%04d", pseudonyms.size() + 1));
    }

    /**
     * Free text (paths, spec text, reasons) with every occurrence of a known id replaced by its pseudonym and the
     * folders of absolute paths replaced by an ellipsis.
     */
    String text(String s) {
        if (!on || s == null) {
            return s;
        }
        // folders of absolute paths can name a person or an institution: keep the file name only
        s = ABSOLUTE_DIRS.matcher(s).replaceAll("\u2026/");
        if (anyId == null) {
            return s;
        }
        Matcher m = anyId.matcher(s);
        StringBuilder b = new StringBuilder();
        while (m.find()) {
            m.appendReplacement(b, Matcher.quoteReplacement(pseudonyms.get(m.group())));
        }
        m.appendTail(b);
        return b.toString();
    }

    /**
     * Base64 text in which an id may occur by chance: a line break is put inside every such occurrence. Browsers
     * ignore whitespace in base64 data URIs, so the image is unchanged, and the id no longer appears in the file.
     */
    String base64(String s) {
        if (anyId == null) {
            return s;
        }
        StringBuilder out = new StringBuilder(s);
        int from = 0;
        Matcher m = anyId.matcher(out);
        while (m.find(from)) {
            int cut = m.start() + 1;
            out.insert(cut, '\n');
            from = cut + 1;
            m = anyId.matcher(out);
        }
        return out.toString();
    }
}
