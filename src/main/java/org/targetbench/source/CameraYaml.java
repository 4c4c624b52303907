package org.targetbench.source;

import org.targetbench.camera.CameraModel;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.constructor.SafeConstructor;
import org.yaml.snakeyaml.error.MarkedYAMLException;
import org.yaml.snakeyaml.error.YAMLException;
import org.yaml.snakeyaml.nodes.Tag;

import java.io.IOException;
import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Camera intrinsics in the two YAML layouts the trade already uses, read and written with SnakeYAML.
 *
 * <ul>
 *   <li><b>OpenCV FileStorage</b> [1]: a {@code %YAML:1.0} first line (not a valid YAML 1.1 directive, so it is
 *       blanked before parsing), then {@code image_width}, {@code image_height}, and {@code camera_matrix} and
 *       {@code distortion_coefficients} as {@code !!opencv-matrix} mappings with {@code rows}, {@code cols},
 *       {@code dt} and row-major {@code data}. Numbers are written as OpenCV does: {@code %.16e}, and whole numbers as
 *       {@code 1.}.</li>
 *   <li><b>ROS camera_info</b> [2]: {@code image_width}, {@code image_height}, {@code camera_name}, {@code camera_matrix}
 *       and {@code distortion_coefficients} as plain mappings with {@code rows}, {@code cols}, {@code data},
 *       {@code distortion_model: plumb_bob}, and the rectification and projection matrices (written as the identity
 *       and [K | 0] for a single camera; ignored when read).</li>
 * </ul>
 * Both order the distortion coefficients k1, k2, p1, p2, k3 (Brown-Conrady, the model of {@link CameraModel}). Longer
 * OpenCV vectors (rational and thin-prism terms) are accepted only when the extra terms are zero; four coefficients
 * mean k3 = 0 and an empty vector means no distortion. Skew must be zero.
 *
 * <p>References: [1] OpenCV 4.x documentation, "File Input and Output using XML / YAML / JSON files" and the
 * calibration sample's output (the layout of Debian opencv-doc's left_intrinsics.yml). [2] ROS
 * camera_calibration_parsers, YAML format of sensor_msgs/CameraInfo (from memory).
 */
public final class CameraYaml {
    /** The two YAML layouts. */
    public enum Layout { OPENCV, ROS }

    private static final Tag OPENCV_MATRIX = new Tag("tag:yaml.org,2002:opencv-matrix");

    private CameraYaml() {}

    /** True when the text looks like an OpenCV FileStorage file (its header line or matrix tag). */
    static boolean looksLikeOpenCv(String text) {
        return text.stripLeading().startsWith("%YAML:") || text.contains("!!opencv-matrix");
    }

    /** Reads either layout, told apart by content: a {@code distortion_model} key means ROS. */
    public static CameraModel read(Path file, String text) throws SourceException {
        Map<?, ?> root = parse(file, text);
        Layout layout = root.containsKey("distortion_model") || !looksLikeOpenCv(text) && !root.containsKey("distortion_coefficients")
                ? Layout.ROS : Layout.OPENCV;
        String what = layout == Layout.ROS ? "ROS camera_info YAML" : "OpenCV FileStorage YAML";
        if (layout == Layout.ROS) {
            Object model = require(file, root, "distortion_model", what);
            if (!"plumb_bob".equals(String.valueOf(model)))
                throw error(file, "distortion_model is \"" + model + "\"; only plumb_bob (k1, k2, p1, p2, k3) is supported");
        }
        int w = whole(file, require(file, root, "image_width", what), "image_width");
        int h = whole(file, require(file, root, "image_height", what), "image_height");
        double[] k = matrix(file, require(file, root, "camera_matrix", what), "camera_matrix", 3, 3);
        double[] d = matrix(file, require(file, root, "distortion_coefficients", what), "distortion_coefficients", -1, -1);
        if (k[1] != 0) throw error(file, "camera_matrix has skew " + k[1] + "; only zero skew is supported");
        if (k[3] != 0 || k[6] != 0 || k[7] != 0 || k[8] != 1)
            throw error(file, "camera_matrix must have the form [fx 0 cx; 0 fy cy; 0 0 1], got rows 2-3 " + List.of(k[3], k[4], k[5]) + " " + List.of(k[6], k[7], k[8]));
        if (d.length != 0 && d.length < 4) throw error(file, "distortion_coefficients has " + d.length + " values; expected 4 or 5 (k1, k2, p1, p2[, k3])");
        for (int i = 5; i < d.length; i++)
            if (d[i] != 0) throw error(file, "distortion_coefficients[" + i + "] = " + d[i] + "; only k1, k2, p1, p2, k3 are supported (rational and thin-prism terms must be 0)");
        double k1 = d.length > 0 ? d[0] : 0, k2 = d.length > 1 ? d[1] : 0, p1 = d.length > 2 ? d[2] : 0, p2 = d.length > 3 ? d[3] : 0, k3 = d.length > 4 ? d[4] : 0;
        try {
            return new CameraModel(w, h, k[0], k[4], k[2], k[5], k1, k2, k3, p1, p2);
        } catch (IllegalArgumentException e) {
            throw error(file, e.getMessage());
        }
    }

