package org.targetbench.export;

import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.score.Robustness;
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

    static String num(double v) { return Double.toString(v); }

    private static String opt(OptionalDouble v) { return v.isPresent() ? num(v.getAsDouble()) : ""; }
}
