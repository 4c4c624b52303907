package org.targetbench.camera;

import boofcv.struct.image.GrayF32;
import org.junit.jupiter.api.Test;
import org.targetbench.source.ImageFiles;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Calibration on the chessboard photos shipped by Debian's opencv-doc 4.6.0+dfsg-12 (left01.jpg ... left14.jpg, 9 x 6
 * inner corners, 25 mm squares; left10.jpg is not in that package), against the result OpenCV's calibration sample
 * computed from them (left_intrinsics.yml, same package; see src/test/resources/reference/calibration/PROVENANCE.md).
 */
class ReferenceCalibrationTest {
    static final Path DIR = Path.of("src/test/resources/reference/calibration");
    /** Reference focal length, px (left_intrinsics.yml, fixed aspect ratio, so fx = fy). */
    static final double REF_F = 535.91573396163199;
    /** Reference principal point, px (left_intrinsics.yml). */
    static final double REF_CX = 342.28315473308373, REF_CY = 235.57082909788173;
    /** Allowed relative deviation of fx and fy from the reference calibration (common practice, no source). */
    static final double F_TOL = 0.01;
    /** Allowed deviation of cx and cy, px (common practice, no source). */
    static final double C_TOL_PX = 5;
    /** Largest acceptable RMS reprojection error, px (the reference reached 0.39 px). */
    static final double RMS_MAX_PX = 0.5;
    /** Fewest views that must be found: 13 photos, of which BoofCV's detector misses left13.jpg (see PROVENANCE.md). */
    static final int MIN_FOUND = 12;

    @Test
    void matchesTheReferenceCalibration() throws Exception {
        List<Path> files;
        try (Stream<Path> s = Files.list(DIR)) {
            files = s.filter(p -> p.getFileName().toString().matches("left\\d\\d\\.jpg")).sorted().toList();
        }
        assertEquals(13, files.size(), "reference photos present");
        Calibration cal = new Calibration(new Calibration.Board(9, 6, 25), new CalibrationConfig());
        List<String> names = new ArrayList<>();
        List<Optional<double[]>> found = new ArrayList<>();
        for (Path f : files) {
            GrayF32 img = ImageFiles.read(f);
            names.add(f.getFileName().toString());
            found.add(cal.detect(img));
        }
        assertTrue(found.stream().filter(Optional::isPresent).count() >= MIN_FOUND, "boards found: " + found.stream().filter(Optional::isPresent).count());
        Calibration.Outcome out = cal.solve(640, 480, names, found);
        CalibrationResult r = assertInstanceOf(CalibrationResult.class, out);
        CameraModel c = r.camera();
        assertEquals(REF_F, c.fx(), F_TOL * REF_F, "fx");
        assertEquals(REF_F, c.fy(), F_TOL * REF_F, "fy");
        assertEquals(REF_CX, c.cx(), C_TOL_PX, "cx");
        assertEquals(REF_CY, c.cy(), C_TOL_PX, "cy");
        assertTrue(r.rmsPx() < RMS_MAX_PX, "RMS " + r.rmsPx());
        assertEquals(13, r.views().size());
        for (CalibrationResult.View v : r.views())
            if (v.found()) assertTrue(v.rmsPx() > 0 && v.rmsPx() <= v.maxPx(), v.name() + ": rms " + v.rmsPx() + " max " + v.maxPx());
        assertTrue(r.coverageFraction() > 0.5 && r.coverageFraction() <= 1, "coverage " + r.coverageFraction());
    }
}
