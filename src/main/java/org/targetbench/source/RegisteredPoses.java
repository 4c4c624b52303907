package org.targetbench.source;

import com.fasterxml.jackson.databind.JsonNode;
import org.targetbench.camera.Pose;

import java.nio.file.Path;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * The per-frame poses a registered {@code truth.json} carries when intrinsics were given (object {@code poses}: frame
 * name to {@code rotation} 3 x 3 and {@code translation_m}; docs/formats.md). A truth file without them gives an empty
 * map.
 */
public final class RegisteredPoses {
    private RegisteredPoses() {}

    public static Map<String, Pose> read(Path truthFile) throws SourceException {
        JsonIn.Parsed parsed = JsonIn.parse(truthFile);
        JsonIn in = parsed.in();
        JsonNode pn = parsed.root().get("poses");
        Map<String, Pose> out = new LinkedHashMap<>();
        if (pn == null) return out;
        if (!pn.isObject()) throw in.error("poses", "must be an object of frame name to pose");
        for (Iterator<Map.Entry<String, JsonNode>> it = pn.fields(); it.hasNext(); ) {
            var e = it.next();
            String where = "poses[\"" + e.getKey() + "\"]";
            JsonNode t = in.array(e.getValue(), "translation_m", where);
            if (t.size() != 3) throw in.error(where + ".translation_m", "must hold 3 numbers");
            try {
                out.put(e.getKey(), new Pose(in.matrix3(e.getValue().get("rotation"), where + ".rotation"),
                        new double[]{in.finite(t.get(0), where), in.finite(t.get(1), where), in.finite(t.get(2), where)}));
            } catch (IllegalArgumentException ex) {
                throw in.error(where, ex.getMessage());
            }
        }
        return out;
    }
}
