package org.targetbench.export;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.servo.Robustness;
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

    public static void write(ServoSet s, Path file) throws IOException {
        MAPPER.writerWithDefaultPrettyPrinter().writeValue(file.toFile(), toJson(s));
    }

    public static ServoSet read(Path file) throws SourceException {
        JsonIn.Parsed parsed = JsonIn.parse(file);
        JsonIn in = parsed.in();
        JsonNode root = parsed.root();
        if (!root.has("format")) throw in.error("format", "is missing; a servo set must say \"format\": \"" + FORMAT + "\"");
        if (!root.has("version")) throw in.error("version", "is missing; this build reads " + FORMAT + " versions 1.." + VERSION);
        in.expectFormat(root, FORMAT, VERSION);
        in.knownKeys(root, "format", "version", "tool_version", "created", "safety", "conventions", "camera", "target", "reference_pose",
                "reference_pose_method", "settings", "set", "points");
        JsonNode cam = root.get("camera");
        if (cam == null || !cam.isObject()) throw in.error("camera", "is missing: the intrinsics are needed");
        JsonNode dist = cam.path("distortion");
        CameraModel camera;
        try {
            camera = new CameraModel(in.integer(cam, "image_width", "camera"), in.integer(cam, "image_height", "camera"),
                    in.number(cam, "fx", "camera"), in.number(cam, "fy", "camera"), in.number(cam, "cx", "camera"), in.number(cam, "cy", "camera"),
                    in.number(dist, "k1", "camera.distortion", 0), in.number(dist, "k2", "camera.distortion", 0), in.number(dist, "k3", "camera.distortion", 0),
                    in.number(dist, "p1", "camera.distortion", 0), in.number(dist, "p2", "camera.distortion", 0));
        } catch (IllegalArgumentException e) {
            throw in.error("camera", e.getMessage());
        }
        var implausible = org.targetbench.camera.CameraChecks.problem(camera);
        if (implausible.isPresent()) throw in.error("camera", implausible.get());
        JsonNode tgt = root.path("target");
        Optional<Pose> pose = Optional.empty();
        JsonNode pn = root.get("reference_pose");
        if (pn != null && !pn.isNull()) {
            JsonNode t = in.array(pn, "translation_m", "reference_pose");
            if (t.size() != 3) throw in.error("reference_pose.translation_m", "must hold 3 numbers");
            try {
                pose = Optional.of(new Pose(in.matrix3(pn.get("rotation"), "reference_pose.rotation"), new double[]{
                        in.finite(t.get(0), "reference_pose.translation_m[0]"), in.finite(t.get(1), "reference_pose.translation_m[1]"),
                        in.finite(t.get(2), "reference_pose.translation_m[2]")}));
            } catch (IllegalArgumentException e) {
                throw in.error("reference_pose", e.getMessage());
            }
        }
        JsonNode settings = root.path("settings");
        JsonNode setN = root.path("set");
        JsonNode pa = in.array(root, "points", "set");
        List<ServoPoint> pts = new ArrayList<>();
        for (int i = 0; i < pa.size(); i++) {
            JsonNode p = pa.get(i);
            String w = "points[" + i + "]";
            double z = in.number(p, "z_m", w);
            if (!(z > 0)) throw in.error(w + ".z_m", "must be a depth > 0 m, got " + z);
            JsonNode rb = p.path("robustness");
            try {
                pts.add(new ServoPoint(in.integer(p, "id", w), in.number(p, "u", w), in.number(p, "v", w), in.number(p, "x", w), in.number(p, "y", w), z,
                        in.number(p, "target_x_mm", w), in.number(p, "target_y_mm", w), (int) in.number(p, "feature_id", w, -1),
                        new Robustness(opt(in, rb, "repeatability", w), opt(in, rb, "track_survival", w), opt(in, rb, "localisation_error_px", w),
                                opt(in, rb, "jitter_px", w)), p.path("reason").asText("")));
            } catch (IllegalArgumentException e) {
                throw in.error(w, e.getMessage());
            }
        }
        var inconsistent = org.targetbench.servo.SetConsistency.problem(camera, pts);
        if (inconsistent.isPresent()) throw new SourceException(file + ": " + inconsistent.get());
        return new ServoSet(root.path("tool_version").asText(""), root.path("created").asText(""), camera, tgt.path("id").asText(""),
                tgt.path("design").asText(""), pose, root.path("reference_pose_method").asText(""), settings.path("detector").asText(""),
                settings.path("detector_config").isMissingNode() ? "{}" : settings.path("detector_config").toString(),
                settings.path("tracker_config").isMissingNode() ? "{}" : settings.path("tracker_config").toString(), pts,
                in.number(setN, "condition_number", "set", Double.NaN), in.number(setN, "sigma_min", "set", Double.NaN));
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

    private static OptionalDouble opt(JsonIn in, JsonNode parent, String key, String where) throws SourceException {
        JsonNode n = parent.get(key);
        if (n == null || n.isNull()) return OptionalDouble.empty();
        return OptionalDouble.of(in.finite(n, where + ".robustness." + key));
    }
}
