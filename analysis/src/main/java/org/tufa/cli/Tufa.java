package org.tufa.cli;

import java.io.PrintWriter;
import org.tufa.common.InputException;
import org.tufa.common.OutputFiles;
import org.tufa.common.Printable;
import picocli.CommandLine;
import picocli.CommandLine.Command;

/** The {@code tufa} command: one subcommand per pipeline stage, plus {@code demo} for the whole job. */
@Command(
        name = "tufa",
        mixinStandardHelpOptions = true,
        versionProvider = Tufa.Version.class,
        description = "Terminal Unit Fleet Analysis: point list to Brick model to per-unit fault candidates.",
        subcommands = {org.tufa.mapper.cli.MapCommand.class, CoverageCommand.class, QueryCommand.class,
                AnalyzeCommand.class, EvaluateCommand.class, LabelsCommand.class, DiagnoseCommand.class, DemoCommand.class,
                LoadCommand.class, ServeCommand.class, CommandLine.HelpCommand.class})
public final class Tufa implements Runnable {

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public void run() {
        throw new CommandLine.ParameterException(spec.commandLine(), "Missing subcommand: try 'tufa --help'.");
    }

    public static void main(String[] args) {
        System.exit(execute(args, new PrintWriter(System.out, true), new PrintWriter(System.err, true)));
    }

    /** Runs the command line with the given streams; used by main and by tests. */
    public static int execute(String[] args, PrintWriter out, PrintWriter err) {
        // --debug is read here, before picocli, so it works on every subcommand without being declared on each.
        boolean debug = java.util.Arrays.asList(args).contains("--debug");
        String[] rest = java.util.Arrays.stream(args).filter(a -> !a.equals("--debug")).toArray(String[]::new);
        return commandLine(out, err, debug).execute(rest);
    }

    /** The configured command line: our streams, and one-line errors instead of stack traces. */
    static CommandLine commandLine(PrintWriter out, PrintWriter err, boolean debug) {
        return configured(new CommandLine(new Tufa()), out, err, debug);
    }

    /**
     * A command line with tufa's streams and error handling: one-line errors and exit codes instead of stack
     * traces. Also for commands run outside {@code tufa} (the spark module's job).
     */
    public static CommandLine configured(CommandLine cli, PrintWriter out, PrintWriter err, boolean debug) {
        cli.setOut(out);
        cli.setErr(err);
        // A wrong command line is one line too: what is wrong and where the help is, not the whole usage text.
        cli.setParameterExceptionHandler((ex, args) -> {
            CommandLine where = ex.getCommandLine();
            err.println("tufa: " + Printable.line(firstLine(ex.getMessage())) + "; see '"
                    + where.getCommandSpec().qualifiedName() + " --help'");
            return ExitCodes.USAGE;
        });
        cli.setExecutionExceptionHandler((ex, commandLine, parseResult) -> {
            if (ex instanceof InputException) {
                err.println("tufa: " + ex.getMessage());
                return ExitCodes.INPUT_ERROR;
            }
            java.io.IOException io = ioCause(ex);
            if (io != null && !debug) {
                // A file that cannot be read or written (a full disk, a lost mount) is not a bug in tufa.
                err.println("tufa: cannot read or write a file (" + OutputFiles.reason(io) + "); check the paths, "
                        + "the free disk space and the permissions");
                return ExitCodes.INPUT_ERROR;
            }
            if (debug) {
                ex.printStackTrace(err);
            }
            err.println("tufa: internal error (" + ex.getClass().getSimpleName() + ": " + ex.getMessage()
                    + "); please report it with the command you ran" + (debug ? "" : ", rerun with --debug for details"));
            return ExitCodes.INTERNAL_ERROR;
        });
        return cli;
    }

    private static java.io.IOException ioCause(Throwable e) {
        for (Throwable t = e; t != null; t = t.getCause()) {
            if (t instanceof java.io.IOException io) {
                return io;
            }
        }
        return null;
    }

    private static String firstLine(String message) {
        return message == null ? "" : message.lines().findFirst().orElse("").strip();
    }

    /** Reads the version Maven wrote into the jar manifest. */
    static final class Version implements CommandLine.IVersionProvider {
        @Override
        public String[] getVersion() {
            String v = Tufa.class.getPackage().getImplementationVersion();
            return new String[] {"tufa " + (v == null ? "(development build)" : v)};
        }
    }
}
