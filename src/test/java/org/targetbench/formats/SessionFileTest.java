package org.targetbench.formats;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.DetectorType;
import org.targetbench.servo.ControlLaw;
import org.targetbench.servo.RehearsalConfig;
import org.targetbench.source.SourceException;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Optional;

import static org.junit.jupiter.api.Assertions.*;

/** The session file: version 2 round trip, version 1 still read, later versions and bad settings refused in one line. */
class SessionFileTest {
    @Test
    void version2KeepsEverySettingAndPathsRelative(@TempDir Path tmp) throws Exception {
        List<DetectorConfig> configs = new ArrayList<>();
        for (DetectorType t : DetectorType.values()) configs.add(DetectorConfig.defaults(t));
        DetectorConfig h = configs.get(DetectorType.HARRIS.ordinal());
        h.maxFeatures = 42;
        h.refine.enabled = true;
        h.refine.maxShiftPx = 1.75;
        RehearsalConfig rc = new RehearsalConfig();
        rc.law = ControlLaw.CURRENT;
        rc.envelopeMm = new double[]{5, 6, 7};
        rc.seed = 9;
        Path file = tmp.resolve("work/a.session.json");
        Files.createDirectories(file.getParent());
        SessionFile.State st = new SessionFile.State(SessionFile.SourceKind.FOLDER, Optional.of(tmp.resolve("frames")),
                Optional.of(new SessionFile.Registration(tmp.resolve("work/target.json"), Optional.empty())), 5, configs,
                EnumSet.of(DetectorType.FAST, DetectorType.SIFT),
                new SessionFile.Servo(Optional.of(tmp.resolve("work/a.servo-set.json")), Optional.of(new SessionFile.Pick("fast", 5, "2026-12-02T10:00:00Z")),
                        List.of(3, 8), List.of(11), Optional.of(new SessionFile.Rehearsed(1, rc, 0.25))),
                new com.fasterxml.jackson.databind.ObjectMapper().createObjectNode().put("x", 1), Optional.of(tmp.resolve("sweep")));
        SessionFile.write(st, file);
        String text = Files.readString(file);
        assertTrue(text.contains("\"path\" : \"../frames\""), text);
        assertTrue(text.contains("\"target\" : \"target.json\""), text);
        assertTrue(text.contains("\"noiseSigmaPx\" : \"NaN\""), "a NaN is written as text: " + text);
        SessionFile.State back = SessionFile.read(file);
        assertEquals(st.kind(), back.kind());
        assertEquals(st.sourcePath(), back.sourcePath());
        assertEquals(st.registration(), back.registration());
        assertEquals(st.frameIndex(), back.frameIndex());
        assertEquals(st.shown(), back.shown());
        assertEquals(st.views(), back.views());
        assertEquals(st.stressResults(), back.stressResults());
        assertEquals(st.servo().set(), back.servo().set());
        assertEquals(st.servo().pick(), back.servo().pick());
        assertEquals(st.servo().edits(), back.servo().edits());
        assertEquals(st.servo().undone(), back.servo().undone());
        for (int i = 0; i < configs.size(); i++)
            assertEquals(ConfigJson.toJson(configs.get(i)), ConfigJson.toJson(back.detectors().get(i)), configs.get(i).type().cliName());
        var r = back.servo().rehearsed().orElseThrow();
        assertEquals(1, r.position());
        assertEquals(0.25, r.elapsedS());
        assertEquals(ConfigJson.toJson(rc), ConfigJson.toJson(r.config()));
        assertTrue(Double.isNaN(r.config().noiseSigmaPx));
    }

    @Test
    void version1IsStillRead(@TempDir Path tmp) throws Exception {
        Path file = tmp.resolve("old.session.json");
        Files.writeString(file, "{ \"format\": \"targetbench-session\", \"version\": 1, \"source\": { \"kind\": \"video\", \"path\": \"clip.mp4\" },"
                + " \"frame_index\": 3, \"servo_set\": \"old.servo-set.json\" }");
        SessionFile.State st = SessionFile.read(file);
        assertEquals(SessionFile.SourceKind.VIDEO, st.kind());
        assertEquals(Optional.of(tmp.resolve("clip.mp4")), st.sourcePath());
        assertEquals(3, st.frameIndex());
        assertEquals(Optional.of(tmp.resolve("old.servo-set.json")), st.servoSet());
        assertTrue(st.detectors().isEmpty() && st.shown().isEmpty() && st.registration().isEmpty());
        assertTrue(st.servo().pick().isEmpty() && st.servo().edits().isEmpty() && st.servo().rehearsed().isEmpty());
    }

    @Test
    void laterVersionsAndBadSettingsAreRefusedInOneLine(@TempDir Path tmp) throws Exception {
        Path file = tmp.resolve("s.session.json");
        for (String body : List.of(
                "{ \"format\": \"targetbench-session\", \"version\": 3, \"source\": { \"kind\": \"demo\" } }",
                "{ \"format\": \"targetbench-session\", \"version\": 2, \"source\": { \"kind\": \"demo\" },"
                        + " \"detectors\": { \"settings\": { \"harris\": { \"maxFeatures\": 0 } } } }",
                "{ \"format\": \"targetbench-session\", \"version\": 2, \"source\": { \"kind\": \"demo\" },"
                        + " \"detectors\": { \"settings\": { \"harris\": { \"noSuchSetting\": 1 } } } }",
                "{ \"format\": \"targetbench-session\", \"version\": 2, \"source\": { \"kind\": \"demo\" },"
                        + " \"servo\": { \"rehearsal\": { \"position\": 0, \"settings\": { \"law\": \"SIDEWAYS\" } } } }")) {
            Files.writeString(file, body);
            SourceException e = assertThrows(SourceException.class, () -> SessionFile.read(file), body);
            assertEquals(1, e.getMessage().split("\\R").length, e.getMessage());
            assertTrue(e.getMessage().startsWith(file.toString()), e.getMessage());
        }
    }
}
