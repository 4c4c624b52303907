package org.targetbench.export;

import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.servo.Robustness;
import org.targetbench.servo.ServoPoint;
import org.targetbench.servo.ServoSet;
import org.targetbench.source.CsvIn;
import org.targetbench.source.SourceException;

import java.io.BufferedWriter;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * The flat {@code servo-set.csv} (format "targetbench-servo-set-csv", version 1): {@code # key,value} header lines
 * holding everything the JSON file holds outside the points, then one table row per point. Numbers are written in
 * Java's shortest round-trip form, so import gives back exactly the same set. Layout: docs/formats.md.
 */
public final class ServoSetCsv {
    public static final String FORMAT = "targetbench-servo-set-csv";
    public static final int VERSION = 1;
    public static final String HEADER = "id,u,v,x,y,z_m,target_x_mm,target_y_mm,feature_id,repeatability,track_survival,localisation_error_px,jitter_px,reason";

    private ServoSetCsv() {}

    public static void write(ServoSet s, Path file) throws IOException {
        Map<String, String> meta = new LinkedHashMap<>();
        meta.put("format", FORMAT);
        meta.put("version", Integer.toString(VERSION));
        meta.put("tool_version", s.toolVersion());
        meta.put("created", s.created());
        meta.put("safety", Safety.NOTICE);
        meta.put("u_v", ServoSetJson.PIXELS);
        meta.put("x_y", ServoSetJson.NORMALISED);
        meta.put("z_m", ServoSetJson.CAMERA_FRAME);
        meta.put("target_x_y_mm", ServoSetJson.TARGET_FRAME);
        meta.put("reference_pose", ServoSetJson.POSE);
        CameraModel c = s.camera();
        meta.put("image_width", Integer.toString(c.width()));
        meta.put("image_height", Integer.toString(c.height()));
        double[] k = {c.fx(), c.fy(), c.cx(), c.cy(), c.k1(), c.k2(), c.k3(), c.p1(), c.p2()};
        String[] kn = {"fx", "fy", "cx", "cy", "k1", "k2", "k3", "p1", "p2"};
        for (int i = 0; i < k.length; i++) meta.put(kn[i], num(k[i]));
        meta.put("target_id", s.targetId());
        meta.put("target_design", s.targetDesign());
        if (s.referencePose().isPresent()) {
            Pose p = s.referencePose().get();
            StringBuilder r = new StringBuilder();
            for (double v : p.rotation()) r.append(r.length() == 0 ? "" : " ").append(num(v));
            meta.put("reference_pose_rotation_row_major", r.toString());
            meta.put("reference_pose_translation_m", num(p.t(0)) + " " + num(p.t(1)) + " " + num(p.t(2)));
        }
        meta.put("reference_pose_method", s.poseMethod());
        meta.put("detector", s.detector());
        meta.put("detector_config", s.detectorConfig());
        meta.put("tracker_config", s.trackerConfig());
        meta.put("condition_number", num(s.condition()));
        meta.put("sigma_min", num(s.sigmaMin()));
        try (BufferedWriter w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            for (var e : meta.entrySet()) w.write("# " + e.getKey() + "," + Csv.text(e.getValue()) + "\n");
            w.write(HEADER + "\n");
            for (ServoPoint p : s.points()) {
                Robustness r = p.robustness();
                w.write(p.id() + "," + num(p.u()) + "," + num(p.v()) + "," + num(p.x()) + "," + num(p.y()) + "," + num(p.zM()) + ","
                        + num(p.targetXMm()) + "," + num(p.targetYMm()) + "," + p.featureId() + "," + opt(r.repeatability()) + ","
                        + opt(r.trackSurvival()) + "," + opt(r.localisationErrorPx()) + "," + opt(r.jitterPx()) + "," + Csv.text(p.reason()) + "\n");
            }
        }
    }

    public static ServoSet read(Path file) throws SourceException {
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
        if (!FORMAT.equals(meta.get("format")))
            throw new SourceException(file + ": format is " + (meta.containsKey("format") ? "\"" + meta.get("format") + "\"" : "missing") + ", expected \"" + FORMAT + "\"");
        if (!Integer.toString(VERSION).equals(meta.get("version")))
            throw new SourceException(file + ": version is " + meta.getOrDefault("version", "missing") + "; this build reads " + FORMAT + " versions 1.." + VERSION);
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
        if (i >= lines.size() || !lines.get(i).strip().equals(HEADER)) throw new SourceException(file + ": line " + (i + 1) + " must be the header " + HEADER);
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

    static String num(double v) { return Double.toString(v); }

    private static String opt(OptionalDouble v) { return v.isPresent() ? num(v.getAsDouble()) : ""; }

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
