package org.targetbench.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The demo as a user runs it, then 'compare' on the frames it wrote: same numbers, every file in place. Also checks
 * that clean synthetic views of a checkerboard give the corner detectors high repeatability (the frames differ only
 * by viewpoint and 1.5 grey levels of noise).
 */
class DemoEndToEndTest {
    /** Corner detectors on a clean checkerboard across moderate viewpoint changes (measured 0.63-0.72; floor with margin). */
    private static final double CORNER_REPEATABILITY_FLOOR = 0.5;

    @Test
    void demoWritesEverythingAndCompareReproducesIt(@TempDir Path tmp) throws Exception {
        Path demo = tmp.resolve("demo");
        Cli.Result r = Cli.run("demo", "--out", demo.toString());
        assertEquals(0, r.exit(), r.err());
        assertEquals("", r.err(), "no noise on stderr when not on a terminal");
        assertTrue(r.out().contains("rank"), r.out());
        assertTrue(r.out().contains("Feasibility at 250 mm stand-off"), r.out()); // the same check as 'check'
        assertTrue(r.out().contains("smallest feature"), r.out());
        for (String f : List.of("detections.csv", "repeatability.csv", "summary.json", "target.json", "camera.json", "poses.json",
                "frames/truth.json", "frames/frame_000.png", "frames/frame_011.png", "overlays/frame_000_all.png", "overlays/frame_000_shi-tomasi.png",
                "tracking/tracks.csv", "tracking/survival.csv", "tracking/drift.csv", "tracking/summary.json"))
            assertTrue(Files.isRegularFile(demo.resolve(f)), "missing " + f);
        assertTrue(Files.isRegularFile(demo.resolve("arm/arm-rehearsal.html")), "the demo ends with a rehearsal on the demo arm");
        JsonNode summary = new ObjectMapper().readTree(demo.resolve("summary.json").toFile());
        int detectors = org.targetbench.detect.DetectorType.values().length;
        assertEquals(detectors, summary.get("ranking").size());
        assertEquals(11, summary.get("frames_with_homography").asInt());
        for (JsonNode d : summary.get("ranking")) {
            String name = d.get("detector").asText();
            if (name.equals("harris") || name.equals("shi-tomasi") || name.equals("xcorner")) {
                assertTrue(d.get("mean_repeatability").asDouble() > CORNER_REPEATABILITY_FLOOR, name + ": " + d);
                assertEquals(1.0, d.get("localisation").get("found_fraction").asDouble(), 0.02, name + " finds the x-corners");
            }
        }
        List<String> header = Files.readAllLines(demo.resolve("repeatability.csv"));
        assertEquals("detector,frame,repeatability,n_reference,n_frame,n_matched", header.get(0));
        assertEquals(1 + detectors * 11, header.size());
        assertEquals("detector,frame,x,y,response,scale", Files.readAllLines(demo.resolve("detections.csv")).get(0));

        Path again = tmp.resolve("again");
        Cli.Result c = Cli.run("compare", "--frames", demo.resolve("frames").toString(), "--out", again.toString());
        assertEquals(0, c.exit(), c.err());
        assertEquals(Files.readString(demo.resolve("repeatability.csv")), Files.readString(again.resolve("repeatability.csv")));
        assertEquals(Files.readString(demo.resolve("detections.csv")), Files.readString(again.resolve("detections.csv")));
        try (var s = Files.list(tmp)) {
            assertTrue(s.noneMatch(p -> p.getFileName().toString().contains(".partial-")), "staging folders removed");
        }
    }

    @Test
    void helpAndVersion() {
        Cli.Result v = Cli.run("--version");
        assertEquals(0, v.exit());
        assertTrue(v.out().startsWith("TargetBench "), v.out());
        for (String cmd : List.of("demo", "compare", "render")) {
            Cli.Result h = Cli.run(cmd, "--help");
            assertEquals(0, h.exit());
            assertTrue(h.out().contains("Usage: targetbench " + cmd), h.out());
        }
    }
}
