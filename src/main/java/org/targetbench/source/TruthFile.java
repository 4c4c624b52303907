package org.targetbench.source;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.targetbench.camera.Homography;
import org.targetbench.camera.Projection.ProjectedFeature;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * The {@code truth.json} ground-truth file of an image folder.
 *
 * <pre>
 * { "reference": "frame_000.png",
 *   "homographies": { "frame_001.png": [[h11,h12,h13],[h21,h22,h23],[h31,h32,h33]], ... },
 *   "points": { "frame_001.png": [ {"id": 0, "u": 312.4, "v": 208.9}, ... ], ... } }
 * </pre>
 * H maps reference-frame pixels to that frame's pixels, x' ~ H (x, y, 1)ᵀ, integer coordinates at pixel centres.
 * {@code points} (optional, our extension) gives the true pixel of designed target features. Frames not listed have
 * no truth; the reference frame has the identity.
 */
public final class TruthFile {
    private TruthFile() {}

    /** Parsed truth: reference frame name and per-frame truth. */
    public record Truth(String reference, Map<String, FrameTruth> frames) {
        public Truth {
            frames = Map.copyOf(frames);
        }

        public FrameTruth forFrame(String name) {
            FrameTruth t = frames.get(name);
            if (t != null) return t;
            return name.equals(reference) ? FrameTruth.homography(Homography.identity()) : FrameTruth.none();
        }
    }

    /**
     * Reads and validates a truth file against the frame names of its folder.
     */
    public static Truth read(Path file, Set<String> frameNames) throws SourceException {
        JsonIn.Parsed parsed = JsonIn.parse(file);
        JsonIn in = parsed.in();
        JsonNode root = parsed.root();
        in.knownKeys(root, "format", "version", "reference", "convention", "homographies", "points", "source", "camera", "poses");
        String reference = in.text(root, "reference", "truth");
        if (!frameNames.contains(reference)) throw in.error("reference", "names frame \"" + reference + "\", which is not in the folder");
        Map<String, Optional<Homography>> hs = new LinkedHashMap<>();
        JsonNode hn = root.get("homographies");
        if (hn != null) {
            if (!hn.isObject()) throw in.error("homographies", "must be an object of frame name to 3x3 matrix");
            for (Iterator<Map.Entry<String, JsonNode>> it = hn.fields(); it.hasNext(); ) {
                var e = it.next();
                String where = "homographies[\"" + e.getKey() + "\"]";
                if (!frameNames.contains(e.getKey())) throw in.error(where, "names a frame that is not in the folder");
                double[] m = in.matrix3(e.getValue(), where);
                try {
                    hs.put(e.getKey(), Optional.of(new Homography(m)));
                } catch (IllegalArgumentException ex) {
                    throw in.error(where, "is singular (not invertible)");
                }
            }
        }
        Map<String, List<ProjectedFeature>> pts = new LinkedHashMap<>();
        JsonNode pn = root.get("points");
        if (pn != null) {
            if (!pn.isObject()) throw in.error("points", "must be an object of frame name to point list");
            for (Iterator<Map.Entry<String, JsonNode>> it = pn.fields(); it.hasNext(); ) {
                var e = it.next();
                String where = "points[\"" + e.getKey() + "\"]";
                if (!frameNames.contains(e.getKey())) throw in.error(where, "names a frame that is not in the folder");
                if (!e.getValue().isArray()) throw in.error(where, "must be an array");
                List<ProjectedFeature> list = new ArrayList<>();
                for (int i = 0; i < e.getValue().size(); i++) {
                    JsonNode p = e.getValue().get(i);
                    String w = where + "[" + i + "]";
                    java.util.Optional<org.targetbench.target.FeatureKind> kind = p.has("kind")
                            ? java.util.Optional.of(TargetFile.parseKind(in, in.text(p, "kind", w), w)) : java.util.Optional.empty();
                    list.add(new ProjectedFeature(in.integer(p, "id", w), in.number(p, "u", w), in.number(p, "v", w), in.number(p, "z_m", w, Double.NaN), kind));
                }
                pts.put(e.getKey(), list);
            }
        }
        Map<String, FrameTruth> frames = new LinkedHashMap<>();
        for (String name : frameNames) {
            Optional<Homography> h = hs.getOrDefault(name, name.equals(reference) ? Optional.of(Homography.identity()) : Optional.empty());
            List<ProjectedFeature> p = pts.getOrDefault(name, List.of());
            if (h.isPresent() || !p.isEmpty()) frames.put(name, new FrameTruth(h, p));
        }
        return new Truth(reference, frames);
    }

    /** Writes a truth file; frames whose truth has neither homography nor points are left out. */
    public static void write(String reference, Map<String, FrameTruth> frames, Path file) throws IOException {
        write(reference, frames, file, true);
    }

    /** As {@link #write(String, Map, Path)}; {@code pretty} false writes one compact line (for long videos). */
    public static void write(String reference, Map<String, FrameTruth> frames, Path file, boolean pretty) throws IOException {
        ObjectNode root = JsonIn.MAPPER.createObjectNode();
        root.put("reference", reference);
        root.put("convention", "H maps reference-frame pixels to frame pixels; integer coordinates are pixel centres");
        ObjectNode hs = root.putObject("homographies");
        ObjectNode ps = root.putObject("points");
        for (var e : frames.entrySet()) {
            e.getValue().fromReference().ifPresent(h -> {
                ArrayNode m = hs.putArray(e.getKey());
                for (int r = 0; r < 3; r++) m.addArray().add(h.get(r, 0)).add(h.get(r, 1)).add(h.get(r, 2));
            });
            if (!e.getValue().features().isEmpty()) {
                ArrayNode a = ps.putArray(e.getKey());
                for (ProjectedFeature f : e.getValue().features()) {
                    ObjectNode o = a.addObject().put("id", f.featureId()).put("u", f.u()).put("v", f.v()).put("z_m", f.depthM());
                    f.kind().ifPresent(k -> o.put("kind", TargetFile.kindName(k)));
                }
            }
        }
        (pretty ? JsonIn.MAPPER.writerWithDefaultPrettyPrinter() : JsonIn.MAPPER.writer()).writeValue(file.toFile(), root);
    }
}
