package org.viewgain.fuzz;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.Tuple;

/**
 * One text mutation of a seed input (a byte flip, a deleted or duplicated line, an inserted hostile token, ...).
 * Positions and choices are plain integers taken modulo the text, so jqwik can shrink a failing list of edits.
 */
record Edit(Op op, int at, int pick) {

    enum Op {
        FLIP_CHAR, DELETE_CHAR, INSERT_TOKEN, REPLACE_WORD, DELETE_LINE, DUPLICATE_LINE, SWAP_LINES, BLANK_LINE,
        TRUNCATE, CRLF, CR_ONLY, BOM, QUOTE_CELL, EMPTY
    }

    /** Hostile values: numbers out of range, spellings of NaN/Inf, quotes, separators, unicode, YAML syntax. */
    static final List<String> TOKENS = List.of("", " ", "NaN", "nan", "-Inf", "Infinity", ".nan", ".inf", "NA", "1e309",
            "-1e400", "4.9e-324", "1.7976931348623157E308", "99999999999999999999999", "-9223372036854775809",
            "2147483648", "0x1F", "1d", "1_000", "+", "-", ".", "e5", "0", "-0", "00", "\"", "\"\"", "'", "''", ",",
            ",,", ";", "\t", "\n", "\r", "\r\n", "\uFEFF", "\u0000", "\u2028", "\u00A0", "é", "日本", "\uD83D\uDE00",
            "\uD800", "{subject}", "..", "/", "../..", "~", "null", "true", "no", ":", ": ", "- ", "-", "#", "[", "]",
            "{", "}", "&a", "*a", "!!binary", "!!float", "---", "...", "? ", "|", ">", "%YAML 1.2", "<<: *a", "@", "`",
            "\\", "a1", "a2", "control", "patient", "s1", "subject", "group", "site", "age", "folds", "seed",
            "x".repeat(300));

    private static final String WORD = "[^\\s,:\\[\\]{}\"']+";

    /** One to {@code max} edits with the given weight of {@link Op#EMPTY} kept low. */
    static Arbitrary<List<Edit>> lists(int max) {
        Arbitrary<Op> op = Arbitraries.frequencyOf(
                Tuple.of(6, Arbitraries.just(Op.FLIP_CHAR)), Tuple.of(4, Arbitraries.just(Op.DELETE_CHAR)),
                Tuple.of(8, Arbitraries.just(Op.INSERT_TOKEN)), Tuple.of(10, Arbitraries.just(Op.REPLACE_WORD)),
                Tuple.of(4, Arbitraries.just(Op.DELETE_LINE)), Tuple.of(4, Arbitraries.just(Op.DUPLICATE_LINE)),
                Tuple.of(2, Arbitraries.just(Op.SWAP_LINES)), Tuple.of(2, Arbitraries.just(Op.BLANK_LINE)),
                Tuple.of(2, Arbitraries.just(Op.TRUNCATE)), Tuple.of(1, Arbitraries.just(Op.CRLF)),
                Tuple.of(1, Arbitraries.just(Op.CR_ONLY)), Tuple.of(1, Arbitraries.just(Op.BOM)),
                Tuple.of(3, Arbitraries.just(Op.QUOTE_CELL)), Tuple.of(1, Arbitraries.just(Op.EMPTY)));
        Arbitrary<Edit> edit = Combinators.combine(op, Arbitraries.integers().between(0, 1 << 20),
                Arbitraries.integers().between(0, 1 << 16)).as(Edit::new);
        return edit.list().ofMinSize(1).ofMaxSize(max);
    }

    static String applyAll(String text, List<Edit> edits) {
        String s = text;
        for (Edit e : edits) {
            s = e.apply(s);
        }
        return s;
    }

    String apply(String s) {
        String token = TOKENS.get(pick % TOKENS.size());
        int p = s.isEmpty() ? 0 : at % s.length();
        switch (op) {
            case FLIP_CHAR:
                return s.isEmpty() ? s
                        : s.substring(0, p) + (char) (s.charAt(p) ^ (1 << (pick % 16))) + s.substring(p + 1);
            case DELETE_CHAR:
                return s.isEmpty() ? s : s.substring(0, p) + s.substring(p + 1);
            case INSERT_TOKEN:
                return s.substring(0, p) + token + s.substring(p);
            case REPLACE_WORD:
                return replaceWord(s, token);
            case TRUNCATE:
                return s.substring(0, p);
            case CRLF:
                return s.replace("\r\n", "\n").replace("\n", "\r\n");
            case CR_ONLY:
                return s.replace("\r\n", "\n").replace('\n', '\r');
            case BOM:
                return "\uFEFF" + s;
            case QUOTE_CELL:
                return s.substring(0, p) + "\"" + s.substring(p, Math.min(s.length(), p + pick % 12)) + "\""
                        + s.substring(Math.min(s.length(), p + pick % 12));
            case EMPTY:
                return "";
            default:
                return lines(s);
        }
    }

    private String replaceWord(String s, String token) {
        List<int[]> words = new ArrayList<>();
        java.util.regex.Matcher m = java.util.regex.Pattern.compile(WORD).matcher(s);
        while (m.find()) {
            words.add(new int[] {m.start(), m.end()});
        }
        if (words.isEmpty()) {
            return s + token;
        }
        int[] w = words.get(at % words.size());
        return s.substring(0, w[0]) + token + s.substring(w[1]);
    }

    private String lines(String s) {
        List<String> lines = new ArrayList<>(Arrays.asList(s.split("\n", -1)));
        int i = at % lines.size();
        int j = pick % lines.size();
        switch (op) {
            case DELETE_LINE -> lines.remove(i);
            case DUPLICATE_LINE -> lines.add(j, lines.get(i));
            case SWAP_LINES -> {
                String t = lines.get(i);
                lines.set(i, lines.get(j));
                lines.set(j, t);
            }
            case BLANK_LINE -> lines.add(i, pick % 2 == 0 ? "" : "   ");
            default -> throw new IllegalStateException(op.toString());
        }
        return String.join("\n", lines);
    }
}
