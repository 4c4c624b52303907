package org.targetbench.export;

import org.targetbench.pipeline.Reasons;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.targetbench.Version;
import org.targetbench.select.Candidate;
import org.targetbench.select.Selection;
import org.targetbench.servo.RehearsalConfig;
import org.targetbench.servo.RehearsalResult;
import org.targetbench.servo.RunResult;

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
 * Writers of the servo step's tables: {@code selection.csv} (every candidate, chosen or not, with its reason),
 * {@code rehearsal.csv} (one row per run) and {@code rehearsal-summary.json}. Layouts in docs/formats.md.
 */
public final class ServoWriters {
    public static final String SELECTION_HEADER = "id,u,v,status,reason,repeatability,frames_found,frames_visible,localisation_error_px,track_survival,jitter_px,z_m,target_x_mm,target_y_mm,feature_id";
    public static final String REHEARSAL_HEADER = "run,outcome,time_s,steps,start_tx_mm,start_ty_mm,start_tz_mm,start_rx_deg,start_ry_deg,start_rz_deg,"
            + "start_translation_mm,start_rotation_deg,initial_error_px,final_error_px,max_retreat_mm,min_plane_distance_m,max_depth_ratio,lost_point,redrawn_starts";
    public static final String REHEARSAL_FORMAT = "targetbench-rehearsal-summary";
    private static final ObjectMapper MAPPER = new ObjectMapper();

    private ServoWriters() {}

    /** UTC now in ISO 8601, as written in headers. */
    public static String now() {
        return OffsetDateTime.now(ZoneOffset.UTC).withNano(0).format(DateTimeFormatter.ISO_OFFSET_DATE_TIME);
    }

    public static void writeSelection(Selection s, Path file) throws IOException {
        try (BufferedWriter w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            w.write(SELECTION_HEADER + "\n");
            for (Selection.Chosen c : s.chosen()) row(w, c.candidate(), "chosen", Reasons.chosen(c));
            for (Selection.Rejected r : s.rejected()) row(w, r.candidate(), "rejected", Reasons.rejected(r));
        }
    }

    /**
     * The selection file of a set as it stands after hand edits: every point of {@code set} is "chosen" with the reason
     * it carries in the set, every other candidate of the selection is "rejected" (with the selection's reason, or
     * {@link Reasons#REMOVED_BY_HAND} for a chosen point taken out), so that the file and the set never disagree.
     */
    public static void writeSelection(Selection s, org.targetbench.servo.ServoSet set, Path file) throws IOException {
        java.util.Map<Integer, Candidate> byId = new java.util.LinkedHashMap<>();
        java.util.Map<Integer, String> rejectedWhy = new java.util.HashMap<>();
        for (Selection.Chosen c : s.chosen()) byId.put(c.candidate().id(), c.candidate());
        for (Selection.Rejected r : s.rejected()) {
            byId.put(r.candidate().id(), r.candidate());
            rejectedWhy.put(r.candidate().id(), Reasons.rejected(r));
        }
        java.util.Set<Integer> in = new java.util.HashSet<>();
        try (BufferedWriter w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            w.write(SELECTION_HEADER + "\n");
            for (org.targetbench.servo.ServoPoint p : set.points()) {
                in.add(p.id());
                Candidate c = byId.get(p.id());
                if (c == null) throw new IllegalArgumentException("set point " + p.id() + " is not a candidate of the selection");
                row(w, c, "chosen", p.reason());
            }
            for (Candidate c : byId.values())
                if (!in.contains(c.id())) row(w, c, "rejected", rejectedWhy.getOrDefault(c.id(), Reasons.REMOVED_BY_HAND));
        }
    }

    /**
     * The selection file of a set with no choice behind it (read from a file): every point "chosen" with the reason it
     * carries, and nothing else, so that an earlier selection file in the folder is replaced and never contradicts the
     * set. The re-detection counts are unknown and left empty.
     */
    public static void writeSelection(org.targetbench.servo.ServoSet set, Path file) throws IOException {
        try (BufferedWriter w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            w.write(SELECTION_HEADER + "\n");
            for (org.targetbench.servo.ServoPoint p : set.points()) {
                var r = p.robustness();
                w.write(p.id() + "," + Csv.num(p.u(), 3) + "," + Csv.num(p.v(), 3) + ",chosen," + Csv.text(p.reason()) + "," + opt(r.repeatability(), 4)
                        + ",,," + opt(r.localisationErrorPx(), 4) + "," + opt(r.trackSurvival(), 4) + "," + opt(r.jitterPx(), 4) + ","
                        + Csv.num(p.zM(), 6) + "," + Csv.num(p.targetXMm(), 3) + "," + Csv.num(p.targetYMm(), 3) + "," + p.featureId() + "\n");
            }
        }
    }