    private static Map<?, ?> parse(Path file, String text) throws SourceException {
        // OpenCV's "%YAML:1.0" is not a YAML directive; blank it, keeping line numbers
        String t = text.startsWith("\uFEFF") ? text.substring(1) : text;
        if (t.startsWith("%YAML:")) t = "#" + t.substring(1);
        LoaderOptions options = new LoaderOptions();
        options.setAllowDuplicateKeys(false);
        options.setTagInspector(OPENCV_MATRIX::equals); // allow this one global tag, nothing else
        SafeConstructor constructor = new SafeConstructor(options) {
            { yamlConstructors.put(OPENCV_MATRIX, yamlConstructors.get(Tag.MAP)); }
        };
        Object root;
        try {
            root = new Yaml(constructor).load(t);
        } catch (MarkedYAMLException e) {
            throw new SourceException("malformed YAML in " + file + " at line " + (e.getProblemMark() == null ? "?" : e.getProblemMark().getLine() + 1)
                    + ": " + ImageFiles.oneLine(new Exception(e.getProblem())));
        } catch (YAMLException e) {
            throw new SourceException("malformed YAML in " + file + ": " + ImageFiles.oneLine(e));
        }
        if (!(root instanceof Map<?, ?> m)) throw new SourceException("malformed camera file " + file + ": expected a mapping of keys at the top level");
        return m;
    }

    private static Object require(Path file, Map<?, ?> root, String key, String what) throws SourceException {
        Object v = root.get(key);
        if (v == null) throw error(file, "missing key " + key + " (" + what + " layout)");
        return v;
    }

    private static SourceException error(Path file, String what) {
        return new SourceException(file + ": " + what);
    }

    private static double number(Path file, Object v, String where) throws SourceException {
        double d;
        if (v instanceof Number n) d = n.doubleValue();
        else if (v instanceof String s) {
            try {
                d = Double.parseDouble(s.trim());
            } catch (NumberFormatException e) {
                throw error(file, where + " must be a number, got \"" + s + "\"");
            }
        } else throw error(file, where + " must be a number, got " + v);
        if (!Double.isFinite(d)) throw error(file, where + " must be finite, got " + v);
        return d;
    }

    private static int whole(Path file, Object v, String where) throws SourceException {
        double d = number(file, v, where);
        if (d != Math.rint(d) || d < 1 || d > 1_000_000) throw error(file, where + " must be a positive whole number of pixels, got " + v);
        return (int) d;
    }

    /** A matrix mapping (rows, cols, data); {@code wantRows} / {@code wantCols} of -1 accept any shape. */
    private static double[] matrix(Path file, Object node, String key, int wantRows, int wantCols) throws SourceException {
        if (!(node instanceof Map<?, ?> m)) throw error(file, key + " must be a matrix with rows, cols and data");
        for (String f : new String[]{"rows", "cols", "data"})
            if (m.get(f) == null) throw error(file, "missing key " + key + "." + f);
        int rows = wholeOrZero(file, m.get("rows"), key + ".rows"), cols = wholeOrZero(file, m.get("cols"), key + ".cols");
        if (!(m.get("data") instanceof List<?> data)) throw error(file, key + ".data must be a list of numbers");
        if (wantRows > 0 && (rows != wantRows || cols != wantCols))
            throw error(file, key + " is " + rows + "x" + cols + "; expected " + wantRows + "x" + wantCols);
        if (wantRows < 0 && rows > 1 && cols > 1) throw error(file, key + " is " + rows + "x" + cols + "; expected a single row or column");
        if (data.size() != rows * cols)
            throw error(file, key + " has " + data.size() + " data values for " + rows + "x" + cols + " (" + rows * cols + " expected)");
        double[] out = new double[data.size()];
        for (int i = 0; i < out.length; i++) out[i] = number(file, data.get(i), key + ".data[" + i + "]");
        return out;
    }

