package org.viewgain.spec;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Set;

/**
 * Reads an independent cohort: the {@code independent-cohort} section of a run spec, or a whole cohort file given
 * to {@code viewgain apply} (the same keys at the top level). Keys: {@code name}, {@code subjects} (required),
 * {@code id}, {@code group} (absent: no labels), {@code site}, and {@code views} with {@code source} (required) and
 * {@code target} (optional), each view with the keys of {@code views.source}.
 */
public final class IndependentKeys {
    /** The run spec key of the section. */
    public static final String KEY = "independent-cohort";
    static final Set<String> KEYS = Set.of("name", "subjects", "id", "group", "site", "views");

    private IndependentKeys() {
    }

    /** The section of a run spec, or null when absent (problems recorded). */
    static Specs.Independent read(Section top, Path base) {
        if (!top.has(KEY)) {
            return null;
        }
        Section s = top.section(KEY, true);
        return s.node == null ? null : section(s, base);
    }

    private static Specs.Independent section(Section s, Path base) {
        s.allowOnly(KEYS);
        String name = s.text("name", "independent", false);
        if (name != null && !name.matches("[A-Za-z0-9][A-Za-z0-9._-]{0,79}")) {
            s.problems.add(s.key("name"), "'" + name + "': use letters, digits, '.', '_' or '-' (at most 80)");
        }
        String subjects = s.text("subjects", null, true);
        String id = s.text("id", "subject", false);
        String group = s.text("group", null, false);
        String site = s.text("site", null, false);
        if (group != null && group.equals(id)) {
            s.problems.add(s.key("group"), "'" + group + "' is also the id column; the group column must differ");
        }
        if (group != null && group.equals(site)) {
            s.problems.add(s.key("site"), "'" + site + "' is also the group column; a site column must differ");
        }
        Section views = s.section("views", true);
        views.allowOnly(Set.of("source", "target"));
        Specs.View source = ViewKeys.read(views, "source", base, true);
        Specs.View target = ViewKeys.read(views, "target", base, false);
        if (subjects == null || source == null) {
            return null;
        }
        return new Specs.Independent(name, base.resolve(subjects).normalize(), id, group, site, source, target,
                s.path);
    }

    /** Loads a cohort file for {@code viewgain apply}; every problem is reported together with its key and line. */
    public static Specs.Independent load(Path file) {
        String text;
        try {
            text = Files.readString(file, StandardCharsets.UTF_8);
        } catch (IOException e) {
            String why = Files.isDirectory(file) ? "it is a folder" : IoMessages.ioProblem(e);
            throw new BadInputException(file + ": cannot read the cohort file (" + why + ")", e);
        }
        YamlTree.Parsed parsed = YamlTree.parse(text, file.toString());
        JsonNode root = parsed.root();
        if (root == null || !root.isObject()) {
            throw new BadInputException(file + ": a cohort file must be a YAML mapping of keys (subjects, views, ...),"
                    + " found " + Section.describe(root));
        }
        Problems problems = new Problems(parsed.where());
        Specs.Independent out = section(new Section(root, "", problems), file.toAbsolutePath().getParent());
        problems.throwIfAny();
        return new Specs.Independent(out.name(), out.subjects(), out.id(), out.group(), out.site(), out.source(),
                out.target(), file.toString());
    }

    /** {@code bundle: true|false} of a run spec (false when absent). */
    static boolean bundle(Section top) {
        if (!top.has("bundle")) {
            return false;
        }
        JsonNode n = top.node.get("bundle");
        if (!n.isBoolean()) {
            top.problems.add("bundle", "expected true or false, found " + Section.describe(n));
            return false;
        }
        return n.asBoolean();
    }
}
