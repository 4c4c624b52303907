package org.targetbench;

import boofcv.struct.image.GrayF32;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.source.RenderConfig;
import org.targetbench.source.SyntheticRenderer;
import org.targetbench.target.TargetDesign;
import org.targetbench.target.TargetGenerators;

import java.util.SplittableRandom;

/** Small, seeded scenes shared by tests. Invented data, for tests only. */
public final class TestScenes {
    private TestScenes() {}

    public static final CameraModel VGA = CameraModel.pinhole(640, 480, 532, 532, 319.5, 239.5);

    /** A checkerboard of 9 x 7 squares of 15 mm in a 12 mm margin. */
    public static TargetDesign checkerboard() {
        return TargetGenerators.checkerboard("test-cb", 7, 9, 15, 12);
    }

    public static RenderConfig clean() {
        return new RenderConfig();
    }

    /** The checkerboard square on at 0.35 m, rendered without noise. */
    public static GrayF32 checkerboardFrame() {
        TargetDesign d = checkerboard();
        return new SyntheticRenderer(VGA, clean()).render(d, Pose.facing(d.widthMm(), d.heightMm(), 0.35, 0, 0, 0, 0, 0)).image();
    }

    /** Seeded smooth random texture, grey 0..255 (sum of blurred random blobs), for detector and tracker tests. */
    public static GrayF32 texture(int w, int h, long seed) {
        SplittableRandom rng = new SplittableRandom(seed);
        GrayF32 img = new GrayF32(w, h);
        int blobs = w * h / 150;
        double[][] b = new double[blobs][4];
        for (double[] q : b) {
            q[0] = rng.nextDouble() * w; q[1] = rng.nextDouble() * h;
            q[2] = 2 + rng.nextDouble() * 6; q[3] = rng.nextDouble() * 2 - 1;
        }
        for (int y = 0; y < h; y++)
            for (int x = 0; x < w; x++) {
                double v = 0;
                for (double[] q : b) {
                    double dx = x - q[0], dy = y - q[1];
                    double d2 = dx * dx + dy * dy;
                    if (d2 < 9 * q[2] * q[2]) v += q[3] * Math.exp(-d2 / (2 * q[2] * q[2]));
                }
                img.unsafe_set(x, y, (float) Math.max(0, Math.min(255, 128 + 60 * v)));
            }
        return img;
    }
}
