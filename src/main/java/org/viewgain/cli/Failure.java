package org.viewgain.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.time.Instant;
import org.viewgain.report.Provenance;
import org.viewgain.report.RunFolder;
import org.viewgain.spec.BadInputException;
import org.viewgain.spec.IoMessages;
import picocli.CommandLine;

/**
 * A run that stopped with an error: marks run.json {@code failed}, says in one line what happened (out of memory and
 * a full disk by name) and how to continue, and returns exit code 1. The journal keeps every finished unit.
 */
final class Failure {
    private Failure() {
    }

    static int report(CommandLine cl, Common common, RunFolder folder, Provenance prov, Throwable e) {
        if (e instanceof BadInputException bad) {
            throw bad;
        }
        String what = describe(e);
        String resume = "viewgain run --resume " + folder.dir();
        try {
            prov.put("status", "failed").put("error", what).put("resume_with", resume)
                    .put("finished_at", Instant.now().toString());
            folder.writeText("run.json", prov.toJson());
        } catch (IOException | RuntimeException | OutOfMemoryError ignored) {
            // run.json still says running: a run that is not complete is never mistaken for one
        }
        PrintWriter err = cl.getErr();
        err.println("viewgain: the run failed: " + what + "; finished units are kept, continue with '" + resume + "'");
        if (common.verbose) {
            e.printStackTrace(err);
        }
        err.flush();
        return ErrorHandler.FAILED;
    }

    /** The out-of-memory phrase, naming the heap this JVM had so that the advice fits. */
    static String outOfMemory() {
        double gb = Runtime.getRuntime().maxMemory() / (1024.0 * 1024 * 1024);
        return String.format(java.util.Locale.ROOT, "out of memory (the Java heap was %.1f GB; give Java more with"
                + " JAVA_OPTS=-Xmx<size>, use fewer --threads, or select features to shrink the rows)", gb);
    }

    /** One phrase naming the cause: out of memory, disk full, a file problem or the root's message (no class names). */
    static String describe(Throwable e) {
        Throwable root = e;
        boolean io = false;
        while (true) {
            io |= root instanceof IOException || root instanceof UncheckedIOException;
            if (root instanceof OutOfMemoryError) {
                return outOfMemory();
            }
            String m = root.getMessage();
            if (m != null && m.contains("No space left on device")) {
                return "disk full (" + m + ")";
            }
            if (root.getCause() == null || root.getCause() == root) {
                break;
            }
            root = root.getCause();
        }
        if (root instanceof IOException ioe) {
            String file = ioe instanceof java.nio.file.FileSystemException fs && fs.getFile() != null
                    ? fs.getFile() + ": " : "";
            return "cannot write or read a file: " + file + IoMessages.ioProblem(ioe);
        }
        String m = root.getMessage() == null ? "" : IoMessages.withoutClassNames(root.getMessage());
        return (io ? "cannot write or read a file" : "an internal error") + (m.isEmpty() ? "" : ": " + m);
    }
}
