package org.targetbench.pipeline;

import boofcv.struct.image.GrayF32;
import org.targetbench.camera.Homography;
import org.targetbench.detect.Detection;
import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.DetectorType;
import org.targetbench.detect.Detectors;
import org.targetbench.detect.PointDetector;
import org.targetbench.score.Localisation;
import org.targetbench.score.LocalisationResult;
import org.targetbench.score.Repeatability;
import org.targetbench.score.Spread;
import org.targetbench.source.FrameTruth;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * Scores every detector on the frames of a live camera, one frame at a time (the newest the camera delivered; the
 * caller drops what it cannot keep up with). Same functions as the command line: repeatability (Schmid, Mohr &
 * Bauckhage 2000, ε = {@value Repeatability#DEFAULT_EPSILON} px), localisation and found share within
 * {@value Localisation#DEFAULT_RADIUS} px, grid coverage.
 *
 * <p>Truth comes through the {@link Registration} hook. Without it ({@link #NO_REGISTRATION}), repeatability is
 * measured against the previous scored frame under the identity mapping: meaningful while the camera and the target
 * hold still (it then measures how stable each detector is under sensor noise and flicker), and low while either
 * moves; localisation and found share stay empty. With a registration (frame-to-design registration, which maps
 * each frame to the known target), the first registered frame becomes the reference, repeatability is measured
 * through the registered homography from it, and localisation and found share against the registered features.
 * Frames that do not register get no repeatability, localisation or found share, and say so ({@link Scored#registration()}). The
 * registration of the workbench's camera is {@link LiveRegistration}; under lens distortion repeatability is measured
 * between undistorted points through the plane-induced homography, as the comparison does.
 */
public final class LiveScoring {
    /** Truth for one live frame: empty when the frame cannot be registered. */
    @FunctionalInterface
    public interface Registration {
        /**
         * The frame's truth: {@link FrameTruth#fromReference()} holds the design-to-image homography (between
         * undistorted images when {@link #undistortWith()} is present), features the true pixels; empty when the
         * frame cannot be registered.
         */
        Optional<FrameTruth> register(GrayF32 frame);

        /** Whether frames are registered at all (false: no target chosen). */
        default boolean active() { return false; }

        /** Why the last frame registered or not, when known. */
        default Optional<org.targetbench.register.RegistrationNote> lastNote() { return Optional.empty(); }

        /** Whether the last frame was refused because its size differs from the intrinsics'. */
        default boolean lastFrameOfWrongSize() { return false; }

        /** The intrinsics whose undistorted images the homographies map between, when they have lens distortion. */
        default Optional<org.targetbench.camera.CameraModel> undistortWith() { return Optional.empty(); }
    }

    /**
     * How the frame fared with the registration: {@code NONE} without a target, {@code REGISTERED}, {@code NOT_REGISTERED}
     * (the note says why), or {@code WRONG_SIZE} (the intrinsics are for another image size).
     */
    public enum RegistrationState { NONE, REGISTERED, NOT_REGISTERED, WRONG_SIZE }

    /** No truth: repeatability against the previous frame. */
    public static final Registration NO_REGISTRATION = f -> Optional.empty();

    /** What a repeatability figure was measured against. */
    public enum Against { NOTHING, PREVIOUS_FRAME, REGISTERED_REFERENCE }

    /**
     * One detector's figures on one frame; NaN where undefined.
     *
     * @param detectMs time the detector took on this frame, milliseconds
     */
    public record Figures(int points, double repeatability, double coverage, double localisationPx, double foundShare, double detectMs) {}

    /** One scored frame. */
    public record Scored(GrayF32 frame, Map<DetectorType, List<Detection>> points, Map<DetectorType, Figures> figures,
                         Against against, Optional<FrameTruth> truth, RegistrationState registration,
                         Optional<org.targetbench.register.RegistrationNote> note) {}

    private final Map<DetectorType, PointDetector> detectors = new EnumMap<>(DetectorType.class);
    private final Registration registration;
    private Map<DetectorType, List<Detection>> previous;
    private GrayF32 previousFrame;
    private Map<DetectorType, List<Detection>> reference;
    private GrayF32 referenceFrame;
    private Homography referenceInverse;
    /** Reference detections in undistorted pixels, when the registration's homographies are between undistorted images. */
    private Map<DetectorType, List<Detection>> referenceUndistorted;

    public LiveScoring(List<DetectorConfig> configs, Registration registration) {
        for (DetectorConfig c : configs) detectors.put(c.type(), Detectors.create(c));
        this.registration = registration;
    }

    public Scored score(GrayF32 frame) {
        Optional<FrameTruth> truth = registration.register(frame);
        Optional<Homography> fromRef = truth.flatMap(FrameTruth::fromReference);
        Optional<org.targetbench.camera.CameraModel> undistort = registration.undistortWith();
        RegistrationState state = !registration.active() ? RegistrationState.NONE
                : registration.lastFrameOfWrongSize() ? RegistrationState.WRONG_SIZE
                : truth.isPresent() ? RegistrationState.REGISTERED : RegistrationState.NOT_REGISTERED;
        Map<DetectorType, List<Detection>> undistortedPoints = new LinkedHashMap<>();
        Map<DetectorType, List<Detection>> points = new LinkedHashMap<>();
        Map<DetectorType, Figures> figures = new LinkedHashMap<>();
        boolean firstRegistered = fromRef.isPresent() && reference == null;
        // with a target chosen, a frame that does not register is never scored against a guess
        Against against = fromRef.isPresent() ? (firstRegistered ? Against.NOTHING : Against.REGISTERED_REFERENCE)
                : previous == null || registration.active() ? Against.NOTHING : Against.PREVIOUS_FRAME;
        for (var e : detectors.entrySet()) {
            long t0 = System.nanoTime();
            List<Detection> found = e.getValue().detect(frame);
            double ms = (System.nanoTime() - t0) / 1e6;
            points.put(e.getKey(), found);
            double rep = Double.NaN;
            if (undistort.isPresent() && fromRef.isPresent()) undistortedPoints.put(e.getKey(), undistorted(found, undistort.get()));
            if (against == Against.REGISTERED_REFERENCE) {
                // under lens distortion both frames' points are undistorted and the plane induces the homography
                // between undistorted images (as CompareRun#withRegisteredTruth)
                boolean und = undistort.isPresent() && referenceUndistorted != null;
                rep = Repeatability.score(und ? referenceUndistorted.get(e.getKey()) : reference.get(e.getKey()),
                        und ? undistortedPoints.get(e.getKey()) : found, fromRef.get().after(referenceInverse), referenceFrame.width,
                        referenceFrame.height, frame.width, frame.height, Repeatability.DEFAULT_EPSILON).repeatability().orElse(Double.NaN);
            } else if (against == Against.PREVIOUS_FRAME) {
                rep = Repeatability.score(previous.get(e.getKey()), found, Homography.identity(), previousFrame.width, previousFrame.height,
                        frame.width, frame.height, Repeatability.DEFAULT_EPSILON).repeatability().orElse(Double.NaN);
            }
            double loc = Double.NaN, share = Double.NaN;
            var findable = truth.isPresent() ? Localisation.findableBy(e.getKey(), truth.get().features()) : List.<org.targetbench.camera.Projection.ProjectedFeature>of();
            if (!findable.isEmpty()) {
                LocalisationResult l = Localisation.score(findable, found, Localisation.DEFAULT_RADIUS);
                loc = l.rmsPx();
                share = l.foundFraction();
            }
            figures.put(e.getKey(), new Figures(found.size(), rep, Spread.score(found, frame.width, frame.height).cellOccupancy(), loc, share, ms));
        }
        if (firstRegistered) {
            reference = points;
            referenceFrame = frame;
            referenceInverse = fromRef.get().inverse();
            referenceUndistorted = undistort.isPresent() ? undistortedPoints : null;
        }
        previous = points;
        previousFrame = frame;
        return new Scored(frame, points, figures, against, truth, state, registration.lastNote());
    }

    /** Points moved to undistorted pixels (eqs. 1-3 of CameraModel inverted, then K). */
    private static List<Detection> undistorted(List<Detection> pts, org.targetbench.camera.CameraModel c) {
        boofcv.struct.distort.Point2Transform2_F64 t = c.pixelToNormalised();
        georegression.struct.point.Point2D_F64 n = new georegression.struct.point.Point2D_F64();
        List<Detection> out = new ArrayList<>(pts.size());
        for (Detection p : pts) {
            t.compute(p.x(), p.y(), n);
            out.add(new Detection(c.fx() * n.x + c.cx(), c.fy() * n.y + c.cy(), p.response(), p.scale()));
        }
        return out;
    }
}
