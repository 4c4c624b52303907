package org.targetbench.pipeline;

import boofcv.struct.image.GrayF32;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.camera.Projection.ProjectedFeature;
import org.targetbench.source.FrameSource;
import org.targetbench.source.RenderConfig;
import org.targetbench.source.SourceException;
import org.targetbench.source.SourceFrame;
import org.targetbench.source.SyntheticRenderer;
import org.targetbench.target.TargetDesign;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.SplittableRandom;

/**
 * The unperturbed frames a sweep starts from. Each frame is its own reference: a perturbed copy is compared with it.
 *
 * @param frames base frames
 * @param scene  the design, camera and renderer when the frames were rendered, so that tilt can be re-rendered
 */
public record SweepBase(String description, List<BaseFrame> frames, Optional<Scene> scene) {
    public SweepBase {
        frames = List.copyOf(frames);
    }

    /** A base frame; {@code pose} and its facing parameters are set when it was rendered. */
    public record BaseFrame(String name, GrayF32 image, List<ProjectedFeature> truth, Optional<Facing> facing) {
        public BaseFrame {
            truth = List.copyOf(truth);
        }
    }

    /** Parameters of {@link Pose#facing} for a rendered base frame. */
    public record Facing(double distanceM, double tiltXDeg, double tiltYDeg, double rollDeg, double offsetXM, double offsetYM) {
        public Pose pose(TargetDesign d, double extraTiltXDeg) {
            return Pose.facing(d.widthMm(), d.heightMm(), distanceM, tiltXDeg + extraTiltXDeg, tiltYDeg, rollDeg, offsetXM, offsetYM);
        }
    }

    /** What a rendered sweep needs to re-render a frame at a new pose. */
    public record Scene(TargetDesign design, CameraModel camera, SyntheticRenderer renderer) {}

    /** Largest random departure of a base view from square-on, degrees (tilt) and in-plane roll. */
    public static final double BASE_TILT_DEG = 5, BASE_ROLL_DEG = 10;

    /**
     * Renders {@code n} base views of a design: square on at {@code standoffM}, each tilted up to ±5° and rolled up to
     * ±10°, shifted up to ±3% of the distance, with the given lighting and its own sensor noise (seeded).
     */
    public static SweepBase render(TargetDesign design, CameraModel camera, RenderConfig lighting, double standoffM, int n, long seed) {
        SyntheticRenderer renderer = new SyntheticRenderer(camera, lighting);
        SplittableRandom rng = new SplittableRandom(seed);
        List<BaseFrame> frames = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            Facing f = new Facing(standoffM, sym(rng, BASE_TILT_DEG), sym(rng, BASE_TILT_DEG), sym(rng, BASE_ROLL_DEG),
                    sym(rng, 0.03 * standoffM), sym(rng, 0.03 * standoffM));
            var r = renderer.render(design, f.pose(design, 0), seed * 7919 + i);
            frames.add(new BaseFrame(String.format("view_%03d", i), r.image(), r.features(), Optional.of(f)));
        }
        return new SweepBase("rendered views of " + design.id() + " at " + standoffM + " m", frames,
                Optional.of(new Scene(design, camera, renderer)));
    }

    /**
     * Base frames taken from a frame source (each frame is its own reference), at most {@code most} of them.
     *
     * @param description what the frames are, for reports
     */
    public static SweepBase fromFrames(FrameSource source, String description, int most) throws SourceException {
        List<BaseFrame> frames = new ArrayList<>();
        Optional<SourceFrame> f;
        while (frames.size() < most && (f = source.next()).isPresent())
            frames.add(new BaseFrame(f.get().name(), f.get().image(), f.get().truth().features(), Optional.empty()));
        return new SweepBase(description, frames, Optional.empty());
    }

    /**
     * Distance at which a design fills about half the width of the camera's view: the default stand-off of a sweep
     * from a target design alone.
     */
    public static double defaultStandoff(TargetDesign design, CameraModel camera) {
        return camera.fx() * design.widthMm() / 1000.0 / (0.5 * camera.width());
    }

    private static double sym(SplittableRandom rng, double range) {
        return (2 * rng.nextDouble() - 1) * range;
    }
}
