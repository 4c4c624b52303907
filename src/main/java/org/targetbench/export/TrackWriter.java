package org.targetbench.export;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.targetbench.Version;
import org.targetbench.pipeline.TrackResult;
import org.targetbench.pipeline.TrackSink;
import org.targetbench.score.Distribution;
import org.targetbench.score.FrameTracking;
import org.targetbench.score.TrackingMetrics;
import org.targetbench.score.TrackingScore;
import org.targetbench.track.KltConfig;
import org.targetbench.track.TrackFrame;
import org.targetbench.track.TrackOutcome;
import org.targetbench.track.TrackPoint;

import java.io.BufferedWriter;
import java.io.Closeable;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;

/**
 * Writes a tracking run as it happens: {@code tracks.csv} and {@code survival.csv} row by row, {@code drift.csv}
 * when truth exists, and {@code summary.json} at the end (layouts in docs/formats.md). Files go through an
 * {@link AtomicOutput}, so they appear only when the run is committed.
 */
public final class TrackWriter implements TrackSink, Closeable {
    public static final String SUMMARY_FORMAT = "targetbench-track-summary";
    private static final ObjectMapper MAPPER = new ObjectMapper();

    private final AtomicOutput out;
    private final BufferedWriter tracks, survival;
    private BufferedWriter drift;

    public TrackWriter(AtomicOutput out) throws IOException {
        this.out = out;
        tracks = Files.newBufferedWriter(out.file("tracks.csv"), StandardCharsets.UTF_8);
        tracks.write("track,frame,x,y,outcome,fb_error\n");
        survival = Files.newBufferedWriter(out.file("survival.csv"), StandardCharsets.UTF_8);
        survival.write("frame,alive_fraction\n");
    }

    @Override
    public void frame(TrackFrame rows, FrameTracking figures) throws IOException {
        StringBuilder sb = new StringBuilder(rows.points().size() * 40);
        for (TrackPoint p : rows.points())
            sb.append(p.trackId()).append(',').append(p.frame()).append(',').append(Csv.num(p.x(), 3)).append(',')
                    .append(Csv.num(p.y(), 3)).append(',').append(p.outcome().csvName()).append(',').append(Csv.num(p.fbError(), 4)).append('\n');
        tracks.write(sb.toString());
        survival.write(rows.frame() + "," + Csv.num(figures.aliveFraction(), 4) + "\n");
        Distribution d = figures.drift();
        if (d.count() > 0) {
            if (drift == null) {
                drift = Files.newBufferedWriter(out.file("drift.csv"), StandardCharsets.UTF_8);
                drift.write("frame,tracks,p50_px,p95_px,max_px\n");
            }
            drift.write(rows.frame() + "," + d.count() + "," + Csv.num(d.p50(), 4) + "," + Csv.num(d.p95(), 4) + "," + Csv.num(d.max(), 4) + "\n");
        }
    }

    /** Closes the CSV files and writes summary.json. */
    public void finish(TrackResult r) throws IOException {
        close();
        MAPPER.writerWithDefaultPrettyPrinter().writeValue(out.file("summary.json").toFile(), summary(r));
    }

    @Override
    public void close() throws IOException {
        try (BufferedWriter a = tracks; BufferedWriter b = survival; BufferedWriter c = drift) {
            // closed in reverse order by try-with-resources
        }
    }

    public static ObjectNode summary(TrackResult r) {
        TrackingScore s = r.score();
        ObjectNode root = MAPPER.createObjectNode();
        root.put("format", SUMMARY_FORMAT).put("version", 1);
        root.put("tool_version", Version.get());
        root.put("created", OffsetDateTime.now(ZoneOffset.UTC).format(DateTimeFormatter.ISO_OFFSET_DATE_TIME));
        root.put("source", r.source());
        root.put("image_width", r.width()).put("image_height", r.height());
        root.put("frames", s.frames()).put("first_frame", s.firstFrame()).put("last_frame", s.lastFrame());
        root.put("skipped_frames", r.skippedFrames());
        root.put("stopped_by", r.stop().code());
        if (r.endNote().isPresent()) root.put("end_note", r.endNote().get());
        else root.putNull("end_note");
        root.put("seeding_detector", r.seeding().cliName());
        root.put("pixel_convention", "integer coordinates are pixel centres; (0,0) is the centre of the top-left pixel");
        root.put("safety", Safety.NOTICE);

        ObjectNode sv = root.putObject("survival");
        sv.put("initial_tracks", s.initialTracks());
        ObjectNode at = sv.putObject("at_frame");
        at.put("frame", s.survivalAtFrame());
        putNum(at, "alive_fraction", s.survivalAtN());
        putNum(sv, "at_end", s.survivalAtEnd());
        if (s.medianLifetime().isPresent()) {
            sv.put("median_lifetime_frames", s.medianLifetime().getAsInt());
            sv.put("median_lifetime_censored", false);
        } else {
            sv.putNull("median_lifetime_frames");
            sv.put("median_lifetime_censored", true);
        }

        ObjectNode tr = root.putObject("tracks");
        tr.put("started", s.tracksStarted()).put("alive_at_end", s.aliveAtEnd());
        ObjectNode ended = tr.putObject("ended");
        for (TrackOutcome o : TrackOutcome.values()) if (o.isLoss()) ended.put(o.csvName(), s.ended().getOrDefault(o, 0));

        root.set("forward_backward_px", dist(s.forwardBackward()));
        if (s.framesWithTruth() > 0) {
            ObjectNode d = dist(s.drift());
            d.put("frames_with_truth", s.framesWithTruth());
            root.set("drift_px", d);
        } else {
            root.putNull("drift_px");
        }
        if (s.jitter().count() > 0) {
            ObjectNode j = dist(s.jitter());
            j.put("static_frames", s.staticFrames()).put("segments", s.jitter().count());
            j.put("min_segment_frames", TrackingMetrics.JITTER_MIN_FRAMES);
            j.put("whole_run_marked_static", r.wholeRunStatic());
            root.set("jitter_px", j);
        } else {
            root.putNull("jitter_px");
        }
        root.putObject("timing").put("wall_s", r.wallSeconds()).put("tracker_ms_per_frame_in_run", r.trackerMillisPerFrame());
        KltConfig k = r.tracker();
        ObjectNode t = root.putObject("tracker");
        t.put("method", "pyramidal KLT (Lucas & Kanade 1981, Bouguet 2000) with forward-backward check (Kalal et al. 2010)");
        t.put("window_radius_px", k.windowRadius).put("pyramid_levels", k.pyramidLevels).put("max_iterations", k.maxIterations)
                .put("epsilon_px", k.epsilon).put("forward_backward", k.forwardBackward).put("fb_threshold_px", k.fbThreshold)
                .put("max_residual_grey", k.maxResidual).put("min_eigenvalue", k.minEigenvalue).put("min_spacing_px", k.minSpacing)
                .put("respawn", k.respawn.cliName()).put("max_tracks", k.maxTracks);
        return root;
    }

    private static ObjectNode dist(Distribution d) {
        ObjectNode o = MAPPER.createObjectNode();
        o.put("count", d.count());
        putNum(o, "mean", d.mean());
        putNum(o, "p50", d.p50());
        putNum(o, "p90", d.p90());
        putNum(o, "p95", d.p95());
        putNum(o, "p99", d.p99());
        putNum(o, "max", d.max());
        return o;
    }

    private static void putNum(ObjectNode o, String key, double v) {
        if (Double.isFinite(v)) o.put(key, v);
        else o.putNull(key);
    }
}
