package org.targetbench.cli;

import org.targetbench.formats.ServoSetReader;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.camera.Projection;
import org.targetbench.pipeline.DemoScenario;
import org.targetbench.servo.ServoPoint;
import org.targetbench.servo.ServoSet;
import org.targetbench.target.TargetDesign;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.*;

/** pick and rehearse as a user runs them, on the demo's own results (rendered, so every truth is known). */
class ServoCliTest {
    /** Exported reference pixels agree with the true projection of their target points within this (a third of a pixel, well inside one pixel of detection noise: common practice, no source). */
    private static final double EXPORT_PX = 0.3;
    /** A PnP pose from sub-pixel corners puts the points within this depth of the true one, metres (common practice, no source). */
    private static final double PNP_DEPTH_M = 0.001;

    @TempDir static Path tmp;
    static Path demo;

    @BeforeAll
    static void runDemo() {
        demo = tmp.resolve("demo");
        Cli.Result r = Cli.run("demo", "--detectors", "shi-tomasi", "--out", demo.toString());
        assertEquals(0, r.exit(), r.err());
        assertEquals("", r.err());
        assertTrue(r.out().contains("Servo set:") && r.out().contains("converged"), r.out());
    }

    @Test
    void demoExportsASetWhosePixelsAreTheTrueProjections() throws Exception {
        for (String f : List.of("servo-set.json", "servo-set.csv", "servo-set-selection.csv", "rehearsal/rehearsal.csv",
                "rehearsal/rehearsal-summary.json", "rehearsal/rehearsal.html", "rehearsal/rehearsal-error.png",
                "rehearsal/rehearsal-paths.png", "rehearsal/rehearsal-map.png"))
            assertTrue(Files.isRegularFile(demo.resolve(f)), "missing " + f);
        ServoSet set = ServoSetReader.read(demo.resolve("servo-set.json"));
        assertEquals(set, ServoSetReader.read(demo.resolve("servo-set.csv")));
        assertEquals(4, set.points().size());
        CameraModel cam = DemoScenario.camera();
        Pose ref = DemoScenario.poses().get(0);
        TargetDesign design = DemoScenario.target();
        for (ServoPoint p : set.points()) {
            double[] truth = Projection.projectTargetPoint(cam, ref, p.targetXMm(), p.targetYMm());
            assertEquals(truth[0], p.u(), EXPORT_PX, "u of point " + p.id());
            assertEquals(truth[1], p.v(), EXPORT_PX, "v of point " + p.id());
            assertTrue(p.featureId() >= 0, "point " + p.id() + " maps to a designed feature");
            assertEquals(design.features().get(p.featureId()).xMm(), p.targetXMm(), 1e-9);
            assertEquals(ref.targetToCamera(p.targetXMm(), p.targetYMm())[2], p.zM(), 1e-9);
        }
        JsonNode summary = new ObjectMapper().readTree(demo.resolve("rehearsal/rehearsal-summary.json").toFile());
        assertEquals(1.0, summary.get("summary").get("convergence_rate").asDouble(), 0.0, summary.toString());
    }

    @Test
    void pickWithMorePointsThenRehearseBothFormats() throws Exception {
        Path six = tmp.resolve("sets/six.json");
        Cli.Result p = Cli.run("pick", "--from", demo.toString(), "--count", "6", "--out", six.toString());
        assertEquals(0, p.exit(), p.err());
        assertTrue(p.out().contains("chose 6 of"), p.out());
        assertEquals(6, ServoSetReader.read(six).points().size());
        List<String> sel = Files.readAllLines(tmp.resolve("sets/six-selection.csv"));
        assertEquals(6, sel.stream().filter(l -> l.contains(",chosen,")).count());
        assertTrue(sel.stream().skip(1).allMatch(l -> l.contains(",chosen,") || l.contains(",rejected,")));

        Path out = tmp.resolve("reh");
        Cli.Result r = Cli.run("rehearse", "--set", tmp.resolve("sets/six.csv").toString(), "--starts", "30", "--law", "current",
                "--noise", "0.1", "--envelope", "10,5", "--out", out.toString());
        assertEquals(0, r.exit(), r.err());
        assertTrue(r.out().contains("converged            30 of 30"), r.out());
        assertEquals(31, Files.readAllLines(out.resolve("rehearsal.csv")).size());
    }

