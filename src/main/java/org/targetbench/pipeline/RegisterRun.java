package org.targetbench.pipeline;

import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Homography;
import org.targetbench.camera.Projection.ProjectedFeature;
import org.targetbench.register.FrameRegistrar;
import org.targetbench.register.RegisterConfig;
import org.targetbench.register.Registration;
import org.targetbench.source.FrameSource;
import org.targetbench.source.FrameTruth;
import org.targetbench.source.SourceException;
import org.targetbench.source.SourceFrame;
import org.targetbench.target.TargetDesign;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.function.BiConsumer;

/**
 * Registers every frame of a source to a design ({@link FrameRegistrar}) and turns the result into truth the scores
 * read: per frame the predicted feature pixels (with depth when intrinsics are given) and, when the model has no lens
 * distortion, the homography from the reference frame (the first registered one) to the frame, H = G_f G_ref^-1 with
 * G the design-to-image mapping (Hartley &amp; Zisserman 2004, sec. 13.1: images of one plane are related by a
 * homography). With distortion no homography exists between frames and only the points are given; frames that did
 * not register carry no truth and are never scored.
 */
public final class RegisterRun {
    private final TargetDesign design;
    private final Optional<CameraModel> camera;
    private final RegisterConfig config;

    /** One frame's outcome. */
    public record Frame(int index, String name, Registration registration) {}

    /** The outcome of a run: frames in order, and the best residual met (also among failed frames; NaN if none). */
    public record Result(List<Frame> frames, double bestRmsPx) {
        public Result {
            frames = List.copyOf(frames);
        }

        public long registeredCount() { return frames.stream().filter(f -> f.registration().registered()).count(); }

        /** The first registered frame, the reference of the truth. */
        public Optional<Frame> reference() { return frames.stream().filter(f -> f.registration().registered()).findFirst(); }
    }

    public RegisterRun(TargetDesign design, Optional<CameraModel> camera, RegisterConfig config) {
        config.checkValidity();
        this.design = design;
        this.camera = camera;
        this.config = config.copy();
    }

    /**
     * Registers every frame. {@code perFrame} (may be null) sees each frame with its registration as it is made, for
     * overlays, without the run keeping the images.
     */
    public Result run(FrameSource source, BiConsumer<SourceFrame, Registration> perFrame) throws SourceException {
        FrameRegistrar reg = new FrameRegistrar(design, camera, config);
        List<Frame> out = new ArrayList<>();
        double best = Double.NaN;
        Optional<SourceFrame> f;
        while ((f = source.next()).isPresent()) {
            Registration r = reg.register(f.get().image());
            out.add(new Frame(f.get().index(), f.get().name(), r));
            if (Double.isFinite(r.rmsPx()) && (Double.isNaN(best) || r.rmsPx() < best)) best = r.rmsPx();
            if (perFrame != null) perFrame.accept(f.get(), r);
        }
        return new Result(out, best);
    }

    /**
     * Per registered frame (the reference included), the homography from the reference frame to it between
     * undistorted images, H = G_f G_ref^-1 (for {@link CompareRun#withRegisteredTruth}).
     */
    public static Map<String, Homography> undistortedFromReference(Result result) {
        Map<String, Homography> out = new LinkedHashMap<>();
        Optional<Frame> ref = result.reference();
        if (ref.isEmpty()) return out;
        Homography gRefInv = ref.get().registration().designToImage().orElseThrow().inverse();
        for (Frame fr : result.frames())
            if (fr.registration().registered()) out.put(fr.name(), fr.registration().designToImage().orElseThrow().after(gRefInv).normalised());
        return out;
    }

    /** Truth of every registered frame, keyed by frame name, in the form the scores read. */
    public static Map<String, FrameTruth> truth(Result result, boolean distorted) {
        Map<String, FrameTruth> out = new LinkedHashMap<>();
        Optional<Frame> ref = result.reference();
        if (ref.isEmpty()) return out;
        Homography gRefInv = ref.get().registration().designToImage().orElseThrow().inverse();
        for (Frame fr : result.frames()) {
            Registration r = fr.registration();
            if (!r.registered()) continue;
            List<ProjectedFeature> pts = new ArrayList<>();
            for (Registration.PredictedFeature p : r.predicted()) pts.add(new ProjectedFeature(p.featureId(), p.u(), p.v(), p.depthM(), p.kind()));
            Optional<Homography> h = distorted ? Optional.empty() : Optional.of(r.designToImage().orElseThrow().after(gRefInv).normalised());
            out.put(fr.name(), new FrameTruth(h, pts));
        }
        return out;
    }
}
