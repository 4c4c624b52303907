package org.targetbench.perturb;

import org.targetbench.source.SyntheticSource;
import org.targetbench.source.SourceException;
import org.targetbench.source.RenderConfig;
import org.targetbench.source.SyntheticRenderer;
import org.targetbench.source.FrameTruth;
import org.targetbench.source.SourceFrame;
import org.targetbench.source.FrameSource;
import boofcv.struct.image.GrayF32;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Homography;
import org.targetbench.camera.Pose;
import org.targetbench.camera.Projection;
import org.targetbench.camera.Trajectory;
import org.targetbench.perturb.PerturbConfig;
import org.targetbench.perturb.Perturbation;
import org.targetbench.perturb.Perturber;
import org.targetbench.target.TargetDesign;

import java.util.Optional;

/**
 * A synthetic video: a target design rendered along a camera {@link Trajectory} at a fixed frame rate, with motion
 * blur consistent with the motion, lighting drift and sensor noise, and full truth on every frame (the true pixel of
 * every visible feature and, for distortion-free cameras, the homography from frame 0).
 *
 * <p>Per frame i at t = i / fps: render at the pose of t without noise; blur with a linear kernel (the
 * {@link Perturbation#MOTION} model) along the image displacement of the target centre between t - e/2 and t + e/2
 * (e the exposure), whose length is that displacement (the box PSF of uniform linear motion, Gonzalez &amp; Woods 2008,
 * sec. 5.6); scale by the lighting gain 1 + a sin(2πt / period) ({@link Perturbation#GAIN}); add Gaussian noise
 * ({@link Perturbation#GAUSSIAN_NOISE}); each step rounds to 8 bits. Frames are named like rendered ones
 * ({@code frame_000.png}, ...).
 *
 * <p>Caveats: the blur is uniform over the frame, so the radial blur of an approach and the rotational blur of a roll
 * are not modelled; the background is a plain grey plate; the sensor is linear with no rolling shutter.
 */
public final class MotionSource implements FrameSource {
    /** Blur shorter than this is not applied, pixels. */
    static final double MIN_BLUR_PX = 0.05;

    private final String name;
    private final TargetDesign design;
    private final Trajectory trajectory;
    private final MotionConfig config;
    private final SyntheticRenderer renderer;
    private final Pose reference;
    private int nextIndex;

    /**
     * @param name     short name of the motion, for descriptions
     * @param lighting grey levels of the scene; its own noise is ignored (noise comes from {@code config})
     */
    public MotionSource(String name, TargetDesign design, CameraModel camera, Trajectory trajectory, RenderConfig lighting, MotionConfig config) {
        config.checkValidity();
        RenderConfig r = lighting.copy();
        r.noiseSigma = 0;
        this.name = name;
        this.design = design;
        this.trajectory = trajectory;
        this.config = config.copy();
        this.renderer = new SyntheticRenderer(camera, r);
        this.reference = trajectory.at(0);
    }

    public CameraModel camera() { return renderer.camera(); }
    public MotionConfig config() { return config.copy(); }

    @Override public String description() {
        return "synthetic motion '" + name + "' of " + design.id() + ": " + config.frames + " frames at " + fmt(config.fps) + " fps";
    }
    @Override public int width() { return camera().width(); }
    @Override public int height() { return camera().height(); }
    @Override public int frameCount() { return config.frames; }
    @Override public String referenceName() { return SyntheticSource.frameName(0); }

    /** Image displacement of the target centre over the exposure around {@code t}, pixels: {dx, dy}. */
    double[] blurVector(double t) {
        double e = config.exposureMs / 1000;
        if (e <= 0) return new double[]{0, 0};
        double cx = design.widthMm() / 2, cy = design.heightMm() / 2;
        double[] a = Projection.projectTargetPoint(camera(), trajectory.at(Math.max(0, t - e / 2)), cx, cy);
        double[] b = Projection.projectTargetPoint(camera(), trajectory.at(t + e / 2), cx, cy);
        double dx = b[0] - a[0], dy = b[1] - a[1];
        return Double.isFinite(dx) && Double.isFinite(dy) ? new double[]{dx, dy} : new double[]{0, 0};
    }

    @Override
    public Optional<SourceFrame> next() {
        if (nextIndex >= config.frames) return Optional.empty();
        int i = nextIndex++;
        double t = i / config.fps;
        Pose pose = trajectory.at(t);
        long seed = config.seed * 1_000_003L + i;
        GrayF32 img = renderer.render(design, pose, seed).image();
        double[] blur = blurVector(t);
        double length = Math.hypot(blur[0], blur[1]);
        if (length >= MIN_BLUR_PX) {
            PerturbConfig pc = new PerturbConfig();
            pc.motionAngleDeg = Math.toDegrees(Math.atan2(blur[1], blur[0]));
            double[] range = Perturbation.MOTION.validRange();
            img = new Perturber(pc).apply(Perturbation.MOTION, Math.min(range[1], length), img, seed).image();
        }
        if (config.lightingDrift > 0) {
            double gain = 1 + config.lightingDrift * Math.sin(2 * Math.PI * t / config.lightingPeriodS);
            img = new Perturber().apply(Perturbation.GAIN, gain, img, seed).image();
        }
        if (config.noiseSigma > 0) img = new Perturber().apply(Perturbation.GAUSSIAN_NOISE, config.noiseSigma, img, seed ^ 0x5DEECE66DL).image();
        Optional<Homography> h = camera().isDistorted() ? Optional.empty() : Optional.of(Projection.referenceToFrame(camera(), reference, pose));
        return Optional.of(new SourceFrame(i, SyntheticSource.frameName(i), img, new FrameTruth(h, Projection.visibleFeatures(design, camera(), pose))));
    }

    @Override public void close() { nextIndex = config.frames; }

    private static String fmt(double v) {
        return v == Math.rint(v) ? String.valueOf((long) v) : String.valueOf(v);
    }
}
