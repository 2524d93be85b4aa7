package org.viewgain.cli;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import picocli.CommandLine;

/** Help text never breaks a file name or path across lines (issue 16), for the root and every command. */
class HelpTextTest {
    /** A word with a '/' or a file extension: results/<experiment>/<run-id>/, DIR/submit.sh, demo.yaml. */
    private static final Pattern FILE_LIKE = Pattern.compile("[\\w<>{}$-]*(?:/[\\w<>{}.$-]*|\\.(?:sh|yaml|csv|json"
            + "|html|jsonl))[\\w<>{}/.$-]*");

    @Test
    void givenEveryCommandsHelp_whenPrinted_thenEveryFileNameOfItsTextsIsOnOneLine() {
        CommandLine root = Main.commandLine();
        List<CommandLine> all = new ArrayList<>(List.of(root));
        all.addAll(root.getSubcommands().values());
        int checked = 0;
        for (CommandLine cl : all) {
            String help = cl.getUsageMessage(CommandLine.Help.Ansi.OFF);
            List<String> texts = new ArrayList<>(List.of(cl.getCommandSpec().usageMessage().description()));
            cl.getCommandSpec().options().forEach(o -> texts.addAll(List.of(o.description())));
            cl.getSubcommands().values().forEach(s -> texts.addAll(List.of(s.getCommandSpec().usageMessage()
                    .description())));
            for (String text : texts) {
                Matcher m = FILE_LIKE.matcher(text.replace("${DEFAULT-VALUE}", ""));
                while (m.find()) {
                    String name = m.group().replaceAll("[.]$", "");
                    if (name.length() < 3) {
                        continue;
                    }
                    checked++;
                    assertFalse(broken(help, name), () -> cl.getCommandName() + " --help breaks '" + name + "':\n"
                            + help);
                }
            }
        }
        assertTrue(checked > 10, "the check saw the file names of the help texts: " + checked);
    }

    /** True when a line ends with the start of {@code name} and the next line begins with the rest of it. */
    static boolean broken(String help, String name) {
        List<String> lines = help.lines().toList();
        for (int i = 0; i + 1 < lines.size(); i++) {
            String a = lines.get(i);
            String b = lines.get(i + 1).stripLeading();
            for (int cut = 1; cut < name.length(); cut++) {
                if (a.endsWith(name.substring(0, cut)) && b.startsWith(name.substring(cut))
                        && (a.length() == cut || !Character.isLetterOrDigit(a.charAt(a.length() - cut - 1)))) {
                    return true;
                }
            }
        }
        return false;
    }

    @Test
    void givenRootHelp_whenPrinted_thenNoLineEndsInsideAFileName() {
        String help = Main.commandLine().getUsageMessage(CommandLine.Help.Ansi.OFF);
        // the break that issue 16 found: "run submit." at the end of one line, "sh on the cluster" on the next
        assertFalse(help.contains("submit.\n"), help);
    }
}
