package org.viewgain.engine;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.Closeable;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.Collections;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.Map;
import java.util.Set;
import java.util.zip.CRC32;
import org.viewgain.spec.BadInputException;

/**
 * The append-only journal {@code journal.jsonl} of a run folder: a header line with the run's identity (spec and
 * input hashes, seed, tool version, shard), then one line per finished work unit, each {@code CRC32 JSON}. Every
 * line is flushed to disk (fsync) before the unit counts as done, so a run killed at any moment loses at most the
 * unit being written; a torn or damaged last line is ignored when the journal is read again.
 */
public final class Journal implements Closeable {
    /** File name inside a run folder. */
    public static final String FILE = "journal.jsonl";
    private static final ObjectMapper JSON = new ObjectMapper();

    /** Where lines go; tests replace it to simulate a full disk. */
    interface Sink {
        void write(byte[] line) throws IOException;
    }

    private final Path file;
    private final JsonNode identity;
    /** Records read from the file (or merged in) and not yet taken; appended records are not kept in memory. */
    private final Map<String, JsonNode> units;
    /** Keys of every finished unit: read, merged in or appended. */
    private final Set<String> keys;
    private final FileChannel channel;
    private Sink sink;
    private long goodBytes;
    private IOException failure;

    private Journal(Path file, JsonNode identity, Map<String, JsonNode> units, FileChannel channel) {
        this.file = file;
        this.identity = identity;
        this.units = units;
        this.keys = Collections.synchronizedSet(new LinkedHashSet<>(units.keySet()));
        this.channel = channel;
        this.sink = channel == null ? null : line -> {
            ByteBuffer b = ByteBuffer.wrap(line);
            while (b.hasRemaining()) {
                channel.write(b);
            }
            channel.force(false);
        };
    }

    /** Starts a new journal holding only the header; refuses an existing file. */
    public static Journal create(Path file, Map<String, Object> identity) throws IOException {
        FileChannel ch;
        try {
            ch = FileChannel.open(file, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE);
        } catch (FileAlreadyExistsException e) {
            throw new BadInputException(file + " already exists; a journal is never overwritten");
        }
        JsonNode id = tree(identity);
        Journal j = new Journal(file, id, Collections.synchronizedMap(new LinkedHashMap<>()), ch);
        ObjectNode header = JSON.createObjectNode();
        header.put("unit", "header");
        header.set("identity", id);
        j.sink.write(line(header));
        return j;
    }

    /**
     * Reopens a journal to go on appending: refuses one whose identity differs from {@code identity} (naming what
     * differs), drops a torn or damaged last line and keeps every finished unit.
     */
    public static Journal resume(Path file, Map<String, Object> identity) throws IOException {
        Journal read = read(file);
        JsonNode want = tree(identity);
        String diff = difference(read.identity, want);
        if (diff != null) {
            throw new BadInputException(file + " does not match this run: " + diff
                    + "; it cannot be resumed, start a new run instead");
        }
        FileChannel ch = FileChannel.open(file, StandardOpenOption.WRITE);
        ch.truncate(read.goodBytes);
        ch.position(read.goodBytes);
        ch.force(true);
        return new Journal(file, read.identity, read.units, ch);
    }

    /** Reads a journal without writing to it. */
    public static Journal read(Path file) throws IOException {
        byte[] all;
        try {
            all = Files.readAllBytes(file);
        } catch (NoSuchFileException e) {
            throw new BadInputException("no journal " + file + " (is this a run folder?)");
        }
        Map<String, JsonNode> units = Collections.synchronizedMap(new LinkedHashMap<>());
        JsonNode id = null;
        int start = 0;
        int lineNo = 0;
        long good = 0;
        while (start < all.length) {
            int end = start;
            while (end < all.length && all[end] != '\n') {
                end++;
            }
            lineNo++;
            JsonNode rec = end < all.length ? parse(new String(all, start, end - start, StandardCharsets.UTF_8))
                    : null; // no newline: torn by a crash
            if (rec == null) {
                if (!onlyBlank(all, end + 1)) {
                    throw new BadInputException(file + ": line " + lineNo + " is damaged (checksum or format) and "
                            + "is not the last line; the journal cannot be trusted");
                }
                break;
            }
            if (lineNo == 1) {
                if (!"header".equals(rec.path("unit").asText())) {
                    throw new BadInputException(file + ": the first line is not a journal header");
                }
                id = rec.get("identity");
            } else {
                String key = rec.path("unit").asText();
                try {
                    WorkUnit.parse(key);
                } catch (IllegalArgumentException e) {
                    throw new BadInputException(file + ": line " + lineNo + " names no work unit of this viewgain ('"
                            + key + "'); the journal comes from another version or was edited");
                }
                units.put(key, rec);
            }
            good = end + 1;
            start = end + 1;
        }
        if (id == null) {
            throw new BadInputException(file + ": no header line (the run stopped before it began)");
        }
        Journal j = new Journal(file, id, units, null);
        j.goodBytes = good;
        return j;
    }

    /** An identity as it reads back from a journal (numbers and maps as JSON reads them), for comparisons. */
    public static Map<String, Object> normalize(Map<String, Object> identity) {
        return JSON.convertValue(tree(identity), JSON.getTypeFactory().constructMapType(LinkedHashMap.class,
                String.class, Object.class));
    }

