package org.viewgain.report;

import java.io.IOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.time.Instant;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;

/**
 * A results folder {@code <root>/<experiment>/<run-id>/}. It is created new (never reused, so no run overwrites
 * another) and every file is written to a temporary name and moved into place, so a reader never sees half a table.
 */
public final class RunFolder {
    private static final DateTimeFormatter ID = DateTimeFormatter.ofPattern("yyyyMMdd'T'HHmmss'Z'")
            .withZone(ZoneOffset.UTC);
    private final Path dir;

    private RunFolder(Path dir) {
        this.dir = dir;
    }

    /** Creates a new, empty run folder; a second run in the same second gets a suffix. */
    public static RunFolder create(Path root, String experiment, Instant start) throws IOException {
        Path parent = root.resolve(experiment);
        Files.createDirectories(parent);
        String base = ID.format(start);
        for (int k = 1; k < 1000; k++) {
            Path candidate = parent.resolve(k == 1 ? base : base + "-" + k);
            try {
                Files.createDirectory(candidate);
                return new RunFolder(candidate);
            } catch (FileAlreadyExistsException e) {
                // try the next suffix
            }
        }
        throw new IOException("cannot create a new run folder under " + parent);
    }

    /**
     * Creates exactly {@code dir} (a shard's folder), refusing one that exists: only {@code --resume} writes into an
     * existing folder.
     */
    public static RunFolder createAt(Path dir) throws IOException {
        if (dir.getParent() != null) {
            Files.createDirectories(dir.getParent());
        }
        try {
            Files.createDirectory(dir);
        } catch (FileAlreadyExistsException e) {
            throw new org.viewgain.spec.BadInputException(dir + " already exists; continue it with 'viewgain run "
                    + "--resume " + dir + "' or choose another --out");
        }
        return new RunFolder(dir);
    }

    /** An existing run folder, to resume; it must hold run.json. */
    public static RunFolder existing(Path dir) {
        if (!Files.isRegularFile(dir.resolve("run.json"))) {
            throw new org.viewgain.spec.BadInputException(dir + ": not a run folder (no run.json)");
        }
        return new RunFolder(dir);
    }

    public Path dir() {
        return dir;
    }

    /** Writes a table atomically. */
    public void write(String name, CsvTable table) throws IOException {
        writeAtomically(name, w -> table.write(w));
    }

    /** Writes text atomically. */
    public void writeText(String name, String text) throws IOException {
        writeAtomically(name, w -> w.write(text));
    }

    interface Body {
        void write(Writer w) throws IOException;
    }

    private void writeAtomically(String name, Body body) throws IOException {
        Path tmp = dir.resolve("." + name + ".tmp");
        try (Writer w = Files.newBufferedWriter(tmp, StandardCharsets.UTF_8)) {
            body.write(w);
        }
        try {
            Files.move(tmp, dir.resolve(name), StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
        } catch (AtomicMoveNotSupportedException e) {
            Files.move(tmp, dir.resolve(name), StandardCopyOption.REPLACE_EXISTING);
        }
    }
}
