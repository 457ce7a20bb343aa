package rdstab.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import rdstab.cli.command.CheckCommand;
import rdstab.cli.command.TraceCommand;
import rdstab.cli.command.ConvergeCommand;
import rdstab.cli.command.SimulateCommand;
import rdstab.cli.command.CriticalCommand;
import rdstab.cli.command.MergeCommand;
import rdstab.cli.command.SweepCommand;
import rdstab.cli.command.ExportCommand;
import rdstab.cli.command.SpectrumCommand;
import rdstab.solver.error.ConvergenceException;
import rdstab.solver.error.InputException;

/**
 * Entry point. Exit status: 0 the run completed (whatever the verdict); 2 bad input; 3 numerical
 * failure; 4 input/output failure. Errors are one line on stderr; stack traces only with --debug.
 */
@Command(name = "rdstab", mixinStandardHelpOptions = true, versionProvider = Main.Version.class,
        description = {
            "Is a steady temperature or concentration field stable? rdstab finds the steady state of a "
                + "reaction-diffusion case, linearizes about it and reports the rightmost eigenvalues (shift-invert "
                + "Arnoldi), an energy-method bound beside them, and the verdict with its margin.",
            "",
            "Start with:  rdstab check cases/slab-self-heating.yaml",
            "Case files are YAML; their keys are described in cases/README.md."},
        footerHeading = "%nExit status:%n",
        footer = {"  0  the run completed (whatever the verdict)", "  1  internal error (a bug: please report it)", "  2  bad input (usage, case file, formula, parameter)",
            "  3  numerical failure (no steady state found, eigen-solver did not converge)", "  4  input/output failure",
            "",
            "Limits (every command that reads a case):",
            "  case files up to 1 MiB; formulas up to 10000 characters and 200 levels;",
            "  up to 4,000,000 cells per direction; YAML aliases limited to 20.",
            "  A case file only describes a case: formulas are evaluated by rdstab's",
            "  own parser, a mesh file must lie in the case file's folder, nothing",
            "  else is included or executed, no environment variable is expanded."})
public final class Main implements Runnable {

    /** Exit status: completed. */
    public static final int OK = 0;
    /** Exit status: bad input. */
    public static final int BAD_INPUT = 2;
    /** Exit status: numerical failure. */
    public static final int NUMERICAL = 3;
    /** Exit status: file failure. */
    public static final int IO = 4;

    /**
     * picocli's converters for java.sql and java.time types, which no rdstab option has (MainTest checks): picocli
     * registers them by reflection in every CommandLine it builds, initializing some twenty JDK classes (the
     * java.time date formatters among them) in each run. picocli.converters.excludes is picocli's own switch.
     */
    static final String UNUSED_CONVERTERS = "java\\.(sql|time)\\..*";

    static {
        // netlib's warning that the native ARPACK is missing stays quiet, without starting java.util.logging
        // in runs that never log (QuietNetlibLogging)
        QuietNetlibLogging.install();
        if (System.getProperty("picocli.converters.excludes") == null) {
            System.setProperty("picocli.converters.excludes", UNUSED_CONVERTERS);
        }
    }

    /**
     * The subcommand names, in the order 'rdstab --help' lists them ('help' last); each is the name in its class's
     * {@code @Command} (MainTest checks). Kept as names so that a run reads the annotation of the one command it
     * builds only.
     */
    static final java.util.List<String> SUBCOMMAND_NAMES = java.util.List.of("check", "sweep", "critical", "trace",
            "converge", "simulate", "merge", "export", "spectrum", "help");

    /** The command class of a name in {@link #SUBCOMMAND_NAMES}. */
    static Class<?> subcommand(String name) {
        switch (name) {
            case "check": return CheckCommand.class;
            case "sweep": return SweepCommand.class;
            case "critical": return CriticalCommand.class;
            case "trace": return TraceCommand.class;
            case "converge": return ConvergeCommand.class;
            case "simulate": return SimulateCommand.class;
            case "merge": return MergeCommand.class;
            case "export": return ExportCommand.class;
            case "spectrum": return SpectrumCommand.class;
            case "help": return CommandLine.HelpCommand.class;
            default: throw new IllegalArgumentException("no subcommand " + name);
        }
    }

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public void run() {
        throw new CommandLine.ParameterException(spec.commandLine(), "a command is needed, e.g. 'rdstab check CASE'");
    }

