package org.viewgain.engine;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.NullNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.util.ArrayList;
import java.util.List;

/**
 * Turns finished work units into journal records and back, exactly: doubles are written with
 * {@link Double#toString(double)} as text (which {@link Double#parseDouble} reads back to the same value, NaN and
 * infinities included), pipelines by their index in the experiment's pipeline list.
 */
final class UnitCodec {
    private static final ObjectMapper JSON = new ObjectMapper();
    private final Experiment ex;

    UnitCodec(Experiment ex) {
        this.ex = ex;
    }

    /** The journal record of a finished unit; {@code value} is the result its kind produces. */
    ObjectNode encode(WorkUnit u, Object value) {
        String key = u.key();
        if (u instanceof WorkUnit.Imputation) {
            return imputer(key, (ImputerSummary) value);
        }
        if (u instanceof WorkUnit.Classifier) {
            return classifier(key, (ClassifierStage.Output) value);
        }
        if (u instanceof WorkUnit.Final) {
            return finalUnit(key, (FinalStage.Unit) value);
        }
        return permutation(key, (Double) value);
    }

    /** The result a journal record of unit {@code u} holds (the inverse of {@link #encode}). */
    Object decode(WorkUnit u, JsonNode rec) {
        if (u instanceof WorkUnit.Imputation) {
            return imputer(rec);
        }
        if (u instanceof WorkUnit.Classifier) {
            return classifier(rec);
        }
        if (u instanceof WorkUnit.Final) {
            return finalUnit(rec);
        }
        return permutation(rec);
    }

    /** A final unit's record: its choice and its frozen parts in Base64 (exact bytes). */
    private ObjectNode finalUnit(String key, FinalStage.Unit u) {
        ObjectNode o = record(key);
        o.set("choice", choice(u.choice()));
        ArrayNode steps = o.putArray("steps");
        java.util.Base64.Encoder b64 = java.util.Base64.getEncoder();
        u.steps().forEach(b -> steps.add(b64.encodeToString(b)));
        o.put("model", b64.encodeToString(u.model()));
        return o;
    }

    private FinalStage.Unit finalUnit(JsonNode o) {
        java.util.Base64.Decoder b64 = java.util.Base64.getDecoder();
        List<byte[]> steps = new ArrayList<>();
        o.get("steps").forEach(n -> steps.add(b64.decode(n.asText())));
        return new FinalStage.Unit(choice(o.get("choice")), steps, b64.decode(o.get("model").asText()));
    }

    /**
     * What phase one reports of one imputer in one outer fold: the choice, the quality rows and the per-feature error
     * sums (null when no test subject had an observed target).
     */
    record ImputerSummary(RunResults.Choice choice, List<RunResults.ImputationRow> quality,
                          RunResults.EdgeErrors edgeErrors) {
    }

    private ObjectNode imputer(String key, ImputerSummary s) {
        ObjectNode o = record(key);
        o.set("choice", choice(s.choice()));
        ArrayNode rows = o.putArray("quality");
        for (RunResults.ImputationRow q : s.quality()) {
            ArrayNode a = rows.addArray();
            a.add(q.imputer()).add(q.repeat()).add(q.fold()).add(q.subject()).add(d(q.mae())).add(d(q.rmse()))
                    .add(d(q.pearsonR())).add(d(q.strengthMae())).add(d(q.skill()));
        }
        RunResults.EdgeErrors e = s.edgeErrors();
        if (e != null) {
            o.putArray("edge_errors").add(e.imputer()).add(e.repeat()).add(e.fold()).add(e.subjects())
                    .add(doubles(e.sum()));
        }
        return o;
    }

    private ImputerSummary imputer(JsonNode o) {
        List<RunResults.ImputationRow> rows = new ArrayList<>();
        for (JsonNode a : o.get("quality")) {
            rows.add(new RunResults.ImputationRow(a.get(0).asText(), a.get(1).asInt(), a.get(2).asInt(),
                    a.get(3).asInt(), d(a.get(4)), d(a.get(5)), d(a.get(6)), d(a.get(7)), d(a.get(8))));
        }
        JsonNode e = o.get("edge_errors");
        RunResults.EdgeErrors edges = e == null ? null : new RunResults.EdgeErrors(e.get(0).asText(),
                e.get(1).asInt(), e.get(2).asInt(), e.get(3).asInt(), doubles(e.get(4)));
        return new ImputerSummary(choice(o.get("choice")), rows, edges);
    }

