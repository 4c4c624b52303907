package org.targetbench.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/** The shoot-out on two committed designs, and its refusals. */
class ShootoutCommandTest {
    static final String CB = "target-designs/fixture-cb15/target.json", DOTS = "target-designs/fixture-dots20/target.json",
            CAMERA = "target-designs/flange-camera.json";

    @Test
    void ranksTwoDesignsSideBySide(@TempDir Path tmp) throws IOException {
        Path out = tmp.resolve("s");
        Cli.Result r = Cli.run("shootout", "--targets", CB + "," + DOTS, "--camera", CAMERA, "--standoff-mm", "250", "--views", "1",
                "--levels", "2", "--kinds", "noise,blur", "--out", out.toString());
        assertEquals(0, r.exit(), r.err());
        List<String> rows = Files.readAllLines(out.resolve("shootout.csv"));
        assertEquals("rank,design,feasibility,best_detector,envelope_score,points,robust_points,best_cond,best_sigma_min,coverage,servo_note,"
                + "matched_detector,matched_envelope_score,matched_points,matched_robust_points,matched_rms_px,"
                + "generic_detector,generic_envelope_score,generic_points,generic_robust_points,generic_rms_px,dot_bias_px,dot_corrected_rms_px", rows.get(0));
        assertEquals(3, rows.size());
        assertTrue(rows.get(1).startsWith("1,") && rows.get(2).startsWith("2,"), rows.toString());
        for (String row : rows.subList(1, 3)) {
            String[] c = row.split(",", -1);
            assertTrue(Integer.parseInt(c[6]) <= Integer.parseInt(c[5]), "robust points are a subset of the points: " + row);
            assertFalse(c[7].isEmpty(), "both designs give an acceptable 4-point set: " + row);
            // each design beside its matched detector and the best generic one
            boolean dots = c[1].equals("fixture-dots20");
            assertEquals(dots ? "dots" : "xcorner", c[11], row);
            assertFalse(c[16].equals("dots") || c[16].equals("xcorner") || c[16].isEmpty(), "generic detector: " + row);
            assertEquals(dots, !c[21].isEmpty(), "dot bias only for the dot design: " + row);
        }
        String html = Files.readString(out.resolve("shootout.html"));
        assertTrue(html.contains("fixture-cb15") && html.contains("fixture-dots20") && html.contains("ISO 10218"));
        assertTrue(html.contains("design-matched detector") && html.contains("best generic detector") && html.contains("Dot centres"), "side by side");
        assertTrue(r.out().contains("matched  X-corners") && r.out().contains("matched  Dot centres"), r.out());
    }

    @Test
    void needsTwoDesignsAndAPositiveStandoff(@TempDir Path tmp) throws IOException {
        BadInputTest.assertBadInput(tmp.resolve("a"), "at least two designs", "shootout", "--targets", CB, "--camera", CAMERA,
                "--standoff-mm", "250", "--out", tmp.resolve("a").toString());
        BadInputTest.assertBadInput(tmp.resolve("b"), "--standoff-mm must be > 0", "shootout", "--targets", CB + "," + DOTS, "--camera", CAMERA,
                "--standoff-mm", "-5", "--out", tmp.resolve("b").toString());
    }
}
