package org.targetbench.track;

import boofcv.struct.image.GrayF32;

import java.util.Arrays;

/**
 * The pyramidal translation Lucas-Kanade step of {@link KltTracker}: templates and their gradients taken once per
 * feature and level, then each level located from the coarsest down ([2] sec. 2.2-2.4).
 *
 * <p>Inverse compositional form for a translation ([1] sec. 3.2; for a pure translation it coincides with the
 * forward-additive form that uses the template's gradient, derived): the template T, its gradient ∇T and the 2 x 2
 * Hessian G = Σ ∇T ∇Tᵀ are computed once when the template is taken ({@link #describe}); each iteration samples
 * the current level once at the window shifted by the current estimate and solves
 * <pre>
 *   G d = e,   e = Σ (T - I(x + p)) ∇T,   p ← p + d                                                     (1)
 * </pre>
 * ([1] eqs. 31-36 for the translation warp; [3] eq. 3-5). A translation moves every window pixel by the same
 * fraction, so one set of four bilinear weights serves the whole window, and sampling, the sums of (1) and the mean
 * absolute residual are fused in one pass with no stored window. The window passes of a complete window (template
 * with both gradients and G; the sums of one iteration) are {@link LkKernels}: eight interleaved partial sums in a
 * fixed order, run with eight-lane vectors ({@link LkVectorKernels}) when the vector module is present and by the
 * scalar twin otherwise, with identical results.
 *
 * <p>Behaviour (stopping rule, drift and bound tests, the partial windows at the image border, float arithmetic)
 * follows BoofCV 1.2.2's {@code KltTracker}/{@code PyramidKltTracker}, the tracker's earlier engine, so tracks agree
 * with it within 1e-3 px (checked in {@code KltEqualityTest}); the deliberate differences are the bilinear sample of
 * a window touching the last image row or column, which here repeats the border pixel, and the order of the window
 * sums (eight partial sums, see above; float addition is not associative, so the last bits differ).
 *
 * <p>Not thread safe; no allocation after the first features of a given size.
 *
 * <p>References: [1] S. Baker, I. Matthews, "Lucas-Kanade 20 years on: a unifying framework", IJCV 56(3), 2004.
 * [2] J.-Y. Bouguet, "Pyramidal implementation of the Lucas Kanade feature tracker", Intel Corporation, 2000.
 * [3] B. D. Lucas, T. Kanade, "An iterative image registration technique with an application to stereo vision",
 * IJCAI 1981.
 */
final class TranslationLk {
    /** Why a level failed, as BoofCV names them (the tracker maps these to {@link TrackOutcome}). */
    enum Fault { SUCCESS, OUT_OF_BOUNDS, DRIFTED, LARGE_ERROR, FAILED }

    /** One feature's templates over the pyramid and its position, full-resolution pixels. */
    static final class Feature {
        /**
         * Per level: template, its x and y gradient (NaN where the window left the image), row-major, then
         * {@link LkKernels#slack()} floats that hold no pixel and never NaN.
         */
        final float[][] t, tx, ty;
        final float[] gxx, gyy, gxy;
        final boolean[] complete;
        float x, y;

        Feature(int levels, int radius) {
            int n = (2 * radius + 1) * (2 * radius + 1) + LkKernels.slack();
            t = new float[levels][n];
            tx = new float[levels][n];
            ty = new float[levels][n];
            gxx = new float[levels];
            gyy = new float[levels];
            gxy = new float[levels];
            complete = new boolean[levels];
        }

        /** Smaller eigenvalue of the full-resolution template's G per window pixel ([4] eq. 7 of Shi &amp; Tomasi). */
        double minEigenvalue(int radius) {
            double a = gxx[0], c = gyy[0], b = gxy[0];
            double half = (a + c) / 2, root = Math.sqrt((a - c) * (a - c) / 4 + b * b);
            int side = 2 * radius + 1;
            return (half - root) / (side * side);
        }
    }

    private final int radius, width, length;
    private final int maxIterations;
    private final float epsilon, maxError, minDeterminant, maxDrift;
    /** Scratch window for the partial-window path. */
    private final float[] cur;
    /** Columns the kernels read right of a window's left column ({@link LkKernels#reach}). */
    private final int reach;
    /** Kernel scratch: partial sums and the three sums. */
    private final float[] acc = new float[LkKernels.SCRATCH], sums = new float[3];

