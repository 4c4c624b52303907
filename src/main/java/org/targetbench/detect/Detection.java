package org.targetbench.detect;

/**
 * One detected point, in the pixel-centre convention (integer coordinates are pixel centres).
 *
 * @param x        column, pixels
 * @param y        row, pixels
 * @param response detector response, larger is stronger; units depend on the detector (absolute value for
 *                 detectors that find both polarities)
 * @param scale    characteristic size, pixels: the window radius for corner detectors, the FAST circle radius (3),
 *                 the blob radius for SURF-style and SIFT-style
 */
public record Detection(double x, double y, double response, double scale) {}
