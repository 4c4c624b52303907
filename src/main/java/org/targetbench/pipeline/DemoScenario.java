package org.targetbench.pipeline;

import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.source.RenderConfig;
import org.targetbench.source.SyntheticSource;
import org.targetbench.target.TargetDesign;
import org.targetbench.target.TargetGenerators;

import java.util.ArrayList;
import java.util.List;

/**
 * The built-in demo scenario, invented for this tool: a checkerboard target clamped to the fixture plate of a small
 * machining cell, watched by a VGA camera on the arm's flange from about 0.25 m while the arm moves through the views
 * a commissioning engineer would try (square on, tilted towards the spindle, rolled, nearer and further).
 * The plate behind the target is mid-grey machined steel; the cell light is fairly flat with mild sensor noise.
 */
public final class DemoScenario {
    /** Stand-off of the reference view, metres. */
    public static final double STANDOFF_M = 0.25;

    private DemoScenario() {}

    /** Fixture target: 9 x 7 squares of 15 mm with a quiet zone of one square (165 x 135 mm), as target-designs/fixture-cb15. */
    public static TargetDesign target() {
        return TargetGenerators.checkerboard("fixture-cb15", 7, 9, 15, 15);
    }

    /**
     * Flange camera: 640 x 480 with a 6 mm lens (about 62 degrees horizontal field of view), modelled distortion free
     * so that every view has an exact homography to the reference.
     */
    public static CameraModel camera() {
        return CameraModel.pinhole(640, 480, 532.0, 532.0, 319.5, 239.5);
    }

    /** Cell lighting and sensor: steel plate grey, matte white paper, 1.5 grey levels of noise. */
    public static RenderConfig lighting() {
        RenderConfig c = new RenderConfig();
        c.backgroundGrey = 96;
        c.paperGrey = 215;
        c.inkGrey = 28;
        c.noiseSigma = 1.5;
        c.noiseSeed = 20261202L;
        return c;
    }

    /** The arm's views of the target; the first is the square-on reference. */
    public static List<Pose> poses() {
        TargetDesign t = target();
        double w = t.widthMm(), h = t.heightMm();
        List<Pose> p = new ArrayList<>();
        p.add(Pose.facing(w, h, STANDOFF_M, 0, 0, 0, 0, 0));
        p.add(Pose.facing(w, h, STANDOFF_M, 0, 0, 0, 0.009, -0.006));
        p.add(Pose.facing(w, h, STANDOFF_M, 10, 0, 0, 0, 0));
        p.add(Pose.facing(w, h, STANDOFF_M, 0, 20, 0, 0, 0));
        p.add(Pose.facing(w, h, STANDOFF_M, -15, 15, 0, 0.007, 0.007));
        p.add(Pose.facing(w, h, STANDOFF_M, 0, -30, 0, -0.007, 0));
        p.add(Pose.facing(w, h, STANDOFF_M, 40, 0, 0, 0, 0.004));
        p.add(Pose.facing(w, h, STANDOFF_M, 0, 0, 15, 0, 0));
        p.add(Pose.facing(w, h, STANDOFF_M, 0, 0, -45, 0, 0));
        p.add(Pose.facing(w, h, STANDOFF_M, 5, 5, 90, 0, 0));
        p.add(Pose.facing(w, h, 0.21, 0, 0, 0, 0, 0));
        p.add(Pose.facing(w, h, 0.33, 0, 10, 0, 0, 0));
        return p;
    }

    public static SyntheticSource source() {
        return new SyntheticSource(target(), camera(), poses(), lighting());
    }
}
