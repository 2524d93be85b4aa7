package org.viewgain.cohort;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.zip.DataFormatException;
import java.util.zip.Inflater;
import org.viewgain.spec.BadInputException;
import org.viewgain.spec.IoMessages;
import us.hebi.matlab.mat.format.Mat5;
import us.hebi.matlab.mat.format.Mat5File;
import us.hebi.matlab.mat.types.MatFile;
import us.hebi.matlab.mat.types.Matrix;
import us.hebi.matlab.mat.types.Sources;

/**
 * Reads one numeric variable of a MATLAB MAT-file of level 5 (what MATLAB's {@code save} writes by default up to
 * {@code -v7}, compressed or not, and what scipy's {@code savemat} writes) through MFL (us.hebi.matlab.mat:mfl-core,
 * Apache-2.0). A v7.3 file is HDF5 and a v4 file has no level-5 header: both are refused in one line saying how to
 * save the file again.
 */
final class MatlabFile implements NumericArray {
    private static final int HEADER = 128;
    /** The MAT-file data type of a zlib-compressed element (miCOMPRESSED), which is not padded. */
    private static final int COMPRESSED = 15;
    /** The MAT-file data type of a variable (miMATRIX). */
    private static final int MATRIX = 14;

    private final Matrix matrix;
    private final int[] shape;

    private MatlabFile(Matrix matrix) {
        this.matrix = matrix;
        this.shape = matrix.getDimensions().clone();
    }

    /**
     * The variable {@code variable} of the file, or its only numeric variable when {@code variable} is null;
     * {@code where} starts every message and {@code key} is the spec key that names a variable.
     */
    static MatlabFile read(Path file, String variable, String where, String key) {
        byte[] bytes;
        try {
            if (Files.size(file) > Integer.MAX_VALUE - 64) {
                throw new BadInputException(where + ": larger than 2 GB; split it into one file per subject");
            }
            bytes = Files.readAllBytes(file);
        } catch (IOException e) {
            throw new BadInputException(where + ": cannot read it (" + IoMessages.ioProblem(e) + ")", e);
        }
        checkHeader(bytes, where);
        checkElementSizes(bytes, where);
        MatFile mat;
        try {
            mat = Mat5.newReader(Sources.wrap(bytes)).disableSubsystemProcessing().readMat();
        } catch (IOException | RuntimeException | OutOfMemoryError | StackOverflowError e) {
            // a damaged file can make the reader fail in many ways; each is the same problem for the user
            throw new BadInputException(where + ": not a readable MATLAB file (" + IoMessages.withoutClassNames(
                    e.getMessage() == null ? "damaged or cut short" : e.getMessage()) + ")", e);
        }
        List<String> numeric = new ArrayList<>();
        List<String> all = new ArrayList<>();
        MatFile.Entry chosen = null;
        for (MatFile.Entry e : mat.getEntries()) {
            boolean isNumeric = e.getValue() instanceof Matrix m && !m.isComplex();
            String desc = e.getName() + " (" + NumericArray.describe(e.getValue().getDimensions()) + " "
                    + e.getValue().getType() + ")";
            all.add(desc);
            if (isNumeric) {
                numeric.add(e.getName());
            }
            if (variable != null && variable.equals(e.getName())) {
                chosen = e;
            } else if (variable == null && isNumeric && numeric.size() == 1) {
                chosen = e;
            }
        }
        if (variable == null && numeric.size() > 1) {
            throw new BadInputException(where + ": holds several numeric variables (" + String.join(", ", numeric)
                    + "); say which one with " + key);
        }
        if (chosen == null) {
            throw new BadInputException(where + ": " + (variable == null ? "holds no real numeric variable"
                    : "holds no variable " + CsvText.show(variable)) + "; it holds "
                    + (all.isEmpty() ? "nothing" : CsvText.oneLine(String.join(", ", all))));
        }
        if (!(chosen.getValue() instanceof Matrix m) || m.isComplex()) {
            throw new BadInputException(where + ": variable " + CsvText.show(chosen.getName()) + " is "
                    + chosen.getValue().getType() + ", not a real numeric array");
        }
        return new MatlabFile(m);
    }

    private static void checkHeader(byte[] b, String where) {
        String text = new String(b, 0, Math.min(b.length, 116), StandardCharsets.ISO_8859_1);
        if (text.startsWith("MATLAB 7.3 MAT-file") || (b.length >= HEADER && b[124] == 0 && b[125] == 2)) {
            throw new BadInputException(where + ": a MATLAB v7.3 file (HDF5), which viewgain cannot read; save it"
                    + " again in MATLAB with save(file, 'name', '-v7')");
        }
        if (b.length < HEADER || !text.startsWith("MATLAB 5.0 MAT-file")) {
            throw new BadInputException(where + ": not a MATLAB 5/7 MAT-file (no 'MATLAB 5.0 MAT-file' header; a"
                    + " v4 file or another format); save it again in MATLAB with save(file, 'name', '-v7')");
        }
    }

    /**
     * Refuses a damaged file before MFL reads it, where MFL would print a warning of its own on stderr (a size
     * beyond 2 GB) and then fail: every top-level element must be a matrix or a compressed element that fits in the
     * file, and a compressed one must start with a matrix tag of a possible size.
     */
    private static void checkElementSizes(byte[] b, String where) {
        ByteOrder order = b[126] == 'I' && b[127] == 'M' ? ByteOrder.LITTLE_ENDIAN
                : b[126] == 'M' && b[127] == 'I' ? ByteOrder.BIG_ENDIAN : null;
        if (order == null) {
            throw damaged(where, "no byte-order mark 'IM' or 'MI' at byte 127");
        }
        ByteBuffer bb = ByteBuffer.wrap(b).order(order);
        long pos = HEADER;
        while (pos + 8 <= b.length) {
            int type = bb.getInt((int) pos);
            long size = bb.getInt((int) pos + 4) & 0xffffffffL;
            if (type != MATRIX && type != COMPRESSED) {
                throw damaged(where, "the element at byte " + pos + " has type " + type + ", expected a variable");
            }
            if (size > b.length - pos - 8) {
                throw damaged(where, "the variable at byte " + pos + " claims " + size + " bytes, the file holds "
                        + (b.length - pos - 8) + " after it");
            }
            if (type == COMPRESSED) {
                checkCompressedTag(b, (int) pos + 8, (int) size, order, where, pos);
            }
            pos += 8 + (type == COMPRESSED ? size : (size + 7) / 8 * 8);
        }
    }

    private static void checkCompressedTag(byte[] b, int from, int length, ByteOrder order, String where, long pos) {
        Inflater inflater = new Inflater();
        byte[] tag = new byte[8];
        int got;
        try {
            inflater.setInput(b, from, length);
            got = inflater.inflate(tag);
        } catch (DataFormatException e) {
            got = -1;
        } finally {
            inflater.end();
        }
        ByteBuffer t = ByteBuffer.wrap(tag).order(order);
        if (got != 8 || t.getInt(0) != MATRIX || (t.getInt(4) & 0xffffffffL) > Integer.MAX_VALUE) {
            throw damaged(where, "the compressed variable at byte " + pos + " does not start with a readable"
                    + " matrix");
        }
    }

    private static BadInputException damaged(String where, String detail) {
        return new BadInputException(where + ": not a readable MATLAB file (damaged or cut short: " + detail + ")");
    }

    @Override
    public int[] shape() {
        return shape.clone();
    }

    @Override
    public double get(int[] index) {
        return index.length == 2 ? matrix.getDouble(index[0], index[1]) : matrix.getDouble(index);
    }
}
