package org.targetbench.detect;

import boofcv.alg.filter.derivative.GradientSobel;
import boofcv.factory.filter.kernel.FactoryKernelGaussian;
import boofcv.struct.convolve.Kernel1D_F32;
import boofcv.struct.convolve.Kernel2D_F32;
import boofcv.struct.image.GrayF32;
import org.targetbench.Simd;

/**
 * The structure-tensor corner response of {@link CornerDetector} with a Gaussian window, computed in one streaming
 * pass over the frame: per row the 3x3 Sobel gradient, the three tensor products, the horizontal Gaussian sum into a
 * ring of 2r+1 row buffers, then the vertical Gaussian sum and the response of the row r above. Only the response
 * image is written to memory; the gradients, products and half-filtered rows live in buffers of a few rows that are
 * reused from call to call (no allocation per frame once the frame size is known).
 *
 * <p>Same numbers as the library pipeline it replaces (BoofCV 1.2.2: Sobel gradient with an extended border, the
 * separable Gaussian of {@code FactoryKernelGaussian.gaussian(-1, r)} normalised at the borders, then the response per
 * pixel), bit for bit: every sum is accumulated in the same order with the same float operations, so the points and
 * responses do not change. A Gaussian window cannot use running (box) sums; the separable form with reused row
 * buffers is what keeps the memory traffic to one read of the frame and one write of the response.
 *
 * <p>With {@link Simd#ENABLED} the gradient with its products, the interior horizontal sums, the vertical sums with the
 * response and nothing else run on vectors across pixels ({@link CornerVectors}), with the same float operations per
 * pixel in the same order, so both paths give the same bits ({@code CornerSimdEqualityTest}).
 *
 * <p>Responses: Harris R = det M - k (tr M)² [1]; Shi-Tomasi R = λ_min(M) = (a+c)/2 - sqrt(((a-c)/2)² + b²) [2],
 * with M = [a b; b c] the Gaussian-weighted sum of the gradient products.
 *
 * <p>References: [1] C. Harris, M. Stephens, "A combined corner and edge detector", Alvey Vision Conf. 1988.
 * [2] J. Shi, C. Tomasi, "Good features to track", CVPR 1994.
 */
final class CornerResponse {
    private final int r;
    private final boolean harris;
    private final float kappa;
    /** Gaussian weights as the library makes them (border sums use these, normalised by their partial sum). */
    private final float[] k;
    /** Weights of the interior sums (the same unless the library would re-normalise them). */
    private final float[] kIn;
    /** Vector loops ({@link CornerVectors}) instead of the scalar ones; same output. */
    private final boolean simd;
    private final float[] sobelX = GradientSobel.kernelDerivX_F32.data.clone(), sobelY = GradientSobel.kernelDerivY_F32.data.clone();

    private int width = -1;
    private float[] gx = new float[0], gy = new float[0], pxx = new float[0], pxy = new float[0], pyy = new float[0];
    private float[][] hxx = new float[0][], hxy = new float[0][], hyy = new float[0][];
    /** The window's rows of the three half-filtered products, top to bottom, for the vector vertical sums. */
    private float[][] winXx = new float[0][], winXy = new float[0][], winYy = new float[0][];

    CornerResponse(int radius, boolean harris, double kappa) {
        this(radius, harris, kappa, Simd.ENABLED);
    }

    /** @param simd the vector loops (only when the vector module is present; {@link Simd#ENABLED} by default) */
    CornerResponse(int radius, boolean harris, double kappa, boolean simd) {
        this.simd = simd;
        this.r = radius;
        this.harris = harris;
        this.kappa = (float) kappa;
        Kernel1D_F32 kernel = FactoryKernelGaussian.gaussian(Kernel1D_F32.class, -1, radius);
        if (kernel.getWidth() != 2 * radius + 1 || kernel.getOffset() != radius)
            throw new IllegalStateException("unexpected Gaussian kernel layout");
        k = java.util.Arrays.copyOf(kernel.data, kernel.getWidth());
        if (Math.abs(kernel.computeSum() - 1f) > 1e-4f) {
            Kernel1D_F32 n = kernel.copy();
            boofcv.alg.filter.kernel.KernelMath.normalizeSumToOne(n);
            kIn = java.util.Arrays.copyOf(n.data, n.getWidth());
        } else {
            kIn = k;
        }
        Kernel2D_F32 check = GradientSobel.kernelDerivX_F32;
        if (check.getWidth() != 3) throw new IllegalStateException("unexpected Sobel kernel layout");
    }

    /** True when this kernel reproduces the library on a frame of this size (else the caller uses the library). */
    boolean handles(int w, int h) {
        return w > 2 * r + 1 && h > 2 * r + 1 && w >= 3 && h >= 3;
    }

