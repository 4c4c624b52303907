package org.targetbench.cli;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.function.Predicate;

/** Runs the command line in a child JVM (for signals, locks and heap limits), output captured to files. */
final class ChildJvm {
    final Process process;
    final Path out, err;

    private ChildJvm(Process p, Path out, Path err) {
        this.process = p;
        this.out = out;
        this.err = err;
    }

    static ChildJvm start(Path dir, List<String> jvmOptions, Map<String, String> env, String... args) throws IOException {
        List<String> cmd = new ArrayList<>();
        cmd.add(Path.of(System.getProperty("java.home"), "bin", "java").toString());
        cmd.addAll(jvmOptions);
        cmd.add("-cp");
        cmd.add(System.getProperty("java.class.path"));
        cmd.add(Main.class.getName());
        cmd.addAll(List.of(args));
        Files.createDirectories(dir);
        Path out = Files.createTempFile(dir, "child", ".out"), err = Files.createTempFile(dir, "child", ".err");
        ProcessBuilder pb = new ProcessBuilder(cmd).redirectOutput(out.toFile()).redirectError(err.toFile());
        pb.environment().putAll(env);
        return new ChildJvm(pb.start(), out, err);
    }

    /** Waits until stderr satisfies {@code ready} (or the process ends, or the timeout passes); true when ready. */
    boolean awaitErr(Predicate<String> ready, long timeoutMs) throws IOException, InterruptedException {
        long end = System.currentTimeMillis() + timeoutMs;
        while (System.currentTimeMillis() < end && process.isAlive()) {
            if (ready.test(Files.readString(err))) return true;
            Thread.sleep(50);
        }
        return ready.test(Files.readString(err));
    }

    /**
     * Sends SIGINT, as Ctrl-C does. A process started with SIGINT ignored (a background job of a non-interactive shell)
     * never gets the JVM's handler for it; then SIGTERM, which runs the same shutdown path, is sent instead.
     */
    void interrupt() throws IOException, InterruptedException {
        boolean intIgnored = false;
        Path status = Path.of("/proc", Long.toString(process.pid()), "status");
        if (Files.exists(status))
            for (String line : Files.readAllLines(status))
                if (line.startsWith("SigIgn:")) intIgnored = (Long.parseLong(line.substring(7).trim(), 16) & 2) != 0;
        new ProcessBuilder("kill", intIgnored ? "-TERM" : "-INT", Long.toString(process.pid())).inheritIO().start().waitFor();
    }

    int waitFor(long seconds) throws InterruptedException {
        if (!process.waitFor(seconds, TimeUnit.SECONDS)) {
            process.destroyForcibly();
            throw new AssertionError("child JVM did not end within " + seconds + " s");
        }
        return process.exitValue();
    }

    String stdout() throws IOException { return Files.readString(out); }
    String stderr() throws IOException { return Files.readString(err); }
}
