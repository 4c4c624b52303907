package org.targetbench.source;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.target.TargetDesign;
import org.targetbench.target.TargetGenerators;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.*;

/** Round trips and strict reading of target.json, camera.json, poses.json and truth.json. */
class FileFormatsTest {
    @TempDir Path tmp;

    @Test
    void targetDesignsRoundTrip() throws Exception {
        for (TargetDesign d : List.of(TargetGenerators.checkerboard("cb", 5, 7, 20, 10),
                TargetGenerators.dotGrid("dots", 4, 6, 20, 8, 10),
                TargetGenerators.xCornerField("xc", 12, 30, 8, 200, 150, 10, 42))) {
            Path f = tmp.resolve(d.id() + ".json");
            TargetFile.write(d, f);
            TargetDesign back = TargetFile.read(f);
            assertEquals(d, back);
            assertEquals(d.parameters().keySet(), back.parameters().keySet());
        }
    }

    @Test
    void cameraRoundTrips() throws Exception {
        CameraModel c = new CameraModel(1280, 960, 1001.5, 999.25, 640.1, 479.7, -0.2, 0.07, -0.01, 0.001, -0.002);
        Path f = tmp.resolve("camera.json");
        CameraFile.write(c, f);
        assertEquals(c, CameraFile.read(f));
    }

    @Test
    void posesRoundTripAndFacingFormIsRead() throws Exception {
        List<Pose> poses = List.of(Pose.fromEulerXYZ(0.1, -0.2, 0.3, 0.01, 0.02, 0.4), Pose.facing(100, 80, 0.3, 10, 0, 5, 0, 0));
        Path f = tmp.resolve("poses.json");
        PosesFile.write(poses, f);
        TargetDesign d = TargetGenerators.checkerboard("cb", 4, 5, 20, 0);
        List<Pose> back = PosesFile.read(f, d);
        for (int i = 0; i < poses.size(); i++) {
            assertArrayEquals(poses.get(i).rotation(), back.get(i).rotation(), 0);
            assertArrayEquals(poses.get(i).translation(), back.get(i).translation(), 0);
        }
        Path g = tmp.resolve("facing.json");
        Files.writeString(g, "{\"poses\": [{\"distance_m\": 0.5, \"tilt_x_deg\": 20}]}");
        Pose p = PosesFile.read(g, d).get(0);
        assertEquals(p, Pose.facing(d.widthMm(), d.heightMm(), 0.5, 20, 0, 0, 0, 0));
    }

    @Test
    void truthRejectsNaNSingularUnknownAndMisshapen() throws Exception {
        Set<String> names = Set.of("a.png", "b.png");
        assertTruthError("{\"reference\": \"a.png\", \"homographies\": {\"b.png\": [[1,0,0],[0,1,0],[0,0,NaN]]}}", names, "finite");
        assertTruthError("{\"reference\": \"a.png\", \"homographies\": {\"b.png\": [[1,2,3],[2,4,6],[0,0,1]]}}", names, "singular");
        assertTruthError("{\"reference\": \"a.png\", \"homographies\": {\"c.png\": [[1,0,0],[0,1,0],[0,0,1]]}}", names, "not in the folder");
        assertTruthError("{\"reference\": \"z.png\"}", names, "not in the folder");
        assertTruthError("{\"reference\": \"a.png\", \"homographies\": {\"b.png\": [[1,0],[0,1]]}}", names, "3x3");
        assertTruthError("{\"reference\": \"a.png\", \"homographies\": {\"b.png\": [[1,0,0],[0,1,0],[0,0,Infinity]]}}", names, "finite");
        assertTruthError("{\"reference\": \"a.png\", ", names, "malformed JSON");
    }

    private void assertTruthError(String json, Set<String> names, String expected) throws Exception {
        Path f = tmp.resolve("truth.json");
        Files.writeString(f, json);
        SourceException e = assertThrows(SourceException.class, () -> TruthFile.read(f, names));
        assertTrue(e.getMessage().contains(expected), e.getMessage());
        assertFalse(e.getMessage().contains("\n"), "one line: " + e.getMessage());
    }
}
