package org.targetbench.track;

import boofcv.struct.image.GrayF32;

import java.util.SplittableRandom;

/**
 * Seeded analytic textures for tracker tests: a sum of Gaussian blobs whose centres can be shifted by any sub-pixel
 * amount, so a translated frame is exact rather than interpolated. Invented data, for tests only.
 */
public final class TrackScenes {
    private TrackScenes() {}

    /** Blobs of the texture: x, y, sigma, weight. */
    static double[][] blobs(int w, int h, long seed) {
        SplittableRandom rng = new SplittableRandom(seed);
        int n = w * h / 120;
        double[][] b = new double[n][4];
        for (double[] q : b) {
            q[0] = rng.nextDouble() * (w + 40) - 20;
            q[1] = rng.nextDouble() * (h + 40) - 20;
            q[2] = 1.5 + rng.nextDouble() * 4;
            q[3] = rng.nextDouble() * 2 - 1;
        }
        return b;
    }

    /**
     * The texture of {@code seed} moved by (dx, dy) pixels: pixel (x, y) of the result shows what pixel (x - dx, y - dy)
     * of the unmoved texture shows. Grey levels 0..255, not quantised.
     */
    public static GrayF32 texture(int w, int h, long seed, double dx, double dy) {
        double[][] b = blobs(w, h, seed);
        GrayF32 img = new GrayF32(w, h);
        float[] acc = new float[w * h];
        for (double[] q : b) {
            double cx = q[0] + dx, cy = q[1] + dy, s = q[2];
            int r = (int) Math.ceil(3 * s);
            int x0 = Math.max(0, (int) Math.floor(cx) - r), x1 = Math.min(w - 1, (int) Math.ceil(cx) + r);
            int y0 = Math.max(0, (int) Math.floor(cy) - r), y1 = Math.min(h - 1, (int) Math.ceil(cy) + r);
            double inv = 1 / (2 * s * s);
            for (int y = y0; y <= y1; y++)
                for (int x = x0; x <= x1; x++) {
                    double ddx = x - cx, ddy = y - cy;
                    acc[y * w + x] += (float) (q[3] * Math.exp(-(ddx * ddx + ddy * ddy) * inv));
                }
        }
        for (int i = 0; i < acc.length; i++) img.data[i] = (float) Math.max(0, Math.min(255, 128 + 70 * acc[i]));
        return img;
    }

    /** Rounds to whole grey levels, as an 8-bit camera delivers. */
    public static GrayF32 quantised(GrayF32 in) {
        GrayF32 out = in.clone();
        for (int i = 0; i < out.data.length; i++) out.data[i] = (float) Math.max(0, Math.min(255, Math.rint(out.data[i])));
        return out;
    }
}
