package org.targetbench.cli;

import org.targetbench.Version;
import org.targetbench.export.OutputException;
import org.targetbench.source.SourceException;
import picocli.CommandLine;
import picocli.CommandLine.Command;

import java.io.PrintWriter;

/**
 * Command-line entry point. Every command is a thin shell over the shared pipeline. Exit codes: 0 success, 1 a run
 * that completed but found nothing acceptable, 2 bad input (one line on stderr, no stack trace, no output files),
 * 3 an internal fault.
 */
@Command(name = "targetbench", mixinStandardHelpOptions = true, versionProvider = Main.VersionProvider.class,
        description = "Bench for fiducial targets, point detectors and servo point sets of eye-in-hand visual servoing cells.",
        subcommands = {DemoCommand.class, CompareCommand.class, SweepCommand.class, TrackCommand.class, PickCommand.class,
                RehearseCommand.class, RenderCommand.class, RecordCommand.class, DevicesCommand.class, DesignCommand.class,
                CheckCommand.class, ShootoutCommand.class, CalibrateCommand.class, RegisterCommand.class, AppCommand.class, CommandLine.HelpCommand.class})
public final class Main implements Runnable {
    public static final int EXIT_NOTHING_ACCEPTABLE = 1;
    public static final int EXIT_BAD_INPUT = 2;
    public static final int EXIT_INTERNAL = 3;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public void run() {
        spec.commandLine().usage(spec.commandLine().getOut());
    }

    static final class VersionProvider implements CommandLine.IVersionProvider {
        @Override public String[] getVersion() { return new String[]{"TargetBench " + Version.get()}; }
    }

    /** A command line wired with this tool's error handling. */
    public static CommandLine commandLine() {
        CommandLine cl = new CommandLine(new Main());
        cl.setExecutionExceptionHandler((ex, cmd, parseResult) -> {
            PrintWriter err = cmd.getErr();
            if (ex instanceof UserError || ex instanceof SourceException || ex instanceof OutputException) {
                err.println("targetbench: error: " + ex.getMessage());
                err.flush();
                return EXIT_BAD_INPUT;
            }
            if (ex instanceof ServoSteps.NoAcceptableSet) {
                err.println("targetbench: " + ex.getMessage());
                err.flush();
                return EXIT_NOTHING_ACCEPTABLE;
            }
            if (ex instanceof InterruptedException) {
                err.println("targetbench: interrupted; no results were written");
                return EXIT_BAD_INPUT;
            }
            err.println("targetbench: internal error: " + ex);
            if (System.getenv("TARGETBENCH_DEBUG") != null) ex.printStackTrace(err);
            else err.println("(set TARGETBENCH_DEBUG=1 to see the stack trace)");
            err.flush();
            return EXIT_INTERNAL;
        });
        cl.setParameterExceptionHandler((ex, args) -> {
            PrintWriter err = ex.getCommandLine().getErr();
            err.println("targetbench: error: " + ex.getMessage().replaceAll("\\s+", " ").trim()
                    + " (see '" + ex.getCommandLine().getCommandSpec().qualifiedName() + " --help')");
            err.flush();
            return EXIT_BAD_INPUT;
        });
        return cl;
    }

    public static void main(String[] args) {
        // double-clicking the jar: no arguments, no terminal, a display -> the workbench
        if (args.length == 0 && System.console() == null && org.targetbench.app.WorkbenchApp.canShowWindows()) args = new String[]{"app"};
        System.exit(commandLine().execute(args));
    }
}
