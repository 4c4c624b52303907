package org.targetbench.bench;

import boofcv.struct.image.GrayF32;
import org.opencv.core.CvType;
import org.opencv.core.Mat;
import org.targetbench.pipeline.DemoScenario;
import org.targetbench.source.SourceFrame;
import org.targetbench.source.SyntheticSource;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * The demo frames, rendered once and held in both forms the detectors take: BoofCV {@link GrayF32} (grey 0..255) for
 * ours and an OpenCV 8-bit single-channel {@link Mat} for the reference. The 8-bit frame is the rounded and clipped
 * float frame, the same rounding our byte-based detectors apply internally, so both libraries see the same pixels.
 *
 * <p>Caveat: ours is handed the float frame, as in the tool, and so pays its own float-to-byte conversion where it
 * needs bytes; OpenCV is handed bytes. That is part of what is measured.
 */
final class BenchFrames {
    final List<GrayF32> gray;
    final List<Mat> mats;

    private BenchFrames(List<GrayF32> gray, List<Mat> mats) {
        this.gray = List.copyOf(gray);
        this.mats = List.copyOf(mats);
    }

    /** Renders the demo scenario; OpenCV's native library must already be loaded. */
    static BenchFrames renderDemo() {
        List<GrayF32> gray = new ArrayList<>();
        List<Mat> mats = new ArrayList<>();
        try (SyntheticSource source = DemoScenario.source()) {
            for (Optional<SourceFrame> f = source.next(); f.isPresent(); f = source.next()) {
                GrayF32 image = f.get().image();
                gray.add(image);
                mats.add(toMat(image));
            }
        }
        if (gray.isEmpty()) throw new IllegalStateException("the demo scenario rendered no frames");
        return new BenchFrames(gray, mats);
    }

    int count() { return gray.size(); }

    int width() { return gray.get(0).width; }

    int height() { return gray.get(0).height; }

    /** Rounds and clips to 8 bits, row by row, into a CV_8UC1 matrix. */
    static Mat toMat(GrayF32 in) {
        byte[] bytes = new byte[in.width * in.height];
        for (int y = 0; y < in.height; y++) {
            int si = in.startIndex + y * in.stride, di = y * in.width;
            for (int x = 0; x < in.width; x++) {
                float v = in.data[si + x];
                bytes[di + x] = (byte) (v <= 0 ? 0 : v >= 255 ? 255 : (int) (v + 0.5f));
            }
        }
        Mat m = new Mat(in.height, in.width, CvType.CV_8UC1);
        m.put(0, 0, bytes);
        return m;
    }
}
