package org.targetbench.detect;

import jdk.incubator.vector.FloatVector;
import jdk.incubator.vector.VectorMask;
import jdk.incubator.vector.VectorOperators;
import jdk.incubator.vector.VectorSpecies;

/**
 * Vector twins of the inner loops of {@link CornerResponse} and {@link CornerPeaks} (Java Vector API, incubator module
 * {@code jdk.incubator.vector}). Touch only behind {@link org.targetbench.Simd#ENABLED}: without the module this class
 * does not load.
 *
 * <p>The vectors run ACROSS pixels: each lane holds one pixel and does exactly the float operations of the scalar twin,
 * in the same order (a separate multiply and add, never a fused multiply-add; no reordered sums), so the output is the
 * same bit for bit whatever the lane count (8 lanes of {@link FloatVector#SPECIES_256}, the one shape all vector code uses, see
 * {@link org.targetbench.Simd}). The remainder of a row that does
 * not fill a vector runs the scalar expression. The square root of the Shi-Tomasi response is the lane-wise IEEE
 * float square root, which equals the scalar twin's {@code (float) Math.sqrt(double)} because a double square root
 * rounded to float is correctly rounded (53 >= 2 x 24 + 2 bits; S. Figueroa, "When is double rounding innocuous?",
 * SIGNUM Newsletter 30(3), 1995, from memory). The maximum is {@link Math#max} per lane, which is associative and
 * commutative, so its reduction order does not matter. {@code CornerSimdEqualityTest} runs both paths on the same
 * frames and compares every bit.
 */
final class CornerVectors {
    private static final VectorSpecies<Float> S = FloatVector.SPECIES_256; // the one shape of the JVM's vector code (Simd)
    private static final int L = S.length();

    private CornerVectors() {}

    /**
     * The 3x3 Sobel gradient of the interior columns 1..w-2 of the row starting at {@code c} (stride {@code s}; the rows
     * above and below must exist) and its products into {@code pxx, pxy, pyy}; same expressions as
     * {@code CornerResponse.gradientRow}.
     */
    static void gradientProducts(float[] d, int c, int s, int w, float[] pxx, float[] pxy, float[] pyy) {
        int x = 1, end = w - 1;
        for (; x <= end - L; x += L) {
            int i = c + x;
            FloatVector v = FloatVector.fromArray(S, d, i + s + 1).sub(FloatVector.fromArray(S, d, i - s - 1)).mul(0.25f);
            FloatVector u = FloatVector.fromArray(S, d, i + s - 1).sub(FloatVector.fromArray(S, d, i - s + 1)).mul(0.25f);
            FloatVector gy = FloatVector.fromArray(S, d, i + s).sub(FloatVector.fromArray(S, d, i - s)).mul(0.5f).add(v).add(u);
            FloatVector gx = FloatVector.fromArray(S, d, i + 1).sub(FloatVector.fromArray(S, d, i - 1)).mul(0.5f).add(v).sub(u);
            gx.mul(gx).intoArray(pxx, x);
            gx.mul(gy).intoArray(pxy, x);
            gy.mul(gy).intoArray(pyy, x);
        }
        for (; x < end; x++) {
            int i = c + x;
            float v = (d[i + s + 1] - d[i - s - 1]) * 0.25f;
            float u = (d[i + s - 1] - d[i - s + 1]) * 0.25f;
            float gy = (d[i + s] - d[i - s]) * 0.5f + v + u;
            float gx = (d[i + 1] - d[i - 1]) * 0.5f + v - u;
            pxx[x] = gx * gx;
            pxy[x] = gx * gy;
            pyy[x] = gy * gy;
        }
    }

    /** Interior horizontal sum for radius 2, x in 2..w-3: in[x-2] k0 + ... + in[x+2] k4, left to right. */
    static void horizontal5(float[] in, float[] out, int w, float k0, float k1, float k2, float k3, float k4) {
        int x = 2, end = w - 2;
        for (; x <= end - L; x += L) {
            FloatVector.fromArray(S, in, x - 2).mul(k0)
                    .add(FloatVector.fromArray(S, in, x - 1).mul(k1))
                    .add(FloatVector.fromArray(S, in, x).mul(k2))
                    .add(FloatVector.fromArray(S, in, x + 1).mul(k3))
                    .add(FloatVector.fromArray(S, in, x + 2).mul(k4))
                    .intoArray(out, x);
        }
        for (; x < end; x++) out[x] = in[x - 2] * k0 + in[x - 1] * k1 + in[x] * k2 + in[x + 1] * k3 + in[x + 2] * k4;
    }

