package org.targetbench.source;

import com.fasterxml.jackson.databind.JsonNode;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * Reads {@code handeye.json}: rotation (3 x 3, rows), translation_m, P_flange = R P_camera + t (docs/formats.md), as
 * plain data; the rotation is checked to be a proper rotation here so a bad file gets one line.
 */
public final class HandEyeFile {
    /** Allowed deviation of RᵀR from I and of det R from 1. */
    public static final double RIGID_TOL = 1e-6;

    /** One view's residual as written by the hand-eye step. */
    public record View(String view, double rotationDeg, double translationMm, boolean outlier, boolean flipped) {}

    /** The file's content: R row major, t in metres, how it was made, per-view residuals. */
    public record Data(double[] rotation, double[] translationM, String method, List<View> views) {}

    private HandEyeFile() {}

    public static Data read(String file) throws SourceException {
        return read(Path.of(file));
    }

    public static Data read(Path file) throws SourceException {
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
        if (!isRotation(rot)) throw new SourceException(file + ": not a rigid transform (rotation must be orthonormal with det +1 to " + RIGID_TOL + ")");
        List<View> views = new ArrayList<>();
        JsonNode v = root.get("views");
        if (v != null && v.isArray())
            for (JsonNode x : v)
                views.add(new View(x.path("view").asText(), x.path("rotation_deg").asDouble(Double.NaN), x.path("translation_mm").asDouble(Double.NaN),
                        x.path("outlier").asBoolean(false), x.path("flipped").asBoolean(false)));
        return new Data(rot, tr, root.hasNonNull("method") ? root.get("method").asText() : "read from " + file.getFileName(), views);
    }

    static boolean isRotation(double[] r) {
        for (int i = 0; i < 3; i++)
            for (int j = 0; j < 3; j++) {
                double dot = r[i] * r[j] + r[3 + i] * r[3 + j] + r[6 + i] * r[6 + j];
                if (Math.abs(dot - (i == j ? 1 : 0)) > RIGID_TOL) return false;
            }
        double det = r[0] * (r[4] * r[8] - r[5] * r[7]) - r[1] * (r[3] * r[8] - r[5] * r[6]) + r[2] * (r[3] * r[7] - r[4] * r[6]);
        return Math.abs(det - 1) <= RIGID_TOL;
    }
}
