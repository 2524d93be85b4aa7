package org.viewgain.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import picocli.CommandLine;

/**
 * Command-line usage mistakes (unknown command or option, missing or bad value) as error lines that start like
 * every other error ({@code viewgain: }), with the nearest command or option when one is close, and a pointer to
 * the command's help instead of the whole usage text. Exit code 2.
 */
final class UsageErrors implements CommandLine.IParameterExceptionHandler {
    /** Prefix of every error line the tool prints. */
    static final String PREFIX = "viewgain: ";

    @Override
    public int handleParseException(CommandLine.ParameterException ex, String[] args) {
        CommandLine cl = ex.getCommandLine();
        PrintWriter err = cl.getErr();
        err.println(PREFIX + message(ex, cl));
        err.println(PREFIX + "see '" + cl.getCommandSpec().qualifiedName() + " --help'");
        err.flush();
        return ErrorHandler.BAD_INPUT;
    }

    private static String message(CommandLine.ParameterException ex, CommandLine cl) {
        if (ex instanceof CommandLine.UnmatchedArgumentException u && !u.getUnmatched().isEmpty()) {
            String first = u.getUnmatched().get(0);
            List<String> commands = new ArrayList<>(cl.getSubcommands().keySet());
            if (!first.startsWith("-") && !commands.isEmpty() && (cl.getParseResult() == null || !cl.getParseResult().hasSubcommand())) {
                return "unknown command '" + first + "'" + nearest(first, commands) + " (commands: "
                        + String.join(", ", commands) + ")";
            }
            if (first.startsWith("-")) {
                String name = first.contains("=") ? first.substring(0, first.indexOf('=')) : first;
                List<String> options = new ArrayList<>(cl.getCommandSpec().optionsMap().keySet());
                return "unknown option '" + name + "' for '" + cl.getCommandSpec().qualifiedName() + "'"
                        + nearest(name, options);
            }
            return "unexpected argument" + (u.getUnmatched().size() > 1 ? "s " : " ") + "'"
                    + String.join("', '", u.getUnmatched()) + "'";
        }
        String m = oneLine(ex.getMessage());
        java.util.regex.Matcher help = java.util.regex.Pattern.compile("Unknown subcommand '(.*)'\\.?").matcher(m);
        if (help.matches()) { // 'viewgain help rnu'
            CommandLine top = cl.getParent() != null ? cl.getParent() : cl;
            List<String> commands = new ArrayList<>(top.getSubcommands().keySet());
            return "unknown command '" + help.group(1) + "'" + nearest(help.group(1), commands) + " (commands: "
                    + String.join(", ", commands) + ")";
        }
        // picocli's sentences start with a capital; ours do not
        return m.length() > 1 && Character.isUpperCase(m.charAt(0)) && Character.isLowerCase(m.charAt(1))
                ? Character.toLowerCase(m.charAt(0)) + m.substring(1) : m;
    }

    /** "; did you mean 'x'?" for the closest candidate within a small edit distance, else "". */
    static String nearest(String given, List<String> candidates) {
        String best = candidates.stream().min(Comparator.comparingInt(c -> distance(given, c))).orElse(null);
        if (best == null || distance(given, best) > Math.max(2, best.length() / 3)) {
            return "";
        }
        return "; did you mean '" + best + "'?";
    }

    /** Levenshtein distance, counting a swap of two neighbours as one edit (Damerau's restricted form). */
    static int distance(String a, String b) {
        int[][] d = new int[a.length() + 1][b.length() + 1];
        for (int i = 0; i <= a.length(); i++) {
            d[i][0] = i;
        }
        for (int j = 0; j <= b.length(); j++) {
            d[0][j] = j;
        }
        for (int i = 1; i <= a.length(); i++) {
            for (int j = 1; j <= b.length(); j++) {
                int cost = a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1;
                d[i][j] = Math.min(Math.min(d[i - 1][j] + 1, d[i][j - 1] + 1), d[i - 1][j - 1] + cost);
                if (i > 1 && j > 1 && a.charAt(i - 1) == b.charAt(j - 2) && a.charAt(i - 2) == b.charAt(j - 1)) {
                    d[i][j] = Math.min(d[i][j], d[i - 2][j - 2] + 1);
                }
            }
        }
        return d[a.length()][b.length()];
    }

    static String oneLine(String s) {
        return s == null ? "bad usage" : s.replaceAll("\\s*[\\r\\n]+\\s*", " ").strip();
    }
}
