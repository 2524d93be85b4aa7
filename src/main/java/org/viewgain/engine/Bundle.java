package org.viewgain.engine;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.viewgain.spec.BadInputException;
import org.viewgain.spec.FeatureSet;
import org.viewgain.spec.Specs;

/**
 * A run's final pipelines on disk ({@code bundle/} of a run folder; layout in {@code docs/bundle.md}): {@code
 * manifest.json} (format and version, provenance, the development cohort's shape, every pipeline with its parts,
 * the SHA-256 of every part) and {@code parts/*.part} (the {@code frozen} encoding). Written into a temporary folder
 * and renamed, so a bundle is complete or absent. Reading checks the format version, the tool version, every
 * part's hash and that no part is unlisted; any failure is one line and nothing is read further.
 */
public final class Bundle {
    /** The folder name inside a run folder. */
    public static final String DIR = "bundle";
    /** The manifest's {@code format}. */
    public static final String FORMAT = "viewgain-bundle";
    /** The layout version this build writes and reads. */
    public static final int FORMAT_VERSION = 1;
    private static final ObjectMapper JSON = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

    /** A bundle read back: its pipelines, the development cohort's shape and the settings of its metrics. */
    public record Loaded(CohortShape shape, List<FrozenPipeline> pipelines, IndependentResults.Settings settings,
                         JsonNode manifest) {
        public Loaded {
            pipelines = List.copyOf(pipelines);
        }
    }

    private Bundle() {
    }

    /** The tool version of this build (the jar manifest's, or {@code dev}). */
    public static String toolVersion() {
        String v = Bundle.class.getPackage().getImplementationVersion();
        return v == null ? "dev" : v;
    }

    /**
     * Writes {@code dir} (which must not exist).
     *
     * @param specSha256 the SHA-256 of the run's spec text (provenance)
     */
    public static void write(Path dir, FinalPipelines f, String specSha256) throws IOException {
        Experiment ex = f.experiment();
        Path tmp = dir.resolveSibling(dir.getFileName() + ".partial");
        if (Files.exists(tmp)) {
            try (Stream<Path> s = Files.walk(tmp)) {
                for (Path p : s.sorted(java.util.Comparator.reverseOrder()).toList()) {
                    Files.delete(p);
                }
            }
        }
        Files.createDirectories(tmp.resolve("parts"));
        Map<String, String> hashes = new TreeMap<>();
        ObjectNode m = JSON.createObjectNode();
        m.put("format", FORMAT).put("format_version", FORMAT_VERSION).put("tool", "viewgain")
                .put("tool_version", toolVersion()).put("experiment", ex.spec().experiment())
                .put("seed", ex.spec().seed()).put("spec_sha256", specSha256)
                .put("development_subjects", ex.data().n());
        ObjectNode shape = m.putObject("shape");
        CohortShape cs = CohortShape.of(ex);
        shape.put("source_graph", cs.sourceGraph());
        cs.sourceNames().forEach(shape.putArray("source_names")::add);
        shape.put("target_graph", cs.targetGraph());
        cs.targetNames().forEach(shape.putArray("target_names")::add);
        cs.extract().forEach(shape.putArray("extract")::add);
        cs.groups().forEach(shape.putArray("groups")::add);
        shape.put("positive", cs.positive());
        cs.sites().forEach(shape.putArray("sites")::add);
        cs.covariates().forEach(shape.putArray("covariates")::add);
        Specs.Significance sig = ex.spec().significance();
        m.putObject("intervals").put("confidence", sig.confidence()).put("bootstrap", sig.bootstrap());
        ArrayNode imps = m.putArray("imputers");
        for (Map.Entry<String, byte[]> e : new TreeMap<>(f.imputerParts()).entrySet()) {
            String part = "parts/imputer-" + e.getKey() + ".part";
            put(tmp, part, e.getValue(), hashes);
            imps.addObject().put("name", e.getKey()).put("method", ex.imputer(e.getKey()).method().method())
                    .put("chosen", f.imputerChoices().get(e.getKey())).put("part", part);
        }
        ArrayNode pipes = m.putArray("pipelines");
        for (int pi = 0; pi < f.entries().size(); pi++) {
            FinalPipelines.Entry e = f.entries().get(pi);
            Pipeline p = e.pipeline();
            ObjectNode o = pipes.addObject();
            o.put("imputer", p.imputer()).put("feature_set", p.featureSet().label()).put("classifier", p.classifier())
                    .put("classifier_method", ex.classifier(p.classifier()).method().method())
                    .put("chosen", e.unit().choice().params()).put("inner_score", e.unit().choice().innerScore());
            ArrayNode steps = o.putArray("steps");
            for (int k = 0; k < e.unit().steps().size(); k++) {
                String part = String.format("parts/pipeline-%02d-step-%d.part", pi + 1, k + 1);
                put(tmp, part, e.unit().steps().get(k), hashes);
                steps.add(part);
            }
            String part = String.format("parts/pipeline-%02d-model.part", pi + 1);
            put(tmp, part, e.unit().model(), hashes);
            o.put("model", part);
        }
        ObjectNode h = m.putObject("sha256");
        hashes.forEach(h::put);
        Files.writeString(tmp.resolve("manifest.json"), JSON.writeValueAsString(m) + "\n");
        Files.move(tmp, dir, StandardCopyOption.ATOMIC_MOVE);
    }

    private static void put(Path dir, String part, byte[] bytes, Map<String, String> hashes) throws IOException {
        Files.write(dir.resolve(part), bytes);
        hashes.put(part, sha256(bytes));
    }

