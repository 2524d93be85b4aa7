package org.viewgain.spec;

import java.io.IOException;
import java.nio.file.AccessDeniedException;
import java.nio.file.FileSystemException;
import java.nio.file.NoSuchFileException;
import java.nio.file.NotDirectoryException;
import java.util.regex.Pattern;

/** Says what went wrong with a file in words a user knows, never by Java exception class names. */
public final class IoMessages {
    private static final Pattern CLASS_NAME =
            Pattern.compile("(?:[a-z_$][\\w$]*\\.)+[A-Z][\\w$]*(?:Exception|Error)(?::\\s*)?");

    private IoMessages() {
    }

    /** A short phrase for an I/O failure, e.g. "no such file", "permission denied", "is a directory". */
    public static String ioProblem(IOException e) {
        if (e instanceof NoSuchFileException) {
            return "no such file";
        }
        if (e instanceof AccessDeniedException) {
            return "permission denied";
        }
        if (e instanceof NotDirectoryException) {
            return "a folder on the path is a file";
        }
        if (e instanceof FileSystemException fs && fs.getReason() != null) {
            return fs.getReason();
        }
        return e.getMessage() == null ? "an input/output error" : withoutClassNames(e.getMessage());
    }

    /** The text with qualified Java exception class names removed and line breaks folded into one line. */
    public static String withoutClassNames(String message) {
        if (message == null) {
            return "(no detail)";
        }
        return CLASS_NAME.matcher(message).replaceAll("").replaceAll("\\s*[\\r\\n]+\\s*", " ").strip();
    }
}
