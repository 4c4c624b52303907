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
 * Frames that do not register are scored as without truth and say so.
 */
public final class LiveScoring {
    /** Truth for one live frame: empty when the frame cannot be registered. */
    @FunctionalInterface
    public interface Registration {
        Optional<FrameTruth> register(GrayF32 frame);
    }

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
                         Against against, Optional<FrameTruth> truth) {}

    private final Map<DetectorType, PointDetector> detectors = new EnumMap<>(DetectorType.class);
    private final Registration registration;
    private Map<DetectorType, List<Detection>> previous;
    private GrayF32 previousFrame;
    private Map<DetectorType, List<Detection>> reference;
    private GrayF32 referenceFrame;
    private Homography referenceInverse;

    public LiveScoring(List<DetectorConfig> configs, Registration registration) {
        for (DetectorConfig c : configs) detectors.put(c.type(), Detectors.create(c));
        this.registration = registration;
    }

    public Scored score(GrayF32 frame) {
        Optional<FrameTruth> truth = registration.register(frame);
        Optional<Homography> fromRef = truth.flatMap(FrameTruth::fromReference);
        Map<DetectorType, List<Detection>> points = new LinkedHashMap<>();
        Map<DetectorType, Figures> figures = new LinkedHashMap<>();
        boolean firstRegistered = fromRef.isPresent() && reference == null;
        Against against = fromRef.isPresent() ? (firstRegistered ? Against.NOTHING : Against.REGISTERED_REFERENCE)
                : previous == null ? Against.NOTHING : Against.PREVIOUS_FRAME;
        for (var e : detectors.entrySet()) {
            long t0 = System.nanoTime();
            List<Detection> found = e.getValue().detect(frame);
            double ms = (System.nanoTime() - t0) / 1e6;
            points.put(e.getKey(), found);
            double rep = Double.NaN;
            if (against == Against.REGISTERED_REFERENCE) {
                rep = Repeatability.score(reference.get(e.getKey()), found, fromRef.get().after(referenceInverse), referenceFrame.width,
                        referenceFrame.height, frame.width, frame.height, Repeatability.DEFAULT_EPSILON).repeatability().orElse(Double.NaN);
            } else if (against == Against.PREVIOUS_FRAME) {
                rep = Repeatability.score(previous.get(e.getKey()), found, Homography.identity(), previousFrame.width, previousFrame.height,
                        frame.width, frame.height, Repeatability.DEFAULT_EPSILON).repeatability().orElse(Double.NaN);
            }
            double loc = Double.NaN, share = Double.NaN;
            if (truth.isPresent() && !truth.get().features().isEmpty()) {
                LocalisationResult l = Localisation.score(truth.get().features(), found, Localisation.DEFAULT_RADIUS);
                loc = l.rmsPx();
                share = l.foundFraction();
            }
            figures.put(e.getKey(), new Figures(found.size(), rep, Spread.score(found, frame.width, frame.height).cellOccupancy(), loc, share, ms));
        }
        if (firstRegistered) {
            reference = points;
            referenceFrame = frame;
            referenceInverse = fromRef.get().inverse();
        }
        previous = points;
        previousFrame = frame;
        return new Scored(frame, points, figures, against, truth);
    }
}
