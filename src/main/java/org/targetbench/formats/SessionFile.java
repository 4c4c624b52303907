package org.targetbench.formats;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.DetectorType;
import org.targetbench.servo.RehearsalConfig;
import org.targetbench.source.SourceException;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.Set;

/**
 * A workbench session (format {@code targetbench-session}), a small JSON of our own that references the files of the
 * work by paths relative to the session file. Version 2 keeps: the source (the demo scene, a video or a frame folder)
 * and the design and camera files it was registered to; the frame shown; every setting of every detector (their
 * refinement included) and the detectors drawn; the servo set as edited (a servo-set.json written beside the session),
 * the choice behind it (detector, count, time) and the hand edits made since, in order, with those undone; the
 * rehearsal run on one state of the set (its settings, so that the seeded run can be repeated); the settings of the
 * views (by component name, opaque here); and the stress sweep's saved results folder. Version 1 (source, frame,
 * servo set) is still read. Docs: docs/formats.md.
 */
public final class SessionFile {
    public static final String FORMAT = "targetbench-session";
    public static final int VERSION = 2;
    private static final ObjectMapper MAPPER = new ObjectMapper();

    /** Where the frames came from. */
    public enum SourceKind {
        DEMO, VIDEO, FOLDER;

        public String word() { return name().toLowerCase(Locale.ROOT); }
    }

    /** The design (target.json) and, optionally, the camera intrinsics the frames were registered to. */
    public record Registration(Path target, Optional<Path> camera) {}

    /** The servo point choice behind the set: detector used, points asked for, and the set's creation time. */
    public record Pick(String detector, int count, String created) {}

    /**
     * The rehearsal kept with the set.
     *
     * @param position which state of the set it ran on: 0 the chosen set, i after the i-th hand edit (past
     *                 {@code edits.size()}: a state that was undone)
     * @param config   its settings (seeded, so running them again gives the same result)
     * @param elapsedS how long it took, seconds
     */
    public record Rehearsed(int position, RehearsalConfig config, double elapsedS) {}

    /**
     * The servo set.
     *
     * @param set    the servo-set.json of the set as it stands, absolute once read, or empty
     * @param pick   the choice behind it, empty for a set read from a file (or version 1)
     * @param edits  candidate ids added or removed by hand since the choice, oldest first
     * @param undone edits taken back, the next to redo first
     */
    public record Servo(Optional<Path> set, Optional<Pick> pick, List<Integer> edits, List<Integer> undone, Optional<Rehearsed> rehearsed) {
        public Servo {
            edits = List.copyOf(edits);
            undone = List.copyOf(undone);
        }

        public static Servo none() { return new Servo(Optional.empty(), Optional.empty(), List.of(), List.of(), Optional.empty()); }
    }

    /**
     * The saved state.
     *
     * @param kind          the source's kind
     * @param sourcePath    the video or folder, absolute once read (empty for the demo)
     * @param registration  the design and camera the source was registered to, or empty
     * @param frameIndex    the frame shown, 0-based
     * @param detectors     every detector's settings (empty in version 1: the defaults)
     * @param shown         the detectors drawn over the frame (empty set in version 1: the workbench's default)
     * @param servo         the servo set, its choice and edits
     * @param views         the settings of the views by component name (an object; empty in version 1)
     * @param stressResults the folder the stress sweep's results were saved to, absolute once read, or empty
     */
    public record State(SourceKind kind, Optional<Path> sourcePath, Optional<Registration> registration, int frameIndex,
                        List<DetectorConfig> detectors, Set<DetectorType> shown, Servo servo, ObjectNode views, Optional<Path> stressResults) {
        public State {
            detectors = List.copyOf(detectors);
            shown = shown.isEmpty() ? Set.of() : Set.copyOf(EnumSet.copyOf(shown));
        }

        /** The servo-set.json of the edited set (as version 1 had it). */
        public Optional<Path> servoSet() { return servo.set(); }
    }

