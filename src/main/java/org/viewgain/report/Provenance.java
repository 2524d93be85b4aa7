package org.viewgain.report;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.viewgain.spec.ExperimentSpec;
import org.viewgain.spec.Specs;

/**
 * The provenance record {@code run.json}: what ran, on what, with which versions and seed, and whether it finished.
 * Its {@code status} is {@code running} while a run goes on and {@code complete} only after every table is written.
 */
public final class Provenance {
    /** Version of the run.json layout; readers refuse a newer one. */
    public static final int SCHEMA_VERSION = 1;

    private final Map<String, Object> record = new LinkedHashMap<>();

    public Provenance(ExperimentSpec spec, List<String> subjectIds, int threads, List<String> commandLine,
                      String startedAt) throws IOException {
        record.put("schema_version", SCHEMA_VERSION);
        record.put("tool", "viewgain");
        record.put("tool_version", toolVersion());
        record.put("status", "running");
        record.put("experiment", spec.experiment());
        record.put("seed", spec.seed());
        record.put("threads", threads);
        record.put("command_line", commandLine);
        record.put("started_at", startedAt);
        record.put("java_version", System.getProperty("java.version"));
        record.put("java_vendor", System.getProperty("java.vendor"));
        record.put("os", System.getProperty("os.name") + " " + System.getProperty("os.version"));
        record.put("arch", System.getProperty("os.arch"));
        record.put("libraries", org.viewgain.classify.ClassifierRegistry.libraryVersions());
        record.put("spec_file", spec.specFile().toAbsolutePath().toString());
        record.put("spec_text", spec.text());
        record.put("input_sha256", inputHashes(spec, subjectIds));
    }

    /**
     * What a journal must match to be resumed or merged: the SHA-256 of the spec text and of every input file, the
     * seed, the tool version and the shard ({@code I/N}, or {@code all} for a whole run).
     */
    public Map<String, Object> identity(String shard) {
        Map<String, Object> id = new LinkedHashMap<>();
        id.put("spec_sha256", sha256(record.get("spec_text").toString()));
        id.put("input_sha256", record.get("input_sha256"));
        id.put("seed", record.get("seed"));
        id.put("tool_version", record.get("tool_version"));
        id.put("shard", shard == null ? "all" : shard);
        return id;
    }

    /** The SHA-256 of the spec text (what a bundle's provenance names). */
    public String specSha256() {
        return sha256(record.get("spec_text").toString());
    }

    private static String sha256(String text) {
        try {
            return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256")
                    .digest(text.getBytes(java.nio.charset.StandardCharsets.UTF_8)));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }

    /** Reads a run folder's run.json as a map (for resume and merge). */
    public static Map<String, Object> read(Path runJson) throws IOException {
        return new ObjectMapper().readValue(runJson.toFile(),
                new com.fasterxml.jackson.core.type.TypeReference<LinkedHashMap<String, Object>>() { });
    }

    /** Records a key (e.g. counts, end time). */
    public Provenance put(String key, Object value) {
        record.put(key, value);
        return this;
    }

    public String toJson() throws IOException {
        return new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT).writeValueAsString(record) + "\n";
    }

    /** The tool version from the jar manifest, or {@code dev} when running from classes. */
    public static String toolVersion() {
        String v = Provenance.class.getPackage().getImplementationVersion();
        return v == null ? "dev" : v;
    }

    static Map<String, String> inputHashes(ExperimentSpec spec, List<String> ids) throws IOException {
        Map<String, String> out = new LinkedHashMap<>();
        Path base = spec.specFile().toAbsolutePath().getParent();
        out.put(rel(base, spec.specFile().toAbsolutePath()), sha256(spec.specFile()));
        out.put(rel(base, spec.cohort().subjects()), sha256(spec.cohort().subjects()));
        for (Specs.View v : new Specs.View[] {spec.source(), spec.target()}) {
            if (v == null) {
                continue;
            }
            for (Path p : v.sharedFiles()) {
                out.put(rel(base, p), sha256(p));
            }
            if (v.layout() == Specs.Layout.MATRICES) {
                for (String id : ids) {
                    Path p = Path.of(v.location().toString().replace("{subject}", id));
                    if (Files.isRegularFile(p)) {
                        out.put(rel(base, p), sha256(p));
                    }
                }
            }
        }
        return out;
    }

    private static String rel(Path base, Path p) {
        try {
            return base.relativize(p.toAbsolutePath()).toString();
        } catch (IllegalArgumentException e) {
            return p.toString();
        }
    }

    static String sha256(Path p) throws IOException {
        try (InputStream in = Files.newInputStream(p)) {
            MessageDigest md = MessageDigest.getInstance("SHA-256");
            byte[] buf = new byte[1 << 16];
            int k;
            while ((k = in.read(buf)) > 0) {
                md.update(buf, 0, k);
            }
            return HexFormat.of().formatHex(md.digest());
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }
}
