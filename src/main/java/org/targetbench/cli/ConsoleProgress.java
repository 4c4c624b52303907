package org.targetbench.cli;

import org.targetbench.pipeline.Progress;

import java.io.PrintStream;

/**
 * Progress on stderr for interactive use: a single self-overwriting line when stderr is a terminal, nothing
 * otherwise (so pipes, logs and tests stay clean).
 */
final class ConsoleProgress implements Progress {
    private final PrintStream err;
    private final boolean enabled;
    private final String label;
    private long lastPrint;

    ConsoleProgress(String label) {
        this.err = System.err;
        this.enabled = System.console() != null;
        this.label = label;
    }

    @Override
    public synchronized void update(int done, int total, String what) {
        if (!enabled) return;
        long now = System.nanoTime();
        if (done != total && now - lastPrint < 100_000_000L) return;
        lastPrint = now;
        String count = total > 0 ? done + "/" + total : Integer.toString(done);
        err.print("\r" + label + " " + count + "  " + what + "          ");
        if (done == total) err.print("\r" + " ".repeat(label.length() + count.length() + what.length() + 14) + "\r");
        err.flush();
    }
}
