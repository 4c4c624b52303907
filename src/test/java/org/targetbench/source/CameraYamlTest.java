package org.targetbench.source;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;
import org.targetbench.camera.CameraModel;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Intrinsics in the OpenCV FileStorage and ROS camera_info YAML layouts: the reference file from Debian's opencv-doc,
 * exact round trips through every layout, detection by content, and one-line refusals of broken files.
 */
class CameraYamlTest {
    static final Path REFERENCE = Path.of("src/test/resources/reference/calibration/left_intrinsics.yml");
    /** Seed of the random cameras written and read back. */
    private static final long SEED = 20261202L;
    @TempDir Path tmp;

    @Test
    void readsTheReferenceOpenCvFile() throws Exception {
        // Values as printed in left_intrinsics.yml (Debian opencv-doc 4.6.0+dfsg-12, see PROVENANCE.md)
        CameraModel c = CameraFiles.read(REFERENCE);
        assertEquals(640, c.width());
        assertEquals(480, c.height());
        assertEquals(5.3591573396163199e+02, c.fx(), 0);
        assertEquals(5.3591573396163199e+02, c.fy(), 0);
        assertEquals(3.4228315473308373e+02, c.cx(), 0);
        assertEquals(2.3557082909788173e+02, c.cy(), 0);
        assertEquals(-2.6637260909660682e-01, c.k1(), 0);
        assertEquals(-3.8588898922304653e-02, c.k2(), 0);
        assertEquals(1.7831947042852964e-03, c.p1(), 0);
        assertEquals(-2.8122100441115472e-04, c.p2(), 0);
        assertEquals(2.3839153080878486e-01, c.k3(), 0);
    }

    @Test
    void writesMatricesTheWayOpenCvDoes() throws Exception {
        // Writing the reference camera reproduces the reference file's own camera_matrix and distortion blocks
        String ours = CameraYaml.format(CameraFiles.read(REFERENCE), CameraYaml.Layout.OPENCV);
        String ref = Files.readString(REFERENCE);
        assertTrue(ours.startsWith("%YAML:1.0\n---\n"), ours);
        for (String key : new String[]{"camera_matrix", "distortion_coefficients"}) {
            String block = block(ref, key);
            assertEquals(block, block(ours, key), key);
        }
    }

    private static String block(String text, String key) {
        int start = text.indexOf(key + ": !!opencv-matrix");
        int end = text.indexOf(" ]", start);
        return text.substring(start, end + 2);
    }

    @ParameterizedTest
    @EnumSource(CameraFiles.Layout.class)
    void everyLayoutRoundTripsExactly(CameraFiles.Layout layout) throws Exception {
        SplittableRandom rng = new SplittableRandom(SEED);
        for (int i = 0; i < 20; i++) {
            CameraModel c = new CameraModel(320 + rng.nextInt(3000), 240 + rng.nextInt(2000), 200 + 3000 * rng.nextDouble(),
                    200 + 3000 * rng.nextDouble(), 1000 * rng.nextDouble(), 800 * rng.nextDouble(), rng.nextDouble() - 0.5,
                    0.2 * (rng.nextDouble() - 0.5), 1e-7 * rng.nextDouble(), 1e-3 * (rng.nextDouble() - 0.5), i == 0 ? 0 : 1e-12 * rng.nextDouble());
            if (org.targetbench.camera.CameraChecks.problem(c).isPresent()) { // implausible cameras are refused on reading; draw again
                i--;
                continue;
            }
            Path f = tmp.resolve("cam-" + layout + "-" + i + (layout == CameraFiles.Layout.JSON ? ".json" : ".txt"));
            CameraFiles.write(c, f, layout);
            assertEquals(c, CameraFiles.read(f), "layout " + layout + ", camera " + i);
        }
    }

    @Test
    void rosFileIsToldApartByContent() throws Exception {
        Path f = tmp.resolve("camera_info.yml");
        Files.writeString(f, """
                image_width: 1280
                image_height: 1024
                camera_name: flange
                camera_matrix:
                  rows: 3
                  cols: 3
                  data: [1100.5, 0, 640.25, 0, 1101.75, 512.5, 0, 0, 1]
                distortion_model: plumb_bob
                distortion_coefficients:
                  rows: 1
                  cols: 5
                  data: [-0.1, 0.02, 0.001, -0.002, 0.003]
                """);
        assertEquals(new CameraModel(1280, 1024, 1100.5, 1101.75, 640.25, 512.5, -0.1, 0.02, 0.003, 0.001, -0.002), CameraFiles.read(f));
    }

    @Test
    void brokenFilesAreRefusedWithOneLine() throws Exception {
        String good = CameraYaml.format(CameraFiles.read(REFERENCE), CameraYaml.Layout.OPENCV);
        assertRefused(good.replace("image_width: 640\n", ""), "missing key image_width");
        assertRefused(good.replace("   rows: 3\n   cols: 3\n", "   rows: 3\n   cols: 2\n"), "camera_matrix is 3x2; expected 3x3");
        assertRefused(good.replace("0., 0., 1. ]", "0., 0. ]"), "camera_matrix has 8 data values for 3x3");
        assertRefused(good.replace("image_height: 480", "image_height: -480"), "image_height must be a positive whole number");
        assertRefused(good.replace("5.3591573396163199e+02", ".nan"), "must be finite");
        assertRefused("camera_matrix: [1, 2\n", "malformed YAML");
        String ros = CameraYaml.format(CameraFiles.read(REFERENCE), CameraYaml.Layout.ROS);
        assertRefused(ros.replace("plumb_bob", "equidistant"), "only plumb_bob");
        assertRefused(ros.replace("distortion_coefficients:", "dist_coeffs:"), "missing key distortion_coefficients");
    }

    private void assertRefused(String text, String fragment) throws Exception {
        Path f = Files.createTempFile(tmp, "bad", ".yml");
        Files.writeString(f, text);
        SourceException e = assertThrows(SourceException.class, () -> CameraFiles.read(f));
        assertTrue(e.getMessage().contains(fragment), "'" + fragment + "' not in: " + e.getMessage());
        assertFalse(e.getMessage().contains("\n"), "one line: " + e.getMessage());
    }
}
