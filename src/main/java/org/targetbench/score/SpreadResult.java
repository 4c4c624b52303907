package org.targetbench.score;

/**
 * How well points cover the frame.
 *
 * @param count            points
 * @param hullAreaFraction convex-hull area / image area (0 for fewer than 3 points)
 * @param cellOccupancy    fraction of the 4x4 grid of equal image cells holding at least one point
 * @param minDistancePx    smallest distance between two points, pixels (NaN for fewer than 2 points)
 */
public record SpreadResult(int count, double hullAreaFraction, double cellOccupancy, double minDistancePx) {}
