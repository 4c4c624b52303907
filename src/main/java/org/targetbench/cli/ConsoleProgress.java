package org.targetbench.cli;

import org.targetbench.pipeline.Progress;

import java.io.PrintStream;
import java.util.Locale;

/**
 * Progress on stderr for interactive use: a single self-overwriting line with a bar, the count and an ETA when the
 * total is known. Silent when stderr is not a terminal, so pipes, logs and tests stay clean (TARGETBENCH_PROGRESS=1 turns
 * it on anyway; the interrupt tests use it to see a run under way).
 */
final class ConsoleProgress implements Progress {
    private static final int BAR = 28;
    /** Least time between redraws, nanoseconds. */
    private static final long REDRAW_NS = 150_000_000L;

    private final PrintStream err;
    private final boolean enabled;
    private final String label;
    private final long start = System.nanoTime();
    private long lastPrint;
    private int lastLength;

    ConsoleProgress(String label) {
        this(label, System.console() != null || "1".equals(System.getenv("TARGETBENCH_PROGRESS")));
    }

    ConsoleProgress(String label, boolean enabled) {
        this.err = System.err;
        this.enabled = enabled;
        this.label = label;
    }

    @Override
    public synchronized void update(int done, int total, String what) {
        if (!enabled) return;
        long now = System.nanoTime();
        boolean last = total > 0 && done >= total;
        if (!last && now - lastPrint < REDRAW_NS) return;
        lastPrint = now;
        String line;
        if (total > 0) {
            int filled = (int) Math.round(BAR * done / (double) total);
            double elapsed = (now - start) / 1e9;
            String eta = done > 0 && !last ? " ETA " + clock(elapsed * (total - done) / done) : " " + clock(elapsed);
            line = String.format(Locale.ROOT, "%s [%s%s] %d/%d%s  %s", label, "#".repeat(filled), ".".repeat(BAR - filled), done, total, eta, what);
        } else {
            line = label + " " + done + "  " + what;
        }
        err.print("\r" + line + " ".repeat(Math.max(0, lastLength - line.length())));
        lastLength = line.length();
        if (last) {
            err.print("\r" + " ".repeat(lastLength) + "\r");
            lastLength = 0;
        }
        err.flush();
    }

    static String clock(double seconds) {
        long s = Math.round(seconds);
        return s >= 3600 ? String.format(Locale.ROOT, "%d:%02d:%02d", s / 3600, (s / 60) % 60, s % 60)
                : String.format(Locale.ROOT, "%d:%02d", s / 60, s % 60);
    }
}
