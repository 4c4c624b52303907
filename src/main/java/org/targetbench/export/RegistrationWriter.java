package org.targetbench.export;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.pipeline.RegisterRun;
import org.targetbench.register.Registration;
import org.targetbench.source.TruthFile;
import org.targetbench.target.TargetDesign;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;

/**
 * Files of a registration run (layouts in docs/formats.md): {@code registration.csv}, {@code registered.csv} and
 * {@code truth.json} (the form {@code compare} reads, plus the design, the camera and per-frame poses when intrinsics
 * were given).
 */
public final class RegistrationWriter {
    private static final ObjectMapper MAPPER = new ObjectMapper();

    private RegistrationWriter() {}

    public static void writeCsvs(RegisterRun.Result result, Path registrationCsv, Path registeredCsv) throws IOException {
        try (PrintWriter w = new PrintWriter(Files.newBufferedWriter(registrationCsv, StandardCharsets.UTF_8))) {
            w.println("frame,status,features_used,rms_px,note");
            for (RegisterRun.Frame f : result.frames()) {
                Registration r = f.registration();
                w.println(Csv.text(f.name()) + "," + r.note().status() + "," + r.featuresUsed() + ","
                        + (Double.isFinite(r.rmsPx()) ? Csv.num(r.rmsPx(), 4) : "") + "," + r.note().code());
            }
        }
        try (PrintWriter w = new PrintWriter(Files.newBufferedWriter(registeredCsv, StandardCharsets.UTF_8))) {
            w.println("frame,feature_id,target_x_mm,target_y_mm,x,y,kind");
            for (RegisterRun.Frame f : result.frames())
                for (Registration.PredictedFeature p : f.registration().predicted())
                    w.println(Csv.text(f.name()) + "," + p.featureId() + "," + Csv.num(p.xMm(), 4) + "," + Csv.num(p.yMm(), 4) + ","
                            + Csv.num(p.u(), 4) + "," + Csv.num(p.v(), 4) + "," + org.targetbench.source.TargetFile.kindName(p.kind()));
        }
    }

    /** Writes truth.json; the result must hold at least one registered frame. */
    public static void writeTruth(RegisterRun.Result result, TargetDesign design, Optional<CameraModel> camera, Path file) throws IOException {
        String reference = result.reference().orElseThrow().name();
        TruthFile.write(reference, RegisterRun.truth(result, camera.map(CameraModel::isDistorted).orElse(false)), file, result.frames().size() <= 500);
        ObjectNode root = (ObjectNode) MAPPER.readTree(file.toFile());
        root.put("source", "registered to design " + design.id() + " (" + design.name() + ")");
        if (camera.isPresent()) {
            CameraModel c = camera.get();
            ObjectNode cam = root.putObject("camera");
            cam.put("image_width", c.width()).put("image_height", c.height()).put("fx", c.fx()).put("fy", c.fy()).put("cx", c.cx()).put("cy", c.cy());
            cam.putObject("distortion").put("model", "brown-conrady").put("k1", c.k1()).put("k2", c.k2()).put("k3", c.k3()).put("p1", c.p1()).put("p2", c.p2());
            ObjectNode poses = root.putObject("poses");
            for (RegisterRun.Frame f : result.frames()) {
                Optional<Pose> p = f.registration().pose();
                if (!f.registration().registered() || p.isEmpty()) continue;
                ObjectNode o = poses.putObject(f.name());
                ArrayNode rot = o.putArray("rotation");
                for (int r = 0; r < 3; r++) rot.addArray().add(p.get().r(r, 0)).add(p.get().r(r, 1)).add(p.get().r(r, 2));
                o.putArray("translation_m").add(p.get().t(0)).add(p.get().t(1)).add(p.get().t(2));
            }
        }
        MAPPER.writerWithDefaultPrettyPrinter().writeValue(file.toFile(), root);
    }
}
