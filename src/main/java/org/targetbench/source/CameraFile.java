package org.targetbench.source;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.targetbench.camera.CameraModel;

import java.io.IOException;
import java.nio.file.Path;

/** The {@code camera.json} format (format "targetbench-camera", version 1), documented in docs/formats.md. */
public final class CameraFile {
    public static final String FORMAT = "targetbench-camera";
    public static final int VERSION = 1;

    private CameraFile() {}

    public static ObjectNode toJson(CameraModel c) {
        ObjectNode root = JsonIn.MAPPER.createObjectNode();
        root.put("format", FORMAT).put("version", VERSION);
        root.put("pixel_convention", "integer coordinates are pixel centres; (0,0) is the centre of the top-left pixel");
        root.put("image_width", c.width()).put("image_height", c.height());
        root.put("fx", c.fx()).put("fy", c.fy()).put("cx", c.cx()).put("cy", c.cy());
        root.putObject("distortion").put("model", "brown-conrady").put("k1", c.k1()).put("k2", c.k2()).put("k3", c.k3())
                .put("p1", c.p1()).put("p2", c.p2());
        return root;
    }

    public static void write(CameraModel c, Path file) throws IOException {
        JsonIn.MAPPER.writerWithDefaultPrettyPrinter().writeValue(file.toFile(), toJson(c));
    }

    public static CameraModel read(Path file) throws SourceException {
        CameraModel c = readUnchecked(file);
        var implausible = org.targetbench.camera.CameraChecks.problem(c);
        if (implausible.isPresent()) throw new SourceException(file + ": camera " + implausible.get());
        return c;
    }

    /** As {@link #read}, without the plausibility checks of {@link org.targetbench.camera.CameraChecks}. */
    static CameraModel readUnchecked(Path file) throws SourceException {
        JsonIn.Parsed parsed = JsonIn.parse(file);
        JsonIn in = parsed.in();
        JsonNode r = parsed.root();
        in.expectFormat(r, FORMAT, VERSION);
        in.knownKeys(r, "format", "version", "pixel_convention", "image_width", "image_height", "fx", "fy", "cx", "cy", "distortion");
        JsonNode d = r.path("distortion");
        CameraModel c;
        try {
            c = new CameraModel(in.integer(r, "image_width", "camera"), in.integer(r, "image_height", "camera"),
                    in.number(r, "fx", "camera"), in.number(r, "fy", "camera"), in.number(r, "cx", "camera"), in.number(r, "cy", "camera"),
                    in.number(d, "k1", "distortion", 0), in.number(d, "k2", "distortion", 0), in.number(d, "k3", "distortion", 0),
                    in.number(d, "p1", "distortion", 0), in.number(d, "p2", "distortion", 0));
        } catch (IllegalArgumentException e) {
            throw in.error("camera", e.getMessage());
        }
        return c;
    }
}
