package org.targetbench.cli;

import org.targetbench.pipeline.Threads;
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
                RehearseCommand.class, HandEyeCommand.class, RenderCommand.class, RecordCommand.class, DevicesCommand.class, DesignCommand.class,
                CheckCommand.class, ShootoutCommand.class, CalibrateCommand.class, RegisterCommand.class, AppCommand.class, CommandLine.HelpCommand.class})
public final class Main implements Runnable {
    public static final int EXIT_NOTHING_ACCEPTABLE = 1;
    public static final int EXIT_BAD_INPUT = 2;
    public static final int EXIT_INTERNAL = 3;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    /** --overwrite, given to every command: let --out replace files this tool did not write. */
    @CommandLine.Option(names = "--overwrite", scope = CommandLine.ScopeType.INHERIT,
            description = "Let --out replace files this tool did not write (default: refuse such a folder).")
    void setOverwrite(boolean overwrite) {
        org.targetbench.export.AtomicOutput.allowOverwrite(overwrite);
    }

    @Override
    public void run() {
        spec.commandLine().usage(spec.commandLine().getOut());
    }

    static final class VersionProvider implements CommandLine.IVersionProvider {
        @Override public String[] getVersion() { return new String[]{"TargetBench " + Version.get()}; }
    }

    /** A command line wired with this tool's error handling. */
    public static CommandLine commandLine() {
        Threads.coarseOnly(); // the process's thread policy, chosen once by the shell (see Threads)
        org.targetbench.export.AtomicOutput.allowOverwrite(false);
        org.targetbench.export.AtomicOutput.guardWholeFolders(true);
        CommandLine cl = new CommandLine(new Main());
        org.targetbench.export.AtomicOutput.onNotice(m -> {
            cl.getErr().println("targetbench: note: " + m);
            cl.getErr().flush();
        });
        org.targetbench.pipeline.MemoryBudget.onNotice(m -> {
            cl.getErr().println("targetbench: note: " + m);
            cl.getErr().flush();
        });
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
            if (ex instanceof org.targetbench.pipeline.MemoryBudget.TooLarge) {
                err.println("targetbench: error: " + ex.getMessage());
                err.flush();
                return EXIT_BAD_INPUT;
            }
            if (ex instanceof InterruptedException) {
                err.println("targetbench: interrupted; no results were written");
                return EXIT_BAD_INPUT;
            }
            return internalError(ex, err);
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

    /** An unexpected fault: one line, the stack trace only with TARGETBENCH_DEBUG set; exit code 3. */
    static int internalError(Throwable ex, PrintWriter err) {
        String m = ex.getMessage() == null ? "" : ": " + ex.getMessage().replaceAll("\\s+", " ").trim();
        err.println("targetbench: internal error: " + ex.getClass().getSimpleName() + m + " (set TARGETBENCH_DEBUG=1 for details)");
        if (System.getenv("TARGETBENCH_DEBUG") != null) ex.printStackTrace(err);
        err.flush();
        return EXIT_INTERNAL;
    }

    /** Out of memory anywhere: one line naming the heap limit and how to raise it; exit code 2. */
    static int outOfMemory(PrintWriter err) {
        long max = Runtime.getRuntime().maxMemory();
        err.println(String.format(java.util.Locale.ROOT, "targetbench: error: out of memory at the heap limit of %.1f GB; raise it with "
                + "TARGETBENCH_JAVA_OPTS=-Xmx%dg, or use smaller frames, fewer detectors or fewer views", max / (double) (1L << 30),
                Math.max(2, 2 * (long) Math.ceil(max / (double) (1L << 30)))));
        err.flush();
        return EXIT_BAD_INPUT;
    }

    public static void main(String[] args) {
        // double-clicking the jar: no arguments, no terminal, a display -> the workbench
        if (args.length == 0 && System.console() == null && org.targetbench.app.WorkbenchApp.canShowWindows()) args = new String[]{"app"};
        PrintWriter err = new PrintWriter(System.err, true);
        // a worker thread that runs out of memory outside a pool's future must not print a stack trace either
        Thread.setDefaultUncaughtExceptionHandler((t, e) -> {
            if (e instanceof OutOfMemoryError) Runtime.getRuntime().halt(outOfMemory(err));
            else Runtime.getRuntime().halt(internalError(e, err));
        });
        int code;
        try {
            code = commandLine().execute(args);
        } catch (OutOfMemoryError e) {
            code = outOfMemory(err);
        } catch (Throwable e) {
            code = e.getCause() instanceof OutOfMemoryError ? outOfMemory(err) : internalError(e, err);
        }
        System.exit(code);
    }
}