    /** The identity as it reads back from the file, so numbers compare equal whatever their Java type. */
    private static JsonNode tree(Map<String, Object> identity) {
        try {
            return JSON.readTree(JSON.writeValueAsString(identity));
        } catch (JsonProcessingException e) {
            throw new IllegalStateException(e);
        }
    }

    private static boolean onlyBlank(byte[] all, int from) {
        for (int i = from; i < all.length; i++) {
            if (all[i] != '\n' && all[i] != '\r' && all[i] != ' ') {
                return false;
            }
        }
        return true;
    }

    private static JsonNode parse(String text) {
        int sp = text.indexOf(' ');
        if (sp != 8) {
            return null;
        }
        String json = text.substring(sp + 1);
        CRC32 crc = new CRC32();
        crc.update(json.getBytes(StandardCharsets.UTF_8));
        if (!String.format("%08x", crc.getValue()).equals(text.substring(0, sp))) {
            return null;
        }
        try {
            JsonNode n = JSON.readTree(json);
            return n != null && n.isObject() && n.hasNonNull("unit") ? n : null;
        } catch (JsonProcessingException e) {
            return null;
        }
    }

    private static byte[] line(JsonNode rec) {
        try {
            String json = JSON.writeValueAsString(rec);
            CRC32 crc = new CRC32();
            byte[] body = json.getBytes(StandardCharsets.UTF_8);
            crc.update(body);
            return (String.format("%08x", crc.getValue()) + " " + json + "\n").getBytes(StandardCharsets.UTF_8);
        } catch (JsonProcessingException e) {
            throw new IllegalStateException(e);
        }
    }

    /** What differs between two identities, or null when they match. */
    static String difference(JsonNode have, JsonNode want) {
        if (have.equals(want)) {
            return null;
        }
        for (Iterator<String> it = want.fieldNames(); it.hasNext(); ) {
            String k = it.next();
            JsonNode a = have.get(k);
            JsonNode b = want.get(k);
            if (a == null || !a.equals(b)) {
                if (a != null && a.isObject() && b.isObject()) {
                    for (Iterator<String> f = b.fieldNames(); f.hasNext(); ) {
                        String name = f.next();
                        if (!b.get(name).equals(a.get(name))) {
                            return k + " differs for " + name + " (journal " + shortText(a.get(name)) + ", now "
                                    + shortText(b.get(name)) + ")";
                        }
                    }
                }
                return k + " differs (journal " + shortText(a) + ", now " + shortText(b) + ")";
            }
        }
        return "the journal records more than this run";
    }

    private static String shortText(JsonNode n) {
        if (n == null) {
            return "none";
        }
        String s = n.isTextual() ? n.asText() : n.toString();
        return s.length() > 16 && n.isTextual() && s.matches("[0-9a-f]+") ? s.substring(0, 12) + "..." : s;
    }

    /** The run identity recorded in the header. */
    public Map<String, Object> identity() {
        return JSON.convertValue(identity, JSON.getTypeFactory().constructMapType(LinkedHashMap.class,
                String.class, Object.class));
    }

    public Path file() {
        return file;
    }

    /**
     * Unit records read from the file or merged in and not yet {@linkplain #take taken}, by key, in journal order;
     * read only. Records appended by this process are written to disk but not kept in memory (at 35,778 edges a
     * phase-one record alone is megabytes of text).
     */
    public Map<String, JsonNode> units() {
        synchronized (units) {
            return Map.copyOf(units);
        }
    }

    /** Keys of every finished unit (read, merged in or appended), in journal order. */
    public Set<String> keys() {
        synchronized (keys) {
            return Set.copyOf(keys);
        }
    }

    /** The record of a unit read or merged in, or null; see {@link #take}. */
    JsonNode unit(String key) {
        return units.get(key);
    }

    /** Releases a record's memory once the caller has decoded it; its key stays finished. */
    void take(String key) {
        units.remove(key);
    }

    /** Number of finished units. */
    public int size() {
        return keys.size();
    }

    /** Appends one finished unit and forces it to disk; the first record of a key wins. */
    synchronized void append(ObjectNode rec) {
        write(rec, false);
    }

    private void write(ObjectNode rec, boolean keep) {
        String key = rec.get("unit").asText();
        if (keys.contains(key)) {
            return;
        }
        if (failure != null) {
            // after a failed write nothing more is appended, so a torn line can only be the last one
            throw new UncheckedIOException(failure.getMessage(), failure);
        }
        if (sink == null) {
            throw new IllegalStateException("journal " + file + " is read only or closed");
        }
        try {
            sink.write(line(rec));
        } catch (IOException e) {
            failure = e;
            throw new UncheckedIOException("cannot write the journal " + file + ": " + e.getMessage(), e);
        }
        keys.add(key);
        if (keep) {
            units.put(key, rec);
        }
    }

    /**
     * Adds records of another journal (merge), writing each one and keeping it in memory for the run that follows;
     * refuses a unit that is already there.
     */
    public synchronized void appendAll(Journal other) {
        for (JsonNode rec : other.units().values()) {
            String key = rec.get("unit").asText();
            if (keys.contains(key)) {
                throw new BadInputException("unit " + key + " is in more than one shard (" + other.file + ")");
            }
            write((ObjectNode) rec, true);
        }
    }

    /** Replaces the writer (tests: a disk that fills up). */
    synchronized void sink(Sink s) {
        this.sink = s;
    }

    /** Stops appending (units finishing later in other threads are not written) and closes the file. */
    @Override
    public synchronized void close() throws IOException {
        sink = null;
        if (channel != null) {
            channel.close();
        }
    }
}
