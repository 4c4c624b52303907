package org.targetbench.pipeline;

import boofcv.struct.image.GrayF32;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Projection.ProjectedFeature;
import org.targetbench.register.FrameRegistrar;
import org.targetbench.register.RegisterConfig;
import org.targetbench.register.Registration;
import org.targetbench.register.RegistrationNote;
import org.targetbench.source.FrameTruth;
import org.targetbench.target.TargetDesign;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * Live truth from the known target: each frame is registered to the design ({@link FrameRegistrar}, following the
 * previous frame), and the registration handed to {@link LiveScoring} as the frame's truth: the design-to-image
 * homography (to undistorted pixels when the intrinsics have lens distortion, see {@link #undistortWith()}) and the
 * predicted pixel of every designed feature in view (lens distortion applied). A frame that does not register gives
 * no truth, and {@link #lastNote()} says why.
 *
 * <p>One instance per stream, used by the scoring thread only (the registrar keeps the previous frame).
 */
public final class LiveRegistration implements LiveScoring.Registration {
    private final TargetDesign design;
    private final Optional<CameraModel> camera;
    private final FrameRegistrar registrar;
    private Optional<RegistrationNote> last = Optional.empty();
    private boolean wrongSize;

    public LiveRegistration(TargetDesign design, Optional<CameraModel> camera, RegisterConfig config) {
        this.design = design;
        this.camera = camera;
        this.registrar = new FrameRegistrar(design, camera, config);
    }

    public TargetDesign design() { return design; }

    public Optional<CameraModel> camera() { return camera; }

    @Override
    public Optional<FrameTruth> register(GrayF32 frame) {
        wrongSize = camera.isPresent() && (camera.get().width() != frame.width || camera.get().height() != frame.height);
        if (wrongSize) {
            last = Optional.empty();
            return Optional.empty();
        }
        Registration r = registrar.register(frame);
        last = Optional.of(r.note());
        if (!r.registered()) return Optional.empty();
        List<ProjectedFeature> pts = new ArrayList<>();
        for (Registration.PredictedFeature p : r.predicted()) pts.add(new ProjectedFeature(p.featureId(), p.u(), p.v(), p.depthM(), p.kind()));
        return Optional.of(new FrameTruth(r.designToImage(), pts));
    }

    @Override public boolean active() { return true; }

    @Override public Optional<RegistrationNote> lastNote() { return last; }

    /** Whether the last frame was refused because its size differs from the intrinsics'. */
    @Override public boolean lastFrameOfWrongSize() { return wrongSize; }

    @Override public Optional<CameraModel> undistortWith() {
        return camera.filter(CameraModel::isDistorted);
    }
}