    /**
     * Writes the response of every pixel of {@code image} into {@code out} (reshaped) and returns the largest.
     */
    float process(GrayF32 image, GrayF32 out) {
        int w = image.width, h = image.height, win = 2 * r + 1;
        out.reshape(w, h);
        if (width != w || hxx.length != win) {
            width = w;
            gx = new float[w]; gy = new float[w];
            pxx = new float[w]; pxy = new float[w]; pyy = new float[w];
            hxx = new float[win][w]; hxy = new float[win][w]; hyy = new float[win][w];
            winXx = new float[win][]; winXy = new float[win][]; winYy = new float[win][];
        }
        float max = -Float.MAX_VALUE;
        for (int y = 0; y < h; y++) {
            gradientRow(image, y);
            int slot = y % win;
            horizontal(pxx, hxx[slot], w);
            horizontal(pxy, hxy[slot], w);
            horizontal(pyy, hyy[slot], w);
            if (y >= r) max = Math.max(max, outputRow(out, y - r, h));
        }
        for (int yo = Math.max(0, h - r); yo < h; yo++) max = Math.max(max, outputRow(out, yo, h));
        return max;
    }

    /** Sobel gradient of row y into gx, gy, then the products into pxx, pxy, pyy. */
    private void gradientRow(GrayF32 image, int y) {
        int w = image.width, h = image.height;
        float[] d = image.data;
        float[] gx = this.gx, gy = this.gy;
        if (y == 0 || y == h - 1) {
            for (int x = 0; x < w; x++) borderGradient(image, x, y);
        } else if (simd) {
            CornerVectors.gradientProducts(d, image.startIndex + y * image.stride, image.stride, w, pxx, pxy, pyy);
            borderGradient(image, 0, y);
            borderGradient(image, w - 1, y);
            product(0);
            product(w - 1);
            return;
        } else {
            int s = image.stride;
            int c = image.startIndex + y * s;
            for (int x = 1; x < w - 1; x++) {
                int i = c + x;
                float v = (d[i + s + 1] - d[i - s - 1]) * 0.25f;
                float u = (d[i + s - 1] - d[i - s + 1]) * 0.25f;
                gy[x] = (d[i + s] - d[i - s]) * 0.5f + v + u;
                gx[x] = (d[i + 1] - d[i - 1]) * 0.5f + v - u;
            }
            borderGradient(image, 0, y);
            borderGradient(image, w - 1, y);
        }
        float[] pxx = this.pxx, pxy = this.pxy, pyy = this.pyy;
        for (int x = 0; x < w; x++) {
            float a = gx[x], b = gy[x];
            pxx[x] = a * a;
            pxy[x] = a * b;
            pyy[x] = b * b;
        }
    }

    /** The products of the gradient at column x. */
    private void product(int x) {
        float a = gx[x], b = gy[x];
        pxx[x] = a * a;
        pxy[x] = a * b;
        pyy[x] = b * b;
    }

    /** The library's border rule for the gradient: the 3x3 kernel over the edge-extended frame, row by row. */
    private void borderGradient(GrayF32 image, int x, int y) {
        float tx = 0, ty = 0;
        for (int i = 0; i < 3; i++) {
            int yy = Math.min(image.height - 1, Math.max(0, y + i - 1));
            for (int j = 0; j < 3; j++) {
                int xx = Math.min(image.width - 1, Math.max(0, x + j - 1));
                float v = image.data[image.startIndex + yy * image.stride + xx];
                tx += v * sobelX[i * 3 + j];
                ty += v * sobelY[i * 3 + j];
            }
        }
        gx[x] = tx;
        gy[x] = ty;
    }

    /** Horizontal Gaussian sum of one row; within r of the ends the partial sum divided by its partial weight. */
    private void horizontal(float[] in, float[] out, int w) {
        float[] k = this.k, kIn = this.kIn;
        int r = this.r;
        if (simd) {
            if (r == 2) CornerVectors.horizontal5(in, out, w, kIn[0], kIn[1], kIn[2], kIn[3], kIn[4]);
            else CornerVectors.horizontal(in, out, w, r, kIn);
        } else if (r == 2) {
            float k0 = kIn[0], k1 = kIn[1], k2 = kIn[2], k3 = kIn[3], k4 = kIn[4];
            for (int x = 2; x < w - 2; x++)
                out[x] = in[x - 2] * k0 + in[x - 1] * k1 + in[x] * k2 + in[x + 1] * k3 + in[x + 2] * k4;
        } else {
            for (int x = r; x < w - r; x++) {
                float t = 0;
                for (int j = 0, i = x - r; j <= 2 * r; j++, i++) t += in[i] * kIn[j];
                out[x] = t;
            }
        }
        for (int x = 0; x < r; x++) out[x] = partial(in, 0, r - x, Math.min(2 * r, w - 1 - x + r), k);
        for (int x = w - r; x < w; x++) out[x] = partial(in, x - r, 0, w - 1 - x + r, k);
    }

