package org.viewgain.frozen;

import java.nio.BufferUnderflowException;
import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;

/**
 * Reads a part written by {@link FrozenOut}. A part that is cut short, of another layout version or otherwise not
 * what its reader expects raises {@link IllegalArgumentException} naming the part.
 */
public final class FrozenIn {
    private final String part;
    private final ByteBuffer in;
    private final String kind;

    /**
     * @param part  the part's name, for messages
     * @param bytes the part's bytes
     */
    public FrozenIn(String part, byte[] bytes) {
        this.part = part;
        this.in = ByteBuffer.wrap(bytes);
        String magic;
        try {
            magic = text();
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException(part + " is not a viewgain part");
        }
        if (!FrozenOut.MAGIC.equals(magic)) {
            throw new IllegalArgumentException(part + " is not a viewgain part");
        }
        int version = integer();
        if (version != FrozenOut.VERSION) {
            throw new IllegalArgumentException(part + " has part layout " + version + "; this version reads "
                    + FrozenOut.VERSION);
        }
        this.kind = text();
    }

    /** The part's kind. */
    public String kind() {
        return kind;
    }

    /** The part's name. */
    public String part() {
        return part;
    }

    public String text() {
        int n = length();
        byte[] b = new byte[n];
        get(b);
        return new String(b, StandardCharsets.UTF_8);
    }

    public int integer() {
        try {
            return in.getInt();
        } catch (BufferUnderflowException e) {
            throw cut();
        }
    }

    public double number() {
        try {
            return Double.longBitsToDouble(in.getLong());
        } catch (BufferUnderflowException e) {
            throw cut();
        }
    }

    public double[] numbers() {
        int n = integer();
        if (n == -1) {
            return null;
        }
        check(n, 8);
        double[] v = new double[n];
        for (int i = 0; i < n; i++) {
            v[i] = number();
        }
        return v;
    }

    public int[] integers() {
        int n = integer();
        if (n == -1) {
            return null;
        }
        check(n, 4);
        int[] v = new int[n];
        for (int i = 0; i < n; i++) {
            v[i] = integer();
        }
        return v;
    }

    public double[][] matrix() {
        int n = integer();
        if (n == -1) {
            return null;
        }
        check(n, 4);
        double[][] m = new double[n][];
        for (int i = 0; i < n; i++) {
            m[i] = numbers();
        }
        return m;
    }

    public List<String> texts() {
        int n = length();
        List<String> out = new ArrayList<>(n);
        for (int i = 0; i < n; i++) {
            out.add(text());
        }
        return out;
    }

    /** Throws unless every byte was read (a reader that stops early reads another layout). */
    public void end() {
        if (in.hasRemaining()) {
            throw new IllegalArgumentException(part + " has " + in.remaining() + " bytes its reader did not expect");
        }
    }

    /** An error for a part whose content its reader cannot accept. */
    public IllegalArgumentException bad(String what) {
        return new IllegalArgumentException(part + " (" + kind + "): " + what);
    }

    private int length() {
        int n = integer();
        check(n, 1);
        return n;
    }

    private void check(int n, int bytesEach) {
        if (n < 0 || (long) n * bytesEach > in.remaining()) {
            throw cut();
        }
    }

    private void get(byte[] b) {
        try {
            in.get(b);
        } catch (BufferUnderflowException e) {
            throw cut();
        }
    }

    private IllegalArgumentException cut() {
        return new IllegalArgumentException(part + " is cut short or damaged");
    }
}
