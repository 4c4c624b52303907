package org.targetbench.export;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.targetbench.Version;
import org.targetbench.detect.Detection;
import org.targetbench.detect.DetectorConfig;
import org.targetbench.pipeline.CompareResult;
import org.targetbench.pipeline.DetectorSummary;
import org.targetbench.pipeline.FrameScore;
import org.targetbench.score.LocalisationResult;
import org.targetbench.score.RepeatabilityResult;

import java.io.BufferedWriter;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.OptionalDouble;

/**
 * Writes a detector comparison: {@code detections.csv}, {@code repeatability.csv} and {@code summary.json}
 * (layouts in docs/formats.md).
 */
public final class CompareWriter {
    public static final String SUMMARY_FORMAT = "targetbench-compare-summary";
    private static final ObjectMapper MAPPER = new ObjectMapper();

    private CompareWriter() {}

    public static void write(CompareResult r, AtomicOutput out) throws IOException {
        writeDetections(r, out.file("detections.csv"));
        writeRepeatability(r, out.file("repeatability.csv"));
        MAPPER.writerWithDefaultPrettyPrinter().writeValue(out.file("summary.json").toFile(), summary(r));
    }

    static void writeDetections(CompareResult r, Path file) throws IOException {
        try (BufferedWriter w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            w.write("detector,frame,x,y,response,scale\n");
            for (FrameScore s : r.frames())
                for (Detection d : s.detections())
                    w.write(s.detector().cliName() + "," + Csv.text(s.frameName()) + "," + Csv.num(d.x(), POSITION_DECIMALS) + "," + Csv.num(d.y(), POSITION_DECIMALS)
                            + "," + Csv.num(d.response(), RESPONSE_DECIMALS) + "," + Csv.num(d.scale(), POSITION_DECIMALS) + "\n");
        }
    }

    /** Decimals detections.csv keeps of positions and scales, and of responses. */
    public static final int POSITION_DECIMALS = 3, RESPONSE_DECIMALS = 6;

    /**
     * A detection exactly as detections.csv records it, so that a pick from results in memory chooses what a pick from
     * the saved folder chooses.
     */
    public static Detection asRecorded(Detection d) {
        return new Detection(recorded(d.x(), POSITION_DECIMALS), recorded(d.y(), POSITION_DECIMALS), recorded(d.response(), RESPONSE_DECIMALS),
                recorded(d.scale(), POSITION_DECIMALS));
    }

    private static double recorded(double v, int decimals) {
        String s = Csv.num(v, decimals);
        return s.isEmpty() ? Double.NaN : Double.parseDouble(s);
    }

    /** Per detector (command-line name), its settings as summary.json records them, as JSON text. */
    public static java.util.Map<String, String> detectorSettings(CompareResult r) {
        java.util.Map<String, String> out = new java.util.LinkedHashMap<>();
        try {
            for (DetectorConfig c : r.configs())
                out.put(c.type().cliName(), MAPPER.readTree(MAPPER.writeValueAsString(MAPPER.valueToTree(c))).toString());
        } catch (IOException e) {
            throw new IllegalStateException("settings do not serialise: " + e.getMessage(), e);
        }
        return out;
    }

    static void writeRepeatability(CompareResult r, Path file) throws IOException {
        try (BufferedWriter w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            w.write("detector,frame,repeatability,n_reference,n_frame,n_matched\n");
            for (FrameScore s : r.frames()) {
                if (s.repeatability().isEmpty()) continue;
                RepeatabilityResult rr = s.repeatability().get();
                w.write(s.detector().cliName() + "," + Csv.text(s.frameName()) + ","
                        + (rr.repeatability().isPresent() ? Csv.num(rr.repeatability().getAsDouble(), 4) : "") + ","
                        + rr.nReference() + "," + rr.nFrame() + "," + rr.nMatched() + "\n");
            }
        }
    }

    public static ObjectNode summary(CompareResult r) {
        ObjectNode root = MAPPER.createObjectNode();
        root.put("format", SUMMARY_FORMAT).put("version", 1);
        root.put("tool_version", Version.get());
        root.put("created", OffsetDateTime.now(ZoneOffset.UTC).format(DateTimeFormatter.ISO_OFFSET_DATE_TIME));
        root.put("source", r.sourceDescription());
        root.put("image_width", r.width()).put("image_height", r.height());
        root.put("reference_frame", r.referenceName());
        root.put("frames", r.frameCount());
        root.put("frames_with_homography", r.framesWithHomography());
        root.put("frames_with_true_points", r.framesWithPoints());
        root.put("epsilon_px", r.epsilon());
        root.put("repeatability_rule", "Schmid, Mohr & Bauckhage 2000: greedy one-to-one matches within epsilon / min(|P'|,|Q'|), points restricted to the common region");
        root.put("pixel_convention", "integer coordinates are pixel centres; (0,0) is the centre of the top-left pixel");
        root.put("safety", Safety.NOTICE);
        ArrayNode ranking = root.putArray("ranking");
        int rank = 1;
        for (DetectorSummary s : r.ranked()) {
            ObjectNode o = ranking.addObject();
            o.put("rank", rank++).put("detector", s.detector().cliName()).put("label", s.detector().label());
            r.configs().stream().filter(c -> c.type() == s.detector()).findFirst().ifPresent(c -> o.put("refinement", c.refine.describe()));
            putOpt(o, "mean_repeatability", s.meanRepeatability());
            putOpt(o, "min_repeatability", s.minRepeatability());
            o.put("frames_scored", s.framesScored());
            o.put("mean_count", s.meanCount());
            LocalisationResult l = s.localisation();
            ObjectNode lo = o.putObject("localisation");
            lo.put("true_features", l.nTrue()).put("found", l.nFound());
            putNum(lo, "found_fraction", l.foundFraction());
            putNum(lo, "rms_px", l.rmsPx());
            putNum(lo, "median_px", l.medianPx());
            putNum(lo, "p95_px", l.p95Px());
            o.putObject("spread").put("mean_hull_fraction", s.meanHullFraction()).put("mean_cell_occupancy", s.meanOccupancy());
            o.put("mean_ms_per_frame_in_run", s.meanMillisPerFrame());
        }
        ObjectNode cfg = root.putObject("detectors");
        for (DetectorConfig c : r.configs()) cfg.set(c.type().cliName(), MAPPER.valueToTree(c));
        return root;
    }

    private static void putOpt(ObjectNode o, String key, OptionalDouble v) {
        if (v.isPresent()) o.put(key, v.getAsDouble());
        else o.putNull(key);
    }

    private static void putNum(ObjectNode o, String key, double v) {
        if (Double.isFinite(v)) o.put(key, v);
        else o.putNull(key);
    }
}
