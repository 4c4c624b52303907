package org.targetbench.formats;

import com.fasterxml.jackson.databind.JsonNode;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.export.ServoSetCsv;
import org.targetbench.export.ServoSetJson;
import org.targetbench.score.Robustness;
import org.targetbench.servo.ServoPoint;
import org.targetbench.servo.ServoSet;
import org.targetbench.source.CsvIn;
import org.targetbench.source.JsonIn;
import org.targetbench.source.SourceException;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * Reads servo sets in both of our formats ({@link ServoSetJson} and the flat {@link ServoSetCsv}, layouts in
 * docs/formats.md), chosen by file extension. Reading is strict: the format name and a known version are required,
 * every number must be finite, depths positive and the intrinsics complete; anything else is a one-line
 * {@link SourceException}.
 */
public final class ServoSetReader {
    private ServoSetReader() {}

    /** Reads {@code .json} or {@code .csv}. */
    public static ServoSet read(Path file) throws SourceException {
        String n = file.getFileName().toString().toLowerCase(Locale.ROOT);
        ServoSet set;
        if (n.endsWith(".csv")) set = readCsv(file);
        else if (n.endsWith(".json")) set = readJson(file);
        else throw new SourceException("cannot tell the format of " + file + ": a servo set ends in .json or .csv");
        var implausible = org.targetbench.camera.CameraChecks.problem(set.camera());
        if (implausible.isPresent()) throw new SourceException(file + ": camera " + implausible.get());
        var inconsistent = org.targetbench.servo.SetConsistency.problem(set.camera(), set.points());
        if (inconsistent.isPresent()) throw new SourceException(file + ": " + inconsistent.get());
        return set;
    }



    static ServoSet readJson(Path file) throws SourceException {
        JsonIn.Parsed parsed = JsonIn.parse(file);
        JsonIn in = parsed.in();
        JsonNode root = parsed.root();
        if (!root.has("format")) throw in.error("format", "is missing; a servo set must say \"format\": \"" + ServoSetJson.FORMAT + "\"");
        if (!root.has("version")) throw in.error("version", "is missing; this build reads " + ServoSetJson.FORMAT + " versions 1.." + ServoSetJson.VERSION);
        in.expectFormat(root, ServoSetJson.FORMAT, ServoSetJson.VERSION);
        in.knownKeys(root, "format", "version", "tool_version", "created", "safety", "conventions", "camera", "target", "reference_pose",
                "reference_pose_method", "settings", "set", "points", "rehearsal");
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
        return new ServoSet(root.path("tool_version").asText(""), root.path("created").asText(""), camera, tgt.path("id").asText(""),
                tgt.path("design").asText(""), pose, root.path("reference_pose_method").asText(""), settings.path("detector").asText(""),
                settings.path("detector_config").isMissingNode() ? "{}" : settings.path("detector_config").toString(),
                settings.path("tracker_config").isMissingNode() ? "{}" : settings.path("tracker_config").toString(), pts,
                in.number(setN, "condition_number", "set", Double.NaN), in.number(setN, "sigma_min", "set", Double.NaN));
    }


    private static OptionalDouble opt(JsonIn in, JsonNode parent, String key, String where) throws SourceException {
        JsonNode n = parent.get(key);
        if (n == null || n.isNull()) return OptionalDouble.empty();
        return OptionalDouble.of(in.finite(n, where + ".robustness." + key));
    }


