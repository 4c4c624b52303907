package org.targetbench.track;

import boofcv.struct.image.GrayF32;


/**
 * Drift correction of one track against the template taken where the track was born: an affine inverse-compositional
 * Lucas-Kanade alignment at full resolution with a per-iteration gain and bias fit, started from the frame-to-frame
 * estimate. It is what keeps a frame-to-frame tracker from random-walking off its corner over a long approach
 * ([2] sec. 2.4, "strategy 3": track with the latest template, then align the first template starting from that
 * result; keep the correction when it converges close by).
 *
 * <p>Warp (template coordinates (u, v) relative to the birth position, [1] sec. 2 with the six affine parameters):
 * <pre>
 *   W(u, v; p) = [ (1 + p0) u + p1 v + p4 ,  p2 u + (1 + p3) v + p5 ]                              (1)
 * </pre>
 * Inverse compositional form ([1] sec. 3.2, eqs. 31-36, from memory): the steepest-descent images
 * SD = ∇T ∂W/∂p = [T_x u, T_x v, T_y u, T_y v, T_x, T_y] and the Hessian H = Σ SDᵀ SD are computed once per track
 * from the birth template (taken on whole pixels, so it is not smoothed by interpolation); each iteration samples the
 * current frame at W(x; p) (bilinear), fits gain a and bias b by least squares against the zero-mean template
 * (w ≈ a T̃ + b), and solves
 * <pre>
 *   Δp = H⁻¹ Σ SDᵀ [ (I(W(x; p)) - b) / a - T̃(x) ],     W ← W ∘ W(Δp)⁻¹                           (2)
 * </pre>
 * With e = (w - b) / a - T̃ the right-hand side splits into sums over the sampled window and constants of the
 * template (derived):
 * <pre>
 *   Σ SD_j e = ( Σ SD_j w - b Σ SD_j ) / a - Σ SD_j T̃,     j = 0..5                                   (3)
 * </pre>
 * so one pass over the window gathers everything an iteration needs, from the template's gradient alone (SD_j w is
 * T_x w or T_y w times u, v or 1; the steepest-descent images themselves are not stored), and the mean absolute
 * residual is taken once, on the converged window.
 * The closed-form gain and bias fit stands in for the linear appearance variation of the Lucas-Kanade series (derived).
 * An x-corner looks the same at every scale, so uniform scale is unobservable from its window; a small Levenberg-style
 * damping of the four linear parameters (relative {@value #DAMPING} of H's mean linear diagonal; common practice, no
 * source) keeps H invertible, and a shape prior λ‖(C - P) - C ΔL‖² (C the current linear part, P the previous frame's,
 * ΔL the linear part of Δp; derived) added to the normal equations of (2) keeps the linear part from absorbing
 * interpolation smoothing ({@link #PRIOR}).
 *
 * <p>References: [1] S. Baker, I. Matthews, "Lucas-Kanade 20 years on: a unifying framework", IJCV 56(3), 2004.
 * [2] I. Matthews, T. Ishikawa, S. Baker, "The template update problem", IEEE PAMI 26(6), 2004.
 */
final class AffineAnchor {
    /** Relative damping of the linear warp parameters (see the class comment). */
    static final double DAMPING = 1e-3;
    /** Smallest accepted gain of the current window against the template (a window gone almost flat fails). */
    static final double MIN_GAIN = 0.2;
    /**
     * Weight of the shape prior, relative to H's mean linear diagonal: each frame's linear part is pulled towards the
     * previous frame's. Without it the four linear parameters absorb the smoothing of bilinear interpolation on fine
     * texture (measured: up to 0.065 px of translation error on a pure sub-pixel shift, against 0.034 px without the
     * correction); with weight 1 the error is back below 0.05 px while the warp still follows a 20° roll and a 1.5x
     * zoom over 90 frames (measured; the value was chosen on those two cases, no source).
     */
    static final double PRIOR = 1;

    /** What an alignment came to. */
    enum Status { CONVERGED, NOT_CONVERGED, OFF_IMAGE, SINGULAR }

