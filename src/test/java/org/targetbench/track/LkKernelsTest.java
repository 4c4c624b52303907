package org.targetbench.track;

import boofcv.struct.image.GrayF32;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

/**
 * The vector kernels of the tracker ({@link LkVectorKernels}) against their scalar twins ({@link LkKernels}), both
 * called directly on the same seeded data: identical samples and identical sums, to the bit (the Vector API rule of
 * the project: a switch that changes speed only). Windows of every width the vector form takes, in the middle of an
 * image and touching its right border (where the lanes past the window read the next row); and the gradient
 * ({@link ScharrGradient}) with and without {@link ScharrVector}.
 */
class LkKernelsTest {
    static final int W = 97, H = 60, SEED = 11;

    static float[] image(SplittableRandom rng, float scale) {
        float[] p = new float[W * H];
        for (int i = 0; i < p.length; i++) p[i] = (float) (rng.nextDouble() * scale) - (scale > 100 ? 0 : scale / 2);
        return p;
    }

    @ParameterizedTest(name = "radius {0}")
    @ValueSource(ints = {4, 5, 6, 7})
    void vectorAndScalarAgreeToTheBit(int radius) {
        assumeTrue(LkKernels.VECTOR, "the vector module is passed to surefire (pom); without it only the scalar form exists");
        int width = 2 * radius + 1, n = width * width + LkKernels.slack();
        SplittableRandom rng = new SplittableRandom(SEED + radius);
        float[] pi = image(rng, 255), px = image(rng, 60), py = image(rng, 60);
        float[] acc = new float[LkKernels.SCRATCH];
        for (int trial = 0; trial < 20; trial++) {
            // the window's left column anywhere in the row, up to touching the right border
            int xt = trial == 0 ? W - width - 1 : rng.nextInt(W - width - 1), yt = rng.nextInt(H - width - 1);
            int index0 = yt * W + xt;
            float ax = (float) rng.nextDouble(), ay = (float) rng.nextDouble(), bx = 1 - ax, by = 1 - ay;
            float a0 = bx * by, a1 = ax * by, a2 = ax * ay, a3 = bx * ay;
            float[] t1 = new float[n], tx1 = new float[n], ty1 = new float[n], g1 = new float[3];
            float[] t2 = new float[n], tx2 = new float[n], ty2 = new float[n], g2 = new float[3];
            LkVectorKernels.describe(pi, px, py, index0, W, width, a0, a1, a2, a3, t1, tx1, ty1, acc, g1);
            LkKernels.describeScalar(pi, px, py, index0, W, width, a0, a1, a2, a3, t2, tx2, ty2, acc, g2);
            for (int k = 0; k < width * width; k++) {
                assertEquals(t2[k], t1[k], "template " + k);
                assertEquals(tx2[k], tx1[k], "x gradient " + k);
                assertEquals(ty2[k], ty1[k], "y gradient " + k);
            }
            for (int i = 0; i < 3; i++) assertEquals(g2[i], g1[i], "G sum " + i);
            // a shifted window of the same image against those templates
            int shifted = index0 + (rng.nextBoolean() ? 1 : W);
            if (shifted + width * W + LkKernels.reach(width) >= pi.length) shifted = index0;
            float[] s1 = new float[3], s2 = new float[3];
            LkVectorKernels.trackSums(pi, shifted, W, width, a1, a0, a3, a2, t1, tx1, ty1, acc, s1);
            LkKernels.trackSumsScalar(pi, shifted, W, width, a1, a0, a3, a2, t2, tx2, ty2, acc, s2);
            for (int i = 0; i < 3; i++) assertEquals(s2[i], s1[i], "iteration sum " + i);
        }
    }

    @Test
    void scharrGradientIsTheSameWithAndWithoutVectors() {
        assumeTrue(ScharrGradient.VECTOR, "the vector module is passed to surefire (pom); without it only the scalar form exists");
        SplittableRandom rng = new SplittableRandom(SEED);
        GrayF32 in = new GrayF32(W, H);
        for (int i = 0; i < in.data.length; i++) in.data[i] = (float) (rng.nextDouble() * 255);
        GrayF32 vx = new GrayF32(1, 1), vy = new GrayF32(1, 1), sx = new GrayF32(1, 1), sy = new GrayF32(1, 1);
        ScharrGradient.compute(in, vx, vy, true);
        ScharrGradient.compute(in, sx, sy, false);
        for (int i = 0; i < in.data.length; i++) {
            assertEquals(sx.data[i], vx.data[i], "x gradient at " + i);
            assertEquals(sy.data[i], vy.data[i], "y gradient at " + i);
        }
    }
}
