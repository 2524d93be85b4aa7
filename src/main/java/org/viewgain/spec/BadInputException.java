package org.viewgain.spec;

/**
 * A user's mistake in a spec, a data file or a command line. Its message is one line that names the file, key, line
 * or subject and says what is allowed; the CLI prints it without a stack trace and exits with code 2.
 */
public final class BadInputException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    public BadInputException(String message) {
        super(message);
    }

    public BadInputException(String message, Throwable cause) {
        super(message, cause);
    }
}
