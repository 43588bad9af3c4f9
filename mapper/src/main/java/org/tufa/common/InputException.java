package org.tufa.common;

/**
 * A problem with what the user gave us (a file, an option, a line of a rule file): never a bug in tufa.
 *
 * <p>The message is one line that names the place (file, line, column) and says what to do; the command line
 * prints it as it is and exits non-zero, without a stack trace. Control characters that user text quoted in the
 * message may carry (a line break in a header, the bytes of a binary file) are replaced by {@code ?}
 * ({@link Printable#line}), so the message stays one printable line whatever the input.
 */
public class InputException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    public InputException(String message) {
        super(Printable.line(message));
    }

    public InputException(String message, Throwable cause) {
        super(Printable.line(message), cause);
    }

    /** A problem at a place in a file: {@code file:line: message}. Line numbers start at 1. */
    public static InputException at(java.nio.file.Path file, long line, String message) {
        return new InputException(file + ":" + line + ": " + message);
    }

    /** A problem with a whole file: {@code file: message}. */
    public static InputException in(java.nio.file.Path file, String message) {
        return new InputException(file + ": " + message);
    }
}
