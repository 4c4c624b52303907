package org.targetbench.register;

/**
 * One correspondence between a point of the design (millimetres) and a pixel of the frame (as detected, distorted,
 * pixel-centre convention). {@code featureId} is the designed feature, or -1 for a grid finder's own key point (the
 * tangent points of a dot grid).
 */
record Match(double xMm, double yMm, double u, double v, int featureId) {}
