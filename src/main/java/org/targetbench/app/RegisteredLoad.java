package org.targetbench.app;

import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.pipeline.RegisterRun;
import org.targetbench.register.FrameRegistrar;
import org.targetbench.register.RegisterConfig;
import org.targetbench.register.Registration;
import org.targetbench.source.FrameTruth;
import org.targetbench.source.RenderConfig;
import org.targetbench.source.SourceException;
import org.targetbench.source.SourceFrame;
import org.targetbench.target.TargetDesign;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * The loaded frames registered to a chosen design (and camera): each frame's truth becomes the registered one
 * (predicted feature pixels, and the homography from the reference when the camera has no distortion), the first
 * registered frame becomes the reference, and with intrinsics the registered poses form the scene, so the servo-set
 * view takes depth from the registered reference pose. Frames that did not register carry no truth and are listed
 * with their reason in {@link Result#notRegistered()}.
 */
final class RegisteredLoad {
    private RegisteredLoad() {}

    record Result(SourceLoader.Loaded loaded, Map<String, String> notRegistered) {}

    static Result register(String name, List<SourceFrame> frames, TargetDesign design, Optional<CameraModel> camera) throws SourceException {
        if (frames.isEmpty()) throw new SourceException("load frames first, then register them to a design");
        if (camera.isPresent() && (camera.get().width() != frames.get(0).image().width || camera.get().height() != frames.get(0).image().height))
            throw new SourceException("the intrinsics are for " + camera.get().width() + " x " + camera.get().height() + " images but the frames are "
                    + frames.get(0).image().width + " x " + frames.get(0).image().height);
        FrameRegistrar reg = new FrameRegistrar(design, camera, new RegisterConfig());
        List<RegisterRun.Frame> runs = new ArrayList<>();
        double best = Double.NaN;
        for (SourceFrame f : frames) {
            Registration r = reg.register(f.image());
            runs.add(new RegisterRun.Frame(f.index(), f.name(), r));
            if (Double.isFinite(r.rmsPx()) && !(r.rmsPx() >= best)) best = r.rmsPx();
        }
        RegisterRun.Result result = new RegisterRun.Result(runs, best);
        if (result.registeredCount() == 0)
            throw new SourceException(String.format(java.util.Locale.ROOT, "design %s never registered: %d frames tried, best residual %s", design.id(),
                    frames.size(), Double.isNaN(best) ? "none (the layout was never found)" : String.format(java.util.Locale.ROOT, "%.3f px", best)));
        Map<String, FrameTruth> truth = RegisterRun.truth(result, camera.map(CameraModel::isDistorted).orElse(false));
        Map<String, String> failed = new LinkedHashMap<>();
        List<SourceFrame> out = new ArrayList<>();
        List<Pose> poses = new ArrayList<>();
        String reference = result.reference().orElseThrow().name();
        for (int i = 0; i < frames.size(); i++) {
            SourceFrame f = frames.get(i);
            Registration r = runs.get(i).registration();
            if (!r.registered()) failed.put(f.name(), r.note().sentence());
            if (f.name().equals(reference)) r.pose().ifPresent(p -> poses.add(0, p));
            else if (r.registered()) r.pose().ifPresent(poses::add);
            out.add(new SourceFrame(f.index(), f.name(), f.image(), truth.getOrDefault(f.name(), FrameTruth.none())));
        }
        Optional<Session.Scene> scene = Optional.empty();
        if (camera.isPresent() && !poses.isEmpty())
            scene = Optional.of(new Session.Scene(design, camera.get(), new RenderConfig(), poses.get(0).t(2), poses));
        String label = name + ", registered to " + design.id() + " (" + result.registeredCount() + " of " + frames.size() + " frames)";
        return new Result(new SourceLoader.Loaded(label, out, reference, scene, false), failed);
    }
}
