package org.targetbench.formats;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.targetbench.source.SourceException;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Optional;

/**
 * A workbench session (format {@code targetbench-session}, version 1): a small JSON of our own that references the files
 * of the work by paths relative to the session file: the source (the demo scene, a video or a frame folder), the frame
 * shown, and the servo set as edited (a servo-set.json written beside the session). Docs: docs/formats.md.
 */
public final class SessionFile {
    public static final String FORMAT = "targetbench-session";
    public static final int VERSION = 1;
    private static final ObjectMapper MAPPER = new ObjectMapper();

    /** Where the frames came from. */
    public enum SourceKind {
        DEMO, VIDEO, FOLDER;

        public String word() { return name().toLowerCase(Locale.ROOT); }
    }

    /**
     * The saved state.
     *
     * @param kind       the source's kind
     * @param sourcePath the video or folder, absolute once read (empty for the demo)
     * @param frameIndex the frame shown, 0-based
     * @param servoSet   the servo-set.json of the edited set, absolute once read, or empty
     */
    public record State(SourceKind kind, Optional<Path> sourcePath, int frameIndex, Optional<Path> servoSet) {}

    private SessionFile() {}

    /** Writes the session; paths are stored relative to the session file's folder. */
    public static void write(State s, Path file) throws IOException {
        Path dir = file.toAbsolutePath().getParent();
        ObjectNode root = MAPPER.createObjectNode();
        root.put("format", FORMAT).put("version", VERSION);
        ObjectNode src = root.putObject("source");
        src.put("kind", s.kind().word());
        s.sourcePath().ifPresent(p -> src.put("path", relative(dir, p)));
        root.put("frame_index", s.frameIndex());
        if (s.servoSet().isPresent()) root.put("servo_set", relative(dir, s.servoSet().get()));
        else root.putNull("servo_set");
        MAPPER.writerWithDefaultPrettyPrinter().writeValue(file.toFile(), root);
    }

    private static String relative(Path dir, Path p) {
        return dir.relativize(p.toAbsolutePath().normalize()).toString().replace('\\', '/');
    }

    public static State read(Path file) throws SourceException {
        JsonNode root;
        try {
            root = MAPPER.readTree(Files.readString(file));
        } catch (IOException e) {
            throw new SourceException("cannot read the session " + file + ": " + e.getMessage());
        }
        if (root == null || !FORMAT.equals(root.path("format").asText()))
            throw new SourceException(file + ": not a session file (\"format\" must be \"" + FORMAT + "\")");
        if (root.path("version").asInt(-1) < 1 || root.path("version").asInt() > VERSION)
            throw new SourceException(file + ": session version " + root.path("version") + " is not readable by this build (1.." + VERSION + ")");
        Path dir = file.toAbsolutePath().getParent();
        String kind = root.path("source").path("kind").asText("");
        SourceKind k = null;
        for (SourceKind x : SourceKind.values()) if (x.word().equals(kind)) k = x;
        if (k == null) throw new SourceException(file + ": source.kind must be demo, video or folder, got \"" + kind + "\"");
        Optional<Path> src = Optional.empty();
        if (k != SourceKind.DEMO) {
            String p = root.path("source").path("path").asText("");
            if (p.isEmpty()) throw new SourceException(file + ": source.path is missing for a " + kind + " source");
            src = Optional.of(dir.resolve(p).normalize());
        }
        JsonNode set = root.path("servo_set");
        Optional<Path> setPath = set.isTextual() ? Optional.of(dir.resolve(set.asText()).normalize()) : Optional.empty();
        return new State(k, src, Math.max(0, root.path("frame_index").asInt(0)), setPath);
    }
}
