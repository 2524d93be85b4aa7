package org.viewgain.spec;

import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonToken;
import com.fasterxml.jackson.core.StreamReadFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.dataformat.yaml.YAMLFactory;
import java.io.IOException;
import java.util.ArrayDeque;
import java.util.Deque;
import java.util.HashMap;
import java.util.Map;

/** Reads a YAML document into a Jackson tree plus the line of every key path. */
final class YamlTree {
    private YamlTree() {
    }

    record Parsed(JsonNode root, SourceMap where) {
    }

    static Parsed parse(String text, String fileName) {
        YAMLFactory factory = YAMLFactory.builder().enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION).build();
        ObjectMapper mapper = new ObjectMapper(factory);
        try {
            JsonNode root = mapper.readTree(text);
            return new Parsed(root, new SourceMap(fileName, lines(factory, text)));
        } catch (IOException e) {
            throw new BadInputException(YamlProblem.describe(e, fileName));
        }
    }

    private static Map<String, Integer> lines(YAMLFactory factory, String text) throws IOException {
        Map<String, Integer> out = new HashMap<>();
        Deque<String> path = new ArrayDeque<>();
        Deque<int[]> arrayIndex = new ArrayDeque<>();
        Deque<Boolean> inArray = new ArrayDeque<>();
        try (JsonParser p = factory.createParser(text)) {
            JsonToken t;
            String pending = null;
            while ((t = p.nextToken()) != null) {
                int line = p.currentTokenLocation().getLineNr();
                if (t == JsonToken.FIELD_NAME) {
                    String parent = path.isEmpty() ? "" : path.peek();
                    pending = parent.isEmpty() ? p.currentName() : parent + "." + p.currentName();
                    out.putIfAbsent(pending, line);
                    continue;
                }
                String here;
                if (!inArray.isEmpty() && inArray.peek()) {
                    int idx = arrayIndex.peek()[0];
                    if (t != JsonToken.END_ARRAY) {
                        arrayIndex.peek()[0]++;
                    }
                    here = path.peek() + "[" + idx + "]";
                    if (t != JsonToken.END_ARRAY) {
                        out.putIfAbsent(here, line);
                    }
                } else {
                    here = pending == null ? "" : pending;
                }
                if (t == JsonToken.START_OBJECT) {
                    path.push(here);
                    inArray.push(false);
                } else if (t == JsonToken.START_ARRAY) {
                    path.push(here);
                    inArray.push(true);
                    arrayIndex.push(new int[] {0});
                } else if (t == JsonToken.END_OBJECT) {
                    path.pop();
                    inArray.pop();
                } else if (t == JsonToken.END_ARRAY) {
                    path.pop();
                    inArray.pop();
                    arrayIndex.pop();
                }
                pending = null;
            }
        }
        return out;
    }
}
