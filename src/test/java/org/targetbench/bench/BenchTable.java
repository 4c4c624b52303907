package org.targetbench.bench;

import java.io.PrintStream;
import java.util.List;
import java.util.Locale;

/** Prints the benchmark results as a fixed-width table with its footnotes. */
final class BenchTable {
    private BenchTable() {}

    static void print(List<BenchRow> rows, int threads, PrintStream out) {
        String head = "%-11s %10s %10s %11s %11s %10s %8s %-10s %9s %9s%n";
        out.printf(Locale.ROOT, head, "detector", "ours ms", "ours fps", "ours fps", "ours eff.", "OpenCV ms", "ours/", "goal",
                "pts/frm", "pts/frm");
        out.printf(Locale.ROOT, head, "", "(1 thr)", "(1 thr)", "(" + threads + " thr)", "ms (" + threads + " thr)", "(1 thr)",
                "OpenCV", ">=100fps", "ours", "OpenCV");
        out.println("-".repeat(107));
        for (BenchRow r : rows) {
            out.printf(Locale.ROOT, "%-11s %10.2f %10.1f %11.1f %11.2f %10s %8s %-10s %9.0f %9s%n",
                    r.type().cliName(),
                    r.ours().medianMs(), r.ours().framesPerSecond(),
                    r.oursAll().framesPerSecond(), r.oursAll().effectiveMsPerFrame(),
                    r.openCv().map(cv -> String.format(Locale.ROOT, "%.2f", cv.medianMs())).orElse("n/a"),
                    r.ratio().map(x -> String.format(Locale.ROOT, "%.2fx", x)).orElse("-"),
                    !r.hasGoal() ? "-" : r.goalMet() ? "yes" : "NO",
                    r.ours().meanPoints(),
                    r.openCv().map(cv -> String.format(Locale.ROOT, "%.0f", cv.meanPoints())).orElse("-"));
        }
        out.println();
        for (BenchRow r : rows) {
            r.openCvNote().ifPresent(n -> out.println(r.type().cliName() + " OpenCV: " + n));
            out.printf(Locale.ROOT, "%-11s spread (p10..p90 ms): ours %.2f..%.2f%s%n", r.type().cliName(),
                    r.ours().p10Ms(), r.ours().p90Ms(),
                    r.openCv().map(cv -> String.format(Locale.ROOT, ", OpenCV %.2f..%.2f", cv.p10Ms(), cv.p90Ms())).orElse(""));
        }
        out.println();
        out.println("ms = median wall time of one detect call on one thread, cycling through the frames after warm-up;");
        out.println("fps (1 thr) = 1000 / median. fps (" + threads + " thr) = total calls / wall time with one detector per thread;");
        out.println("eff. ms = wall time per frame when all threads work. ours/OpenCV = ours ms / OpenCV ms (> 1: ours slower).");
        out.println("OpenCV runs single-threaded (Core.setNumThreads(1)); ours runs with BoofCV's internal threading off.");
        out.println("goal = ours >= " + (int) BenchRow.GOAL_FPS + " frames/s on one thread (Harris, Shi-Tomasi, FAST only).");
        out.println("The work is comparable, not identical (polarity merge, caps): see pts/frm. Ours runs without the refinement stage, "
                + "as OpenCV's detectors do (it is timed in 'bench tracking').");
        out.flush();
    }
}