    static ServoSet readCsv(Path file) throws SourceException {
        if (!Files.isRegularFile(file)) throw org.targetbench.source.Missing.file(file, "file");
        List<String> lines;
        try {
            lines = Files.readAllLines(file, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new SourceException("cannot read " + file + ": " + e.getMessage());
        }
        Map<String, String> meta = new LinkedHashMap<>();
        int i = 0;
        for (; i < lines.size() && lines.get(i).startsWith("#"); i++) {
            List<String> c = split(file, i, lines.get(i).substring(1).strip());
            meta.put(c.get(0), c.size() > 1 ? c.get(1) : "");
        }
        if (!ServoSetCsv.FORMAT.equals(meta.get("format")))
            throw new SourceException(file + ": format is " + (meta.containsKey("format") ? "\"" + meta.get("format") + "\"" : "missing") + ", expected \"" + ServoSetCsv.FORMAT + "\"");
        if (!Integer.toString(ServoSetCsv.VERSION).equals(meta.get("version")))
            throw new SourceException(file + ": version is " + meta.getOrDefault("version", "missing") + "; this build reads " + ServoSetCsv.FORMAT + " versions 1.." + ServoSetCsv.VERSION);
        CameraModel camera;
        try {
            camera = new CameraModel((int) req(file, meta, "image_width"), (int) req(file, meta, "image_height"), req(file, meta, "fx"), req(file, meta, "fy"),
                    req(file, meta, "cx"), req(file, meta, "cy"), opt0(file, meta, "k1"), opt0(file, meta, "k2"), opt0(file, meta, "k3"),
                    opt0(file, meta, "p1"), opt0(file, meta, "p2"));
        } catch (IllegalArgumentException e) {
            throw new SourceException(file + ": camera " + e.getMessage());
        }
        Optional<Pose> pose = Optional.empty();
        if (meta.containsKey("reference_pose_rotation_row_major")) {
            double[] r = nums(file, meta, "reference_pose_rotation_row_major", 9), t = nums(file, meta, "reference_pose_translation_m", 3);
            try {
                pose = Optional.of(new Pose(r, t));
            } catch (IllegalArgumentException e) {
                throw new SourceException(file + ": reference_pose " + e.getMessage());
            }
        }
        if (i >= lines.size() || !lines.get(i).strip().equals(ServoSetCsv.HEADER)) throw new SourceException(file + ": line " + (i + 1) + " must be the header " + ServoSetCsv.HEADER);
        List<ServoPoint> pts = new ArrayList<>();
        for (int ln = i + 1; ln < lines.size(); ln++) {
            if (lines.get(ln).isBlank()) continue;
            List<String> c = split(file, ln, lines.get(ln));
            if (c.size() != 14) throw new SourceException(file + ": line " + (ln + 1) + " has " + c.size() + " cells, expected 14");
            double[] v = new double[13];
            for (int k = 0; k < 13; k++) v[k] = c.get(k).isEmpty() && k >= 9 ? Double.NaN : cell(file, ln, c.get(k), k >= 9);
            if (!(v[5] > 0)) throw new SourceException(file + ": line " + (ln + 1) + ": z_m must be a depth > 0 m, got " + c.get(5));
            try {
                pts.add(new ServoPoint((int) v[0], v[1], v[2], v[3], v[4], v[5], v[6], v[7], (int) v[8],
                        new Robustness(od(v[9]), od(v[10]), od(v[11]), od(v[12])), c.get(13)));
            } catch (IllegalArgumentException e) {
                throw new SourceException(file + ": line " + (ln + 1) + ": " + e.getMessage());
            }
        }
        return new ServoSet(meta.getOrDefault("tool_version", ""), meta.getOrDefault("created", ""), camera, meta.getOrDefault("target_id", ""),
                meta.getOrDefault("target_design", ""), pose, meta.getOrDefault("reference_pose_method", ""), meta.getOrDefault("detector", ""),
                meta.getOrDefault("detector_config", "{}"), meta.getOrDefault("tracker_config", "{}"), pts,
                meta.containsKey("condition_number") ? parse(file, "condition_number", meta.get("condition_number")) : Double.NaN,
                meta.containsKey("sigma_min") ? parse(file, "sigma_min", meta.get("sigma_min")) : Double.NaN);
    }


    private static OptionalDouble od(double v) { return Double.isNaN(v) ? OptionalDouble.empty() : OptionalDouble.of(v); }


    private static List<String> split(Path file, int line, String text) throws SourceException {
        try {
            return CsvIn.split(text);
        } catch (IllegalArgumentException e) {
            throw new SourceException(file + ": line " + (line + 1) + ": " + e.getMessage());
        }
    }


    private static double cell(Path file, int line, String s, boolean optional) throws SourceException {
        double v = parse(file, "line " + (line + 1), s);
        if (!Double.isFinite(v)) throw new SourceException(file + ": line " + (line + 1) + ": values must be finite, got " + s);
        return v;
    }


    private static double parse(Path file, String where, String s) throws SourceException {
        try {
            double v = Double.parseDouble(s.strip());
            if (!Double.isFinite(v)) throw new SourceException(file + ": " + where + " must be finite, got " + s);
            return v;
        } catch (NumberFormatException e) {
            throw new SourceException(file + ": " + where + ": \"" + s + "\" is not a number");
        }
    }


    private static double req(Path file, Map<String, String> meta, String key) throws SourceException {
        if (!meta.containsKey(key) || meta.get(key).isBlank()) throw new SourceException(file + ": camera " + key + " is missing");
        return parse(file, key, meta.get(key));
    }


    private static double opt0(Path file, Map<String, String> meta, String key) throws SourceException {
        return meta.containsKey(key) && !meta.get(key).isBlank() ? parse(file, key, meta.get(key)) : 0;
    }


    private static double[] nums(Path file, Map<String, String> meta, String key, int n) throws SourceException {
        String[] parts = meta.getOrDefault(key, "").strip().split("\\s+");
        if (parts.length != n) throw new SourceException(file + ": " + key + " must hold " + n + " numbers");
        double[] out = new double[n];
        for (int i = 0; i < n; i++) out[i] = parse(file, key, parts[i]);
        return out;
    }
}
