package org.targetbench.camera;

import org.junit.jupiter.api.Test;
import org.targetbench.target.TargetDesign;
import org.targetbench.target.TargetGenerators;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The feasibility line on the perspective bias of dots: the committed dot design (8 x 6 dots of 10 mm at 20 mm) at its
 * intended 260 mm stand-off with the flange camera (f = 532 px). Measured worst bias: 0.090 px at 20 degrees of tilt,
 * 0.145 px at 30 (so the default 0.1 px threshold warns at 30). No line for a design without dots.
 */
class DotBiasCheckTest {
    static final CameraModel FLANGE = CameraModel.pinhole(640, 480, 532, 532, 319.5, 239.5);
    static final TargetDesign DOTS = TargetGenerators.dotGrid("fixture-dots20", 6, 8, 20, 10, 10);

    static FeasibilityReport.Check line(TargetDesign d, double tilt) {
        return Feasibility.check(d, FLANGE, 0.26, tilt, new FeasibilityConfig()).checks().stream()
                .filter(c -> c.name().equals("dot centre bias")).findFirst().orElse(null);
    }

    @Test
    void warnsAboveTheThresholdAndNeverFails() {
        FeasibilityReport.Check at20 = line(DOTS, 20), at30 = line(DOTS, 30), flat = line(DOTS, 0);
        assertEquals(FeasibilityReport.Status.PASS, at20.status(), at20.measured());
        assertEquals(0.090, at20.value(), 0.002);
        assertEquals(FeasibilityReport.Status.WARN, at30.status(), at30.measured());
        assertEquals(0.145, at30.value(), 0.002);
        assertEquals(0, flat.value(), 1e-9, "square on, no bias");
        assertTrue(at30.basis().contains("derived") && at30.basis().contains("no source"), at30.basis());
        FeasibilityConfig strict = new FeasibilityConfig();
        strict.maxDotBiasPx = 0.01;
        FeasibilityReport.Check s = Feasibility.check(DOTS, FLANGE, 0.26, 45, strict).checks().stream()
                .filter(c -> c.name().equals("dot centre bias")).findFirst().orElseThrow();
        assertEquals(FeasibilityReport.Status.WARN, s.status(), "a warning at most");
    }

    @Test
    void noLineWithoutDots() {
        assertNull(line(TargetGenerators.checkerboard("cb", 7, 9, 15, 15), 30));
    }

    @Test
    void badThresholdIsNamed() {
        FeasibilityConfig c = new FeasibilityConfig();
        c.maxDotBiasPx = -1;
        var e = assertThrows(IllegalArgumentException.class, c::checkValidity);
        assertTrue(e.getMessage().contains("maxDotBiasPx") && e.getMessage().contains("-1"));
        assertEquals(-1, c.copy().maxDotBiasPx);
    }
}
