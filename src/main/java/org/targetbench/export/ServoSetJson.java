package org.targetbench.export;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.score.Robustness;
import org.targetbench.servo.ServoPoint;
import org.targetbench.servo.ServoSet;
import org.targetbench.source.JsonIn;
import org.targetbench.source.SourceException;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * The {@code servo-set.json} format (format "targetbench-servo-set", version 1), our own, documented in
 * docs/formats.md. Reading is strict: the format name and a known version are required, every number must be finite,
 * depths positive and the intrinsics complete.
 */
public final class ServoSetJson {
    public static final String FORMAT = "targetbench-servo-set";
    public static final int VERSION = 1;
    static final String PIXELS = "pixels; integer coordinates are pixel centres, (0,0) is the centre of the top-left pixel, u right, v down";
    static final String NORMALISED = "undistorted normalised image coordinates x = X/Z, y = Y/Z (dimensionless)";
    static final String CAMERA_FRAME = "camera frame: x right, y down, z along the optical axis; depth Z in metres";
    static final String TARGET_FRAME = "target design: millimetres, origin at the top-left corner of the page, x right, y down the page, z into the page";
    static final String POSE = "reference_pose maps target points (metres) into the reference camera frame: P_camera = R P_target + t";
    static final String CONDITION = "cond(L*) and sigma_min of the stacked point interaction matrix at the reference, translational columns scaled by the mean Z* (unit free)";
    private static final ObjectMapper MAPPER = new ObjectMapper();

    private ServoSetJson() {}

    public static ObjectNode toJson(ServoSet s) {
        ObjectNode root = MAPPER.createObjectNode();
        root.put("format", FORMAT).put("version", VERSION);
        root.put("tool_version", s.toolVersion()).put("created", s.created());
        root.put("safety", Safety.NOTICE);
        ObjectNode units = root.putObject("conventions");
        units.put("u_v", PIXELS).put("x_y", NORMALISED).put("z_m", CAMERA_FRAME).put("target_x_y_mm", TARGET_FRAME)
                .put("reference_pose", POSE).put("condition_number", CONDITION);
        CameraModel c = s.camera();
        ObjectNode cam = root.putObject("camera");
        cam.put("image_width", c.width()).put("image_height", c.height()).put("fx", c.fx()).put("fy", c.fy()).put("cx", c.cx()).put("cy", c.cy());
        cam.putObject("distortion").put("model", "brown-conrady").put("k1", c.k1()).put("k2", c.k2()).put("k3", c.k3()).put("p1", c.p1()).put("p2", c.p2());
        root.putObject("target").put("id", s.targetId()).put("design", s.targetDesign());
        if (s.referencePose().isPresent()) {
            Pose p = s.referencePose().get();
            ObjectNode po = root.putObject("reference_pose");
            ArrayNode r = po.putArray("rotation");
            for (int i = 0; i < 3; i++) r.addArray().add(p.r(i, 0)).add(p.r(i, 1)).add(p.r(i, 2));
            po.putArray("translation_m").add(p.t(0)).add(p.t(1)).add(p.t(2));
        } else root.putNull("reference_pose");
        root.put("reference_pose_method", s.poseMethod());
        ObjectNode set = root.putObject("settings");
        set.put("detector", s.detector());
        set.set("detector_config", parse(s.detectorConfig()));
        set.set("tracker_config", parse(s.trackerConfig()));
        root.putObject("set").put("count", s.points().size()).put("condition_number", s.condition()).put("sigma_min", s.sigmaMin());
        ArrayNode pts = root.putArray("points");
        for (ServoPoint p : s.points()) {
            ObjectNode o = pts.addObject();
            o.put("id", p.id()).put("u", p.u()).put("v", p.v()).put("x", p.x()).put("y", p.y()).put("z_m", p.zM())
                    .put("target_x_mm", p.targetXMm()).put("target_y_mm", p.targetYMm()).put("feature_id", p.featureId());
            ObjectNode rb = o.putObject("robustness");
            opt(rb, "repeatability", p.robustness().repeatability());
            opt(rb, "track_survival", p.robustness().trackSurvival());
            opt(rb, "localisation_error_px", p.robustness().localisationErrorPx());
            opt(rb, "jitter_px", p.robustness().jitterPx());
            o.put("reason", p.reason());
        }
        return root;
    }

    /** The words the {@code rehearsal} key holds when the set was exported without a rehearsal of exactly this set. */
    public static final String NOT_REHEARSED = "not rehearsed";

    /**
     * The set with a {@code rehearsal} key: the settings and headline figures of the rehearsal run on exactly this set,
     * or {@link #NOT_REHEARSED}.
     */
    public static ObjectNode toJson(ServoSet s, java.util.Optional<org.targetbench.servo.RehearsalResult> rehearsal, String rehearsalFolder) {
        ObjectNode root = toJson(s);
        if (rehearsal.isEmpty()) root.put("rehearsal", NOT_REHEARSED);
        else {
            ObjectNode full = ServoWriters.rehearsalSummary(rehearsal.get(), "servo-set.json", 0);
            ObjectNode r = root.putObject("rehearsal");
            r.put("files", rehearsalFolder);
            r.set("settings", full.get("settings"));
            r.set("summary", full.get("summary"));
            r.set("warnings", full.get("warnings"));
        }
        return root;
    }

    public static void write(ServoSet s, java.util.Optional<org.targetbench.servo.RehearsalResult> rehearsal, String rehearsalFolder, Path file) throws IOException {
        MAPPER.writerWithDefaultPrettyPrinter().writeValue(file.toFile(), toJson(s, rehearsal, rehearsalFolder));
    }

    public static void write(ServoSet s, Path file) throws IOException {
        MAPPER.writerWithDefaultPrettyPrinter().writeValue(file.toFile(), toJson(s));
    }

    static JsonNode parse(String json) {
        try {
            return MAPPER.readTree(json == null || json.isBlank() ? "{}" : json);
        } catch (IOException e) {
            throw new IllegalArgumentException("settings are not valid JSON: " + json);
        }
    }

    private static void opt(ObjectNode o, String key, OptionalDouble v) {
        if (v.isPresent()) o.put(key, v.getAsDouble());
        else o.putNull(key);
    }
}
