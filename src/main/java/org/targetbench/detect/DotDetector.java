package org.targetbench.detect;

import boofcv.struct.image.GrayF32;
import org.targetbench.camera.Conics;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;

/**
 * Dot centres: the detector matched to dot-grid targets.
 *
 * <p>Steps:
 * <ol>
 *   <li>Polarity: the frame is read as g = I (dark dots) or g = 255 - I (light dots), so dots are dark in g.</li>
 *   <li>Adaptive threshold: a pixel is ink when g &lt; m - {@code minContrast}, m the mean of g over the
 *       (2r+1)² window about it (clipped to the frame), summed on an integral image: the local-mean threshold of
 *       Wellner 1993 [1] and Bradley &amp; Roth 2007 [2] with an offset in grey levels instead of a percentage.</li>
 *   <li>Connected components of ink (8-connected), holes filled (a dot larger than the window, or with a highlight,
 *       comes out whole). Rejected: components touching the frame border, an area outside
 *       [{@code minAreaPx}, {@code maxAreaPx}], a convexity below {@code minConvexity} (pixel count over the lattice
 *       points inside the convex hull of the pixel centres, by Pick's theorem, so a digitally convex set scores 1),
 *       a contrast below {@code minContrast}.</li>
 *   <li>Levels: the page level b is the median (to a quarter grey level) of g over the pixels below the ink threshold and outside the component of the component's box grown by
 *       {@value #MARGIN} px; the ink level k the mean over the component's interior pixels (its minimum when it has
 *       none). Sub-pixel edge points are the crossings of the level (b + k)/2 between 4-neighbouring pixels next to
 *       the component, by linear interpolation.</li>
 *   <li>Ellipse filter: the direct least-squares ellipse [3] through the edge points; rejected when none exists, its
 *       axis ratio exceeds {@code maxAspect} or the RMS Sampson distance of the edge points exceeds
 *       {@code maxEllipseError} times the mean semi-axis.</li>
 *   <li>Centre: the fitted ellipse's centre ({@code ELLIPSE}), or the grey-weighted centroid Σ w p / Σ w with
 *       w = clamp(b - g, 0, b - k) over the component grown by 2 px ({@code CENTROID}).</li>
 * </ol>
 * Response: the dot's contrast b - k, grey levels. Scale: the fitted ellipse's mean semi-axis sqrt(A a), pixels.
 *
 * <p>Both centres estimate the centre of the imaged outline, which under perspective is not the image of the dot's
 * centre; {@link DotBiasCorrection} removes that bias when the pose is known.
 *
 * <p>Caveats: one dot per component, so touching dots are rejected as non-convex; no scale space, so dots smaller
 * than {@code minAreaPx} are not seen.
 *
 * <p>References: [1] P. Wellner, "Adaptive thresholding for the DigitalDesk", Rank Xerox EuroPARC TR EPC-1993-110,
 * 1993 (from memory). [2] D. Bradley, G. Roth, "Adaptive thresholding using the integral image", Journal of Graphics
 * Tools 12(2), 2007. [3] A. Fitzgibbon, M. Pilu, R. Fisher, "Direct least square fitting of ellipses", IEEE TPAMI
 * 21(5), 1999 (see {@link Conics#fitEllipse}).
 */
final class DotDetector implements PointDetector {
    /** Margin around a component's box in which the page level is measured, pixels. */
    static final int MARGIN = 3;

    /** Resolution of the page-level histogram, bins per grey level. */
    static final int BINS_PER_GREY = 4;
    static final int BINS = 256 * BINS_PER_GREY;

    private final DotConfig config;
    private final int[] histogram = new int[BINS];
    private float[] g = new float[0];
    private double[] integral = new double[0];
    private int[] labels = new int[0];
    /** The threshold's answer per pixel (1 = ink), never changed by labelling or hole filling. */
    private byte[] ink = new byte[0];
    private int[] order = new int[0];

    DotDetector(DotConfig config) {
        this.config = config;
    }

    @Override public DetectorType type() { return DetectorType.DOTS; }

