package org.viewgain.fuzz;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.fasterxml.jackson.dataformat.yaml.YAMLMapper;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.math.BigDecimal;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;

/**
 * Structural mutations of a YAML spec: a node of the parsed tree replaced by a value of another shape or type
 * (a mapping where a list belongs, a huge number where a word belongs, ...), a key removed or a key added.
 */
final class Shapes {
    private static final JsonNodeFactory F = JsonNodeFactory.instance;
    private static final YAMLMapper YAML = new YAMLMapper();

    /** Keys and words of the spec language, so that random shapes often land on meaningful paths. */
    static final List<String> WORDS = List.of("experiment", "seed", "cohort", "subjects", "id", "group", "groups",
            "positive", "site", "covariates", "views", "source", "target", "matrices", "table", "missing", "tolerance",
            "features", "extract", "scale", "imputers", "imputed-for-training", "feature-sets", "classifiers", "name",
            "method", "fixed", "grid", "class", "options", "validation", "outer", "inner", "scheme", "folds",
            "repeats", "tune-by", "k", "alpha", "trees", "features-per-split", "C", "gamma", "max-depth",
            "min-node-size", "components", "weights", "lambda", "mean", "nearest-neighbours", "ridge", "pls",
            "random-forest", "svm-linear", "svm-rbf", "knn", "lda", "logistic", "weka", "allowed", "not-allowed",
            "stratified-k-fold", "leave-one-out", "leave-site-out", "balanced-accuracy", "auc", "source+imputed",
            "source+target", "imputed", "edges", "strength", "standardize", "none", "cross-fitted", "observed",
            "control", "patient", "sqrt", "log2", "subjects.csv", "src.csv", "tgt.csv", "mats/{subject}.csv",
            "{subject}", "../..", "/dev/null", "/", "", " ", "\u0000", "é", "日本", "a\nb",
            "weka.classifiers.trees.J48",
            "java.lang.String", "-C 0.25", "-Q", "age", "NaN", "1e999");

    private Shapes() {
    }

    /** One structural edit: which node (index in document order), what to do, and the replacement value. */
    record TreeEdit(int node, int action, JsonNode value) {
    }

    static Arbitrary<List<TreeEdit>> edits(int max) {
        return Combinators.combine(Arbitraries.integers().between(0, 10_000), Arbitraries.integers().between(0, 3),
                values(3)).as(TreeEdit::new).list().ofMinSize(1).ofMaxSize(max);
    }

    /** Random YAML values up to {@code depth} levels of nesting. */
    static Arbitrary<JsonNode> values(int depth) {
        Arbitrary<JsonNode> scalar = Arbitraries.oneOf(
                Arbitraries.of(WORDS).map(F::textNode),
                Arbitraries.strings().ofMaxLength(12).map(F::textNode),
                Arbitraries.integers().map(i -> (JsonNode) F.numberNode(i)),
                Arbitraries.longs().map(l -> (JsonNode) F.numberNode(l)),
                Arbitraries.of(new BigInteger("123456789012345678901234567890"), BigInteger.TWO.pow(63).negate()
                        .subtract(BigInteger.ONE)).map(b -> (JsonNode) F.numberNode(b)),
                Arbitraries.of(0.0, -0.0, 1e-300, 1e308, -1e308, Double.NaN, Double.POSITIVE_INFINITY,
                        Double.NEGATIVE_INFINITY, 0.5, 2.5, 1e6).map(d -> (JsonNode) F.numberNode(d)),
                Arbitraries.just(F.numberNode(new BigDecimal("1e400"))),
                Arbitraries.of(true, false).map(b -> (JsonNode) F.booleanNode(b)),
                Arbitraries.just(F.nullNode()));
        if (depth <= 0) {
            return scalar;
        }
        Arbitrary<JsonNode> inner = values(depth - 1);
        Arbitrary<JsonNode> list = inner.list().ofMaxSize(3).map(items -> {
            ArrayNode a = F.arrayNode();
            items.forEach(a::add);
            return a;
        });
        Arbitrary<JsonNode> map = Combinators.combine(Arbitraries.of(WORDS), inner).as(List::<Object>of).list()
                .ofMaxSize(3).map(pairs -> {
                    ObjectNode o = F.objectNode();
                    pairs.forEach(p -> o.set((String) p.get(0), (JsonNode) p.get(1)));
                    return o;
                });
        return Arbitraries.frequencyOf(net.jqwik.api.Tuple.of(6, scalar), net.jqwik.api.Tuple.of(2, list),
                net.jqwik.api.Tuple.of(2, map));
    }

    /** The spec text after the edits, written back as YAML. */
    static String apply(String specText, List<TreeEdit> edits) {
        try {
            JsonNode root = YAML.readTree(specText);
            for (TreeEdit e : edits) {
                root = apply(root, e);
            }
            return YAML.writeValueAsString(root);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** A whole random document (the root itself of any shape). */
    static String document(JsonNode root) {
        try {
            return YAML.writeValueAsString(root);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private static JsonNode apply(JsonNode root, TreeEdit e) {
        List<JsonNode> parents = new ArrayList<>();
        collect(root, parents);
        if (parents.isEmpty()) {
            return e.value();
        }
        JsonNode parent = parents.get(e.node() % parents.size());
        if (parent instanceof ObjectNode o) {
            List<String> keys = new ArrayList<>();
            o.fieldNames().forEachRemaining(keys::add);
            String key = keys.isEmpty() ? "x" : keys.get(e.node() % keys.size());
            switch (e.action()) {
                case 0 -> o.remove(key);
                case 1 -> o.set(WORDS.get(e.node() % WORDS.size()), e.value());
                default -> o.set(key, e.value());
            }
        } else if (parent instanceof ArrayNode a && !a.isEmpty()) {
            int i = e.node() % a.size();
            switch (e.action()) {
                case 0 -> a.remove(i);
                case 1 -> a.insert(i, e.value());
                default -> a.set(i, e.value());
            }
        }
        return root;
    }

    private static void collect(JsonNode n, List<JsonNode> out) {
        if (n.isContainerNode()) {
            out.add(n);
            n.elements().forEachRemaining(c -> collect(c, out));
        }
    }
}
