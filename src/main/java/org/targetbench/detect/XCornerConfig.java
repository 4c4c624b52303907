package org.targetbench.detect;

/**
 * X-corner (saddle point) detector settings ({@link XCornerDetector}). The common {@code threshold} applies to the
 * x-corner intensity (relative to the strongest by default); {@code nmsRadius} is the non-maximum suppression radius
 * of the x-corner intensity, pixels.
 */
public final class XCornerConfig extends DetectorConfig {
    /** Search an image pyramid (finds large, blurred x-corners; about 1.3 times the work). */
    public boolean pyramid = true;
    /**
     * Gaussian blur of the frame before the saddle fit, pixels (σ). More smoothing averages more noise but bends the
     * saddle towards the curvature of real (distorted) lines: on the opencv-doc chessboard photos the median distance
     * to OpenCV's cornerSubPix grows from 0.077 px (σ 1, radius 2) to 0.100 px (σ 1.5, radius 3).
     */
    public double saddleSigma = 1.0;
    /**
     * Half-size of the quadric fit window of the saddle refinement, pixels (samples within this radius); 0 turns the
     * refinement off and keeps the library's mean-shift position.
     */
    public int saddleRadius = 2;
    /** Smallest edge-intensity ratio the library accepts (its default 0.01; lower keeps fainter x-corners). */
    public double edgeIntensityRatio = 0.01;

    public XCornerConfig() {
        threshold = 0.05;
        nmsRadius = 2;
    }

    @Override public DetectorType type() { return DetectorType.XCORNER; }

    @Override public XCornerConfig copy() {
        XCornerConfig c = copyCommonTo(new XCornerConfig());
        c.pyramid = pyramid; c.saddleSigma = saddleSigma; c.saddleRadius = saddleRadius; c.edgeIntensityRatio = edgeIntensityRatio;
        return c;
    }

    @Override public void checkValidity() {
        super.checkValidity();
        if (!(saddleSigma > 0) || saddleSigma > 10) throw new IllegalArgumentException("xcorner: saddleSigma must be within (0, 10] px, got " + saddleSigma);
        if (saddleRadius < 0 || saddleRadius > 15) throw new IllegalArgumentException("xcorner: saddleRadius must be 0..15 px, got " + saddleRadius);
        if (saddleRadius > 0 && saddleRadius < 2) throw new IllegalArgumentException("xcorner: saddleRadius must be 0 or at least 2 px (a quadric needs 6 samples), got " + saddleRadius);
        if (!(edgeIntensityRatio >= 0 && edgeIntensityRatio < 1)) throw new IllegalArgumentException("xcorner: edgeIntensityRatio must be within 0..1, got " + edgeIntensityRatio);
    }
}