    @Override
    public List<Detection> detect(GrayF32 image) {
        int w = image.width, h = image.height, n = w * h;
        if (g.length != n) {
            g = new float[n];
            labels = new int[n];
            ink = new byte[n];
            order = new int[n];
            integral = new double[(w + 1) * (h + 1)];
        }
        boolean dark = config.polarity == DotConfig.Polarity.DARK_ON_LIGHT;
        for (int y = 0; y < h; y++) {
            int si = image.startIndex + y * image.stride, gi = y * w, ii = (y + 1) * (w + 1) + 1, above = y * (w + 1) + 1;
            double row = 0;
            for (int x = 0; x < w; x++) {
                float v = dark ? image.data[si + x] : 255f - image.data[si + x];
                g[gi + x] = v;
                row += v;
                integral[ii + x] = integral[above + x] + row;
            }
        }
        // adaptive threshold: ink is marked -1, page 0
        int r = config.windowRadius;
        double contrast = config.minContrast;
        for (int y = 0; y < h; y++) {
            int y0 = Math.max(0, y - r), y1 = Math.min(h - 1, y + r);
            for (int x = 0; x < w; x++) {
                int x0 = Math.max(0, x - r), x1 = Math.min(w - 1, x + r);
                double sum = integral[(y1 + 1) * (w + 1) + x1 + 1] - integral[y0 * (w + 1) + x1 + 1]
                        - integral[(y1 + 1) * (w + 1) + x0] + integral[y0 * (w + 1) + x0];
                double area = (double) (x1 - x0 + 1) * (y1 - y0 + 1);
                boolean isInk = (g[y * w + x] + contrast) * area < sum; // g < local mean - minContrast
                labels[y * w + x] = isInk ? -1 : 0;
                ink[y * w + x] = (byte) (isInk ? 1 : 0);
            }
        }
        List<Detection> candidates = new ArrayList<>();
        double strongest = 0;
        int next = 1;
        for (int start = 0; start < n; start++) {
            if (labels[start] != -1) continue;
            int label = next++;
            int count = grow(start, label, w, h);
            Optional<Detection> d = measure(label, count, w, h);
            if (d.isPresent()) {
                candidates.add(d.get());
                strongest = Math.max(strongest, d.get().response());
            }
        }
        return Detectors.select(Detectors.suppressNear(candidates, config.nmsRadius), config, strongest);
    }

    /** Labels the 8-connected ink component at {@code start}; its pixel indices land in order[0..count). */
    private int grow(int start, int label, int w, int h) {
        int head = 0, tail = 0;
        order[tail++] = start;
        labels[start] = label;
        while (head < tail) {
            int p = order[head++], px = p % w, py = p / w;
            for (int dy = -1; dy <= 1; dy++) {
                int qy = py + dy;
                if (qy < 0 || qy >= h) continue;
                for (int dx = -1; dx <= 1; dx++) {
                    int qx = px + dx;
                    if (qx < 0 || qx >= w) continue;
                    int q = qy * w + qx;
                    if (labels[q] == -1) {
                        labels[q] = label;
                        order[tail++] = q;
                    }
                }
            }
        }
        return tail;
    }

