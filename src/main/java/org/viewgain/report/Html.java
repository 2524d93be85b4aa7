package org.viewgain.report;

import java.util.List;
import java.util.Locale;

/** Small HTML writing helpers: escaping, numbers with their exact value kept in a data attribute, tables, notes. */
final class Html {
    private Html() {
    }

    /** Escapes text for element content and attribute values. */
    static String esc(String s) {
        if (s == null) {
            return "";
        }
        StringBuilder b = new StringBuilder(s.length() + 16);
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '&' -> b.append("&amp;");
                case '<' -> b.append("&lt;");
                case '>' -> b.append("&gt;");
                case '"' -> b.append("&quot;");
                case '\'' -> b.append("&#39;");
                default -> b.append(c);
            }
        }
        return b.toString();
    }

    /**
     * A number shown rounded, with the cell text it came from kept in {@code data-value} (so a reader or a test can
     * check the shown value against the table) and its column in {@code data-col}.
     */
    static String num(String column, String raw, String shown) {
        return "<span class=\"num\" data-col=\"" + esc(column) + "\" data-value=\"" + esc(raw) + "\">" + esc(shown)
                + "</span>";
    }

    /** Three decimals, or a dash when missing. */
    /** An ISO-8601 instant from run.json shown to the second, e.g. {@code 2026-12-03 06:40:32 UTC}; other text as is. */
    static String time(String iso) {
        try {
            java.time.Instant t = java.time.Instant.parse(iso).truncatedTo(java.time.temporal.ChronoUnit.SECONDS);
            return t.toString().replace('T', ' ').replace("Z", " UTC");
        } catch (java.time.format.DateTimeParseException e) {
            return iso;
        }
    }

    static String f3(double v) {
        return Double.isFinite(v) ? String.format(Locale.ROOT, "%.3f", v) : "\u2013";
    }

    /** Three decimals with an explicit sign. */
    static String signed3(double v) {
        return Double.isFinite(v) ? String.format(Locale.ROOT, "%+.3f", v) : "\u2013";
    }

    /** A p-value: three decimals, or two significant digits in e-notation below 0.001. */
    static String p(double v) {
        if (!Double.isFinite(v)) {
            return "\u2013";
        }
        return v >= 0.001 ? String.format(Locale.ROOT, "%.3f", v) : String.format(Locale.ROOT, "%.1e", v);
    }

    /** A table with a header row; cells are HTML already (escape text with {@link #esc}). */
    static String table(String cssClass, List<String> head, List<List<String>> rows) {
        StringBuilder b = new StringBuilder("<table class=\"").append(cssClass).append("\"><thead><tr>");
        for (String h : head) {
            b.append("<th>").append(h).append("</th>");
        }
        b.append("</tr></thead><tbody>\n");
        for (List<String> r : rows) {
            b.append("<tr>");
            for (String c : r) {
                b.append("<td>").append(c).append("</td>");
            }
            b.append("</tr>\n");
        }
        return b.append("</tbody></table>\n").toString();
    }

    /** A paragraph of plain text. */
    static String para(String cssClass, String text) {
        return "<p class=\"" + cssClass + "\">" + esc(text) + "</p>\n";
    }

    /** The plain statement that a part of the report was not computed because its table is absent. */
    static String notComputed(String what, String file) {
        return "<p class=\"absent\">Not computed in this run: " + esc(what) + " (" + esc(file)
                + " was not written).</p>\n";
    }

    /** An image from a data URI, with alternative text. */
    static String img(String dataUri, String alt, int width) {
        return "<figure><img src=\"" + dataUri + "\" alt=\"" + esc(alt) + "\" width=\"" + width + "\"><figcaption>"
                + esc(alt) + "</figcaption></figure>\n";
    }
}
