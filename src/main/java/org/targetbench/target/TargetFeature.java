package org.targetbench.target;

/**
 * One designed feature point of a planar target.
 *
 * @param id   index of the feature within its design, 0-based and unique
 * @param xMm  position along the design's x axis (to the right on the printed page), millimetres
 * @param yMm  position along the design's y axis (down the printed page), millimetres
 * @param kind what the feature looks like
 */
public record TargetFeature(int id, double xMm, double yMm, FeatureKind kind) {
    public TargetFeature {
        if (!Double.isFinite(xMm) || !Double.isFinite(yMm))
            throw new IllegalArgumentException("feature " + id + " position must be finite, got (" + xMm + ", " + yMm + ")");
    }
}