    @Test
    void pickAndDemoRecordTheRehearsalKeyAsTheWorkbenchExportDoes() throws Exception {
        ObjectMapper m = new ObjectMapper();
        // pick runs no rehearsal: the key says so, and the file is exactly what the one export writes for that set
        Path f = tmp.resolve("keyed/set.json");
        Cli.Result p = Cli.run("pick", "--from", demo.toString(), "--out", f.toString());
        assertEquals(0, p.exit(), p.err());
        JsonNode picked = m.readTree(f.toFile());
        assertEquals(org.targetbench.export.ServoSetJson.NOT_REHEARSED, picked.get("rehearsal").asText());
        ServoSet set = ServoSetReader.read(f);
        Path again = tmp.resolve("keyed-again");
        try (org.targetbench.export.AtomicOutput out = org.targetbench.export.AtomicOutput.open(again)) {
            List<String> files = org.targetbench.report.ServoSetExport.write(set, java.util.Optional.empty(), java.util.Optional.empty(), 0, out,
                    "set", "rehearsal/");
            assertEquals(List.of("set.json", "set.csv", "set-selection.csv"), files);
            out.commit();
        }
        assertEquals(picked, m.readTree(again.resolve("set.json").toFile()));
        assertFalse(Files.exists(tmp.resolve("keyed/rehearsal")), "no rehearsal, no rehearsal files");
        // the demo rehearses exactly the set it exports: the key holds that rehearsal, and its files are where it says
        JsonNode demoSet = m.readTree(demo.resolve("servo-set.json").toFile());
        JsonNode summary = m.readTree(demo.resolve("rehearsal/rehearsal-summary.json").toFile());
        assertTrue(demoSet.get("rehearsal").isObject(), demoSet.get("rehearsal").toString());
        assertEquals("rehearsal/", demoSet.at("/rehearsal/files").asText());
        assertEquals(summary.get("summary"), demoSet.at("/rehearsal/summary"));
        assertEquals(summary.get("settings"), demoSet.at("/rehearsal/settings"));
    }

    @Test
    void pickEstimatesThePoseWithPnpWhenNoPoseIsKnown() throws Exception {
        Path copy = tmp.resolve("no-poses");
        copyTree(demo, copy);
        Files.delete(copy.resolve("poses.json"));
        Path f = copy.resolve("servo-set.json");
        Cli.Result p = Cli.run("pick", "--from", copy.toString(), "--out", f.toString());
        assertEquals(0, p.exit(), p.err());
        ServoSet est = ServoSetReader.read(f);
        assertTrue(est.poseMethod().contains("PnP"), est.poseMethod());
        Pose ref = DemoScenario.poses().get(0);
        for (ServoPoint pt : est.points())
            assertEquals(ref.targetToCamera(pt.targetXMm(), pt.targetYMm())[2], pt.zM(), PNP_DEPTH_M, "depth of point " + pt.id());
    }

    @Test
    void pickRefusesWhenNoSetIsAcceptable() {
        Path f = tmp.resolve("never.json");
        Cli.Result p = Cli.run("pick", "--from", demo.toString(), "--min-separation", "2000", "--out", f.toString());
        assertEquals(1, p.exit(), p.err());
        assertTrue(p.err().startsWith("targetbench: no acceptable servo set:"), p.err());
        assertEquals(1, p.err().strip().split("\\R").length);
        assertFalse(Files.exists(f));
    }

    static void copyTree(Path from, Path to) throws IOException {
        try (Stream<Path> s = Files.walk(from)) {
            for (Path p : s.toList()) {
                Path d = to.resolve(from.relativize(p).toString());
                if (Files.isDirectory(p)) Files.createDirectories(d);
                else Files.copy(p, d);
            }
        }
    }
}