    /** Σ in[start + j - j0] k[j] / Σ k[j] over j = j0..j1, both sums in increasing j. */
    private static float partial(float[] in, int start, int j0, int j1, float[] k) {
        float t = 0, weight = 0;
        for (int j = j0, i = start; j <= j1; j++, i++) {
            weight += k[j];
            t += in[i] * k[j];
        }
        return t / weight;
    }

    /** Vertical Gaussian sum of the buffered rows around yo, then the response; returns the row's largest. */
    private float outputRow(GrayF32 out, int yo, int h) {
        int w = width, win = 2 * r + 1;
        float[] sxx = pxx, sxy = pxy, syy = pyy; // the product rows are free again: reuse them for the sums
        int j0 = Math.max(0, r - yo), j1 = Math.min(2 * r, h - 1 - yo + r);
        if (simd && j0 == 0 && j1 == 2 * r) {
            for (int j = 0; j < win; j++) {
                winXx[j] = row(hxx, yo + j - r);
                winXy[j] = row(hxy, yo + j - r);
                winYy[j] = row(hyy, yo + j - r);
            }
            return CornerVectors.verticalResponse(winXx, winXy, winYy, kIn, r != 2, w, harris, kappa, out.data,
                    out.startIndex + yo * out.stride);
        }
        if (j0 == 0 && j1 == 2 * r) {
            if (r == 2) {
                vertical5(hxx, yo, sxx, w);
                vertical5(hxy, yo, sxy, w);
                vertical5(hyy, yo, syy, w);
            } else {
                verticalFull(hxx, yo, sxx, w);
                verticalFull(hxy, yo, sxy, w);
                verticalFull(hyy, yo, syy, w);
            }
        } else {
            verticalPartial(hxx, yo, j0, j1, sxx, w);
            verticalPartial(hxy, yo, j0, j1, sxy, w);
            verticalPartial(hyy, yo, j0, j1, syy, w);
        }
        float[] o = out.data;
        int base = out.startIndex + yo * out.stride;
        float max = -Float.MAX_VALUE;
        if (harris) {
            float kap = kappa;
            for (int x = 0; x < w; x++) {
                float a = sxx[x], b = sxy[x], c = syy[x];
                float tr = a + c;
                float v = a * c - b * b - kap * tr * tr;
                o[base + x] = v;
                max = Math.max(max, v);
            }
        } else {
            for (int x = 0; x < w; x++) {
                float a = sxx[x], b = sxy[x], c = syy[x];
                float left = (a + c) * 0.5f;
                float e = (a - c) * 0.5f;
                float v = left - (float) Math.sqrt(e * e + b * b);
                o[base + x] = v;
                max = Math.max(max, v);
            }
        }
        return max;
    }

    private float[] row(float[][] ring, int y) {
        return ring[y % ring.length];
    }

    private void vertical5(float[][] ring, int yo, float[] dst, int w) {
        float[] a = row(ring, yo - 2), b = row(ring, yo - 1), c = row(ring, yo), d = row(ring, yo + 1), e = row(ring, yo + 2);
        float k0 = kIn[0], k1 = kIn[1], k2 = kIn[2], k3 = kIn[3], k4 = kIn[4];
        for (int x = 0; x < w; x++) dst[x] = a[x] * k0 + b[x] * k1 + c[x] * k2 + d[x] * k3 + e[x] * k4;
    }

    private void verticalFull(float[][] ring, int yo, float[] dst, int w) {
        java.util.Arrays.fill(dst, 0, w, 0f);
        for (int j = 0; j <= 2 * r; j++) {
            float[] src = row(ring, yo + j - r);
            float kj = kIn[j];
            for (int x = 0; x < w; x++) dst[x] += src[x] * kj;
        }
    }

    private void verticalPartial(float[][] ring, int yo, int j0, int j1, float[] dst, int w) {
        float weight = 0;
        java.util.Arrays.fill(dst, 0, w, 0f);
        for (int j = j0; j <= j1; j++) {
            float[] src = row(ring, yo + j - r);
            float kj = k[j];
            weight += kj;
            for (int x = 0; x < w; x++) dst[x] += src[x] * kj;
        }
        for (int x = 0; x < w; x++) dst[x] /= weight;
    }
}