    private SessionFile() {}

    /** Writes the session; paths are stored relative to the session file's folder. */
    public static void write(State s, Path file) throws IOException {
        Path dir = file.toAbsolutePath().getParent();
        ObjectNode root = MAPPER.createObjectNode();
        root.put("format", FORMAT).put("version", VERSION);
        ObjectNode src = root.putObject("source");
        src.put("kind", s.kind().word());
        s.sourcePath().ifPresent(p -> src.put("path", relative(dir, p)));
        if (s.registration().isPresent()) {
            ObjectNode r = root.putObject("registration");
            r.put("target", relative(dir, s.registration().get().target()));
            if (s.registration().get().camera().isPresent()) r.put("camera", relative(dir, s.registration().get().camera().get()));
            else r.putNull("camera");
        } else root.putNull("registration");
        root.put("frame_index", s.frameIndex());
        if (s.servoSet().isPresent()) root.put("servo_set", relative(dir, s.servoSet().get()));
        else root.putNull("servo_set");
        ObjectNode det = root.putObject("detectors");
        ArrayNode shown = det.putArray("shown");
        for (DetectorType t : DetectorType.values()) if (s.shown().contains(t)) shown.add(t.cliName());
        ObjectNode settings = det.putObject("settings");
        for (DetectorConfig c : s.detectors()) settings.set(c.type().cliName(), ConfigJson.toJson(c));
        ObjectNode servo = root.putObject("servo");
        if (s.servo().pick().isPresent()) {
            Pick p = s.servo().pick().get();
            servo.putObject("pick").put("detector", p.detector()).put("count", p.count()).put("created", p.created());
        } else servo.putNull("pick");
        ArrayNode edits = servo.putArray("edits");
        s.servo().edits().forEach(edits::add);
        ArrayNode undone = servo.putArray("undone");
        s.servo().undone().forEach(undone::add);
        if (s.servo().rehearsed().isPresent()) {
            Rehearsed r = s.servo().rehearsed().get();
            ObjectNode ro = servo.putObject("rehearsal");
            ro.put("position", r.position()).put("elapsed_s", r.elapsedS());
            ro.set("settings", ConfigJson.toJson(r.config()));
        } else servo.putNull("rehearsal");
        root.set("views", s.views() == null ? MAPPER.createObjectNode() : s.views());
        ObjectNode stress = root.putObject("stress");
        if (s.stressResults().isPresent()) stress.put("results", relative(dir, s.stressResults().get()));
        else stress.putNull("results");
        MAPPER.writerWithDefaultPrettyPrinter().writeValue(file.toFile(), root);
    }

    private static String relative(Path dir, Path p) {
        return dir.relativize(p.toAbsolutePath().normalize()).toString().replace('\\', '/');
    }

    /** Reads a session of version 1 or 2; anything it cannot read is refused with one line naming the file. */
    public static State read(Path file) throws SourceException {
        JsonNode root;
        try {
            root = MAPPER.readTree(Files.readString(file));
        } catch (IOException e) {
            throw new SourceException("cannot read the session " + file + ": " + e.getMessage());
        }
        if (root == null || !FORMAT.equals(root.path("format").asText()))
            throw new SourceException(file + ": not a session file (\"format\" must be \"" + FORMAT + "\")");
        int version = root.path("version").isIntegralNumber() ? root.path("version").asInt() : -1;
        if (version < 1 || version > VERSION)
            throw new SourceException(file + ": session version " + root.path("version") + " is not readable by this build (1.." + VERSION + ")");
        try {
            return read(root, file.toAbsolutePath().getParent());
        } catch (SourceException e) {
            throw new SourceException(file + ": " + e.getMessage());
        }
    }

