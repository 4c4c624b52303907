package org.targetbench.pipeline;

import org.targetbench.detect.DetectorType;
import org.targetbench.target.FeatureKind;
import org.targetbench.target.TargetDesign;
import org.targetbench.target.TargetFeature;

import java.util.Optional;

/**
 * Which detector is built for a design's features, so a design is judged with the detector it would be located with
 * in practice as well as with the best generic one.
 *
 * <ul>
 *   <li>{@code checkerboard}, {@code xcorners} and {@code markers}: the features a saddle detector is built for are
 *       x-corners (a marker is a 2 x 2 checker cell whose single feature is its x-corner), so
 *       {@link DetectorType#XCORNER}. A checkerboard also lists its outer L-corners; the x-corner detector is scored on
 *       the x-corners only ({@link DetectorType#finds}).</li>
 *   <li>{@code dots}: {@link DetectorType#DOTS}.</li>
 *   <li>{@code squares}: the features are the L-corners of separate squares; no saddle and no blob centre is designed
 *       there, and L-corners are what the generic structure-tensor corner detectors (Harris, Shi-Tomasi) are built
 *       for, so there is no separate matched detector: the best generic detector is its match.</li>
 *   <li>{@code custom} and anything else: by the designed feature kinds: x-corners (with or without L-corners, as a
 *       checkerboard has) give the x-corner detector, dot centres alone the dot detector; otherwise none.</li>
 * </ul>
 */
public final class DesignMatch {
    private DesignMatch() {}

    /** The design-matched detector, or empty when the generic detectors are the match (L-corners, mixed features). */
    public static Optional<DetectorType> matched(TargetDesign design) {
        return switch (design.pattern()) {
            case "checkerboard", "xcorners", "markers" -> Optional.of(DetectorType.XCORNER);
            case "dots" -> Optional.of(DetectorType.DOTS);
            case "squares" -> Optional.empty();
            default -> byKinds(design);
        };
    }

    private static Optional<DetectorType> byKinds(TargetDesign design) {
        java.util.EnumSet<FeatureKind> kinds = java.util.EnumSet.noneOf(FeatureKind.class);
        for (TargetFeature f : design.features()) kinds.add(f.kind());
        if (kinds.contains(FeatureKind.X_CORNER) && !kinds.contains(FeatureKind.DOT_CENTRE)) return Optional.of(DetectorType.XCORNER);
        if (kinds.equals(java.util.EnumSet.of(FeatureKind.DOT_CENTRE))) return Optional.of(DetectorType.DOTS);
        return Optional.empty();
    }
}
