package org.targetbench.source;

import boofcv.struct.image.GrayF32;
import org.targetbench.camera.Homography;

/**
 * Does a frame look like the reference frame moved by the frame's truth homography? Truth of other footage fails this
 * at once: the moved reference does not line up with the frame. Measure: the normalised cross-correlation (insensitive
 * to gain and offset, so lighting drift passes) between frame k and the reference sampled at H⁻¹ q (bilinear), over
 * every {@value #STEP}th pixel q of frame k whose source lies inside the reference.
 */
public final class TruthConsistency {
    /** Sampling step over the frame, pixels. */
    static final int STEP = 3;

    private TruthConsistency() {}

    /** The correlation, or NaN when too few pixels overlap or either side is flat. */
    public static double correlation(GrayF32 reference, GrayF32 frame, Homography fromReference) {
        Homography back = fromReference.inverse();
        double sa = 0, sb = 0, saa = 0, sbb = 0, sab = 0;
        int n = 0;
        for (int y = 0; y < frame.height; y += STEP)
            for (int x = 0; x < frame.width; x += STEP) {
                double[] p = back.apply(x, y);
                if (!(p[0] >= 0 && p[1] >= 0 && p[0] < reference.width - 1 && p[1] < reference.height - 1)) continue;
                int x0 = (int) p[0], y0 = (int) p[1];
                double fx = p[0] - x0, fy = p[1] - y0;
                double a = (1 - fx) * (1 - fy) * reference.unsafe_get(x0, y0) + fx * (1 - fy) * reference.unsafe_get(x0 + 1, y0)
                        + (1 - fx) * fy * reference.unsafe_get(x0, y0 + 1) + fx * fy * reference.unsafe_get(x0 + 1, y0 + 1);
                double b = frame.unsafe_get(x, y);
                sa += a; sb += b; saa += a * a; sbb += b * b; sab += a * b;
                n++;
            }
        if (n < 100) return Double.NaN;
        double va = saa - sa * sa / n, vb = sbb - sb * sb / n;
        if (!(va > 0) || !(vb > 0)) return Double.NaN;
        return (sab - sa * sb / n) / Math.sqrt(va * vb);
    }
}
