package org.viewgain.cohort;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.viewgain.spec.BadInputException;
import org.viewgain.spec.IoMessages;

/**
 * Reads a NumPy {@code .npy} file (format versions 1.0, 2.0 and 3.0, as published in numpy's {@code numpy.lib.format}
 * documentation and NEP 1): a magic string, a Python-literal header with {@code descr}, {@code fortran_order} and
 * {@code shape}, then the raw elements. Reads little- and big-endian floats (4, 8 bytes), signed and unsigned
 * integers (1 to 8 bytes) and booleans, in C or Fortran order. Object, complex, structured and string arrays are
 * refused. Written here rather than taken from a library: the format is small and fully published, and the Java
 * readers on Maven Central are early (org.openlca:npy 0.0.x) or pull in Kotlin (org.jetbrains.bio:npy).
 */
final class NpyFile implements NumericArray {
    private static final byte[] MAGIC = {(byte) 0x93, 'N', 'U', 'M', 'P', 'Y'};
    private static final Pattern DESCR = Pattern.compile("['\"]descr['\"]\\s*:\\s*(['\"])([^'\"]*)\\1");
    private static final Pattern FORTRAN = Pattern.compile("['\"]fortran_order['\"]\\s*:\\s*(True|False)");
    private static final Pattern SHAPE = Pattern.compile("['\"]shape['\"]\\s*:\\s*\\(([^)]*)\\)");
    private static final Pattern TYPE = Pattern.compile("([<>|=]?)([fiub])(\\d+)");
    /** Files up to this size are read into the heap; larger ones are mapped. */
    private static final long READ_AT_MOST = 64L << 20;

    private final ByteBuffer data;
    private final int offset;
    private final char kind;
    private final int itemSize;
    private final int[] shape;
    private final long[] strides;

    private NpyFile(ByteBuffer data, int offset, char kind, int itemSize, int[] shape, boolean fortran) {
        this.data = data;
        this.offset = offset;
        this.kind = kind;
        this.itemSize = itemSize;
        this.shape = shape;
        this.strides = new long[shape.length];
        long s = 1;
        for (int k = 0; k < shape.length; k++) {
            int axis = fortran ? k : shape.length - 1 - k;
            strides[axis] = s;
            s *= shape[axis];
        }
    }

    /** Reads the file; {@code where} starts every message (it names the view, subject and file). */
    static NpyFile read(Path file, String where) {
        ByteBuffer b = bytes(file, where);
        if (b.limit() < 10 || !startsWithMagic(b)) {
            throw new BadInputException(where + ": not a NumPy .npy file (it does not start with the .npy magic"
                    + " string; write it with numpy.save)");
        }
        int major = b.get(6) & 0xff;
        int minor = b.get(7) & 0xff;
        if (major < 1 || major > 3 || minor != 0) {
            throw new BadInputException(where + ": .npy format version " + major + "." + minor
                    + " is not read (versions 1.0, 2.0 and 3.0 are)");
        }
        int lengthBytes = major == 1 ? 2 : 4;
        if (b.limit() < 8 + lengthBytes) {
            throw new BadInputException(where + ": the .npy header is cut short (the file has " + b.limit()
                    + " bytes)");
        }
        long headerLength = major == 1 ? (b.order(ByteOrder.LITTLE_ENDIAN).getShort(8) & 0xffff)
                : (b.order(ByteOrder.LITTLE_ENDIAN).getInt(8) & 0xffffffffL);
        long dataStart = 8L + lengthBytes + headerLength;
        if (dataStart > b.limit()) {
            throw new BadInputException(where + ": the .npy header is cut short (it says " + headerLength
                    + " bytes, the file has " + b.limit() + ")");
        }
        byte[] h = new byte[(int) headerLength];
        b.get(8 + lengthBytes, h);
        String header = new String(h, major == 3 ? StandardCharsets.UTF_8 : StandardCharsets.ISO_8859_1);
        String descr = find(DESCR, header, 2, where, "descr");
        boolean fortran = "True".equals(find(FORTRAN, header, 1, where, "fortran_order"));
        int[] shape = shape(find(SHAPE, header, 1, where, "shape"), where);
        Matcher t = TYPE.matcher(descr);
        if (!t.matches()) {
            throw new BadInputException(where + ": element type " + CsvText.show(descr) + " is not read; expected"
                    + " real numbers (float32/float64, integers or booleans)");
        }
        char kind = t.group(2).charAt(0);
        int size = Integer.parseInt(t.group(3).length() > 2 ? "0" : t.group(3));
        boolean known = switch (kind) {
            case 'f' -> size == 4 || size == 8;
            case 'i', 'u' -> size == 1 || size == 2 || size == 4 || size == 8;
            default -> size == 1;
        };
        if (!known) {
            throw new BadInputException(where + ": element type " + CsvText.show(descr) + " is not read; expected"
                    + " float32, float64, integers of 1 to 8 bytes or booleans");
        }
        long count = 1;
        for (int d : shape) {
            count *= d;
            if (count > Integer.MAX_VALUE) {
                throw new BadInputException(where + ": shape " + NumericArray.describe(shape) + " is too large");
            }
        }
        long needed = count * size;
        if (dataStart + needed > b.limit()) {
            throw new BadInputException(where + ": the file is cut short: shape " + NumericArray.describe(shape)
                    + " needs " + needed + " bytes of data, the file holds " + (b.limit() - dataStart));
        }
        b.order(">".equals(t.group(1)) ? ByteOrder.BIG_ENDIAN : ByteOrder.LITTLE_ENDIAN);
        return new NpyFile(b, (int) dataStart, kind, size, shape, fortran);
    }

