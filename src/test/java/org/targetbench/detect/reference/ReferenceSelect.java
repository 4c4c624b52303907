/*
 * Frozen copy of the selection helpers of Detectors as they were before the fused kernels (commit 907b02e), for the
 * reference detectors in this package.
 */
package org.targetbench.detect.reference;

import boofcv.struct.image.GrayF32;
import boofcv.struct.image.GrayU8;
import org.targetbench.detect.Detection;
import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.ThresholdMode;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

final class ReferenceSelect {
    private ReferenceSelect() {}

    static List<Detection> select(List<Detection> candidates, DetectorConfig config, double strongest) {
        double cut = Math.max(config.minResponse,
                config.thresholdMode == ThresholdMode.RELATIVE ? config.threshold * strongest : config.threshold);
        List<Detection> kept = new ArrayList<>();
        for (Detection d : candidates) if (d.response() > 0 && d.response() >= cut) kept.add(d);
        kept.sort(Comparator.comparingDouble(Detection::response).reversed()
                .thenComparingDouble(Detection::y).thenComparingDouble(Detection::x));
        return List.copyOf(kept.size() > config.maxFeatures ? kept.subList(0, config.maxFeatures) : kept);
    }

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

    static double parabolaOffset(double minus, double centre, double plus) {
        double den = minus - 2 * centre + plus;
        if (den >= 0) return 0;
        double d = 0.5 * (minus - plus) / den;
        return Math.max(-0.5, Math.min(0.5, d));
    }
}