    private final int radius, n;
    /** Zero-mean template, row-major over the window. */
    private final float[] template;
    /**
     * The template's gradient, row-major over the window: with the pixel's (u, v) it gives the steepest-descent
     * images SD = [T_x u, T_x v, T_y u, T_y v, T_x, T_y] of (2) without storing them (a sixth of their memory).
     */
    private final float[] gx, gy;
    /** Σ SD_j and Σ SD_j T̃ over the window (j = 0..5): the constant parts of the right-hand side of (2), see (3). */
    private final double[] sdSum = new double[6], sdTemplate = new double[6];
    /** Damped Hessian and scratch for the one with the shape prior, 6 x 6 row-major. */
    private final double[] scratch = new double[36], hess = new double[36], hAug = new double[36], hInvAug = new double[36], hInv = new double[36];
    /** Mean diagonal of the Hessian's linear block, the scale of the shape prior. */
    private double linScale;
    /** Scratch: samples of the current window, the right-hand side and the step. */
    private final float[] window;
    private final double[] b = new double[6], d = new double[6];
    /** Offset of the template's whole-pixel grid from the birth position, pixels. */
    private double du, dv;
    /** Σ T̃², the zero-mean template's energy. */
    private double stt;
    /** Current warp: linear part and the absolute position of the centre ((1) with p4, p5 made absolute). */
    private double a11, a12, a21, a22;
    /** Result of the last converged alignment, kept apart until {@link #commit()}. */
    double r11, r12, r21, r22, rx, ry;
    /** Per-pixel mean absolute residual of the last converged alignment, grey levels of the current frame. */
    double residual;

    AffineAnchor(int radius) {
        this.radius = radius;
        int side = 2 * radius + 1;
        this.n = side * side;
        this.template = new float[n];
        this.gx = new float[n];
        this.gy = new float[n];
        this.window = new float[n];
    }

    /**
     * Takes the template at (x, y) of {@code image} with its gradient ({@code dx}, {@code dy}, grey levels per pixel).
     *
     * @return false when the window is not wholly inside the image or its Hessian is singular
     */
    boolean init(GrayF32 image, GrayF32 dx, GrayF32 dy, double x, double y) {
        int ix = (int) Math.round(x), iy = (int) Math.round(y);
        if (ix - radius < 0 || iy - radius < 0 || ix + radius > image.width - 1 || iy + radius > image.height - 1) return false;
        du = ix - x;
        dv = iy - y;
        double mean = 0;
        double[] h = new double[36], sd = new double[6];
        for (int j = -radius, k = 0; j <= radius; j++) {
            double v = j + dv;
            for (int i = -radius; i <= radius; i++, k++) {
                double u = i + du;
                double t = image.unsafe_get(ix + i, iy + j);
                float fx = dx.unsafe_get(ix + i, iy + j), fy = dy.unsafe_get(ix + i, iy + j);
                double gx = fx, gy = fy;
                template[k] = (float) t;
                this.gx[k] = fx;
                this.gy[k] = fy;
                mean += t;
                sd[0] = gx * u; sd[1] = gx * v; sd[2] = gy * u; sd[3] = gy * v; sd[4] = gx; sd[5] = gy;
                for (int a = 0; a < 6; a++) for (int c = a; c < 6; c++) h[6 * a + c] += sd[a] * sd[c];
            }
        }
        mean /= n;
        stt = 0;
        for (int k = 0; k < n; k++) {
            template[k] -= (float) mean;
            stt += template[k] * template[k];
        }
        java.util.Arrays.fill(sdSum, 0);
        java.util.Arrays.fill(sdTemplate, 0);
        for (int j = -radius, k = 0; j <= radius; j++) {
            double v = j + dv;
            for (int i = -radius; i <= radius; i++, k++) {
                double u = i + du, gx = this.gx[k], gy = this.gy[k], t = template[k];
                sd[0] = gx * u; sd[1] = gx * v; sd[2] = gy * u; sd[3] = gy * v; sd[4] = gx; sd[5] = gy;
                for (int a = 0; a < 6; a++) {
                    sdSum[a] += sd[a];
                    sdTemplate[a] += sd[a] * t;
                }
            }
        }
        for (int i = 0; i < 6; i++) for (int j = 0; j < i; j++) h[6 * i + j] = h[6 * j + i];
        double lin = (h[0] + h[7] + h[14] + h[21]) / 4;
        for (int i = 0; i < 4; i++) h[7 * i] += DAMPING * lin;
        linScale = lin;
        System.arraycopy(h, 0, hess, 0, 36);
        if (!(stt > 0) || !invert6(h, hInv, scratch)) return false;
        a11 = 1; a12 = 0; a21 = 0; a22 = 1;
        return true;
    }