    @Override
    public int[] shape() {
        return shape.clone();
    }

    @Override
    public double get(int[] index) {
        long linear = 0;
        for (int k = 0; k < shape.length; k++) {
            if (index[k] < 0 || index[k] >= shape[k]) {
                throw new IndexOutOfBoundsException("index " + index[k] + " on axis " + k);
            }
            linear += index[k] * strides[k];
        }
        int at = offset + (int) (linear * itemSize);
        return switch (kind) {
            case 'f' -> itemSize == 8 ? data.getDouble(at) : data.getFloat(at);
            case 'i' -> switch (itemSize) {
                case 1 -> data.get(at);
                case 2 -> data.getShort(at);
                case 4 -> data.getInt(at);
                default -> data.getLong(at);
            };
            case 'u' -> switch (itemSize) {
                case 1 -> data.get(at) & 0xff;
                case 2 -> data.getShort(at) & 0xffff;
                case 4 -> data.getInt(at) & 0xffffffffL;
                default -> unsigned(data.getLong(at));
            };
            default -> data.get(at) == 0 ? 0 : 1;
        };
    }

    private static double unsigned(long v) {
        return v >= 0 ? v : (v >>> 1) * 2.0 + (v & 1);
    }

    private static boolean startsWithMagic(ByteBuffer b) {
        for (int i = 0; i < MAGIC.length; i++) {
            if (b.get(i) != MAGIC[i]) {
                return false;
            }
        }
        return true;
    }

    private static String find(Pattern p, String header, int group, String where, String key) {
        Matcher m = p.matcher(header);
        if (!m.find()) {
            throw new BadInputException(where + ": the .npy header has no readable '" + key + "' ("
                    + (key.equals("descr") && header.contains("[") ? "structured arrays are not read" : "header "
                    + CsvText.show(header.strip())) + ")");
        }
        return m.group(group);
    }

    private static int[] shape(String text, String where) {
        String[] parts = text.split(",");
        int n = 0;
        int[] out = new int[parts.length];
        for (String part : parts) {
            String s = part.strip().replaceFirst("[lL]$", "");
            if (s.isEmpty()) {
                continue;
            }
            if (!s.matches("\\d{1,9}")) {
                throw new BadInputException(where + ": the .npy header's shape (" + CsvText.oneLine(text)
                        + ") is not a list of sizes");
            }
            out[n++] = Integer.parseInt(s);
        }
        return java.util.Arrays.copyOf(out, n);
    }

    private static ByteBuffer bytes(Path file, String where) {
        if (!Files.isRegularFile(file)) {
            throw new BadInputException(where + ": not found or not a regular file");
        }
        try (FileChannel ch = FileChannel.open(file, StandardOpenOption.READ)) {
            long size = ch.size();
            if (size > Integer.MAX_VALUE) {
                throw new BadInputException(where + ": larger than 2 GB; split it into one file per subject");
            }
            if (size > READ_AT_MOST) {
                return ch.map(FileChannel.MapMode.READ_ONLY, 0, size);
            }
            return ByteBuffer.wrap(Files.readAllBytes(file));
        } catch (IOException e) {
            throw new BadInputException(where + ": cannot read it (" + IoMessages.ioProblem(e) + ")", e);
        }
    }
}
