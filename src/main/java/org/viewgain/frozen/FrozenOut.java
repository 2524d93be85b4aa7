package org.viewgain.frozen;

import java.io.ByteArrayOutputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.List;

/**
 * Writes one part: the magic {@code VGPART}, a layout version, the kind, then the state as big-endian values (Java's
 * {@link DataOutputStream}): doubles as their IEEE 754 bits, so a part read back gives the same values bit for bit.
 * Arrays are written with their length first; a null array as length -1.
 */
public final class FrozenOut {
    /** The first bytes of every part. */
    public static final String MAGIC = "VGPART";
    /** The part layout version. */
    public static final int VERSION = 1;

    private final ByteArrayOutputStream bytes = new ByteArrayOutputStream();
    private final DataOutputStream out = new DataOutputStream(bytes);

    private FrozenOut(String kind) {
        text(MAGIC);
        integer(VERSION);
        text(kind);
    }

    /** The bytes of a freezable thing's part. */
    public static byte[] of(Freezable f) {
        FrozenOut o = new FrozenOut(f.kind());
        f.freeze(o);
        return o.bytes.toByteArray();
    }

    public FrozenOut text(String s) {
        try {
            byte[] b = s.getBytes(java.nio.charset.StandardCharsets.UTF_8);
            out.writeInt(b.length);
            out.write(b);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return this;
    }

    public FrozenOut integer(int v) {
        try {
            out.writeInt(v);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return this;
    }

    public FrozenOut number(double v) {
        try {
            out.writeLong(Double.doubleToRawLongBits(v));
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return this;
    }

    public FrozenOut numbers(double[] v) {
        if (v == null) {
            return integer(-1);
        }
        integer(v.length);
        for (double x : v) {
            number(x);
        }
        return this;
    }

    public FrozenOut integers(int[] v) {
        if (v == null) {
            return integer(-1);
        }
        integer(v.length);
        for (int x : v) {
            integer(x);
        }
        return this;
    }

    /** Rows of doubles (each row may have its own length). */
    public FrozenOut matrix(double[][] m) {
        if (m == null) {
            return integer(-1);
        }
        integer(m.length);
        for (double[] r : m) {
            numbers(r);
        }
        return this;
    }

    public FrozenOut texts(List<String> v) {
        integer(v.size());
        v.forEach(this::text);
        return this;
    }
}