    private Optional<Detection> measure(int label, int count, int w, int h) {
        if (count > config.maxAreaPx) return Optional.empty();
        int bx0 = w, by0 = h, bx1 = -1, by1 = -1;
        for (int i = 0; i < count; i++) {
            int p = order[i], x = p % w, y = p / w;
            bx0 = Math.min(bx0, x); bx1 = Math.max(bx1, x);
            by0 = Math.min(by0, y); by1 = Math.max(by1, y);
        }
        if (bx0 == 0 || by0 == 0 || bx1 == w - 1 || by1 == h - 1) return Optional.empty(); // cut by the frame
        int area = count + fillHoles(label, bx0, by0, bx1, by1, w);
        if (area < config.minAreaPx || area > config.maxAreaPx) return Optional.empty();
        if (convexity(label, bx0, by0, bx1, by1, w) < config.minConvexity) return Optional.empty();

        // levels
        int ex0 = Math.max(0, bx0 - MARGIN), ey0 = Math.max(0, by0 - MARGIN), ex1 = Math.min(w - 1, bx1 + MARGIN), ey1 = Math.min(h - 1, by1 + MARGIN);
        int bw = ex1 - ex0 + 1, bh = ey1 - ey0 + 1;
        java.util.Arrays.fill(histogram, 0);
        int pages = 0;
        double inkSum = 0, inkMin = Double.POSITIVE_INFINITY;
        int interior = 0;
        for (int y = ey0; y <= ey1; y++)
            for (int x = ex0; x <= ex1; x++) {
                int p = y * w + x;
                if (ink[p] == 0 && labels[p] != label) {
                    histogram[Math.max(0, Math.min(BINS - 1, (int) (g[p] * BINS_PER_GREY)))]++;
                    pages++;
                }
                else if (labels[p] == label) {
                    inkMin = Math.min(inkMin, g[p]);
                    if (labels[p - 1] == label && labels[p + 1] == label && labels[p - w] == label && labels[p + w] == label) {
                        inkSum += g[p];
                        interior++;
                    }
                }
            }
        if (pages == 0) return Optional.empty();
        double b = median(pages);
        double k = interior > 0 ? inkSum / interior : inkMin;
        double contrast = b - k;
        if (!(contrast >= config.minContrast)) return Optional.empty();

        // near: the component grown by 1 px (edge points) and by 2 px (centroid weights), inside the grown box
        boolean[] near1 = grownMask(label, ex0, ey0, ex1, ey1, w, 1);
        double level = (b + k) / 2;
        double[] xs = new double[4 * (bw + bh) + 4 * area + 16], ys = new double[xs.length];
        int m = 0;
        for (int y = ey0; y <= ey1; y++)
            for (int x = ex0; x <= ex1; x++) {
                int p = y * w + x;
                double a = g[p] - level;
                boolean inA = near1[(y - ey0) * bw + (x - ex0)];
                if (x < ex1 && (inA || near1[(y - ey0) * bw + (x + 1 - ex0)])) {
                    double c = g[p + 1] - level;
                    if ((a < 0) != (c < 0) && m < xs.length) { xs[m] = x + a / (a - c); ys[m] = y; m++; }
                }
                if (y < ey1 && (inA || near1[(y + 1 - ey0) * bw + (x - ex0)])) {
                    double c = g[p + w] - level;
                    if ((a < 0) != (c < 0) && m < xs.length) { xs[m] = x; ys[m] = y + a / (a - c); m++; }
                }
            }
        Optional<double[]> fit = Conics.fitEllipse(xs, ys, m);
        if (fit.isEmpty()) return Optional.empty();
        double[] q = fit.get();
        double[] axes = Conics.semiAxes(q);
        if (!(axes[0] / axes[1] <= config.maxAspect)) return Optional.empty();
        double err = 0;
        for (int i = 0; i < m; i++) {
            double d = Conics.distance(q, xs[i], ys[i]);
            err += d * d;
        }
        double meanAxis = Math.sqrt(axes[0] * axes[1]);
        if (!(Math.sqrt(err / m) <= config.maxEllipseError * meanAxis)) return Optional.empty();
        double[] c = Conics.centre(q);
        if (!(c[0] >= bx0 - 1 && c[0] <= bx1 + 1 && c[1] >= by0 - 1 && c[1] <= by1 + 1)) return Optional.empty();

        if (config.centre == DotConfig.CentreMethod.CENTROID) {
            boolean[] near2 = grownMask(label, ex0, ey0, ex1, ey1, w, 2);
            double sw = 0, sx = 0, sy = 0;
            for (int y = ey0; y <= ey1; y++)
                for (int x = ex0; x <= ex1; x++) {
                    int p = y * w + x;
                    if (!near2[(y - ey0) * bw + (x - ex0)] || (ink[p] == 1 && labels[p] != label)) continue;
                    double wt = Math.max(0, Math.min(contrast, b - g[p]));
                    sw += wt; sx += wt * x; sy += wt * y;
                }
            if (!(sw > 0)) return Optional.empty();
            c = new double[]{sx / sw, sy / sw};
        }
        return Optional.of(new Detection(c[0], c[1], contrast, meanAxis));
    }

    /** Median of the page histogram, to a quarter grey level (bin centre). */
    private double median(int count) {
        int half = count / 2, seen = 0;
        for (int i = 0; i < BINS; i++) {
            seen += histogram[i];
            if (seen > half) return (i + 0.5) / BINS_PER_GREY;
        }
        return 255;
    }