    private static int wholeOrZero(Path file, Object v, String where) throws SourceException {
        double d = number(file, v, where);
        if (d != Math.rint(d) || d < 0 || d > 1000) throw error(file, where + " must be a whole number 0..1000, got " + v);
        return (int) d;
    }

    /** The text of {@code c} in the given layout. */
    public static String format(CameraModel c, Layout layout) {
        double[] k = {c.fx(), 0, c.cx(), 0, c.fy(), c.cy(), 0, 0, 1};
        double[] d = {c.k1(), c.k2(), c.p1(), c.p2(), c.k3()};
        StringBuilder b = new StringBuilder();
        if (layout == Layout.OPENCV) {
            b.append("%YAML:1.0\n---\n");
            b.append("image_width: ").append(c.width()).append('\n');
            b.append("image_height: ").append(c.height()).append('\n');
            openCvMatrix(b, "camera_matrix", 3, 3, k);
            openCvMatrix(b, "distortion_coefficients", 5, 1, d);
        } else {
            b.append("image_width: ").append(c.width()).append('\n');
            b.append("image_height: ").append(c.height()).append('\n');
            b.append("camera_name: camera\n");
            rosMatrix(b, "camera_matrix", 3, 3, k);
            b.append("distortion_model: plumb_bob\n");
            rosMatrix(b, "distortion_coefficients", 1, 5, d);
            rosMatrix(b, "rectification_matrix", 3, 3, new double[]{1, 0, 0, 0, 1, 0, 0, 0, 1});
            rosMatrix(b, "projection_matrix", 3, 4, new double[]{c.fx(), 0, c.cx(), 0, 0, c.fy(), c.cy(), 0, 0, 0, 1, 0});
        }
        return b.toString();
    }

    public static void write(CameraModel c, Path file, Layout layout) throws IOException {
        Files.writeString(file, format(c, layout));
    }

    private static void openCvMatrix(StringBuilder b, String key, int rows, int cols, double[] data) {
        b.append(key).append(": !!opencv-matrix\n   rows: ").append(rows).append("\n   cols: ").append(cols).append("\n   dt: d\n");
        StringBuilder line = new StringBuilder("   data: [ ");
        for (int i = 0; i < data.length; i++) {
            String item = openCvNumber(data[i]) + (i + 1 < data.length ? "," : " ]");
            if (line.length() + item.length() > 72 && !line.toString().endsWith("[ ")) {
                b.append(line.toString().stripTrailing()).append('\n');
                line = new StringBuilder("       ");
            }
            line.append(item).append(i + 1 < data.length ? " " : "");
        }
        b.append(line).append('\n');
    }

    /**
     * OpenCV's way of writing a double: whole numbers as "1.", others as C's %.16e, i.e. the exact binary value rounded
     * to 17 significant digits (Java's %e rounds the shortest decimal instead, which can differ in the last digit).
     */
    static String openCvNumber(double v) {
        if (v == Math.rint(v) && Math.abs(v) < 1e15) return (long) v + ".";
        BigDecimal bd = new BigDecimal(v).round(new MathContext(17, RoundingMode.HALF_EVEN));
        String digits = bd.unscaledValue().abs().toString();
        int exponent = digits.length() - 1 - bd.scale();
        digits = (digits + "0".repeat(17)).substring(0, 17);
        return (v < 0 ? "-" : "") + digits.charAt(0) + "." + digits.substring(1) + "e" + (exponent < 0 ? "-" : "+")
                + String.format(Locale.ROOT, "%02d", Math.abs(exponent));
    }

    private static void rosMatrix(StringBuilder b, String key, int rows, int cols, double[] data) {
        b.append(key).append(":\n  rows: ").append(rows).append("\n  cols: ").append(cols).append("\n  data: [");
        for (int i = 0; i < data.length; i++) b.append(i == 0 ? "" : ", ").append(plain(data[i]));
        b.append("]\n");
    }

    /** The shortest decimal that reads back as the same double, without an exponent. */
    static String plain(double v) {
        if (v == Math.rint(v) && Math.abs(v) < 1e15) return Long.toString((long) v);
        return new BigDecimal(Double.toString(v)).toPlainString();
    }
}
