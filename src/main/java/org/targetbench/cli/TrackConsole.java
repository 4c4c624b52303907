package org.targetbench.cli;

import org.targetbench.pipeline.TrackResult;
import org.targetbench.score.Distribution;
import org.targetbench.score.TrackingScore;
import org.targetbench.track.TrackOutcome;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/** The console summary of a tracking run. */
final class TrackConsole {
    private TrackConsole() {}

    static void print(TrackResult r, PrintWriter w) {
        TrackingScore s = r.score();
        w.println("Tracked " + r.source() + " (" + r.width() + "x" + r.height() + ")");
        w.printf(Locale.ROOT, "  frames: %d (%d..%d)%s; %s%n", s.frames(), s.firstFrame(), s.lastFrame(),
                r.skippedFrames() > 0 ? ", " + r.skippedFrames() + " undecodable frame" + (r.skippedFrames() == 1 ? "" : "s") + " skipped" : "",
                r.stop().label());
        r.endNote().ifPresent(n -> w.println("  note: " + n));
        w.printf(Locale.ROOT, "  tracks: %d started on frame %d by %s, %d started in all, %d alive at the end (respawn %s)%n",
                s.initialTracks(), s.firstFrame(), r.seeding().cliName(), s.tracksStarted(), s.aliveAtEnd(), r.tracker().respawn.cliName());
        String median = s.medianLifetime().isPresent() ? s.medianLifetime().getAsInt() + " frames"
                : "more than " + (s.lastFrame() - s.firstFrame()) + " frames (over half outlived the run)";
        w.printf(Locale.ROOT, "  survival: %s at frame %d, %s at the end; median lifetime %s%n", fmt(s.survivalAtN(), 3), s.survivalAtFrame(),
                fmt(s.survivalAtEnd(), 3), median);
        List<String> lost = new ArrayList<>();
        for (TrackOutcome o : TrackOutcome.values())
            if (o.isLoss() && s.ended().getOrDefault(o, 0) > 0) lost.add(s.ended().get(o) + " " + o.csvName());
        w.println("  lost: " + (lost.isEmpty() ? "none" : String.join(", ", lost)));
        w.println("  forward-backward error: " + px(s.forwardBackward()));
        w.println("  drift against truth:    " + (s.framesWithTruth() > 0 ? px(s.drift()) + " over " + s.framesWithTruth() + " frames" : "no truth"));
        w.println("  jitter while static:    " + (s.jitter().count() > 0 ? px(s.jitter()) + " over " + s.jitter().count() + " track segments"
                : "no static stretch" + (r.hasTruth() ? "" : " (without truth, mark a still recording with --static)")));
        w.printf(Locale.ROOT, "  tracker: %.2f ms per frame in this run (JIT warm-up included; the benchmark measures speed properly)%n", r.trackerMillisPerFrame());
    }

    private static String px(Distribution d) {
        return String.format(Locale.ROOT, "p50 %s px, p95 %s px, max %s px", fmt(d.p50(), 3), fmt(d.p95(), 3), fmt(d.max(), 3));
    }

    private static String fmt(double v, int decimals) {
        return Double.isNaN(v) ? "-" : String.format(Locale.ROOT, "%." + decimals + "f", v);
    }
}