    /**
     * Fills the holes of the component inside its box: page pixels not reachable from the box border without crossing
     * the component. Ink of other components inside a hole stays theirs. Returns how many pixels were filled.
     */
    private int fillHoles(int label, int bx0, int by0, int bx1, int by1, int w) {
        int bw = bx1 - bx0 + 1, bh = by1 - by0 + 1;
        byte[] seen = new byte[bw * bh];
        int[] stack = new int[bw * bh];
        int top = 0;
        for (int y = 0; y < bh; y++)
            for (int x = 0; x < bw; x++) {
                if (x != 0 && y != 0 && x != bw - 1 && y != bh - 1) continue;
                int i = y * bw + x;
                if (labels[(by0 + y) * w + bx0 + x] != label && seen[i] == 0) { seen[i] = 1; stack[top++] = i; }
            }
        while (top > 0) {
            int i = stack[--top], x = i % bw, y = i / bw;
            for (int k = 0; k < 4; k++) {
                int qx = x + (k == 0 ? -1 : k == 1 ? 1 : 0), qy = y + (k == 2 ? -1 : k == 3 ? 1 : 0);
                if (qx < 0 || qy < 0 || qx >= bw || qy >= bh) continue;
                int j = qy * bw + qx;
                if (seen[j] == 0 && labels[(by0 + qy) * w + bx0 + qx] != label) { seen[j] = 1; stack[top++] = j; }
            }
        }
        int filled = 0;
        for (int y = 0; y < bh; y++)
            for (int x = 0; x < bw; x++) {
                int p = (by0 + y) * w + bx0 + x;
                if (seen[y * bw + x] == 0 && labels[p] == 0) { labels[p] = label; filled++; }
            }
        return filled;
    }

    /**
     * Pixel count over the lattice points inside the convex hull of the pixel centres, A + B/2 + 1 by Pick's theorem
     * (A the hull's area, B the lattice points on its boundary).
     */
    private double convexity(int label, int bx0, int by0, int bx1, int by1, int w) {
        List<long[]> pts = new ArrayList<>();
        int count = 0;
        for (int y = by0; y <= by1; y++) {
            int lo = -1, hi = -1;
            for (int x = bx0; x <= bx1; x++)
                if (labels[y * w + x] == label) { if (lo < 0) lo = x; hi = x; count++; }
            if (lo >= 0) { pts.add(new long[]{lo, y}); if (hi != lo) pts.add(new long[]{hi, y}); }
        }
        pts.sort((a, b) -> a[0] != b[0] ? Long.compare(a[0], b[0]) : Long.compare(a[1], b[1]));
        int k = 0;
        long[][] hull = new long[2 * pts.size() + 1][];
        for (long[] p : pts) { // Andrew's monotone chain, lower hull
            while (k >= 2 && cross(hull[k - 2], hull[k - 1], p) <= 0) k--;
            hull[k++] = p;
        }
        for (int i = pts.size() - 2, t = k + 1; i >= 0; i--) { // upper hull
            long[] p = pts.get(i);
            while (k >= t && cross(hull[k - 2], hull[k - 1], p) <= 0) k--;
            hull[k++] = p;
        }
        if (k <= 3) return 1; // a line of pixels: leave it to the ellipse filter
        long twiceArea = 0, boundary = 0;
        for (int i = 0; i < k - 1; i++) {
            twiceArea += hull[i][0] * hull[i + 1][1] - hull[i + 1][0] * hull[i][1];
            boundary += gcd(Math.abs(hull[i + 1][0] - hull[i][0]), Math.abs(hull[i + 1][1] - hull[i][1]));
        }
        double lattice = Math.abs(twiceArea) / 2.0 + boundary / 2.0 + 1;
        return Math.min(1, count / lattice);
    }

    private static long cross(long[] o, long[] a, long[] b) {
        return (a[0] - o[0]) * (b[1] - o[1]) - (a[1] - o[1]) * (b[0] - o[0]);
    }

    private static long gcd(long a, long b) { return b == 0 ? a : gcd(b, a % b); }

    /** The component grown by {@code grow} px (8-neighbourhood), as a mask over the box [x0, x1] x [y0, y1]. */
    private boolean[] grownMask(int label, int x0, int y0, int x1, int y1, int w, int grow) {
        int bw = x1 - x0 + 1, bh = y1 - y0 + 1;
        boolean[] mask = new boolean[bw * bh];
        for (int y = y0; y <= y1; y++)
            for (int x = x0; x <= x1; x++) {
                if (labels[y * w + x] != label) continue;
                for (int dy = -grow; dy <= grow; dy++)
                    for (int dx = -grow; dx <= grow; dx++) {
                        int qx = x + dx - x0, qy = y + dy - y0;
                        if (qx >= 0 && qy >= 0 && qx < bw && qy < bh) mask[qy * bw + qx] = true;
                    }
            }
        return mask;
    }
}