    /** Interior horizontal sum for any radius, x in r..w-r-1: 0 + in[x-r] k[0] + ... + in[x+r] k[2r], left to right. */
    static void horizontal(float[] in, float[] out, int w, int r, float[] k) {
        int x = r, end = w - r;
        for (; x <= end - L; x += L) {
            FloatVector t = FloatVector.zero(S);
            for (int j = 0; j <= 2 * r; j++) t = t.add(FloatVector.fromArray(S, in, x - r + j).mul(k[j]));
            t.intoArray(out, x);
        }
        for (; x < end; x++) {
            float t = 0;
            for (int j = 0, i = x - r; j <= 2 * r; j++, i++) t += in[i] * k[j];
            out[x] = t;
        }
    }

    /**
     * The vertical sums over the full window of the rows {@code xx[j], xy[j], yy[j]} (j = 0..2r, top to bottom) with
     * weights {@code k}, then the response, written to {@code o} from {@code base}; returns the row's largest response.
     * {@code fromZero} false is the radius-2 form of the scalar twin (the first product starts the sum), true the
     * general form (the sum starts at 0).
     */
    static float verticalResponse(float[][] xx, float[][] xy, float[][] yy, float[] k, boolean fromZero, int w,
                                  boolean harris, float kappa, float[] o, int base) {
        int n = k.length, x = 0;
        FloatVector maxV = FloatVector.broadcast(S, -Float.MAX_VALUE);
        for (; x <= w - L; x += L) {
            FloatVector a, b, c;
            if (fromZero) {
                a = FloatVector.zero(S).add(FloatVector.fromArray(S, xx[0], x).mul(k[0]));
                b = FloatVector.zero(S).add(FloatVector.fromArray(S, xy[0], x).mul(k[0]));
                c = FloatVector.zero(S).add(FloatVector.fromArray(S, yy[0], x).mul(k[0]));
            } else {
                a = FloatVector.fromArray(S, xx[0], x).mul(k[0]);
                b = FloatVector.fromArray(S, xy[0], x).mul(k[0]);
                c = FloatVector.fromArray(S, yy[0], x).mul(k[0]);
            }
            for (int j = 1; j < n; j++) {
                float kj = k[j];
                a = a.add(FloatVector.fromArray(S, xx[j], x).mul(kj));
                b = b.add(FloatVector.fromArray(S, xy[j], x).mul(kj));
                c = c.add(FloatVector.fromArray(S, yy[j], x).mul(kj));
            }
            FloatVector v;
            if (harris) {
                FloatVector tr = a.add(c);
                v = a.mul(c).sub(b.mul(b)).sub(tr.mul(kappa).mul(tr));
            } else {
                FloatVector e = a.sub(c).mul(0.5f);
                v = a.add(c).mul(0.5f).sub(e.mul(e).add(b.mul(b)).sqrt());
            }
            v.intoArray(o, base + x);
            maxV = maxV.max(v);
        }
        float max = maxV.reduceLanes(VectorOperators.MAX);
        for (; x < w; x++) {
            float a = fromZero ? 0f + xx[0][x] * k[0] : xx[0][x] * k[0];
            float b = fromZero ? 0f + xy[0][x] * k[0] : xy[0][x] * k[0];
            float c = fromZero ? 0f + yy[0][x] * k[0] : yy[0][x] * k[0];
            for (int j = 1; j < n; j++) {
                a += xx[j][x] * k[j];
                b += xy[j][x] * k[j];
                c += yy[j][x] * k[j];
            }
            float v;
            if (harris) {
                float tr = a + c;
                v = a * c - b * b - kappa * tr * tr;
            } else {
                float e = (a - c) * 0.5f;
                v = (a + c) * 0.5f - (float) Math.sqrt(e * e + b * b);
            }
            o[base + x] = v;
            max = Math.max(max, v);
        }
        return max;
    }

    /** The first index in {@code from..to-1} whose value is at or above {@code t} (false for NaN), else {@code to}. */
    static int firstAtLeast(float[] d, int from, int to, float t) {
        int x = from;
        for (; x <= to - L; x += L) {
            VectorMask<Float> m = FloatVector.fromArray(S, d, x).compare(VectorOperators.GE, t);
            if (m.anyTrue()) return x + m.firstTrue();
        }
        for (; x < to; x++) if (d[x] >= t) return x;
        return to;
    }
}
