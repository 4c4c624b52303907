package org.targetbench.export;

import org.targetbench.formats.ServoSetReader;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.score.Robustness;
import org.targetbench.servo.ServoFixtures;
import org.targetbench.servo.ServoPoint;
import org.targetbench.servo.ServoSet;
import org.targetbench.source.SourceException;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;

import static org.junit.jupiter.api.Assertions.*;

/** servo-set.json and servo-set.csv: both round-trip to an identical set; the importer refuses what it cannot trust. */
class ServoSetFormatTest {
    static ServoSet sample() {
        CameraModel cam = new CameraModel(640, 480, 531.7, 533.1, 318.9, 241.3, -0.21, 0.07, -0.004, 0.0011, -0.0006);
        Pose pose = Pose.fromEulerXYZ(0.1, -0.05, 0.3, -0.07, -0.05, 0.31);
        ServoSet base = ServoFixtures.set(cam, pose, new double[][]{{20, 20}, {120, 25}, {115, 100}, {25, 95}, {70, 60}});
        List<ServoPoint> pts = new ArrayList<>();
        for (ServoPoint p : base.points()) {
            Robustness r = new Robustness(OptionalDouble.of(0.9 + p.id() / 100.0), p.id() % 2 == 0 ? OptionalDouble.empty() : OptionalDouble.of(0.97),
                    OptionalDouble.of(0.0123456789 * (p.id() + 1)), OptionalDouble.empty());
            pts.add(new ServoPoint(p.id(), p.u(), p.v(), p.x(), p.y(), p.zM(), p.targetXMm(), p.targetYMm(), p.id() == 4 ? -1 : p.id(), r,
                    "a reason, with \"quotes\" and commas"));
        }
        return new ServoSet("0.1.0", "2026-12-02T03:04:05Z", cam, "fixture-cb15", "Checkerboard 9x7 @ 15 mm (target.json)",
                Optional.of(pose), "known: pose 0 of poses.json", "shi-tomasi", "{\"maxFeatures\":500,\"threshold\":0.01,\"k\":\"x,y\"}", "{}",
                pts, base.condition(), base.sigmaMin());
    }

    @Test
    void jsonRoundTripsToAnIdenticalSet(@TempDir Path tmp) throws Exception {
        ServoSet s = sample();
        Path f = tmp.resolve("servo-set.json");
        ServoSetJson.write(s, f);
        assertEquals(s, ServoSetReader.read(f));
        String text = Files.readString(f);
        assertTrue(text.contains("\"format\" : \"targetbench-servo-set\"") && text.contains(Safety.NOTICE.substring(0, 40)), text);
    }

    @Test
    void csvRoundTripsToAnIdenticalSet(@TempDir Path tmp) throws Exception {
        ServoSet s = sample();
        Path f = tmp.resolve("servo-set.csv");
        ServoSetCsv.write(s, f);
        assertEquals(s, ServoSetReader.read(f));
        List<String> lines = Files.readAllLines(f);
        assertTrue(lines.contains(ServoSetCsv.HEADER));
        assertEquals(5, lines.size() - lines.indexOf(ServoSetCsv.HEADER) - 1);
    }

    @Test
    void withoutAPoseToo(@TempDir Path tmp) throws Exception {
        ServoSet p = sample();
        ServoSet s = new ServoSet(p.toolVersion(), p.created(), p.camera(), p.targetId(), p.targetDesign(), Optional.empty(), "unknown",
                p.detector(), p.detectorConfig(), p.trackerConfig(), p.points(), p.condition(), p.sigmaMin());
        ServoSetJson.write(s, tmp.resolve("a.json"));
        ServoSetCsv.write(s, tmp.resolve("a.csv"));
        assertEquals(s, ServoSetReader.read(tmp.resolve("a.json")));
        assertEquals(s, ServoSetReader.read(tmp.resolve("a.csv")));
    }

    @Test
    void refusesUnknownVersionsMissingIntrinsicsAndBadDepths(@TempDir Path tmp) throws Exception {
        ObjectMapper m = new ObjectMapper();
        ObjectNode good = ServoSetJson.toJson(sample());
        ObjectNode v2 = good.deepCopy();
        v2.put("version", 2);
        assertRefused(tmp, m, v2, "version is 2");
        ObjectNode noFx = good.deepCopy();
        ((ObjectNode) noFx.get("camera")).remove("fx");
        assertRefused(tmp, m, noFx, "camera.fx is missing");
        ObjectNode zero = good.deepCopy();
        ((ObjectNode) zero.get("points").get(1)).put("z_m", 0.0);
        assertRefused(tmp, m, zero, "points[1].z_m must be a depth > 0 m");
        ObjectNode noVersion = good.deepCopy();
        noVersion.remove("version");
        assertRefused(tmp, m, noVersion, "version is missing");

        Path csv = tmp.resolve("v.csv");
        ServoSetCsv.write(sample(), csv);
        Files.writeString(csv, Files.readString(csv).replace("# version,1", "# version,7"));
        var e = assertThrows(SourceException.class, () -> ServoSetReader.read(csv));
        assertTrue(e.getMessage().contains("version is 7"), e.getMessage());
    }

    private static void assertRefused(Path tmp, ObjectMapper m, ObjectNode json, String fragment) throws Exception {
        Path f = tmp.resolve("bad-" + Math.abs(fragment.hashCode()) + ".json");
        m.writeValue(f.toFile(), json);
        var e = assertThrows(SourceException.class, () -> ServoSetReader.read(f));
        assertTrue(e.getMessage().contains(fragment), e.getMessage());
    }
}