    /**
     * Aligns the template with {@code image} starting from the current linear part and the centre at (x, y).
     * On {@link Status#CONVERGED} the result is in rx, ry (and the linear part in r11..r22) until {@link #commit()}
     * makes it the track's warp.
     */
    Status align(GrayF32 image, double x, double y, int maxIterations, double epsilon) {
        double c11 = a11, c12 = a12, c21 = a21, c22 = a22, ctx = x, cty = y;
        // shape prior λ‖(C - P) - K ΔL‖² with K the map ΔL -> C ΔL, here frozen at the starting C = P (derived)
        double lam = PRIOR * linScale, k11 = c11, k12 = c12, k21 = c21, k22 = c22;
        System.arraycopy(hess, 0, hAug, 0, 36);
        if (lam > 0) {
            // KᵀK for parameters (d0, d1, d2, d3) = ΔL row-major: blocks of [[c11, c12], [c21, c22]]ᵀ[[..]]
            double q11 = k11 * k11 + k21 * k21, q12 = k11 * k12 + k21 * k22, q22 = k12 * k12 + k22 * k22;
            hAug[0] += lam * q11; hAug[2] += lam * q12; hAug[12] += lam * q12; hAug[14] += lam * q22;
            hAug[7] += lam * q11; hAug[9] += lam * q12; hAug[19] += lam * q12; hAug[21] += lam * q22;
        }
        if (!invert6(hAug, hInvAug, scratch)) return Status.SINGULAR;
        double[] hAug = hInvAug;
        for (int it = 0; it < maxIterations; it++) {
            // every bilinear sample of the window must lie inside the image
            double ex = (Math.abs(c11) + Math.abs(c12)) * (radius + 0.5), ey = (Math.abs(c21) + Math.abs(c22)) * (radius + 0.5);
            if (!inside(image, ctx - ex, cty - ey) || !inside(image, ctx + ex, cty + ey)) return Status.OFF_IMAGE;
            // one pass: the samples with Σ w, Σ w T̃ and Σ SD_j w, the last by rows (v is constant along a row, derived)
            double sw = 0, swt = 0, w0 = 0, w1 = 0, w2 = 0, w3 = 0, w4 = 0, w5 = 0;
            for (int j = -radius, k = 0; j <= radius; j++) {
                double v = j + dv, rowX = ctx + c12 * v, rowY = cty + c22 * v;
                double sx = 0, sxu = 0, sy = 0, syu = 0;
                for (int i = -radius; i <= radius; i++, k++) {
                    double u = i + du;
                    float w = (float) bilinear(image, rowX + c11 * u, rowY + c21 * u);
                    window[k] = w;
                    sw += w;
                    swt += w * template[k];
                    double gw = gx[k] * (double) w, hw = gy[k] * (double) w;
                    sx += gw;
                    sxu += gw * u;
                    sy += hw;
                    syu += hw * u;
                }
                w0 += sxu; w1 += sx * v; w2 += syu; w3 += sy * v; w4 += sx; w5 += sy;
            }
            double bias = sw / n, gain = swt / stt;
            if (!(gain > MIN_GAIN)) return Status.SINGULAR;
            // (3): Σ SD_j e = (Σ SD_j w - b Σ SD_j) / a - Σ SD_j T̃ with e = (w - b) / a - T̃ (derived from (2))
            double inverseGain = 1 / gain;
            b[0] = (w0 - bias * sdSum[0]) * inverseGain - sdTemplate[0];
            b[1] = (w1 - bias * sdSum[1]) * inverseGain - sdTemplate[1];
            b[2] = (w2 - bias * sdSum[2]) * inverseGain - sdTemplate[2];
            b[3] = (w3 - bias * sdSum[3]) * inverseGain - sdTemplate[3];
            b[4] = (w4 - bias * sdSum[4]) * inverseGain - sdTemplate[4];
            b[5] = (w5 - bias * sdSum[5]) * inverseGain - sdTemplate[5];
            if (lam > 0) {
                // prior's right-hand side: λ Kᵀ vec(C - P)
                double e11 = c11 - a11, e12 = c12 - a12, e21 = c21 - a21, e22 = c22 - a22;
                b[0] += lam * (k11 * e11 + k21 * e21);
                b[1] += lam * (k11 * e12 + k21 * e22);
                b[2] += lam * (k12 * e11 + k22 * e21);
                b[3] += lam * (k12 * e12 + k22 * e22);
            }
            for (int i = 0; i < 6; i++) {
                double s = 0;
                for (int j = 0; j < 6; j++) s += hAug[6 * i + j] * b[j];
                d[i] = s;
            }
            // W(Δp)⁻¹ as a 2 x 2 matrix plus translation, then the composition of (2)
            double m11 = 1 + d[0], m12 = d[1], m21 = d[2], m22 = 1 + d[3];
            double det = m11 * m22 - m12 * m21;
            if (!(Math.abs(det) > 1e-6)) return Status.SINGULAR;
            double i11 = m22 / det, i12 = -m12 / det, i21 = -m21 / det, i22 = m11 / det;
            double itx = -(i11 * d[4] + i12 * d[5]), ity = -(i21 * d[4] + i22 * d[5]);
            double n11 = c11 * i11 + c12 * i21, n12 = c11 * i12 + c12 * i22;
            double n21 = c21 * i11 + c22 * i21, n22 = c21 * i12 + c22 * i22;
            double ntx = c11 * itx + c12 * ity + ctx, nty = c21 * itx + c22 * ity + cty;
            double step = Math.max(Math.abs(ntx - ctx), Math.abs(nty - cty));
            c11 = n11; c12 = n12; c21 = n21; c22 = n22; ctx = ntx; cty = nty;
            if (step < epsilon) {
                r11 = c11; r12 = c12; r21 = c21; r22 = c22; rx = ctx; ry = cty;
                // the residual of the last iteration's window, needed only once converged
                double abs = 0;
                for (int k = 0; k < n; k++) abs += Math.abs((window[k] - bias) * inverseGain - template[k]);
                residual = abs * gain / n;
                return Status.CONVERGED;
            }
        }
        return Status.NOT_CONVERGED;
    }

