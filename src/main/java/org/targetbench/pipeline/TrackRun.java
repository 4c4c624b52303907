package org.targetbench.pipeline;

import org.targetbench.detect.DetectorConfig;
import org.targetbench.score.FrameTracking;
import org.targetbench.score.TrackingMetrics;
import org.targetbench.source.FrameSource;
import org.targetbench.source.SourceException;
import org.targetbench.source.SourceFrame;
import org.targetbench.track.KltConfig;
import org.targetbench.track.KltTracker;
import org.targetbench.track.TrackFrame;

import java.io.IOException;
import java.util.Optional;
import java.util.function.BooleanSupplier;

/**
 * A tracking run shared by the CLI and the app: frames from a source through the KLT tracker and the tracking
 * metrics, each frame's rows and figures handed to a sink as they come, in constant memory.
 */
public final class TrackRun {
    private final KltConfig tracker;
    private final DetectorConfig seeding;
    private final int survivalAtFrame;
    private final boolean wholeRunStatic;
    private final int maxFrames;

    /**
     * @param survivalAtFrame frame index at which survival is reported on its own
     * @param wholeRunStatic  the user says nothing moved during the recording (jitter over the whole run)
     * @param maxFrames       most frames to process; 0 for all
     */
    public TrackRun(KltConfig tracker, DetectorConfig seeding, int survivalAtFrame, boolean wholeRunStatic, int maxFrames) {
        tracker.checkValidity();
        seeding.checkValidity();
        if (maxFrames < 0) throw new IllegalArgumentException("maxFrames must be >= 0, got " + maxFrames);
        if (survivalAtFrame < 0) throw new IllegalArgumentException("survivalAtFrame must be >= 0, got " + survivalAtFrame);
        this.tracker = tracker.copy();
        this.seeding = seeding.copy();
        this.survivalAtFrame = survivalAtFrame;
        this.wholeRunStatic = wholeRunStatic;
        this.maxFrames = maxFrames;
    }

    /**
     * @param cancelled polled once per frame; when it turns true the run stops and reports what it has
     * @throws SourceException when the source fails, delivers nothing, or its frames are too small for the pyramid
     */
    public TrackResult run(FrameSource source, TrackSink sink, Progress progress, BooleanSupplier cancelled) throws SourceException, IOException {
        long start = System.nanoTime();
        int need = tracker.minImageSide();
        if (Math.min(source.width(), source.height()) < need)
            throw new SourceException("frames of " + source.width() + "x" + source.height() + " are too small to track with " + tracker.pyramidLevels
                    + " pyramid levels and window radius " + tracker.windowRadius + " (each side needs " + need + " px); use fewer levels or a smaller window");
        KltTracker klt = new KltTracker(tracker, seeding);
        TrackingMetrics metrics = new TrackingMetrics(source.width(), source.height(), survivalAtFrame, wholeRunStatic);
        int total = source.frameCount() < 0 ? (maxFrames > 0 ? maxFrames : -1)
                : maxFrames > 0 ? Math.min(maxFrames, source.frameCount()) : source.frameCount();
        int done = 0;
        long trackerNanos = 0;
        boolean truth = false;
        TrackResult.Stop stop = TrackResult.Stop.END_OF_SOURCE;
        while (true) {
            if (cancelled.getAsBoolean()) {
                stop = TrackResult.Stop.CANCELLED;
                break;
            }
            if (maxFrames > 0 && done >= maxFrames) {
                stop = TrackResult.Stop.FRAME_LIMIT;
                break;
            }
            Optional<SourceFrame> next = source.next();
            if (next.isEmpty()) {
                if (source.endNote().isPresent()) stop = TrackResult.Stop.SOURCE_LOST;
                break;
            }
            SourceFrame f = next.get();
            long t0 = System.nanoTime();
            TrackFrame rows = klt.process(f.image(), f.index());
            trackerNanos += System.nanoTime() - t0;
            // the reference frame's identity homography is no truth by itself
            truth |= !f.name().equals(source.referenceName()) && (f.truth().fromReference().isPresent() || !f.truth().features().isEmpty());
            FrameTracking figures = metrics.add(rows, f.truth().fromReference(), f.truth().features());
            sink.frame(rows, figures);
            done++;
            progress.update(done, total, "frame " + f.index() + ", " + rows.alive() + " tracks alive");
        }
        if (done == 0) {
            if (stop == TrackResult.Stop.CANCELLED) throw new SourceException("stopped before the first frame; nothing was measured");
            throw new SourceException("the source delivered no frames: " + source.description() + source.endNote().map(n -> " (" + n + ")").orElse(""));
        }
        return new TrackResult(source.description(), source.width(), source.height(), metrics.result(), source.skippedFrames(), stop,
                source.endNote(), truth, wholeRunStatic, tracker, seeding.type(), (System.nanoTime() - start) / 1e9, trackerNanos / 1e6 / done);
    }
}
