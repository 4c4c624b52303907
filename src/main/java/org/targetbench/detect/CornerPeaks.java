package org.targetbench.detect;

import boofcv.struct.image.GrayF32;
import org.targetbench.Simd;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Peaks of a corner response: relaxed non-maximum suppression over the pixels at or above a threshold only, a
 * three-point parabola fit per peak, and the strongest N in a fixed order (response descending, then row, then column
 * of the fitted position), chosen with a bounded heap instead of sorting every peak.
 *
 * <p>Rule (the same as BoofCV's relaxed block search with this threshold and border): a pixel at least {@code border}
 * from every edge is a peak when its response is at or above the threshold and no pixel within {@code radius} (a
 * square window clipped to the frame) has a strictly larger response, so flat-topped peaks keep every pixel.
 * Buffers grow as needed and are reused from call to call. With {@link Simd#ENABLED} the search for the next pixel at or
 * above the threshold compares a vector of pixels at a time ({@link CornerVectors#firstAtLeast}); the pixels are still
 * visited in the same order, so the points are the same.
 */
final class CornerPeaks {
    /** Vector threshold scan instead of the scalar one; same output. */
    private final boolean simd;
    private int count;
    private float[] value = new float[256];
    private double[] px = new double[256], py = new double[256];
    private int[] heap = new int[64];

    CornerPeaks() {
        this(Simd.ENABLED);
    }

    /** @param simd the vector threshold scan (only when the vector module is present; {@link Simd#ENABLED} by default) */
    CornerPeaks(boolean simd) {
        this.simd = simd;
    }

    /**
     * @param threshold the suppression's threshold (float, as the library compares)
     * @param cut       the detector's threshold in double, applied again to the responses as the detector did
     */
    List<Detection> find(GrayF32 r, float threshold, double cut, int radius, int border, double scale, int maxFeatures) {
        count = 0;
        int w = r.width, h = r.height;
        float[] d = r.data;
        for (int y = border; y < h - border; y++) {
            int row = r.startIndex + y * r.stride, end = row + w - border;
            for (int i = row + border; i < end; i++) {
                i = simd ? CornerVectors.firstAtLeast(d, i, end, threshold) : firstAtLeast(d, i, end, threshold);
                if (i == end) break;
                int x = i - row;
                float v = d[i];
                if (isPeak(r, x, y, v, radius)) add(r, x, y, v, cut);
            }
        }
        return top(maxFeatures, scale);
    }

    /** Scalar twin of {@link CornerVectors#firstAtLeast}: the first index in from..to-1 at or above t, else to. */
    private static int firstAtLeast(float[] d, int from, int to, float t) {
        for (int i = from; i < to; i++) if (d[i] >= t) return i;
        return to;
    }

    private static boolean isPeak(GrayF32 r, int xc, int yc, float v, int radius) {
        int x0 = Math.max(0, xc - radius), x1 = Math.min(r.width - 1, xc + radius);
        int y0 = Math.max(0, yc - radius), y1 = Math.min(r.height - 1, yc + radius);
        float[] d = r.data;
        // most pixels above the threshold sit on the flank of a peak: a larger 4-neighbour rejects them at once
        int c = r.startIndex + yc * r.stride + xc;
        if ((xc > 0 && d[c - 1] > v) || (xc < r.width - 1 && d[c + 1] > v)
                || (yc > 0 && d[c - r.stride] > v) || (yc < r.height - 1 && d[c + r.stride] > v)) return false;
        for (int y = y0; y <= y1; y++) {
            int i = r.startIndex + y * r.stride + x0;
            for (int x = x0; x <= x1; x++, i++) if (d[i] > v) return false;
        }
        return true;
    }

    private void add(GrayF32 r, int x, int y, float v, double cut) {
        double c = v;
        if (!(c > 0) || c < cut) return;
        double ox = 0, oy = 0;
        if (x > 0 && x < r.width - 1) ox = Detectors.parabolaOffset(r.unsafe_get(x - 1, y), c, r.unsafe_get(x + 1, y));
        if (y > 0 && y < r.height - 1) oy = Detectors.parabolaOffset(r.unsafe_get(x, y - 1), c, r.unsafe_get(x, y + 1));
        addPoint(x + ox, y + oy, v);
    }

    /** Drops the points whose response is not above 0 or is below {@code cut}, keeping the others in order. */
    void keepAtLeast(double cut) {
        int n = 0;
        for (int i = 0; i < count; i++) {
            double v = value[i];
            if (!(v > 0) || v < cut) continue;
            value[n] = value[i];
            px[n] = px[i];
            py[n] = py[i];
            n++;
        }
        count = n;
    }

    /** Forgets the points of the previous frame. */
    void reset() {
        count = 0;
    }

    /** Adds one point with its response (for detectors that suppress on their own). */
    void addPoint(double x, double y, float v) {
        if (count == value.length) {
            int n = 2 * count;
            value = Arrays.copyOf(value, n);
            px = Arrays.copyOf(px, n);
            py = Arrays.copyOf(py, n);
        }
        value[count] = v;
        px[count] = x;
        py[count] = y;
        count++;
    }



    /** True when peak a comes before peak b: larger response, then smaller row, then smaller column. */
    private boolean before(int a, int b) {
        if (value[a] != value[b]) return value[a] > value[b];
        if (py[a] != py[b]) return py[a] < py[b];
        return px[a] < px[b];
    }

    /**
     * The strongest {@code maxFeatures} points added since {@link #reset()}, in the order of {@link #before}: a heap
     * holds the best so far with the worst at its root, so only the kept points are ever ordered.
     */
    List<Detection> top(int maxFeatures, double scale) {
        int n = Math.min(count, maxFeatures);
        if (n == 0) return List.of();
        if (heap.length < n) heap = new int[Math.max(n, 2 * heap.length)];
        int size = 0;
        for (int i = 0; i < count; i++) {
            if (size < n) {
                heap[size] = i;
                siftUp(size++);
            } else if (before(i, heap[0])) {
                heap[0] = i;
                siftDown(0, size);
            }
        }
        // heap sort in place: repeatedly move the worst to the end
        for (int end = size - 1; end > 0; end--) {
            int t = heap[0]; heap[0] = heap[end]; heap[end] = t;
            siftDown(0, end);
        }
        List<Detection> out = new ArrayList<>(size);
        for (int i = 0; i < size; i++) {
            int p = heap[i];
            out.add(new Detection(px[p], py[p], value[p], scale));
        }
        return List.copyOf(out);
    }

    /** Heap order: the parent comes after (is worse than) its children. */
    private void siftUp(int i) {
        while (i > 0) {
            int parent = (i - 1) >> 1;
            if (!before(heap[parent], heap[i])) break;
            int t = heap[parent]; heap[parent] = heap[i]; heap[i] = t;
            i = parent;
        }
    }

    private void siftDown(int i, int size) {
        while (true) {
            int l = 2 * i + 1, worst = i;
            if (l < size && before(heap[worst], heap[l])) worst = l;
            if (l + 1 < size && before(heap[worst], heap[l + 1])) worst = l + 1;
            if (worst == i) return;
            int t = heap[worst]; heap[worst] = heap[i]; heap[i] = t;
            i = worst;
        }
    }
}