    /** Makes the last converged alignment the track's warp. */
    void commit() {
        a11 = r11; a12 = r12; a21 = r21; a22 = r22;
    }

    private static boolean inside(GrayF32 g, double x, double y) {
        return x >= 0 && y >= 0 && x < g.width - 1 && y < g.height - 1;
    }

    /** Bilinear interpolation; the caller keeps (x, y) within [0, w-1) x [0, h-1). */
    static double bilinear(GrayF32 g, double x, double y) {
        int ix = (int) x, iy = (int) y;
        float fx = (float) (x - ix), fy = (float) (y - iy);
        int i = g.startIndex + iy * g.stride + ix;
        float[] p = g.data;
        float top = p[i] + fx * (p[i + 1] - p[i]);
        float bot = p[i + g.stride] + fx * (p[i + g.stride + 1] - p[i + g.stride]);
        return top + fy * (bot - top);
    }

    /** Gauss-Jordan inversion with partial pivoting of a 6 x 6 row-major matrix ({@code a}: 36 scratch); false when singular. */
    static boolean invert6(double[] m, double[] out, double[] a) {
        System.arraycopy(m, 0, a, 0, 36);
        for (int i = 0; i < 36; i++) out[i] = (i % 7 == 0) ? 1 : 0;
        for (int c = 0; c < 6; c++) {
            int p = c;
            for (int r = c + 1; r < 6; r++) if (Math.abs(a[6 * r + c]) > Math.abs(a[6 * p + c])) p = r;
            if (!(Math.abs(a[6 * p + c]) > 1e-12)) return false;
            if (p != c) for (int k = 0; k < 6; k++) {
                double t = a[6 * c + k]; a[6 * c + k] = a[6 * p + k]; a[6 * p + k] = t;
                t = out[6 * c + k]; out[6 * c + k] = out[6 * p + k]; out[6 * p + k] = t;
            }
            double inv = 1 / a[6 * c + c];
            for (int k = 0; k < 6; k++) { a[6 * c + k] *= inv; out[6 * c + k] *= inv; }
            for (int r = 0; r < 6; r++) {
                if (r == c) continue;
                double f = a[6 * r + c];
                if (f == 0) continue;
                for (int k = 0; k < 6; k++) { a[6 * r + k] -= f * a[6 * c + k]; out[6 * r + k] -= f * out[6 * c + k]; }
            }
        }
        return true;
    }
}