    /**
     * @param minDeterminant singularity guard on det G per window pixel
     */
    TranslationLk(int radius, int maxIterations, double epsilon, double maxError, float minDeterminant) {
        this.radius = radius;
        this.width = 2 * radius + 1;
        this.length = width * width;
        this.maxIterations = maxIterations;
        this.epsilon = (float) epsilon;
        this.maxError = (float) maxError;
        this.minDeterminant = minDeterminant;
        this.maxDrift = width;
        this.cur = new float[length];
        this.reach = LkKernels.reach(width);
    }

    /**
     * Takes the feature's templates at its position (x, y) on every level.
     *
     * @return false when a level's window is wholly outside its image or its G is singular
     */
    boolean describe(Feature f, GrayF32[] levels, GrayF32[] dx, GrayF32[] dy) {
        for (int l = 0; l < levels.length; l++) {
            float scale = (float) (1 << l);
            if (!describeLevel(f, l, levels[l], dx[l], dy[l], f.x / scale, f.y / scale)) return false;
        }
        return true;
    }

    private boolean describeLevel(Feature f, int l, GrayF32 img, GrayF32 dx, GrayF32 dy, float x, float y) {
        float[] t = f.t[l], tx = f.tx[l], ty = f.ty[l];
        int w = img.width, h = img.height;
        float gxx = 0, gyy = 0, gxy = 0;
        if (x >= radius && x <= w - radius - 1 && y >= radius && y <= h - radius - 1) {
            float tlx = x - radius, tly = y - radius;
            int xt = (int) tlx, yt = (int) tly;
            if (xt + width < w && yt + width < h && img.stride == dx.stride && img.stride == dy.stride
                    && img.startIndex == dx.startIndex && img.startIndex == dy.startIndex
                    && img.data.length == dx.data.length && img.data.length == dy.data.length) {
                // one pass over the image and both gradients (same weights, same positions), G summed on the way;
                // the scalar twin where the vector form's reads would pass the array's end (identical output)
                float ax = tlx - xt, ay = tly - yt, bx = 1.0f - ax, by = 1.0f - ay;
                float a0 = bx * by, a1 = ax * by, a2 = ax * ay, a3 = bx * ay;
                int index0 = img.startIndex + yt * img.stride + xt;
                if (index0 + width * img.stride + reach < img.data.length)
                    LkKernels.describe(img.data, dx.data, dy.data, index0, img.stride, width, a0, a1, a2, a3, t, tx, ty, acc, sums);
                else
                    LkKernels.describeScalar(img.data, dx.data, dy.data, index0, img.stride, width, a0, a1, a2, a3, t, tx, ty, acc, sums);
                gxx = sums[0];
                gyy = sums[1];
                gxy = sums[2];
            } else {
                region(img, tlx, tly, width, width, t, 0);
                region(dx, tlx, tly, width, width, tx, 0);
                region(dy, tlx, tly, width, width, ty, 0);
                for (int i = 0; i < length; i++) {
                    float gx = tx[i], gy = ty[i];
                    gxx += gx * gx;
                    gyy += gy * gy;
                    gxy += gx * gy;
                }
            }
            f.gxx[l] = gxx; f.gyy[l] = gyy; f.gxy[l] = gxy;
            f.complete[l] = true;
            return gxx * gyy - gxy * gxy >= minDeterminant * length;
        }
        if (fullyOutside(x, y, w, h)) return false;
        // partial window: NaN where it leaves the image
        Arrays.fill(t, 0, length, Float.NaN);
        Arrays.fill(tx, 0, length, Float.NaN);
        Arrays.fill(ty, 0, length, Float.NaN);
        subRegion(img, x, y, t);
        subRegion(dx, x, y, tx);
        subRegion(dy, x, y, ty);
        int total = 0;
        for (int i = 0; i < length; i++) {
            if (Float.isNaN(t[i])) continue;
            total++;
            float gx = tx[i], gy = ty[i];
            gxx += gx * gx;
            gyy += gy * gy;
            gxy += gx * gy;
        }
        f.gxx[l] = gxx; f.gyy[l] = gyy; f.gxy[l] = gxy;
        f.complete[l] = false;
        return gxx * gyy - gxy * gxy >= minDeterminant * total;
    }

