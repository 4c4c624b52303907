package org.targetbench.source;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.targetbench.target.FeatureKind;
import org.targetbench.target.Shape;
import org.targetbench.target.TargetDesign;
import org.targetbench.target.TargetFeature;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The {@code target.json} format (format "targetbench-target", version 1), documented in docs/formats.md.
 */
public final class TargetFile {
    public static final String FORMAT = "targetbench-target";
    public static final int VERSION = 1;

    private TargetFile() {}

    public static ObjectNode toJson(TargetDesign d) {
        ObjectNode root = JsonIn.MAPPER.createObjectNode();
        root.put("format", FORMAT).put("version", VERSION);
        root.put("id", d.id()).put("name", d.name());
        root.put("width_mm", d.widthMm()).put("height_mm", d.heightMm()).put("quiet_zone_mm", d.quietZoneMm());
        root.put("pattern", d.pattern());
        root.set("parameters", JsonIn.MAPPER.valueToTree(d.parameters()));
        ArrayNode shapes = root.putArray("shapes");
        for (Shape s : d.drawing()) {
            ObjectNode o = shapes.addObject();
            if (s instanceof Shape.Rect r) {
                o.put("type", "rect").put("x0", r.x0()).put("y0", r.y0()).put("x1", r.x1()).put("y1", r.y1());
            } else if (s instanceof Shape.Circle c) {
                o.put("type", "circle").put("cx", c.cx()).put("cy", c.cy()).put("r", c.r());
            } else if (s instanceof Shape.Polygon p) {
                o.put("type", "polygon");
                ArrayNode pts = o.putArray("points");
                double[] xs = p.xs(), ys = p.ys();
                for (int i = 0; i < xs.length; i++) pts.addArray().add(xs[i]).add(ys[i]);
            }
            o.put("grey", s.grey());
        }
        ArrayNode feats = root.putArray("features");
        for (TargetFeature f : d.features())
            feats.addObject().put("id", f.id()).put("x_mm", f.xMm()).put("y_mm", f.yMm()).put("kind", kindName(f.kind()));
        return root;
    }

    public static void write(TargetDesign d, Path file) throws IOException {
        JsonIn.MAPPER.writerWithDefaultPrettyPrinter().writeValue(file.toFile(), toJson(d));
    }

    public static TargetDesign read(Path file) throws SourceException {
        JsonIn.Parsed parsed = JsonIn.parse(file);
        JsonIn in = parsed.in();
        JsonNode root = parsed.root();
        in.expectFormat(root, FORMAT, VERSION);
        in.knownKeys(root, "format", "version", "id", "name", "width_mm", "height_mm", "quiet_zone_mm", "pattern", "parameters", "shapes", "features");
        List<Shape> shapes = new ArrayList<>();
        JsonNode sa = in.array(root, "shapes", "target");
        for (int i = 0; i < sa.size(); i++) {
            JsonNode s = sa.get(i);
            String where = "shapes[" + i + "]";
            double grey = in.number(s, "grey", where, 0);
            String type = in.text(s, "type", where);
            try {
                shapes.add(switch (type) {
                    case "rect" -> new Shape.Rect(in.number(s, "x0", where), in.number(s, "y0", where), in.number(s, "x1", where), in.number(s, "y1", where), grey);
                    case "circle" -> new Shape.Circle(in.number(s, "cx", where), in.number(s, "cy", where), in.number(s, "r", where), grey);
                    case "polygon" -> {
                        JsonNode pts = in.array(s, "points", where);
                        double[] xs = new double[pts.size()], ys = new double[pts.size()];
                        for (int k = 0; k < pts.size(); k++) {
                            JsonNode p = pts.get(k);
                            if (!p.isArray() || p.size() != 2) throw in.error(where + ".points[" + k + "]", "must be [x, y]");
                            xs[k] = in.finite(p.get(0), where + ".points[" + k + "][0]");
                            ys[k] = in.finite(p.get(1), where + ".points[" + k + "][1]");
                        }
                        yield new Shape.Polygon(xs, ys, grey);
                    }
                    default -> throw in.error(where + ".type", "is \"" + type + "\"; expected rect, circle or polygon");
                });
            } catch (IllegalArgumentException e) {
                throw in.error(where, e.getMessage());
            }
        }
        List<TargetFeature> features = new ArrayList<>();
        JsonNode fa = in.array(root, "features", "target");
        for (int i = 0; i < fa.size(); i++) {
            JsonNode f = fa.get(i);
            String where = "features[" + i + "]";
            features.add(new TargetFeature(in.integer(f, "id", where), in.number(f, "x_mm", where), in.number(f, "y_mm", where),
                    parseKind(in, in.text(f, "kind", where), where)));
        }
        Map<String, Object> params = new LinkedHashMap<>();
        JsonNode pn = root.get("parameters");
        if (pn != null && pn.isObject())
            pn.fields().forEachRemaining(e -> params.put(e.getKey(), e.getValue().isNumber() ? (Object) e.getValue().numberValue() : e.getValue().asText()));
        TargetDesign d;
        try {
            d = new TargetDesign(in.text(root, "id", "target"), root.path("name").asText(null),
                    in.number(root, "width_mm", "target"), in.number(root, "height_mm", "target"),
                    in.number(root, "quiet_zone_mm", "target", 0), shapes, features,
                    root.path("pattern").asText("custom"), params);
        } catch (IllegalArgumentException e) {
            throw in.error("design:", e.getMessage()); // the message names what ("target size ...", "feature 3 ...")
        }
        // a design with nothing for a detector to find would pass every check and win every comparison with 1.0
        if (org.targetbench.target.FeatureVisibility.drawnCount(d) == 0)
            throw in.error("features", d.features().isEmpty() ? "is empty: a design needs at least one designed feature"
                    : "are all hidden under later shapes (" + d.features().size() + " listed, none visible as drawn)");
        return d;
    }

    /** The name of a feature kind in the files: x-corner, dot-centre or corner (an L-corner). */
    public static String kindName(FeatureKind k) {
        return switch (k) {
            case X_CORNER -> "x-corner";
            case DOT_CENTRE -> "dot-centre";
            case CORNER -> "corner";
        };
    }

    static FeatureKind parseKind(JsonIn in, String s, String where) throws SourceException {
        return switch (s.toLowerCase(Locale.ROOT)) {
            case "x-corner" -> FeatureKind.X_CORNER;
            case "dot-centre" -> FeatureKind.DOT_CENTRE;
            case "corner" -> FeatureKind.CORNER;
            default -> throw in.error(where + ".kind", "is \"" + s + "\"; expected x-corner, dot-centre or corner");
        };
    }
}
