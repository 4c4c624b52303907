package org.targetbench.source;

import com.fasterxml.jackson.core.JsonParseException;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.json.JsonMapper;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;

/**
 * Strict reading of this tool's JSON files, with one-line messages that name the file and the field at fault.
 * Non-numeric tokens such as NaN and Infinity are rejected by the parser. A key given twice in one object is an
 * error (Jackson's STRICT_DUPLICATE_DETECTION), never "the last one wins". Policy for unknown top-level keys: an
 * error naming the key and the keys the format knows ({@link #knownKeys}); keys starting with {@code _} are free for
 * comments.
 */
public final class JsonIn {
    static final ObjectMapper MAPPER = JsonMapper.builder()
            .enable(com.fasterxml.jackson.core.json.JsonReadFeature.ALLOW_NON_NUMERIC_NUMBERS)
            .enable(com.fasterxml.jackson.core.StreamReadFeature.STRICT_DUPLICATE_DETECTION)
            .build();

    private final Path file;

    private JsonIn(Path file) { this.file = file; }

    /** Parses a whole file; throws with the line and column of a syntax error. */
    public static Parsed parse(Path file) throws SourceException {
        if (!Files.isRegularFile(file)) throw Missing.file(file, "file");
        try (JsonParser p = MAPPER.createParser(file.toFile())) {
            JsonNode root = MAPPER.readTree(p);
            if (root == null || !root.isObject()) throw new SourceException("malformed JSON in " + file + ": expected an object at the top level");
            return new Parsed(new JsonIn(file), root);
        } catch (JsonParseException e) {
            throw new SourceException("malformed JSON in " + file + " at line " + e.getLocation().getLineNr()
                    + ", column " + e.getLocation().getColumnNr() + ": " + e.getOriginalMessage().split("\n")[0]);
        } catch (NoSuchFileException e) {
            throw new SourceException("file not found: " + file);
        } catch (IOException e) {
            throw new SourceException("cannot read " + file + ": " + ImageFiles.oneLine(e));
        }
    }

    /** A parsed file and its root object. */
    public record Parsed(JsonIn in, JsonNode root) {}

    public Path file() { return file; }

    public SourceException error(String where, String what) {
        return new SourceException(file + ": " + where + " " + what);
    }

    /** A required finite number. NaN and Infinity are refused. */
    public double number(JsonNode parent, String field, String where) throws SourceException {
        JsonNode n = parent.get(field);
        if (n == null || n.isNull()) throw error(where + "." + field, "is missing");
        return finite(n, where + "." + field);
    }

    /** An optional finite number, {@code fallback} when absent. */
    public double number(JsonNode parent, String field, String where, double fallback) throws SourceException {
        JsonNode n = parent.get(field);
        if (n == null || n.isNull()) return fallback;
        return finite(n, where + "." + field);
    }

    public double finite(JsonNode n, String where) throws SourceException {
        if (!n.isNumber()) throw error(where, "must be a number, got " + n);
        double v = n.asDouble();
        if (!Double.isFinite(v)) throw error(where, "must be finite, got " + n);
        return v;
    }

    public int integer(JsonNode parent, String field, String where) throws SourceException {
        double v = number(parent, field, where);
        if (v != Math.rint(v) || Math.abs(v) > Integer.MAX_VALUE) throw error(where + "." + field, "must be a whole number, got " + v);
        return (int) v;
    }

    public String text(JsonNode parent, String field, String where) throws SourceException {
        JsonNode n = parent.get(field);
        if (n == null || !n.isTextual()) throw error(where + "." + field, "must be a string");
        return n.asText();
    }

    public JsonNode array(JsonNode parent, String field, String where) throws SourceException {
        JsonNode n = parent.get(field);
        if (n == null || !n.isArray()) throw error(where + "." + field, "must be an array");
        return n;
    }

    /** A 3x3 matrix written as three rows of three finite numbers; returned row major. */
    public double[] matrix3(JsonNode n, String where) throws SourceException {
        if (n == null || !n.isArray() || n.size() != 3) throw error(where, "must be a 3x3 matrix (three rows of three numbers)");
        double[] m = new double[9];
        for (int r = 0; r < 3; r++) {
            JsonNode row = n.get(r);
            if (!row.isArray() || row.size() != 3) throw error(where, "must be a 3x3 matrix; row " + r + " is " + row);
            for (int c = 0; c < 3; c++) m[r * 3 + c] = finite(row.get(c), where + "[" + r + "][" + c + "]");
        }
        return m;
    }

    /** Refuses a top-level key outside {@code known} (keys starting with "_" are comments and allowed). */
    public void knownKeys(JsonNode root, String... known) throws SourceException {
        java.util.List<String> k = java.util.List.of(known);
        for (java.util.Iterator<String> it = root.fieldNames(); it.hasNext(); ) {
            String f = it.next();
            if (!f.startsWith("_") && !k.contains(f))
                throw error("\"" + f + "\"", "is not a key of this file; known keys: " + String.join(", ", known));
        }
    }

    /** Checks the {@code format} and {@code version} fields of one of this tool's files. */
    public void expectFormat(JsonNode root, String format, int maxVersion) throws SourceException {
        JsonNode f = root.get("format");
        if (f != null && !format.equals(f.asText()))
            throw error("format", "is \"" + f.asText() + "\", expected \"" + format + "\"");
        JsonNode v = root.get("version");
        if (v != null && (!v.isInt() || v.asInt() < 1 || v.asInt() > maxVersion))
            throw error("version", "is " + v + "; this build reads " + format + " versions 1.." + maxVersion);
    }
}
