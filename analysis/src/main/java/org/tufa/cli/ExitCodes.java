package org.tufa.cli;

/** Exit codes of the {@code tufa} command; README.md lists them for users. */
public final class ExitCodes {
    /** The job ran and its checks passed. */
    public static final int OK = 0;
    /** Bad input: a file, an option value or a rule-file line; the one-line message says which. */
    public static final int INPUT_ERROR = 1;
    /** The command line itself is wrong (unknown option, missing argument); picocli's usage help follows. */
    public static final int USAGE = 2;
    /** The job ran but a check it carries failed: a rule-file expectation, or a fleet with no terminal units. */
    public static final int CHECK_FAILED = 3;
    /** A bug in tufa. The message asks for a report; --debug shows the stack trace. */
    public static final int INTERNAL_ERROR = 70;

    private ExitCodes() {
    }
}