    private static void row(BufferedWriter w, Candidate c, String status, String reason) throws IOException {
        var r = c.robustness();
        w.write(c.id() + "," + Csv.num(c.u(), 3) + "," + Csv.num(c.v(), 3) + "," + status + "," + Csv.text(reason) + "," + opt(r.repeatability(), 4) + ","
                + c.framesFound() + "," + c.framesVisible() + "," + opt(r.localisationErrorPx(), 4) + "," + opt(r.trackSurvival(), 4) + ","
                + opt(r.jitterPx(), 4) + "," + Csv.num(c.zM(), 6) + "," + Csv.num(c.targetXMm(), 3) + "," + Csv.num(c.targetYMm(), 3) + "," + c.featureId() + "\n");
    }

    private static String opt(OptionalDouble v, int d) { return v.isPresent() ? Csv.num(v.getAsDouble(), d) : ""; }

    public static void writeRehearsalCsv(RehearsalResult r, Path file) throws IOException {
        try (BufferedWriter w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            w.write(REHEARSAL_HEADER + "\n");
            for (RunResult x : r.runs()) {
                var s = x.start();
                w.write(x.index() + "," + x.outcome().label() + "," + Csv.num(x.timeS(), 3) + "," + x.steps() + "," + Csv.num(s.txMm(), 3) + ","
                        + Csv.num(s.tyMm(), 3) + "," + Csv.num(s.tzMm(), 3) + "," + Csv.num(s.rxDeg(), 3) + "," + Csv.num(s.ryDeg(), 3) + ","
                        + Csv.num(s.rzDeg(), 3) + "," + Csv.num(s.translationMm(), 3) + "," + Csv.num(s.rotationDeg(), 3) + ","
                        + Csv.num(x.initialErrorPx(), 4) + "," + Csv.num(x.finalErrorPx(), 4) + "," + Csv.num(x.maxRetreatMm(), 3) + ","
                        + Csv.num(x.minPlaneDistanceM(), 5) + "," + Csv.num(x.maxDepthRatio(), 4) + "," + (x.lostPoint() < 0 ? "" : x.lostPoint()) + "," + x.redrawnStarts() + "\n");
            }
        }
    }

    public static ObjectNode rehearsalSummary(RehearsalResult r, String setFile, double elapsedS) {
        ObjectNode root = MAPPER.createObjectNode();
        root.put("format", REHEARSAL_FORMAT).put("version", 1);
        root.put("tool_version", Version.get()).put("created", now());
        root.put("safety", Safety.NOTICE);
        root.put("set", setFile);
        root.put("reference_pose_method", r.poseMethod());
        root.put("reference_distance_m", r.referenceDistanceM());
        RehearsalConfig c = r.config();
        ObjectNode s = root.putObject("settings");
        s.put("starts", c.starts).put("lambda_per_s", c.lambda).put("law", c.law.cliName()).put("depth", c.depthMode.cliName())
                .put("depth_error_factor", c.depthErrorFactor);
        if (Double.isNaN(c.noiseSigmaPx)) s.put("noise_px", "measured jitter per point (0 where not measured)");
        else s.put("noise_px", c.noiseSigmaPx);
        s.put("use_measured_survival", c.useSurvival).put("dt_s", c.dtS).put("timeout_s", c.timeoutS).put("converged_below_px_rms", c.convergedPx);
        ArrayNode em = s.putArray("envelope_mm"), ed = s.putArray("envelope_deg");
        for (int i = 0; i < 3; i++) {
            em.add(c.envelopeMm[i]);
            ed.add(c.envelopeDeg[i]);
        }
        s.put("retreat_limit", c.retreatLimit).put("seed", c.seed);
        RehearsalResult.Summary m = r.summary();
        ObjectNode o = root.putObject("summary");
        o.put("runs", m.runs()).put("converged", m.converged());
        num(o, "convergence_rate", m.convergenceRate());
        num(o, "median_time_to_converge_s", m.medianTimeS());
        num(o, "p95_time_to_converge_s", m.p95TimeS());
        num(o, "median_final_error_px", m.medianFinalErrorPx());
        num(o, "p95_final_error_px", m.p95FinalErrorPx());
        num(o, "max_retreat_along_optical_axis_mm", m.maxRetreatMm());
        num(o, "max_depth_ratio", m.maxDepthRatio());
        num(o, "min_distance_to_target_plane_m", m.minPlaneDistanceM());
        o.put("lost_point_out_of_view", m.lostFieldOfView()).put("lost_track", m.trackLost()).put("timeouts", m.timeouts())
                .put("retreated", m.retreated()).put("singular", m.singular())
                .put("redrawn_starts", m.redrawnStarts());
        ArrayNode w = root.putArray("warnings");
        org.targetbench.pipeline.Reasons.warnings(r).forEach(w::add);
        root.put("elapsed_s", elapsedS);
        return root;
    }

    public static void writeRehearsalSummary(RehearsalResult r, String setFile, double elapsedS, Path file) throws IOException {
        MAPPER.writerWithDefaultPrettyPrinter().writeValue(file.toFile(), rehearsalSummary(r, setFile, elapsedS));
    }

    private static void num(ObjectNode o, String k, double v) {
        if (Double.isFinite(v)) o.put(k, v);
        else o.putNull(k);
    }
}