    private static State read(JsonNode root, Path dir) throws SourceException {
        String kind = root.path("source").path("kind").asText("");
        SourceKind k = null;
        for (SourceKind x : SourceKind.values()) if (x.word().equals(kind)) k = x;
        if (k == null) throw new SourceException("source.kind must be demo, video or folder, got \"" + kind + "\"");
        Optional<Path> src = Optional.empty();
        if (k != SourceKind.DEMO) {
            String p = root.path("source").path("path").asText("");
            if (p.isEmpty()) throw new SourceException("source.path is missing for a " + kind + " source");
            src = Optional.of(dir.resolve(p).normalize());
        }
        Optional<Registration> reg = Optional.empty();
        JsonNode r = root.path("registration");
        if (r.isObject()) {
            if (!r.path("target").isTextual()) throw new SourceException("registration.target must name the design file");
            reg = Optional.of(new Registration(dir.resolve(r.get("target").asText()).normalize(), path(dir, r.path("camera"))));
        }
        List<DetectorConfig> detectors = new ArrayList<>();
        JsonNode settings = root.path("detectors").path("settings");
        for (DetectorType t : DetectorType.values()) {
            if (!settings.has(t.cliName())) continue;
            DetectorConfig c = DetectorConfig.defaults(t);
            ConfigJson.fill(c, settings.get(t.cliName()), "detectors.settings." + t.cliName());
            try {
                c.checkValidity();
            } catch (IllegalArgumentException e) {
                throw new SourceException("detectors.settings: " + e.getMessage());
            }
            detectors.add(c);
        }
        Set<DetectorType> shown = EnumSet.noneOf(DetectorType.class);
        for (JsonNode n : root.path("detectors").path("shown")) {
            try {
                shown.add(DetectorType.parse(n.asText()));
            } catch (IllegalArgumentException e) {
                throw new SourceException("detectors.shown: " + e.getMessage());
            }
        }
        JsonNode sv = root.path("servo");
        Optional<Pick> pick = Optional.empty();
        if (sv.path("pick").isObject()) {
            JsonNode p = sv.get("pick");
            if (!p.path("detector").isTextual() || !p.path("count").isIntegralNumber())
                throw new SourceException("servo.pick needs a detector and a count");
            pick = Optional.of(new Pick(p.get("detector").asText(), p.get("count").asInt(), p.path("created").asText("")));
        }
        Optional<Rehearsed> rehearsed = Optional.empty();
        if (sv.path("rehearsal").isObject()) {
            JsonNode ro = sv.get("rehearsal");
            RehearsalConfig c = new RehearsalConfig();
            ConfigJson.fill(c, ro.path("settings"), "servo.rehearsal.settings");
            try {
                c.checkValidity();
            } catch (IllegalArgumentException e) {
                throw new SourceException("servo.rehearsal.settings: " + e.getMessage());
            }
            rehearsed = Optional.of(new Rehearsed(ro.path("position").asInt(0), c, ro.path("elapsed_s").asDouble(0)));
        }
        Servo servo = new Servo(path(dir, root.path("servo_set")), pick, ids(sv.path("edits"), "servo.edits"),
                ids(sv.path("undone"), "servo.undone"), rehearsed);
        ObjectNode views = root.path("views").isObject() ? (ObjectNode) root.get("views") : MAPPER.createObjectNode();
        return new State(k, src, reg, Math.max(0, root.path("frame_index").asInt(0)), detectors, shown, servo, views,
                path(dir, root.path("stress").path("results")));
    }

    private static Optional<Path> path(Path dir, JsonNode n) {
        return n.isTextual() && !n.asText().isEmpty() ? Optional.of(dir.resolve(n.asText()).normalize()) : Optional.empty();
    }

    private static List<Integer> ids(JsonNode n, String what) throws SourceException {
        List<Integer> out = new ArrayList<>();
        if (n.isMissingNode() || n.isNull()) return out;
        if (!n.isArray()) throw new SourceException(what + " must be a list of candidate ids");
        for (JsonNode x : n) {
            if (!x.isIntegralNumber()) throw new SourceException(what + " must be a list of candidate ids, got " + x);
            out.add(x.asInt());
        }
        return out;
    }
}
