package org.targetbench.detect;

import boofcv.struct.image.GrayF32;

import java.util.ArrayList;
import java.util.List;

/**
 * The sub-pixel refinement stage: moves each detected point to the corner by gradient orthogonality (Förstner &amp;
 * Gülch 1987 [1]; the method of OpenCV's cornerSubPix), keeping the move only under the rule of {@link RefineConfig}.
 * At the true corner q every image gradient g_i in the window is orthogonal to p_i - q, so q solves
 * <pre>
 *   (Σ w_i g_i g_iᵀ) q = Σ w_i g_i g_iᵀ p_i                                   (1)
 * </pre>
 * with Gaussian weights w_i (σ = radius / 2) over the window centred on the nearest pixel to the current estimate;
 * repeated until q moves less than {@link RefineConfig#epsilon}. How well (1) fits, the weighted RMS distance of the
 * gradients' lines from q, sqrt(Σ w (gᵀ(p - q))² / Σ w |g|²), is near 0 at a designed corner and large on texture. The gradients are 3 x 3 Sobel, computed only inside
 * the windows (no full-frame pass). Works for any detector's points: L-corners, x-corners and FAST corners alike.
 * Blurred corners, whose misfit is the width of their edges, are kept only when a window of twice the radius
 * agrees (the rule in {@link RefineConfig}).
 *
 * <p>Not thread safe (one instance per detector). Reference: [1] W. Förstner, E. Gülch, "A fast operator for detection
 * and precise location of distinct points, corners and centres of circular features", ISPRS Intercommission
 * Workshop, Interlaken, 1987.
 */
public final class SubpixelRefiner {
    /** Smallest det/trace² of the system matrix accepted (a straight edge gives 0). */
    static final double MIN_CONDITION = 1e-4;

    /** What became of one point. */
    public enum Fate { REFINED, NOT_CONVERGED, SHIFT_TOO_LARGE, NOT_CORNER_LIKE, AT_BORDER }

    private final RefineConfig config;
    private final double[] weight, wideWeight;
    private final double[] state = new double[4];
    private int refined, kept;

    public SubpixelRefiner(RefineConfig config) {
        config.checkValidity();
        this.config = config.copy();
        weight = gaussian(this.config.windowRadius);
        wideWeight = gaussian(2 * this.config.windowRadius);
    }

    public RefineConfig config() { return config.copy(); }

    /** Points refined and points left as detected since this instance was made. */
    public int refinedCount() { return refined; }
    public int keptCount() { return kept; }

    /** The points with refined positions where the rule allows, in the same order; responses and scales unchanged. */
    public List<Detection> refine(GrayF32 image, List<Detection> points) {
        List<Detection> out = new ArrayList<>(points.size());
        double[] q = new double[2];
        for (Detection d : points) {
            if (config.enabled && refine(image, d.x(), d.y(), q) == Fate.REFINED) {
                out.add(new Detection(q[0], q[1], d.response(), d.scale()));
                refined++;
            } else {
                out.add(d);
                kept++;
            }
        }
        return out;
    }

    /** Refines one point; {@code out} receives the refined position on {@link Fate#REFINED}. */
    public Fate refine(GrayF32 img, double x0, double y0, double[] out) {
        Fate f = iterate(img, x0, y0, config.windowRadius, weight, state);
        if (f != null) return f;
        if (Math.hypot(state[0] - x0, state[1] - y0) > config.maxShiftPx) return Fate.SHIFT_TOO_LARGE;
        double fit = state[2];
        if (!(fit <= Math.max(config.maxFitRmsPx, config.maxBlurredFitRmsPx))) return Fate.NOT_CORNER_LIKE;
        if (state[3] < config.minEigenRatio) return Fate.NOT_CORNER_LIKE;
        double qx = state[0], qy = state[1];
        if (!(fit <= config.maxFitRmsPx)) {
            // a blurred corner: its fit is the width of its edges; accepted only when a window twice as large
            // converges on the same point (a corner is one point at every window size; texture is not; derived)
            Fate g = iterate(img, x0, y0, 2 * config.windowRadius, wideWeight, state);
            if (g != null) return g == Fate.AT_BORDER ? Fate.AT_BORDER : Fate.NOT_CORNER_LIKE;
            if (Math.hypot(state[0] - qx, state[1] - qy) > config.maxScaleDisagreementPx) return Fate.NOT_CORNER_LIKE;
            if (!(state[2] <= config.maxBlurredFitRmsPx) || state[3] < config.minEigenRatio) return Fate.NOT_CORNER_LIKE;
        }
        out[0] = qx;
        out[1] = qy;
        return Fate.REFINED;
    }