    /**
     * Locates the feature's templates in {@code levels} from the coarsest level down, starting at the feature's
     * position. On success the feature's position is the result; on failure it is unchanged.
     */
    Fault track(Feature f, GrayF32[] levels) {
        float x = f.x, y = f.y;
        for (int l = levels.length - 1; l >= 0; l--) {
            float scale = (float) (1 << l);
            x /= scale;
            y /= scale;
            Fault r = trackLevel(f, l, levels[l], x, y);
            if (r != Fault.SUCCESS) return r;
            x = rx * scale;
            y = ry * scale;
        }
        f.x = x;
        f.y = y;
        return Fault.SUCCESS;
    }

    /** Result of the last level, at that level's scale. */
    private float rx, ry;

    /** One level: Gauss-Newton iterations of (1) from (x, y); the result in rx, ry. */
    private Fault trackLevel(Feature f, int l, GrayF32 img, float x, float y) {
        int w = img.width, h = img.height;
        if (fullyOutside(x, y, w, h)) return Fault.OUT_OF_BOUNDS;
        float[] t = f.t[l], tx = f.tx[l], ty = f.ty[l];
        float origX = x, origY = y;
        boolean complete = f.complete[l];
        float gxx = 0, gyy = 0, gxy = 0, det = 0;
        if (complete) {
            gxx = f.gxx[l]; gyy = f.gyy[l]; gxy = f.gxy[l];
            det = gxx * gyy - gxy * gxy;
            if (det < minDeterminant * length) return Fault.FAILED;
        }
        float[] data = img.data;
        int stride = img.stride;
        float error = 0;
        for (int iter = 0; iter < maxIterations; iter++) {
            float ex = 0, ey = 0;
            float tlx = x - radius, tly = y - radius;
            int xt = (int) tlx, yt = (int) tly;
            if (complete && x >= radius && x <= w - radius - 1 && y >= radius && y <= h - radius - 1
                    && xt + width < w && yt + width < h) {
                // the hot path: one set of bilinear weights, sampling fused with the sums of (1) and the residual
                float ax = tlx - xt, ay = tly - yt, bx = 1.0f - ax, by = 1.0f - ay;
                float a0 = bx * by, a1 = ax * by, a2 = ax * ay, a3 = bx * ay;
                int index0 = img.startIndex + yt * stride + xt;
                if (index0 + width * stride + reach < data.length) LkKernels.trackSums(data, index0, stride, width, a0, a1, a2, a3, t, tx, ty, acc, sums);
                else LkKernels.trackSumsScalar(data, index0, stride, width, a0, a1, a2, a3, t, tx, ty, acc, sums);
                ex = sums[0];
                ey = sums[1];
                error = sums[2] / length;
            } else if (complete && x >= radius && x <= w - radius - 1 && y >= radius && y <= h - radius - 1) {
                // whole window inside but touching the last row or column: the clamped sampler
                region(img, tlx, tly, width, width, cur, 0);
                float abs = 0;
                for (int k = 0; k < length; k++) {
                    float d = t[k] - cur[k];
                    ex += d * tx[k];
                    ey += d * ty[k];
                    abs += Math.abs(d);
                }
                error = abs / length;
            } else {
                // partial window: G and e over the pixels inside both windows; once outside it stays on this path
                Arrays.fill(cur, Float.NaN);
                subRegion(img, x, y, cur);
                int total = 0;
                gxx = 0; gyy = 0; gxy = 0;
                float abs = 0;
                for (int k = 0; k < length; k++) {
                    float tk = t[k], ck = cur[k];
                    if (Float.isNaN(tk) || Float.isNaN(ck)) continue;
                    total++;
                    float gx = tx[k], gy = ty[k];
                    float d = tk - ck;
                    ex += d * gx;
                    ey += d * gy;
                    gxx += gx * gx;
                    gyy += gy * gy;
                    gxy += gx * gy;
                    abs += Math.abs(d);
                }
                error = abs / total;
                det = gxx * gyy - gxy * gxy;
                if (det <= minDeterminant * total) {
                    rx = x; ry = y;
                    return Fault.FAILED;
                }
            }
            float dx = (gyy * ex - gxy * ey) / det;
            float dy = (gxx * ey - gxy * ex) / det;
            x += dx;
            y += dy;
            rx = x; ry = y;
            if (fullyOutside(x, y, w, h)) return Fault.OUT_OF_BOUNDS;
            if (Math.abs(x - origX) > maxDrift || Math.abs(y - origY) > maxDrift) return Fault.DRIFTED;
            if (Math.abs(dx) < epsilon && Math.abs(dy) < epsilon) break;
        }
        rx = x; ry = y;
        return error > maxError ? Fault.LARGE_ERROR : Fault.SUCCESS;
    }

