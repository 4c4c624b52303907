package org.targetbench.source;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.targetbench.camera.Pose;
import org.targetbench.target.TargetDesign;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * The {@code poses.json} format (format "targetbench-poses", version 1): a list of target poses in the camera frame,
 * each either explicit ({@code rotation} 3x3 and {@code translation_m}) or "facing" ({@code distance_m} plus optional
 * {@code tilt_x_deg}, {@code tilt_y_deg}, {@code roll_deg}, {@code offset_x_m}, {@code offset_y_m}), see
 * {@link Pose#facing}. Documented in docs/formats.md.
 */
public final class PosesFile {
    public static final String FORMAT = "targetbench-poses";
    public static final int VERSION = 1;

    private PosesFile() {}

    public static List<Pose> read(Path file, TargetDesign design) throws SourceException {
        JsonIn.Parsed parsed = JsonIn.parse(file);
        JsonIn in = parsed.in();
        in.expectFormat(parsed.root(), FORMAT, VERSION);
        in.knownKeys(parsed.root(), "format", "version", "frame_convention", "poses");
        JsonNode arr = in.array(parsed.root(), "poses", "poses");
        if (arr.isEmpty()) throw in.error("poses", "is empty; give at least one pose");
        List<Pose> out = new ArrayList<>();
        for (int i = 0; i < arr.size(); i++) {
            JsonNode p = arr.get(i);
            String where = "poses[" + i + "]";
            try {
                if (p.has("rotation")) {
                    JsonNode t = in.array(p, "translation_m", where);
                    if (t.size() != 3) throw in.error(where + ".translation_m", "must hold 3 numbers");
                    out.add(new Pose(in.matrix3(p.get("rotation"), where + ".rotation"),
                            new double[]{in.finite(t.get(0), where), in.finite(t.get(1), where), in.finite(t.get(2), where)}));
                } else {
                    double dist = in.number(p, "distance_m", where);
                    if (!(dist > 0)) throw in.error(where + ".distance_m", "must be > 0, got " + dist);
                    out.add(Pose.facing(design.widthMm(), design.heightMm(), dist,
                            in.number(p, "tilt_x_deg", where, 0), in.number(p, "tilt_y_deg", where, 0), in.number(p, "roll_deg", where, 0),
                            in.number(p, "offset_x_m", where, 0), in.number(p, "offset_y_m", where, 0)));
                }
            } catch (IllegalArgumentException e) {
                throw in.error(where, e.getMessage());
            }
            var bad = org.targetbench.camera.CameraChecks.problem(out.get(out.size() - 1), design);
            if (bad.isPresent()) throw in.error(where, bad.get());
        }
        return out;
    }

    /** Writes poses in the explicit form. */
    public static void write(List<Pose> poses, Path file) throws IOException {
        ObjectNode root = JsonIn.MAPPER.createObjectNode();
        root.put("format", FORMAT).put("version", VERSION);
        root.put("frame_convention", "target pose in the camera frame: P_camera = R P_target + t; target units metres");
        ArrayNode arr = root.putArray("poses");
        for (Pose p : poses) {
            ObjectNode o = arr.addObject();
            ArrayNode r = o.putArray("rotation");
            for (int i = 0; i < 3; i++) r.addArray().add(p.r(i, 0)).add(p.r(i, 1)).add(p.r(i, 2));
            o.putArray("translation_m").add(p.t(0)).add(p.t(1)).add(p.t(2));
        }
        JsonIn.MAPPER.writerWithDefaultPrettyPrinter().writeValue(file.toFile(), root);
    }
}
