package dev.nanoplan.cli;

import java.io.PrintWriter;
import picocli.CommandLine;
import picocli.CommandLine.Command;

/** The top-level {@code nanoplan} command: only dispatches to subcommands. */
@Command(name = "nanoplan",
        mixinStandardHelpOptions = true,
        versionProvider = ManifestVersion.class,
        description = "Plans networks of nanomachines that talk by releasing molecules into a fluid.",
        subcommands = {LinkCommand.class, PlanCommand.class, SlotsCommand.class, ImproveCommand.class, CompareCommand.class,
            ValidateCommand.class, SimulateCommand.class, ToleranceCommand.class, SweepCommand.class,
            UiCommand.class, CommandLine.HelpCommand.class})
public final class NanoplanCommand implements Runnable {

    /** Columns of the help text. */
    static final int HELP_WIDTH = 110;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public void run() {
        throw new CommandLine.ParameterException(spec.commandLine(), "missing subcommand (try: nanoplan --help)");
    }

    /** Builds the command line with nanoplan's error handling. */
    public static CommandLine commandLine() {
        CommandLine cl = new CommandLine(new NanoplanCommand());
        OptionForms.register(cl);
        // wide enough that option names, paths and units are not broken across lines
        cl.setUsageHelpWidth(HELP_WIDTH);
        cl.setExecutionExceptionHandler(new ErrorHandling.ExecutionErrors());
        cl.setParameterExceptionHandler(new ErrorHandling.ParameterErrors());
        return cl;
    }

    /** Runs with the given arguments and returns the exit status. */
    public static int execute(String... args) {
        return commandLine().execute(args);
    }

    /** Runs with given output streams (for tests). */
    public static int execute(PrintWriter out, PrintWriter err, String... args) {
        CommandLine cl = commandLine();
        cl.setOut(out);
        cl.setErr(err);
        return cl.execute(args);
    }
}