    /** Reads and checks a bundle; a damaged, altered or foreign one is refused with one line. */
    public static Loaded read(Path dir) {
        Path manifest = dir.resolve("manifest.json");
        if (!Files.isRegularFile(manifest)) {
            throw new BadInputException(dir + ": not a bundle (no manifest.json)");
        }
        JsonNode m;
        try {
            m = new ObjectMapper().readTree(manifest.toFile());
        } catch (IOException e) {
            throw new BadInputException(manifest + ": not readable JSON (" + e.getMessage().split("\n")[0] + ")");
        }
        if (!FORMAT.equals(text(m, "format"))) {
            throw new BadInputException(manifest + ": not a viewgain bundle (format '" + text(m, "format") + "')");
        }
        if (m.path("format_version").asInt(-1) != FORMAT_VERSION) {
            throw new BadInputException(manifest + ": bundle format version " + m.path("format_version")
                    + "; this viewgain reads version " + FORMAT_VERSION);
        }
        if (!toolVersion().equals(text(m, "tool_version"))) {
            throw new BadInputException(manifest + ": made by viewgain " + text(m, "tool_version") + "; this is "
                    + toolVersion() + " (apply a bundle with the version that made it)");
        }
        JsonNode hashes = m.path("sha256");
        Map<String, byte[]> parts = new TreeMap<>();
        try (Stream<Path> s = Files.list(dir.resolve("parts"))) {
            for (Path p : s.sorted().toList()) {
                String name = "parts/" + p.getFileName();
                if (!hashes.has(name)) {
                    throw new BadInputException(dir.resolve(name) + ": a part the manifest does not list");
                }
                parts.put(name, Files.readAllBytes(p));
            }
        } catch (IOException e) {
            throw new BadInputException(dir + ": cannot read its parts (" + e.getMessage() + ")");
        }
        var it = hashes.fields();
        while (it.hasNext()) {
            var e = it.next();
            byte[] b = parts.get(e.getKey());
            if (b == null) {
                throw new BadInputException(dir.resolve(e.getKey()) + ": listed in the manifest but missing");
            }
            if (!sha256(b).equals(e.getValue().asText())) {
                throw new BadInputException(dir.resolve(e.getKey()) + ": SHA-256 differs from the manifest's; the"
                        + " bundle was altered or damaged");
            }
        }
        try {
            return thaw(m, parts);
        } catch (IllegalArgumentException | NullPointerException e) {
            throw new BadInputException(manifest + ": " + (e.getMessage() == null ? "incomplete manifest"
                    : e.getMessage()));
        }
    }

    private static Loaded thaw(JsonNode m, Map<String, byte[]> parts) {
        JsonNode s = m.get("shape");
        CohortShape shape = new CohortShape(s.get("source_graph").asBoolean(), texts(s.get("source_names")),
                s.get("target_graph").asBoolean(), texts(s.get("target_names")), texts(s.get("extract")),
                texts(s.get("groups")), s.get("positive").isNull() ? null : s.get("positive").asText(),
                texts(s.path("sites")), texts(s.path("covariates")));
        Map<String, byte[]> imputers = new TreeMap<>();
        for (JsonNode i : m.get("imputers")) {
            imputers.put(i.get("name").asText(), part(parts, i.get("part").asText()));
        }
        List<FrozenPipeline> out = new ArrayList<>();
        for (JsonNode p : m.get("pipelines")) {
            FeatureSet fs = FeatureSet.byLabel(p.get("feature_set").asText());
            if (fs == null) {
                throw new IllegalArgumentException("unknown feature set " + p.get("feature_set"));
            }
            Pipeline pipe = new Pipeline(p.get("imputer").asText(), fs, p.get("classifier").asText());
            List<byte[]> steps = new ArrayList<>();
            p.get("steps").forEach(n -> steps.add(part(parts, n.asText())));
            byte[] imp = fs.needsImputer() ? imputers.get(pipe.imputer()) : null;
            if (fs.needsImputer() && imp == null) {
                throw new IllegalArgumentException("pipeline " + pipe.label() + " names an imputer it does not hold");
            }
            out.add(FinalStage.thaw(pipe, shape, imp, steps, part(parts, p.get("model").asText()), pipe.label()));
        }
        JsonNode iv = m.get("intervals");
        Specs.Significance sig = new Specs.Significance(0, 0, Specs.Metric.BALANCED_ACCURACY, 0.05, List.of(), Specs.Adjustment.NONE, 0.01,
                iv.get("bootstrap").asInt(), iv.get("confidence").asDouble());
        // calibration applies to classifiers whose scores are probabilities, as their method says
        java.util.Set<String> probability = new java.util.TreeSet<>();
        for (JsonNode p : m.get("pipelines")) {
            if ("probability".equals(org.viewgain.classify.ClassifierRegistry.create(p.get("classifier_method")
                    .asText()).scoreKind())) {
                probability.add(p.get("classifier").asText());
            }
        }
        return new Loaded(shape, out, new IndependentResults.Settings(shape.groups(), shape.positive(), sig,
                m.get("seed").asLong(), probability), m);
    }

    private static byte[] part(Map<String, byte[]> parts, String name) {
        byte[] b = parts.get(name);
        if (b == null) {
            throw new IllegalArgumentException("part " + name + " is not in the bundle");
        }
        return b;
    }

    private static List<String> texts(JsonNode a) {
        List<String> out = new ArrayList<>();
        a.forEach(n -> out.add(n.asText()));
        return out;
    }

    private static String text(JsonNode m, String key) {
        JsonNode n = m.get(key);
        return n == null ? null : n.asText();
    }

    static String sha256(byte[] b) {
        try {
            return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(b));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }
}
