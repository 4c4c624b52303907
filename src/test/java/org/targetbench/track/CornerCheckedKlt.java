package org.targetbench.track;

import boofcv.alg.interpolate.InterpolateRectangle;
import boofcv.alg.tracker.klt.ConfigKlt;
import boofcv.alg.tracker.klt.KltFeature;
import boofcv.struct.image.GrayF32;

/**
 * BoofCV's single-level KLT with a constant-time completeness test. BoofCV marks the template pixels that fell
 * outside the image as NaN, and the pixels it fills are always one rectangle inside the window, so a template is
 * incomplete exactly when one of its four corner pixels is NaN; BoofCV scans the whole window on every call instead
 * (about a tenth of the tracking time at 15 x 15). Behaviour is otherwise BoofCV's.
 */
final class CornerCheckedKlt extends boofcv.alg.tracker.klt.KltTracker<GrayF32, GrayF32> {
    CornerCheckedKlt(InterpolateRectangle<GrayF32> input, InterpolateRectangle<GrayF32> derivative, ConfigKlt config) {
        super(input, derivative, config);
    }

    @Override
    public boolean isDescriptionComplete(KltFeature feature) {
        GrayF32 d = feature.desc;
        int last = d.width - 1, bottom = d.height - 1;
        return !Float.isNaN(d.unsafe_get(0, 0)) && !Float.isNaN(d.unsafe_get(last, 0))
                && !Float.isNaN(d.unsafe_get(0, bottom)) && !Float.isNaN(d.unsafe_get(last, bottom));
    }
}
