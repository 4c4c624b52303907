package org.targetbench.export;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.targetbench.Version;
import org.targetbench.arm.ArmModel;
import org.targetbench.arm.ArmRehearsalResult;
import org.targetbench.arm.ArmRunResult;
import org.targetbench.pipeline.ArmWords;
import org.targetbench.arm.DhRow;
import org.targetbench.arm.GainAdvice;
import org.targetbench.arm.HandEye;

import java.io.BufferedWriter;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;

/**
 * Writers of the arm step: {@code handeye.json}, {@code arm.json} (for a DH arm), the per-run table
 * {@code arm-rehearsal.csv} and {@code arm-rehearsal-summary.json}. Layouts in docs/formats.md.
 */
public final class ArmWriters {
    public static final String HANDEYE_FORMAT = "targetbench-handeye";
    public static final String ARM_FORMAT = "targetbench-arm";
    public static final String SUMMARY_FORMAT = "targetbench-arm-rehearsal-summary";
    public static final String RUNS_HEADER = "run,outcome,time_s,steps,initial_error_px,final_error_px,min_manipulability,min_manipulability_time_s,"
            + "min_limit_margin_deg,min_limit_margin_joint,peak_speed_ratio,peak_speed_joint,damped_s,speed_scaled_s,camera_error_mm,camera_error_deg,"
            + "start_q1_deg,start_q2_deg,start_q3_deg,start_q4_deg,start_q5_deg,start_q6_deg,final_q1_deg,final_q2_deg,final_q3_deg,final_q4_deg,"
            + "final_q5_deg,final_q6_deg,flags";
    private static final ObjectMapper MAPPER = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

    private ArmWriters() {}

    public static void writeHandEye(HandEye h, Path file) throws IOException {
        ObjectNode root = MAPPER.createObjectNode();
        root.put("format", HANDEYE_FORMAT);
        root.put("version", 1);
        root.put("tool_version", Version.get());
        root.put("convention", "P_flange = rotation * P_camera + translation_m");
        root.put("method", h.method());
        ArrayNode r = root.putArray("rotation");
        double[] rot = h.rotation();
        for (int i = 0; i < 3; i++) {
            ArrayNode row = r.addArray();
            for (int j = 0; j < 3; j++) row.add(rot[i * 3 + j]);
        }
        ArrayNode t = root.putArray("translation_m");
        for (double v : h.translationM()) t.add(v);
        ArrayNode views = root.putArray("views");
        for (HandEye.ViewResidual v : h.views()) {
            ObjectNode o = views.addObject();
            o.put("view", v.view());
            o.put("rotation_deg", v.rotationDeg());
            o.put("translation_mm", v.translationMm());
            o.put("outlier", v.outlier());
            o.put("flipped", v.flipped());
        }
        root.put("safety", Safety.NOTICE);
        Files.writeString(file, MAPPER.writeValueAsString(root) + "\n", StandardCharsets.UTF_8);
    }

    /** arm.json of a DH arm (the demo arm, for instance), with the reference joints. */
    public static void writeArm(ArmModel arm, double[] referenceRad, Path file) throws IOException {
        if (arm.dh().isEmpty()) throw new IllegalArgumentException("only a DH arm can be written as arm.json");
        ObjectNode root = MAPPER.createObjectNode();
        root.put("format", ARM_FORMAT);
        root.put("version", 1);
        root.put("name", arm.name());
        root.put("convention", arm.convention().label());
        ArrayNode js = root.putArray("joints");
        for (int i = 0; i < ArmModel.JOINTS; i++) {
            DhRow r = arm.dh().get(i);
            ObjectNode j = js.addObject();
            j.put("a_m", r.aM());
            j.put("alpha_deg", Math.toDegrees(r.alphaRad()));
            j.put("d_m", r.dM());
            j.put("theta_offset_deg", Math.toDegrees(r.thetaOffsetRad()));
            j.put("min_deg", Math.toDegrees(arm.lower(i)));
            j.put("max_deg", Math.toDegrees(arm.upper(i)));
            j.put("max_speed_deg_s", Math.toDegrees(arm.maxSpeed(i)));
        }
        if (referenceRad != null) {
            ArrayNode q = root.putArray("reference_joints_deg");
            for (double v : referenceRad) q.add(Math.toDegrees(v));
        }
        Files.writeString(file, MAPPER.writeValueAsString(root) + "\n", StandardCharsets.UTF_8);
    }

    public static void writeRuns(ArmRehearsalResult r, Path file) throws IOException {
        try (BufferedWriter w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            w.write(RUNS_HEADER);
            w.write("\n");
            for (ArmRunResult x : r.runs()) {
                StringBuilder b = new StringBuilder();
                b.append(String.format(Locale.ROOT, "%d,%s,%.4f,%d,%.4f,%.4f,%.6g,%.4f,%.3f,%d,%.4f,%d,%.4f,%.4f,%.4f,%.5f", x.index(),
                        x.outcome().label(), x.timeS(), x.steps(), x.initialErrorPx(), x.finalErrorPx(), x.minManipulability(), x.minManipulabilityTimeS(),
                        x.minLimitMarginDeg(), x.minLimitMarginJoint(), x.peakSpeedRatio(), x.peakSpeedJoint(), x.dampedS(), x.speedScaledS(),
                        x.cameraErrorMm(), x.cameraErrorDeg()));
                for (double q : x.startJointsRad()) b.append(String.format(Locale.ROOT, ",%.4f", Math.toDegrees(q)));
                for (double q : x.finalJointsRad()) b.append(String.format(Locale.ROOT, ",%.4f", Math.toDegrees(q)));
                b.append(',').append(Csv.text(ArmWords.flags(x)));
                w.write(b.append('\n').toString());
            }
        }
    }

    public static void writeSummary(ArmRehearsalResult r, Path file) throws IOException {
        ObjectNode root = MAPPER.createObjectNode();
        root.put("format", SUMMARY_FORMAT);
        root.put("version", 1);
        root.put("tool_version", Version.get());
        root.put("created", ServoWriters.now());
        root.put("arm", r.arm().name());
        root.put("arm_is_demo", r.arm().isDemo());
        root.put("runs", r.runs().size());
        root.put("converged", r.converged());
        root.put("latency_periods", r.config().latencyFrames);
        root.put("period_s", r.config().servo.dtS);
        root.put("lambda", r.config().servo.lambda);
        root.put("law", r.config().servo.law.cliName());
        ArrayNode ref = root.putArray("reference_joints_deg");
        for (double q : r.referenceJointsRad()) ref.add(Math.toDegrees(q));
        r.advice().ifPresent(a -> {
            ObjectNode o = root.putObject("gain_advice");
            o.put("best_lambda", a.bestLambda());
            o.put("bound_lambda", a.boundLambda());
            o.put("bound_gain", GainAdvice.boundOnGain(a.latencyFrames()));
            o.put("text", ArmWords.advice(a));
            ArrayNode rows = o.putArray("rows");
            for (GainAdvice.Row row : a.rows()) {
                ObjectNode x = rows.addObject();
                x.put("lambda", row.lambda());
                x.put("converged", row.converged());
                x.put("runs", row.runs());
                x.put("oscillating", row.oscillating());
            }
        });
        ArrayNode w = root.putArray("warnings");
        ArmWords.warnings(r).forEach(w::add);
        root.put("not_modelled", ArmWords.NOT_MODELLED);
        root.put("safety", Safety.NOTICE);
        Files.writeString(file, MAPPER.writeValueAsString(root) + "\n", StandardCharsets.UTF_8);
    }
}
