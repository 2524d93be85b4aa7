package org.viewgain.run;

import java.io.IOException;
import java.io.UncheckedIOException;
import org.viewgain.spec.IoMessages;

/** One phrase for what stopped a run: out of memory and a full disk by name, a file problem, or the root's message. */
public final class RunFailure {
    private RunFailure() {
    }

    /** The out-of-memory phrase, naming the heap this JVM had so that the advice fits. */
    static String outOfMemory() {
        double gb = Runtime.getRuntime().maxMemory() / (1024.0 * 1024 * 1024);
        return String.format(java.util.Locale.ROOT, "out of memory (the Java heap was %.1f GB; give Java more with"
                + " JAVA_OPTS=-Xmx<size>, use fewer --threads, or select features to shrink the rows)", gb);
    }

    /** One phrase naming the cause: out of memory, disk full, a file problem or the root's message (no class names). */
    public static String describe(Throwable e) {
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
