package org.targetbench.source;

import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Homography;
import org.targetbench.camera.Pose;
import org.targetbench.camera.Projection;
import org.targetbench.target.TargetDesign;

import java.util.List;
import java.util.Optional;

/**
 * Frames rendered from a target design at a list of poses, each with full truth: the true pixel of every visible
 * feature and, for distortion-free cameras, the homography from the reference view (the first pose).
 * Frames are named {@code frame_000.png}, {@code frame_001.png}, ...
 */
public final class SyntheticSource implements FrameSource {
    private final TargetDesign design;
    private final List<Pose> poses;
    private final SyntheticRenderer renderer;
    private final long baseNoiseSeed;
    private int nextIndex;

    public SyntheticSource(TargetDesign design, CameraModel camera, List<Pose> poses, RenderConfig config) {
        if (poses.isEmpty()) throw new IllegalArgumentException("a synthetic source needs at least one pose");
        this.design = design;
        this.poses = List.copyOf(poses);
        this.renderer = new SyntheticRenderer(camera, config);
        this.baseNoiseSeed = config.noiseSeed;
    }

    public static String frameName(int index) { return String.format("frame_%03d.png", index); }

    public TargetDesign design() { return design; }
    public CameraModel camera() { return renderer.camera(); }
    public List<Pose> poses() { return poses; }

    @Override public String description() { return "synthetic render of " + design.id() + " at " + poses.size() + " poses"; }
    @Override public int width() { return renderer.camera().width(); }
    @Override public int height() { return renderer.camera().height(); }
    @Override public int frameCount() { return poses.size(); }
    @Override public String referenceName() { return frameName(0); }

    @Override
    public Optional<SourceFrame> next() {
        if (nextIndex >= poses.size()) return Optional.empty();
        int i = nextIndex++;
        // every frame gets its own, reproducible noise
        SyntheticRenderer.Rendered out = renderer.render(design, poses.get(i), baseNoiseSeed * 1_000_003L + i);
        Optional<Homography> h = camera().isDistorted() ? Optional.empty()
                : Optional.of(Projection.referenceToFrame(camera(), poses.get(0), poses.get(i)));
        return Optional.of(new SourceFrame(i, frameName(i), out.image(), new FrameTruth(h, out.features())));
    }

    @Override public void close() { nextIndex = poses.size(); }
}