    /** Runs the program and exits with its status. */
    public static void main(String[] args) {
        System.exit(execute(args, new PrintWriter(System.out, true), new PrintWriter(System.err, true)));
    }

    /** Runs with the given writers; returns the exit status (for tests). */
    public static int execute(String[] args, PrintWriter out, PrintWriter err) {
        boolean debug = java.util.Arrays.asList(args).contains("--debug");
        CommandLine cl = commandLine(args.length > 0 ? args[0] : "");
        cl.setOut(out);
        cl.setErr(err);
        cl.setExecutionExceptionHandler(new ExecutionErrors(debug));
        cl.setParameterExceptionHandler(new UsageErrors());
        int code = cl.execute(args);
        out.flush();
        err.flush();
        return code;
    }

    /** The configured command line with every subcommand. */
    public static CommandLine commandLine() {
        return commandLine("");
    }

    /**
     * The configured command line. When {@code first} (the first argument) names a subcommand other than
     * 'help', only that subcommand is built: picocli reflects over every option of every subcommand it is
     * given, and building the whole tree (with the classes it loads) was most of a short run's start-up.
     * Any other first argument ('--help', '--version', a typo) gets the whole tree, so usage and
     * suggestions are unchanged.
     */
    static CommandLine commandLine(String first) {
        CommandLine cl = new CommandLine(new Main());
        boolean one = !first.equals("help") && SUBCOMMAND_NAMES.contains(first);
        for (String name : SUBCOMMAND_NAMES) {
            if (!one || name.equals(first)) {
                cl.addSubcommand(subcommand(name));
            }
        }
        cl.setCaseInsensitiveEnumValuesAllowed(true);
        cl.setUsageHelpAutoWidth(true);
        return cl;
    }

    /*
     * The two handlers are named classes, not lambdas: picocli's interfaces are Java 5 class files, which the
     * class-data archive cannot hold, and a lambda implementing one is spun at run time (about 4 ms of a short
     * run) where a named class is only loaded.
     */

    /** An exception from a command: one line on stderr and the exit status ({@link #handle}). */
    private static final class ExecutionErrors implements CommandLine.IExecutionExceptionHandler {
        private final boolean debug;

        ExecutionErrors(boolean debug) {
            this.debug = debug;
        }

        @Override
        public int handleExecutionException(Exception ex, CommandLine line, CommandLine.ParseResult parsed) {
            return handle(ex, line.getErr(), debug);
        }
    }

    /** A usage error: the message and where to find the options, exit status 2. */
    private static final class UsageErrors implements CommandLine.IParameterExceptionHandler {
        @Override
        public int handleParseException(CommandLine.ParameterException ex, String[] args) {
            PrintWriter e = ex.getCommandLine().getErr();
            e.println("rdstab: " + ex.getMessage());
            e.println("Try '" + ex.getCommandLine().getCommandSpec().qualifiedName() + " --help' for the options.");
            e.flush();
            return BAD_INPUT;
        }
    }

    static int handle(Exception ex, PrintWriter err, boolean debug) {
        int code;
        String msg;
        if (ex instanceof InputException) {
            code = BAD_INPUT;
            msg = ex.getMessage();
        } else if (ex instanceof ConvergenceException) {
            code = NUMERICAL;
            msg = ex.getMessage();
        } else if (ex instanceof IOException || ex instanceof UncheckedIOException) {
            code = IO;
            msg = ex.getMessage();
        } else if (ex instanceof IllegalArgumentException) {
            code = BAD_INPUT;
            msg = ex.getMessage();
        } else {
            code = 1;
            msg = "internal error (" + ex.getClass().getSimpleName() + "): " + ex.getMessage()
                    + " — please report it with the case file; rerun with --debug for details";
        }
        err.println("rdstab: " + (msg == null ? ex.getClass().getSimpleName() : msg.replaceAll("\\s*\\R\\s*", " ")));
        if (debug) {
            ex.printStackTrace(err);
        }
        err.flush();
        return code;
    }

    /** Version from the jar manifest, or "development". */
    static final class Version implements CommandLine.IVersionProvider {
        @Override
        public String[] getVersion() {
            String v = Main.class.getPackage().getImplementationVersion();
            return new String[] {"rdstab " + (v == null ? "0.1.0-SNAPSHOT" : v)};
        }
    }
}
