package org.targetbench.detect;

import boofcv.struct.image.GrayF32;
import org.junit.jupiter.api.Test;
import org.targetbench.TestScenes;
import org.targetbench.camera.Pose;
import org.targetbench.score.Localisation;
import org.targetbench.source.RenderConfig;
import org.targetbench.source.SyntheticRenderer;
import org.targetbench.target.TargetDesign;
import org.targetbench.target.TargetGenerators;

import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/** The dot detector's settings: polarity, the shape filters, and accuracy on a tilted grid with truth. */
class DotDetectorTest {
    static final TargetDesign GRID = TargetGenerators.dotGrid("grid", 6, 8, 20, 10, 10);
    static final Pose TILTED = Pose.facing(GRID.widthMm(), GRID.heightMm(), 0.26, 20, -10, 5, 0, 0);

    static SyntheticRenderer.Rendered render(boolean inverted) {
        RenderConfig rc = new RenderConfig();
        if (inverted) { rc.inkGrey = 220; rc.paperGrey = 30; rc.backgroundGrey = 110; }
        return new SyntheticRenderer(TestScenes.VGA, rc).render(GRID, TILTED);
    }

    @Test
    void findsEveryDotOfATiltedGridCloseToTheConicCentre() {
        SyntheticRenderer.Rendered r = render(false);
        List<Detection> d = Detectors.create(DetectorType.DOTS).detect(r.image());
        assertEquals(48, d.size());
        // the truth is the projected centre; the bias at this pose is below 0.1 px, so the RMS stays small
        assertTrue(Localisation.score(r.features(), d, 1).rmsPx() < 0.1, "RMS " + Localisation.score(r.features(), d, 1));
    }

    @Test
    void polarityIsASetting() {
        GrayF32 light = render(true).image();
        assertEquals(0, Detectors.create(DetectorType.DOTS).detect(light).size(), "dark-on-light finds no light dots");
        DotConfig c = new DotConfig();
        c.polarity = DotConfig.Polarity.LIGHT_ON_DARK;
        assertEquals(48, Detectors.create(c).detect(light).size());
    }

    @Test
    void squaresAndCheckerboardsAreNotDots() {
        assertEquals(List.of(), Detectors.create(DetectorType.DOTS).detect(TestScenes.checkerboardFrame()));
        TargetDesign squares = TargetGenerators.squareGrid("sq", 3, 4, 15, 30, 10);
        GrayF32 img = new SyntheticRenderer(TestScenes.VGA, new RenderConfig())
                .render(squares, Pose.facing(squares.widthMm(), squares.heightMm(), 0.3, 0, 0, 0, 0, 0)).image();
        assertEquals(List.of(), Detectors.create(DetectorType.DOTS).detect(img), "squares fail the ellipse filter");
    }

    @Test
    void badSettingsAreNamed() {
        DotConfig c = new DotConfig();
        c.minConvexity = 1.5;
        var e = assertThrows(IllegalArgumentException.class, () -> Detectors.create(c));
        assertTrue(e.getMessage().contains("minConvexity") && e.getMessage().contains("1.5"));
        DotConfig copy = c.copy();
        copy.centre = DotConfig.CentreMethod.CENTROID;
        assertEquals(DotConfig.CentreMethod.ELLIPSE, c.centre, "copies are independent");
        XCornerConfig x = new XCornerConfig();
        x.saddleRadius = 1;
        assertThrows(IllegalArgumentException.class, () -> Detectors.create(x));
    }
}
