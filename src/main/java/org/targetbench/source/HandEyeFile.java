package org.targetbench.source;

import com.fasterxml.jackson.databind.JsonNode;
import org.targetbench.arm.HandEye;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/** Reads {@code handeye.json}: rotation (3 x 3, rows), translation_m, P_flange = R P_camera + t (docs/formats.md). */
public final class HandEyeFile {
    private HandEyeFile() {}

    public static HandEye read(Path file) throws SourceException {
        JsonIn.Parsed p = JsonIn.parse(file);
        JsonIn in = p.in();
        JsonNode root = p.root();
        JsonNode r = root.get("rotation");
        if (r == null || !r.isArray() || r.size() != 3) throw in.error("rotation", "must be 3 rows of 3 numbers");
        double[] rot = new double[9];
        for (int i = 0; i < 3; i++) {
            JsonNode row = r.get(i);
            if (row == null || !row.isArray() || row.size() != 3) throw in.error("rotation[" + i + "]", "must be 3 numbers");
            for (int j = 0; j < 3; j++) rot[i * 3 + j] = in.finite(row.get(j), "rotation[" + i + "][" + j + "]");
        }
        JsonNode t = root.get("translation_m");
        if (t == null || !t.isArray() || t.size() != 3) throw in.error("translation_m", "must be 3 numbers");
        double[] tr = new double[3];
        for (int i = 0; i < 3; i++) tr[i] = in.finite(t.get(i), "translation_m[" + i + "]");
        List<HandEye.ViewResidual> views = new ArrayList<>();
        JsonNode v = root.get("views");
        if (v != null && v.isArray())
            for (JsonNode x : v)
                views.add(new HandEye.ViewResidual(x.path("view").asText(), x.path("rotation_deg").asDouble(Double.NaN),
                        x.path("translation_mm").asDouble(Double.NaN), x.path("outlier").asBoolean(false), x.path("flipped").asBoolean(false)));
        try {
            return new HandEye(rot, tr, views, root.hasNonNull("method") ? root.get("method").asText() : "read from " + file.getFileName());
        } catch (IllegalArgumentException e) {
            throw new SourceException(file + ": not a rigid transform (rotation must be orthonormal with det +1 to " + HandEye.RIGID_TOL + ")");
        }
    }
}
