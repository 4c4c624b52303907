package org.targetbench.source;

import com.fasterxml.jackson.databind.JsonNode;

import java.nio.file.Path;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * The operating-envelope file of a sweep (format "targetbench-envelope", version 1): the harshest value of each
 * parameter the cell is expected to meet.
 * <pre>
 * { "format": "targetbench-envelope", "version": 1,
 *   "worst": { "lighting.gain": 0.4, "blur.defocus": 2.0, "noise.gaussian": 8, "jpeg.quality": 60, "viewpoint.tilt": 30 } }
 * </pre>
 * Keys are parameter ids ({@code kind.name}) or bare kinds (their primary parameter); checking them against the
 * known parameters and their ranges is left to the caller, which knows the parameter table.
 */
public final class EnvelopeFile {
    public static final String FORMAT = "targetbench-envelope";

    private EnvelopeFile() {}

    /** Parameter id to worst value, in file order. */
    public static Map<String, Double> read(Path file) throws SourceException {
        JsonIn.Parsed parsed = JsonIn.parse(file);
        JsonIn in = parsed.in();
        in.expectFormat(parsed.root(), FORMAT, 1);
        in.knownKeys(parsed.root(), "format", "version", "worst");
        JsonNode w = parsed.root().get("worst");
        if (w == null || !w.isObject() || w.isEmpty()) throw in.error("worst", "must be an object of parameter to harshest value, e.g. {\"blur.defocus\": 2.0}");
        Map<String, Double> out = new LinkedHashMap<>();
        for (Iterator<Map.Entry<String, JsonNode>> it = w.fields(); it.hasNext(); ) {
            var e = it.next();
            out.put(e.getKey(), in.finite(e.getValue(), "worst[\"" + e.getKey() + "\"]"));
        }
        return out;
    }
}
