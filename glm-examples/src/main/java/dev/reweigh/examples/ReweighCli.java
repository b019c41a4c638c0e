package dev.reweigh.examples;

import dev.reweigh.core.Reweigh;
import dev.reweigh.families.ReweighException;
import picocli.CommandLine;
import picocli.CommandLine.Command;

import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;

/**
 * The command-line front end: {@code java -jar reweigh.jar <command>} with the commands
 * {@code fit}, {@code score} and {@code demo}.
 *
 * <p>Exit status: 0 on success; 2 for bad input (an unreadable or malformed file, an unknown
 * column, family, link or level, a value the model cannot use, a wrong option), with a one-line
 * message on standard error naming the file, column, row and value; 1 for an unexpected internal
 * error (also one line, never a stack trace).
 *
 * <pre>{@code
 * int status = ReweighCli.run(new String[] {"fit", "--data", "claims.csv", "--response", "claims",
 *         "--family", "poisson", "--factor", "region", "--log-offset", "exposure", "--json"},
 *         new PrintWriter(System.out, true), new PrintWriter(System.err, true));
 * }</pre>
 *
 * @since 0.1
 */
@Command(name = "reweigh", mixinStandardHelpOptions = true, versionProvider = ReweighCli.Version.class,
        description = "Fits, scores and demonstrates generalized linear models for insurance pricing.",
        subcommands = {FitCommand.class, ScoreCommand.class, DemoCommand.class, CommandLine.HelpCommand.class})
public final class ReweighCli implements Runnable {
    /** Exit status for bad input and usage errors. */
    public static final int BAD_INPUT = 2;
    /** Exit status for an unexpected internal error. */
    public static final int INTERNAL_ERROR = 1;

    @CommandLine.Spec
    private CommandLine.Model.CommandSpec spec;

    /**
     * Creates the top-level command (picocli instantiates it).
     *
     * @since 0.1
     */
    public ReweighCli() {
    }

    /**
     * Runs the command line and exits the JVM with its status.
     *
     * @param args the arguments
     * @since 0.1
     */
    public static void main(String[] args) {
        System.setProperty("java.awt.headless", "true");
        PrintWriter out = new PrintWriter(new java.io.OutputStreamWriter(System.out, StandardCharsets.UTF_8), true);
        PrintWriter err = new PrintWriter(new java.io.OutputStreamWriter(System.err, StandardCharsets.UTF_8), true);
        System.exit(run(args, out, err));
    }

    /**
     * Runs the command line in this JVM, writing to the given streams (which are flushed, not
     * closed).
     *
     * @param args the arguments
     * @param out standard output
     * @param err standard error
     * @return the exit status: 0 success, 2 bad input or usage, 1 internal error
     * @since 0.1
     */
    public static int run(String[] args, PrintWriter out, PrintWriter err) {
        CommandLine cl = new CommandLine(new ReweighCli());
        cl.setOut(out);
        cl.setErr(err);
        cl.setCaseInsensitiveEnumValuesAllowed(true);
        cl.setParameterExceptionHandler(ReweighCli::usageError);
        cl.setExecutionExceptionHandler(ReweighCli::failure);
        try {
            return cl.execute(args);
        } finally {
            out.flush();
            err.flush();
        }
    }

    /**
     * Without a command, shows the usage.
     */
    @Override
    public void run() {
        spec.commandLine().usage(spec.commandLine().getOut());
    }

    private static int usageError(CommandLine.ParameterException e, String[] args) {
        CommandLine cmd = e.getCommandLine();
        String name = cmd.getCommandSpec().qualifiedName();
        cmd.getErr().println(name + ": " + oneLine(e.getMessage()) + " (see '" + name + " --help')");
        return BAD_INPUT;
    }

    private static int failure(Exception e, CommandLine cmd, CommandLine.ParseResult parsed) {
        String name = cmd.getCommandSpec().qualifiedName();
        if (e instanceof ReweighException || e instanceof IllegalArgumentException) {
            cmd.getErr().println(name + ": " + oneLine(e.getMessage()));
            return BAD_INPUT;
        }
        if (e instanceof UncheckedIOException) {
            cmd.getErr().println(name + ": cannot write output: " + oneLine(e.getCause().getMessage()));
            return BAD_INPUT;
        }
        cmd.getErr().println(name + ": internal error (" + e.getClass().getSimpleName() + "): "
                + oneLine(String.valueOf(e.getMessage())) + "; please report it");
        return INTERNAL_ERROR;
    }

    static String oneLine(String text) {
        return text == null ? "" : text.replaceAll("[\\r\\n]+", " ").strip();
    }

    /** Reports the library version for {@code --version}. */
    static final class Version implements CommandLine.IVersionProvider {
        @Override
        public String[] getVersion() {
            return new String[] {"reweigh " + Reweigh.version()};
        }
    }
}