    private ObjectNode classifier(String key, ClassifierStage.Output out) {
        ObjectNode o = record(key);
        ArrayNode preds = o.putArray("predictions");
        for (RunResults.Prediction p : out.predictions()) {
            ArrayNode a = preds.addArray();
            a.add(index(p.pipeline())).add(p.repeat()).add(p.fold()).add(p.subject()).add(p.truth())
                    .add(p.predicted()).add(d(p.score()));
            a.add(doubles(p.scores()));
        }
        o.set("choice", out.choice() == null ? NullNode.getInstance() : choice(out.choice()));
        Importance.Fold f = out.importance();
        if (f != null) {
            ObjectNode imp = o.putObject("importance");
            imp.put("pipeline", index(f.pipeline())).put("repeat", f.repeat()).put("fold", f.fold())
                    .put("selected", f.selected()).put("kind", f.kind());
            // the names are written only when they are not the feature set's own (selection): 71,556 names per
            // unit would dominate the journal at 268 regions
            if (!f.inputNames().equals(ex.data().featureNames(f.pipeline().featureSet()))) {
                ArrayNode names = imp.putArray("names");
                f.inputNames().forEach(names::add);
            }
            imp.set("values", doubles(f.values()));
        }
        return o;
    }

    private ClassifierStage.Output classifier(JsonNode o) {
        List<RunResults.Prediction> preds = new ArrayList<>();
        for (JsonNode a : o.get("predictions")) {
            preds.add(new RunResults.Prediction(ex.pipelines().get(a.get(0).asInt()), a.get(1).asInt(),
                    a.get(2).asInt(), a.get(3).asInt(), a.get(4).asInt(), a.get(5).asInt(), d(a.get(6)),
                    doubles(a.get(7))));
        }
        Importance.Fold imp = null;
        JsonNode f = o.get("importance");
        if (f != null && !f.isNull()) {
            Pipeline pipeline = ex.pipelines().get(f.get("pipeline").asInt());
            List<String> names = new ArrayList<>();
            if (f.has("names")) {
                f.get("names").forEach(n -> names.add(n.asText()));
            } else {
                names.addAll(ex.data().featureNames(pipeline.featureSet()));
            }
            imp = new Importance.Fold(pipeline, f.get("repeat").asInt(),
                    f.get("fold").asInt(), f.get("selected").asBoolean(), names, doubles(f.get("values")),
                    text(f.get("kind")));
        }
        JsonNode c = o.get("choice");
        return new ClassifierStage.Output(preds, c == null || c.isNull() ? null : choice(c), imp);
    }

    private ObjectNode permutation(String key, double statistic) {
        ObjectNode o = record(key);
        o.put("statistic", d(statistic));
        return o;
    }

    private static double permutation(JsonNode o) {
        return d(o.get("statistic"));
    }

    private static ObjectNode record(String key) {
        ObjectNode o = JSON.createObjectNode();
        o.put("unit", key);
        return o;
    }

    private int index(Pipeline p) {
        int i = ex.pipelines().indexOf(p);
        if (i < 0) {
            throw new IllegalStateException("unknown pipeline " + p.label());
        }
        return i;
    }

    private static ArrayNode choice(RunResults.Choice c) {
        ArrayNode a = JSON.createArrayNode();
        a.add(c.repeat()).add(c.fold()).add(c.stage()).add(c.imputer()).add(c.featureSet()).add(c.classifier())
                .add(c.params()).add(d(c.innerScore())).add(c.gridSize()).add(c.unconverged());
        return a;
    }

    private static RunResults.Choice choice(JsonNode a) {
        return new RunResults.Choice(a.get(0).asInt(), a.get(1).asInt(), text(a.get(2)), text(a.get(3)),
                text(a.get(4)), text(a.get(5)), text(a.get(6)), d(a.get(7)), a.get(8).asInt(),
                a.size() > 9 ? a.get(9).asInt() : 0); // journals written before the count had nine fields
    }

    private static String text(JsonNode n) {
        return n == null || n.isNull() ? null : n.asText();
    }

    private static String d(double v) {
        return Double.toString(v);
    }

    private static double d(JsonNode n) {
        return Double.parseDouble(n.asText());
    }

    private static JsonNode doubles(double[] v) {
        if (v == null) {
            return com.fasterxml.jackson.databind.node.NullNode.getInstance();
        }
        ArrayNode a = JSON.createArrayNode();
        for (double x : v) {
            a.add(d(x));
        }
        return a;
    }

    private static double[] doubles(JsonNode n) {
        if (n == null || n.isNull()) {
            return null;
        }
        double[] v = new double[n.size()];
        for (int i = 0; i < v.length; i++) {
            v[i] = d(n.get(i));
        }
        return v;
    }
}
