package org.viewgain.fuzz;

import java.io.ByteArrayOutputStream;
import java.nio.charset.StandardCharsets;
import java.util.List;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;

/**
 * One mutation of a binary file: flip, set, cut, insert or overwrite with text, at a position that is mostly in the
 * first 160 bytes (the .npy header and the MAT-file header and first tags, where a reader's decisions are made).
 */
record ByteEdit(Kind kind, int at, int value, String text) {
    enum Kind { FLIP, SET, CUT, INSERT, TEXT }

    /** Text a mutated .npy header may receive: other types, orders, shapes (huge, negative, empty) and junk. */
    static final List<String> HEADER_TEXT = List.of("'<f8'", "'>f4'", "'|b1'", "'<c16'", "'|O'", "'<U8'",
            "[('a', '<f8')]", "True", "False", "(4, 4)", "(3, 4, 4)", "(4,)", "()", "(99999999, 99999999)",
            "(-4, 4)", "(4, 4L)", "(0, 0)", "(2147483647, 3)", "{", "}", "'shape'", "'descr'", "\u00e9\u00e8",
            "\0", "\n", "MATLAB 5.0 MAT-file", "MATLAB 7.3 MAT-file", "\u0093NUMPY");

    static Arbitrary<List<ByteEdit>> lists(int most) {
        Arbitrary<Kind> kinds = Arbitraries.of(Kind.class);
        Arbitrary<Integer> at = Arbitraries.frequencyOf(
                net.jqwik.api.Tuple.of(3, Arbitraries.integers().between(0, 160)),
                net.jqwik.api.Tuple.of(1, Arbitraries.integers().between(0, 100_000)));
        Arbitrary<Integer> value = Arbitraries.integers().between(0, 255);
        Arbitrary<String> text = Arbitraries.of(HEADER_TEXT);
        return Combinators.combine(kinds, at, value, text).as(ByteEdit::new).list().ofMinSize(1).ofMaxSize(most);
    }

    byte[] apply(byte[] in) {
        if (in.length == 0) {
            return kind == Kind.INSERT || kind == Kind.TEXT ? text.getBytes(StandardCharsets.ISO_8859_1) : in;
        }
        int p = at % in.length;
        byte[] out;
        switch (kind) {
            case FLIP -> {
                out = in.clone();
                out[p] ^= (byte) (1 << (value % 8));
            }
            case SET -> {
                out = in.clone();
                out[p] = (byte) value;
            }
            case CUT -> out = java.util.Arrays.copyOf(in, p);
            case INSERT -> {
                ByteArrayOutputStream b = new ByteArrayOutputStream();
                b.write(in, 0, p);
                for (int k = 0; k < 1 + value % 16; k++) {
                    b.write((value * 31 + k) & 0xff);
                }
                b.write(in, p, in.length - p);
                out = b.toByteArray();
            }
            default -> {
                out = in.clone();
                byte[] t = text.getBytes(StandardCharsets.ISO_8859_1);
                System.arraycopy(t, 0, out, p, Math.min(t.length, out.length - p));
            }
        }
        return out;
    }

    static byte[] applyAll(byte[] in, List<ByteEdit> edits) {
        byte[] b = in;
        for (ByteEdit e : edits) {
            b = e.apply(b);
        }
        return b;
    }
}
