package org.targetbench.detect;

import boofcv.struct.image.GrayF32;
import boofcv.struct.image.GrayU8;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

/** The one factory switch from a detector configuration to a detector. */
public final class Detectors {
    private Detectors() {}

    /** Creates a detector; validates and copies the configuration. */
    public static PointDetector create(DetectorConfig config) {
        config.checkValidity();
        DetectorConfig c = config.copy();
        PointDetector d = switch (c.type()) {
            case HARRIS, SHI_TOMASI -> new CornerDetector((CornerConfig) c);
            case FAST -> new FastDetector((FastConfig) c);
            case SURF -> new FastHessianDetector((SurfConfig) c);
            case SIFT -> new DogDetector((SiftConfig) c);
            case DOTS -> new DotDetector((DotConfig) c);
            case XCORNER -> new XCornerDetector((XCornerConfig) c);
        };
        return c.refine.enabled ? new RefinedDetector(d, c) : d;
    }

    public static PointDetector create(DetectorType type) {
        return create(DetectorConfig.defaults(type));
    }

    /**
     * Applies the threshold and the feature limit to raw candidates: drops responses below the threshold (relative
     * to the strongest candidate's response, or absolute) or below {@code minResponse}, sorts strongest first and keeps at most maxFeatures.
     * Ties are broken by row, then column, so the result is deterministic.
     *
     * @param strongest the frame's strongest response, the base of a relative threshold
     */
    static List<Detection> select(List<Detection> candidates, DetectorConfig config, double strongest) {
        double cut = Math.max(config.minResponse,
                config.thresholdMode == ThresholdMode.RELATIVE ? config.threshold * strongest : config.threshold);
        List<Detection> kept = new ArrayList<>();
        for (Detection d : candidates) if (d.response() > 0 && d.response() >= cut) kept.add(d);
        kept.sort(Comparator.comparingDouble(Detection::response).reversed()
                .thenComparingDouble(Detection::y).thenComparingDouble(Detection::x));
        return List.copyOf(kept.size() > config.maxFeatures ? kept.subList(0, config.maxFeatures) : kept);
    }

    /**
     * Drops every point that lies within {@code radius} of a stronger one (greedy, strongest first; ties by row then
     * column). Used after sub-pixel refinement, which can move neighbouring peaks of one corner onto the same spot.
     */
    static List<Detection> suppressNear(List<Detection> points, double radius) {
        List<Detection> sorted = new ArrayList<>(points);
        sorted.sort(Comparator.comparingDouble(Detection::response).reversed()
                .thenComparingDouble(Detection::y).thenComparingDouble(Detection::x));
        double r2 = radius * radius;
        double cell = Math.max(radius, 1e-9);
        java.util.Map<Long, List<Detection>> grid = new java.util.HashMap<>();
        List<Detection> kept = new ArrayList<>();
        for (Detection d : sorted) {
            long gx = (long) Math.floor(d.x() / cell), gy = (long) Math.floor(d.y() / cell);
            boolean clash = false;
            for (long j = gy - 1; j <= gy + 1 && !clash; j++)
                for (long i = gx - 1; i <= gx + 1 && !clash; i++)
                    for (Detection k : grid.getOrDefault((i << 32) ^ (j & 0xffffffffL), List.of())) {
                        double ddx = k.x() - d.x(), ddy = k.y() - d.y();
                        if (ddx * ddx + ddy * ddy < r2) { clash = true; break; }
                    }
            if (clash) continue;
            kept.add(d);
            grid.computeIfAbsent((gx << 32) ^ (gy & 0xffffffffL), k -> new ArrayList<>()).add(d);
        }
        return kept;
    }

    /** Rounds and clips a grey image to 8 bits, for the detectors that work on bytes. */
    static GrayU8 toU8(GrayF32 in, GrayU8 out) {
        out.reshape(in.width, in.height);
        for (int y = 0; y < in.height; y++) {
            int si = in.startIndex + y * in.stride, di = out.startIndex + y * out.stride;
            for (int x = 0; x < in.width; x++) {
                float v = in.data[si + x];
                out.data[di + x] = (byte) (v <= 0 ? 0 : v >= 255 ? 255 : (int) (v + 0.5f));
            }
        }
        return out;
    }

    /**
     * Sub-pixel offset of a peak from three samples by a parabola fit, clamped to ±0.5 px:
     * δ = (f₋ - f₊) / (2 (f₋ - 2 f₀ + f₊)), the standard three-point quadratic interpolation
     * (common practice, no source).
     */
    static double parabolaOffset(double minus, double centre, double plus) {
        double den = minus - 2 * centre + plus;
        if (den >= 0) return 0;
        double d = 0.5 * (minus - plus) / den;
        return Math.max(-0.5, Math.min(0.5, d));
    }
}