    /** A window is wholly outside when not one whole pixel of it is inside (BoofCV's rule). */
    private boolean fullyOutside(float x, float y, int w, int h) {
        return x < -radius || x > w + radius - 1 || y < -radius || y > h + radius - 1;
    }

    /**
     * Bilinear samples of the rw x rh grid with top-left (tlx, tly) into {@code out} (row stride {@code width} from
     * {@code off}); one set of four weights for the whole grid. A sample whose right or lower neighbour is outside
     * the image repeats the border pixel. The caller keeps the grid inside [0, w-1] x [0, h-1].
     */
    void region(GrayF32 img, float tlx, float tly, int rw, int rh, float[] out, int off) {
        int xt = (int) tlx, yt = (int) tly;
        float ax = tlx - xt, ay = tly - yt, bx = 1.0f - ax, by = 1.0f - ay;
        float a0 = bx * by, a1 = ax * by, a2 = ax * ay, a3 = bx * ay;
        float[] data = img.data;
        int stride = img.stride, w = img.width, h = img.height;
        if (xt + rw < w && yt + rh < h) {
            for (int i = 0; i < rh; i++) {
                int index = img.startIndex + (yt + i) * stride + xt;
                int o = off + i * width;
                float pXY = data[index], pXy = data[index + stride];
                for (int end = index + rw; index < end; index++) {
                    float pxY = data[index + 1], pxy = data[index + stride + 1];
                    out[o++] = a0 * pXY + a1 * pxY + a2 * pxy + a3 * pXy;
                    pXY = pxY;
                    pXy = pxy;
                }
            }
            return;
        }
        for (int i = 0; i < rh; i++) {
            int y0 = yt + i, y1 = Math.min(y0 + 1, h - 1);
            int r0 = img.startIndex + y0 * stride, r1 = img.startIndex + y1 * stride;
            int o = off + i * width;
            for (int j = 0; j < rw; j++) {
                int x0 = xt + j, x1 = Math.min(x0 + 1, w - 1);
                out[o++] = a0 * data[r0 + x0] + a1 * data[r0 + x1] + a2 * data[r1 + x1] + a3 * data[r1 + x0];
            }
        }
    }

    /**
     * The part of the window centred at (cx, cy) that lies inside the image, sampled into its place in {@code out}
     * (the rest untouched); the bounds as BoofCV's {@code KltTracker.computeSubImageBounds}.
     */
    private void subRegion(GrayF32 img, float cx, float cy, float[] out) {
        int dstX0 = 0, dstY0 = 0, dstX1 = width, dstY1 = width;
        float srcX0 = cx - radius, srcY0 = cy - radius;
        float srcX1 = srcX0 + width, srcY1 = srcY0 + width;
        int w = img.width, h = img.height;
        if (srcX0 < 0) {
            dstX0 = (int) -Math.floor(srcX0);
            srcX0 += dstX0;
        }
        if (srcX1 > w) {
            dstX1 -= (int) Math.ceil(srcX1 - w);
            dstX1 -= (srcX0 + (dstX1 - dstX0) > w ? 1 : 0);
        }
        if (srcY0 < 0) {
            dstY0 = (int) -Math.floor(srcY0);
            srcY0 += dstY0;
        }
        if (srcY1 > h) {
            dstY1 -= (int) Math.ceil(srcY1 - h);
            dstY1 -= (srcY0 + (dstY1 - dstY0) > h ? 1 : 0);
        }
        int rw = dstX1 - dstX0, rh = dstY1 - dstY0;
        if (rw <= 0 || rh <= 0) return;
        // BoofCV samples a region of rw x rh from (srcX0, srcY0); its last sample may sit on the last pixel
        region(img, srcX0, srcY0, rw, rh, out, dstY0 * width + dstX0);
    }
}
