package org.targetbench.app;

import boofcv.struct.image.GrayF32;
import org.targetbench.export.AtomicOutput;
import org.targetbench.export.TrackWriter;
import org.targetbench.pipeline.TrackResult;
import org.targetbench.pipeline.TrackSink;
import org.targetbench.score.FrameTracking;
import org.targetbench.source.ImageFiles;
import org.targetbench.track.TrackFrame;
import org.targetbench.track.TrackOutcome;
import org.targetbench.track.TrackPoint;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * A tracking run as it was measured, frame by frame: the tracker's rows and the figures the run handed to its sink, and
 * the frames themselves (8-bit, up to {@link #IMAGE_BUDGET_BYTES}), so the view can show any frame with the tracks as
 * they were then, plot drift per frame, and save the run through the command line's writer. Appended to by the worker
 * that runs the tracking and read by the event-dispatch thread; every access is synchronised and what it holds is
 * immutable.
 */
final class TrackHistory implements TrackSink {
    /** Most bytes of frame images kept for scrubbing; later frames show their tracks without the picture. */
    static final long IMAGE_BUDGET_BYTES = 256L << 20;

    private final List<TrackFrame> rows = new ArrayList<>();
    private final List<FrameTracking> figures = new ArrayList<>();
    private final List<BufferedImage> images = new ArrayList<>();
    private long imageBytes;
    private volatile GrayF32 pending;
    private TrackResult result;

    /** The frame the source just delivered; kept with the rows the tracker makes of it. */
    void offer(GrayF32 frame) { pending = frame; }

    @Override
    public synchronized void frame(TrackFrame r, FrameTracking f) {
        GrayF32 img = pending;
        BufferedImage kept = null;
        if (img != null && imageBytes + (long) img.width * img.height <= IMAGE_BUDGET_BYTES) {
            kept = grey8(img);
            imageBytes += (long) img.width * img.height;
        }
        rows.add(r);
        figures.add(f);
        images.add(kept);
    }

    synchronized void finish(TrackResult r) { result = r; }

    /** The frame as 8-bit grey, rounded and clipped to 0..255 as {@link ImageFiles#toBuffered} does, written straight into the raster's bytes. */
    static BufferedImage grey8(GrayF32 img) {
        BufferedImage bi = new BufferedImage(img.width, img.height, BufferedImage.TYPE_BYTE_GRAY);
        byte[] px = ((java.awt.image.DataBufferByte) bi.getRaster().getDataBuffer()).getData();
        for (int y = 0; y < img.height; y++) {
            int row = img.startIndex + y * img.stride, out = y * img.width;
            for (int x = 0; x < img.width; x++)
                px[out + x] = (byte) (int) Math.max(0, Math.min(255, Math.rint(img.data[row + x])));
        }
        return bi;
    }

    /** The finished run, or null while it runs. */
    synchronized TrackResult result() { return result; }

    synchronized int size() { return rows.size(); }

    synchronized TrackFrame rows(int i) { return rows.get(i); }

    synchronized FrameTracking figures(int i) { return figures.get(i); }

    /** The picture of frame {@code i}, or null when it was not kept. */
    synchronized BufferedImage image(int i) { return images.get(i); }

    synchronized List<FrameTracking> allFigures() { return List.copyOf(figures); }

    /**
     * What to draw at frame {@code i}: for each track alive after that frame, its path over the last {@code trail}
     * frames (ending at its position on frame {@code i}); every track that ended on or before frame {@code i}, where
     * it ended; and the live points of frame {@code i}.
     */
    record Scene(int index, Map<Integer, List<double[]>> trails, List<TrackPoint> ended, List<TrackPoint> live) {}

    synchronized Scene scene(int i, int trail) {
        if (i < 0 || i >= rows.size()) throw new IllegalArgumentException("frame " + i + " of " + rows.size());
        List<TrackPoint> ended = new ArrayList<>(), live = new ArrayList<>();
        for (int k = 0; k <= i; k++)
            for (TrackPoint p : rows.get(k).points()) if (p.outcome().isLoss()) ended.add(p);
        for (TrackPoint p : rows.get(i).points()) if (!p.outcome().isLoss()) live.add(p);
        Map<Integer, List<double[]>> paths = new HashMap<>();
        for (int k = Math.max(0, i - trail + 1); k <= i; k++)
            for (TrackPoint p : rows.get(k).points()) {
                if (p.outcome() == TrackOutcome.STARTED) paths.put(p.trackId(), new ArrayList<>()); // a reused id starts afresh
                if (!p.outcome().isLoss()) paths.computeIfAbsent(p.trackId(), id -> new ArrayList<>()).add(new double[]{p.x(), p.y()});
            }
        Map<Integer, List<double[]>> trails = new LinkedHashMap<>();
        for (TrackPoint p : live) {
            List<double[]> path = paths.get(p.trackId());
            if (path != null) trails.put(p.trackId(), List.copyOf(path));
        }
        return new Scene(i, trails, ended, live);
    }

    /**
     * Writes the run as the command line's {@code track} does: the same rows and figures, in the same order, through
     * the same {@link TrackWriter} into an all-or-nothing folder.
     *
     * @return the files written
     */
    synchronized List<String> save(Path dir) throws IOException, org.targetbench.export.OutputException {
        if (result == null) throw new IllegalStateException("the run has not finished");
        try (AtomicOutput out = AtomicOutput.open(dir); TrackWriter w = new TrackWriter(out)) {
            for (int i = 0; i < rows.size(); i++) w.frame(rows.get(i), figures.get(i));
            w.finish(result);
            out.commit();
        }
        return result.score().framesWithTruth() > 0 ? List.of("tracks.csv", "survival.csv", "drift.csv", "summary.json")
                : List.of("tracks.csv", "survival.csv", "summary.json");
    }
}
