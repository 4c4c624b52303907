package org.targetbench.track;

import org.junit.jupiter.api.Test;
import org.targetbench.camera.Trajectories;
import org.targetbench.detect.ShiTomasiConfig;
import org.targetbench.pipeline.DemoScenario;
import org.targetbench.pipeline.Progress;
import org.targetbench.pipeline.TrackResult;
import org.targetbench.pipeline.TrackRun;
import org.targetbench.pipeline.TrackSink;
import org.targetbench.perturb.MotionConfig;
import org.targetbench.perturb.MotionSource;
import org.targetbench.perturb.MotionSourceAccess;
import org.targetbench.target.TargetDesign;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Under strong motion blur, survival falls monotonically with blur length (common practice, no source). The demo
 * target seen by the demo camera rings sideways at 3 Hz with 15 mm amplitude (up to about 19 px of image motion per
 * frame) and the exposure grows, so the blur consistent with that motion grows from none to about 19 px; everything
 * else is equal (same motion, same noise seed). Measured: longest blur 0, 4.8, 9.6, 14.3, 19.0 px gives survival after
 * 30 frames of 1.0, 1.0, 1.0, 0.93, 0.40.
 */
class BlurSurvivalTest {
    /** Exposures tried, ms (the frame interval is 33 ms). */
    static final double[] EXPOSURE_MS = {0, 8, 16, 24, 32};
    static final int FRAMES = 30;
    /** The sharpest run must keep nearly everything; the most blurred must lose at least this much more. */
    static final double SHARP_SURVIVAL_FLOOR = 0.9, LEAST_DROP = 0.3;
    /** The longest blur must reach this, pixels ("strong"). */
    static final double STRONG_BLUR_PX = 15;

    @Test
    void survivalFallsWithBlurLength() throws Exception {
        TargetDesign d = DemoScenario.target();
        List<Double> survival = new ArrayList<>(), blur = new ArrayList<>();
        for (double e : EXPOSURE_MS) {
            MotionConfig c = new MotionConfig();
            c.frames = FRAMES;
            c.exposureMs = e;
            c.seed = 3;
            MotionSource src = new MotionSource("vibration", d, DemoScenario.camera(),
                    Trajectories.vibration(d.widthMm(), d.heightMm(), DemoScenario.STANDOFF_M, 15, 3), DemoScenario.lighting(), c);
            double longest = 0;
            for (int i = 0; i < FRAMES; i++) {
                double[] v = MotionSourceAccess.blurVector(src, i / c.fps);
                longest = Math.max(longest, Math.hypot(v[0], v[1]));
            }
            blur.add(Math.round(longest * 10) / 10.0);
            TrackResult r = new TrackRun(new KltConfig(), new ShiTomasiConfig(), 0, false, 0).run(src, TrackSink.NONE, Progress.NONE, () -> false);
            survival.add(r.score().survivalAtEnd());
        }
        String table = "longest blur px " + blur + " -> survival " + survival;
        assertTrue(survival.get(0) >= SHARP_SURVIVAL_FLOOR, table);
        for (int i = 1; i < survival.size(); i++) {
            assertTrue(blur.get(i) > blur.get(i - 1), table);
            assertTrue(survival.get(i) <= survival.get(i - 1), "not monotonic: " + table);
        }
        assertTrue(survival.get(survival.size() - 1) <= survival.get(0) - LEAST_DROP, table);
        assertTrue(blur.get(blur.size() - 1) >= STRONG_BLUR_PX, table);
    }
}
