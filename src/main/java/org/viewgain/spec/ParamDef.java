package org.viewgain.spec;

import java.util.List;
import java.util.Locale;

/**
 * The declaration of one hyperparameter of a method: its name, kind, allowed range or choices and default.
 * Methods publish their parameters so that a spec can be checked before anything runs.
 *
 * @param name         the key used in the spec's {@code fixed:} and {@code grid:} maps
 * @param kind         the value type
 * @param min          smallest allowed number (inclusive), ignored for text
 * @param max          largest allowed number (inclusive), ignored for text
 * @param choices      allowed words for {@link Kind#CHOICE}, or words also allowed beside a number for
 *                     {@link Kind#NUMBER_OR_CHOICE} (e.g. {@code sqrt})
 * @param defaultValue value used when the spec gives none (Integer, Double or String), or null when required
 * @param help         one line for the README and error messages
 */
public record ParamDef(String name, Kind kind, double min, double max, List<String> choices, Object defaultValue,
                       String help) {

    /** Value types a parameter can take. */
    public enum Kind { INTEGER, NUMBER, CHOICE, NUMBER_OR_CHOICE, TEXT,
        /** A file path; relative paths are resolved against the spec file's folder before the method sees them. */
        PATH }

    public ParamDef {
        choices = List.copyOf(choices);
    }

    public static ParamDef integer(String name, int min, int max, Integer def, String help) {
        return new ParamDef(name, Kind.INTEGER, min, max, List.of(), def, help);
    }

    public static ParamDef number(String name, double min, double max, Double def, String help) {
        return new ParamDef(name, Kind.NUMBER, min, max, List.of(), def, help);
    }

    public static ParamDef choice(String name, List<String> choices, String def, String help) {
        return new ParamDef(name, Kind.CHOICE, 0, 0, choices, def, help);
    }

    public static ParamDef numberOrChoice(String name, double min, double max, List<String> words, Object def,
                                          String help) {
        return new ParamDef(name, Kind.NUMBER_OR_CHOICE, min, max, words, def, help);
    }

    public static ParamDef path(String name, String help) {
        return new ParamDef(name, Kind.PATH, 0, 0, List.of(), null, help);
    }

    public static ParamDef text(String name, String def, String help) {
        return new ParamDef(name, Kind.TEXT, 0, 0, List.of(), def, help);
    }

    /**
     * Converts a raw spec value to the parameter's type.
     *
     * @return Integer, Double or String
     * @throws IllegalArgumentException with a message saying what is allowed
     */
    public Object coerce(Object raw) {
        switch (kind) {
            case INTEGER -> {
                if (raw instanceof Number n && n.doubleValue() == Math.rint(n.doubleValue())) {
                    double v = n.doubleValue();
                    if (v >= min && v <= max) {
                        return (int) v;
                    }
                }
                throw new IllegalArgumentException("expected a whole number " + range(min, max));
            }
            case NUMBER -> {
                if (raw instanceof Number n) {
                    double v = n.doubleValue();
                    if (v >= min && v <= max) {
                        return v;
                    }
                }
                throw new IllegalArgumentException("expected a number " + range(min, max));
            }
            case CHOICE -> {
                if (raw instanceof String s && choices.contains(s)) {
                    return s;
                }
                throw new IllegalArgumentException("expected one of " + String.join(", ", choices));
            }
            case NUMBER_OR_CHOICE -> {
                if (raw instanceof Number n) {
                    double v = n.doubleValue();
                    if (v >= min && v <= max) {
                        return v;
                    }
                } else if (raw instanceof String s && choices.contains(s)) {
                    return s;
                }
                throw new IllegalArgumentException("expected a number " + range(min, max)
                        + " or one of " + String.join(", ", choices));
            }
            default -> {
                if (raw instanceof String || raw instanceof Number || raw instanceof Boolean) {
                    return String.valueOf(raw);
                }
                throw new IllegalArgumentException("expected text");
            }
        }
    }

    /** The allowed range in words: "from 1 to 100", "of at least 1.0E-12" (no upper bound), "above 0". */
    static String range(double min, double max) {
        boolean open = max == Double.MAX_VALUE || max == Integer.MAX_VALUE;
        if (min == Double.MIN_VALUE) {
            return open ? "above 0" : "above 0 and at most " + fmt(max);
        }
        return open ? "of at least " + fmt(min) : "from " + fmt(min) + " to " + fmt(max);
    }

    static String fmt(double v) {
        if (v == Math.rint(v) && Math.abs(v) < 1e15) {
            return String.valueOf((long) v);
        }
        return String.format(Locale.ROOT, "%s", v);
    }
}