    static double[] gaussian(int r) {
        int side = 2 * r + 1;
        double[] w = new double[side * side];
        double s2 = 2 * Math.pow(r / 2.0, 2);
        for (int j = -r, k = 0; j <= r; j++) for (int i = -r; i <= r; i++, k++) w[k] = Math.exp(-(i * i + j * j) / s2);
        return w;
    }

    /**
     * Iterates (1) from (x0, y0) with window radius r. Returns a failing fate, or null when converged with
     * {@code st} = {qx, qy, fit, λmin/λmax}.
     */
    private Fate iterate(GrayF32 img, double x0, double y0, int r, double[] weight, double[] st) {
        double qx = x0, qy = y0;
        double a = 0, b = 0, c = 0, fit = Double.NaN;
        boolean converged = false;
        for (int it = 0; it < config.maxIterations; it++) {
            int cx = (int) Math.round(qx), cy = (int) Math.round(qy);
            // window plus the Sobel border inside the image
            if (cx - r - 1 < 0 || cy - r - 1 < 0 || cx + r + 1 > img.width - 1 || cy + r + 1 > img.height - 1) return Fate.AT_BORDER;
            a = 0; b = 0; c = 0;
            double r1 = 0, r2 = 0, s0 = 0, sg = 0;
            float[] p = img.data;
            int stride = img.stride;
            for (int j = -r, k = 0; j <= r; j++) {
                int py = cy + j;
                int row = img.startIndex + py * stride;
                for (int i = -r; i <= r; i++, k++) {
                    int px = cx + i, o = row + px;
                    double gx = (p[o - stride + 1] - p[o - stride - 1]) + 2 * (p[o + 1] - p[o - 1]) + (p[o + stride + 1] - p[o + stride - 1]);
                    double gy = (p[o + stride - 1] - p[o - stride - 1]) + 2 * (p[o + stride] - p[o - stride]) + (p[o + stride + 1] - p[o - stride + 1]);
                    double w = weight[k];
                    double gxx = w * gx * gx, gxy = w * gx * gy, gyy = w * gy * gy;
                    a += gxx; b += gxy; c += gyy;
                    r1 += gxx * px + gxy * py;
                    r2 += gxy * px + gyy * py;
                    double gp = gx * px + gy * py;
                    s0 += w * gp * gp;
                }
            }
            sg = a + c;
            double det = a * c - b * b, tr = a + c;
            if (!(tr > 0) || det < MIN_CONDITION * tr * tr) return Fate.NOT_CORNER_LIKE;
            double nx = (c * r1 - b * r2) / det, ny = (a * r2 - b * r1) / det;
            // weighted mean squared distance of the gradients' lines from q: Σ w (gᵀ(p - q))² / Σ w |g|² (derived)
            fit = Math.sqrt(Math.max(0, (s0 - 2 * (nx * r1 + ny * r2) + nx * nx * a + 2 * nx * ny * b + ny * ny * c) / sg));
            double step = Math.hypot(nx - qx, ny - qy);
            qx = nx;
            qy = ny;
            if (Math.hypot(qx - x0, qy - y0) > Math.max(config.maxShiftPx, r)) return Fate.SHIFT_TOO_LARGE;
            if (step < config.epsilon) {
                converged = true;
                break;
            }
        }
        if (!converged) return Fate.NOT_CONVERGED;
        double half = (a + c) / 2, root = Math.sqrt((a - c) * (a - c) / 4 + b * b);
        st[0] = qx;
        st[1] = qy;
        st[2] = fit;
        st[3] = (half - root) / (half + root);
        return null;
    }
}
