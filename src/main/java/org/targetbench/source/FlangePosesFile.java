package org.targetbench.source;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Reads the flange-pose CSV of the hand-eye step: one row per view, the flange pose in the robot base frame, with
 * columns {@code frame,x_m,y_m,z_m,rx,ry,rz} (rotation vector, radians: axis times angle) or
 * {@code frame,x_m,y_m,z_m,qw,qx,qy,qz} (unit quaternion). Returns frame name to 4 x 4 row-major pose, in file order.
 */
public final class FlangePosesFile {
    /** A quaternion's norm may differ from 1 by this before it is refused. */
    public static final double QUATERNION_TOL = 1e-3;

    private FlangePosesFile() {}

    public static Map<String, double[]> read(Path file) throws SourceException {
        if (!Files.isRegularFile(file)) throw new SourceException("flange poses file not found: " + file);
        List<String> lines;
        try {
            lines = Files.readAllLines(file, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new SourceException("cannot read " + file + ": " + ImageFiles.oneLine(e));
        }
        int h = 0;
        while (h < lines.size() && (lines.get(h).isBlank() || lines.get(h).startsWith("#"))) h++;
        if (h == lines.size()) throw new SourceException(file + " is empty; expected a header frame,x_m,y_m,z_m,rx,ry,rz");
        List<String> head = CsvIn.split(lines.get(h).replace("\uFEFF", "").trim()).stream().map(s -> s.trim().toLowerCase(Locale.ROOT)).toList();
        boolean rotvec = head.equals(List.of("frame", "x_m", "y_m", "z_m", "rx", "ry", "rz"));
        boolean quat = head.equals(List.of("frame", "x_m", "y_m", "z_m", "qw", "qx", "qy", "qz"));
        if (!rotvec && !quat) throw new SourceException(file + ": header must be frame,x_m,y_m,z_m,rx,ry,rz or frame,x_m,y_m,z_m,qw,qx,qy,qz, got " + lines.get(h).trim());
        Map<String, double[]> out = new LinkedHashMap<>();
        for (int n = h + 1; n < lines.size(); n++) {
            String l = lines.get(n).trim();
            if (l.isEmpty() || l.startsWith("#")) continue;
            List<String> c = CsvIn.split(l);
            if (c.size() != head.size()) throw new SourceException(file + " line " + (n + 1) + ": needs " + head.size() + " values, got " + c.size());
            double[] v = new double[c.size() - 1];
            for (int i = 1; i < c.size(); i++) {
                try {
                    v[i - 1] = Double.parseDouble(c.get(i).trim());
                } catch (NumberFormatException e) {
                    throw new SourceException(file + " line " + (n + 1) + ": " + head.get(i) + " is not a number: \"" + c.get(i).trim() + "\"");
                }
                if (!Double.isFinite(v[i - 1])) throw new SourceException(file + " line " + (n + 1) + ": " + head.get(i) + " must be finite");
            }
            double[] m;
            if (rotvec) m = rotationVector(v[3], v[4], v[5]);
            else {
                double w = v[3], x = v[4], y = v[5], z = v[6], norm = Math.sqrt(w * w + x * x + y * y + z * z);
                if (Math.abs(norm - 1) > QUATERNION_TOL) throw new SourceException(file + " line " + (n + 1) + ": the quaternion's norm is " + norm + ", not 1");
                w /= norm; x /= norm; y /= norm; z /= norm;
                m = new double[]{1 - 2 * (y * y + z * z), 2 * (x * y - w * z), 2 * (x * z + w * y), 0,
                        2 * (x * y + w * z), 1 - 2 * (x * x + z * z), 2 * (y * z - w * x), 0,
                        2 * (x * z - w * y), 2 * (y * z + w * x), 1 - 2 * (x * x + y * y), 0, 0, 0, 0, 1};
            }
            m[3] = v[0]; m[7] = v[1]; m[11] = v[2];
            String frame = c.get(0).trim();
            if (out.put(frame, m) != null) throw new SourceException(file + " line " + (n + 1) + ": frame \"" + frame + "\" appears twice");
        }
        return out;
    }

    /** Rodrigues' formula: rotation vector (radians) to a 4 x 4 row-major transform without translation. */
    static double[] rotationVector(double rx, double ry, double rz) {
        double a = Math.sqrt(rx * rx + ry * ry + rz * rz);
        double[] m = {1, 0, 0, 0, 0, 1, 0, 0, 0, 0, 1, 0, 0, 0, 0, 1};
        if (a == 0) return m;
        double x = rx / a, y = ry / a, z = rz / a, c = Math.cos(a), s = Math.sin(a), v = 1 - c;
        m[0] = c + x * x * v; m[1] = x * y * v - z * s; m[2] = x * z * v + y * s;
        m[4] = y * x * v + z * s; m[5] = c + y * y * v; m[6] = y * z * v - x * s;
        m[8] = z * x * v - y * s; m[9] = z * y * v + x * s; m[10] = c + z * z * v;
        return m;
    }
}
