package org.viewgain.spec;

import java.util.ArrayList;
import java.util.List;

/** Collects every problem of a spec so that they are reported together, each naming its key and line. */
public final class Problems {
    private final SourceMap where;
    private final List<String> messages = new ArrayList<>();
    private final java.util.Set<String> misspelled = new java.util.HashSet<>();

    public Problems(SourceMap where) {
        this.where = where;
    }

    public void add(String path, String message) {
        messages.add(where.at(path, message).replace("\r", "\\r").replace("\n", "\\n")); // one line per problem
    }

    /** Notes that an unknown key looks like a misspelling of {@code path}, so checks of that key stay quiet. */
    void misspelled(String path) {
        misspelled.add(path);
    }

    /** True when the key was probably given under a misspelled name (its absence is already reported). */
    boolean wasMisspelled(String path) {
        return misspelled.contains(path);
    }

    public boolean isEmpty() {
        return messages.isEmpty();
    }

    public List<String> messages() {
        return List.copyOf(messages);
    }

    /** Throws one {@link BadInputException} listing every problem, one per line, when there are any. */
    public void throwIfAny() {
        if (!messages.isEmpty()) {
            String head = messages.size() == 1 ? "" : messages.size() + " problems in the spec:" + System.lineSeparator();
            throw new BadInputException(head + String.join(System.lineSeparator(), messages));
        }
    }
}
