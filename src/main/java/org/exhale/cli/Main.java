package org.exhale.cli;

import java.io.PrintWriter;

import org.exhale.io.InputException;

import picocli.CommandLine;
import picocli.CommandLine.Command;

/** The exhale command line. */
@Command(name = "exhale", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class,
        header = "Bake recipes for sacrificial-polymer air gaps and cavities under porous caps.",
        description = {"Simulates decomposition of the sacrificial polymer, transport of its products through the cap, "
                + "the trapped pressure and the cap's stresses; plans the shortest recipe that meets every limit; "
                + "fits kinetics from thermogravimetric runs.",
                "Predictions are estimates: confirm recipes on test wafers and follow your site's safety rules."},
        subcommands = {NewCommand.class, CheckCommand.class, SimulateCommand.class, PlanCommand.class, CompareCommand.class,
                RobustCommand.class, FitCommand.class, ReportCommand.class, DemoCommand.class, BenchCommand.class,
                SchemaCommand.class, CompletionCommand.class, CommandLine.HelpCommand.class},
        footer = {"", "Exit codes: 0 all limits met; 1 internal error; 2 bad input; 3 a limit is violated; "
                + "4 no feasible recipe; 130 stopped with Ctrl-C (compare and robust keep the work done)."})
public final class Main implements java.util.concurrent.Callable<Integer> {
    public static final int OK = 0;
    public static final int INTERNAL = 1;
    public static final int BAD_INPUT = 2;
    public static final int VIOLATED = 3;
    public static final int INFEASIBLE = 4;

    /** Bare {@code exhale}: a command is missing, so the usage goes to stderr with exit 2. */
    @Override
    public Integer call() {
        commandLine().usage(System.err);
        return BAD_INPUT;
    }

    public static void main(String[] args) {
        java.io.PrintStream out = Terminal.stdout();
        System.setOut(out);
        System.setErr(Terminal.stderr());
        int code = execute(args);
        out.flush();
        if (out.checkError()) {
            // PrintStream swallows write errors: a full disk or a closed pipe must not look like success
            System.err.println("error: standard output: cannot write (the disk is full, or the reader closed it); "
                    + "the output is incomplete");
            code = INTERNAL;
        }
        System.exit(code);
    }

    /** Runs the command line and returns the exit code (no System.exit; used by tests). */
    public static int execute(String... args) {
        try {
            return commandLine().execute(args);
        } catch (OutOfMemoryError e) {
            // memory is bounded by design (docs/errors.md); should a machine still be too small, say so in one line
            System.err.println("error: out of memory: the run needs more than the " + (Runtime.getRuntime().maxMemory() >> 20)
                    + " MiB the Java heap may use; give Java more (java -Xmx2g -jar exhale.jar ...)");
            return INTERNAL;
        }
    }

    public static CommandLine commandLine() {
        CommandLine cl = new CommandLine(new Main());
        giveVersionToAll(cl);
        HelpText.apply(cl);
        cl.setExecutionExceptionHandler(Main::handle);
        cl.setParameterExceptionHandler((ex, a) -> {
            PrintWriter err = ex.getCommandLine().getErr();
            String msg = String.valueOf(ex.getMessage()).replaceAll("\\s*[\\r\\n]+\\s*", " ").strip();
            err.println("error: command line: " + Terminal.clean(msg) + " (try '"
                    + ex.getCommandLine().getCommandSpec().qualifiedName() + " --help')");
            return BAD_INPUT;
        });
        return cl;
    }

    /** Every subcommand answers --version with the root's version provider. */
    private static void giveVersionToAll(CommandLine cl) {
        for (CommandLine sub : cl.getSubcommands().values()) {
            if (sub.getCommandSpec().versionProvider() == null) {
                sub.getCommandSpec().versionProvider(cl.getCommandSpec().versionProvider());
            }
            giveVersionToAll(sub);
        }
    }

    private static int handle(Exception ex, CommandLine cl, CommandLine.ParseResult parse) {
        PrintWriter err = cl.getErr();
        boolean debug = parse != null && hasDebug(parse);
        if (ex instanceof InputException ie) {
            err.println("error: " + Terminal.clean(ie.getMessage()));
            if (debug) {
                ex.printStackTrace(err);
            }
            return BAD_INPUT;
        }
        if (ex instanceof org.exhale.simulation.OutOfReach oor) {
            err.println("error: " + Terminal.clean(oor.getMessage()));
            if (debug) {
                ex.printStackTrace(err);
            }
            return BAD_INPUT;
        }
        err.println("internal error: " + Terminal.clean(String.valueOf(ex)) + (debug ? "" : " (run with --debug for details)"));
        if (debug) {
            ex.printStackTrace(err);
        }
        return INTERNAL;
    }

    private static boolean hasDebug(CommandLine.ParseResult parse) {
        CommandLine.ParseResult p = parse;
        while (p != null) {
            if (p.hasMatchedOption("--debug")) {
                return true;
            }
            p = p.subcommand();
        }
        return false;
    }
}
