package org.targetbench.source;

import org.targetbench.camera.Projection.ProjectedFeature;

import java.nio.file.Path;
import java.util.Locale;
import java.util.Map;

/**
 * Refuses truth that does not fit its footage, which would otherwise give confident drift and repeatability figures
 * for the wrong scene. Checks: a video's truth covers every frame of it (what {@code record} writes; truth for a
 * frame folder may cover some frames only), and every true point lies inside the frames' image,
 * [-0.5, w - 0.5] x [-0.5, h - 0.5] (truth lists visible features only, so a point outside was made for another image
 * size).
 */
final class TruthFit {
    private TruthFit() {}

    static void check(TruthFile.Truth truth, Path truthFile, int frameCount, boolean video, int width, int height) throws SourceException {
        if (truth.frames().isEmpty()) return;
        if (video && frameCount > 0 && truth.frames().size() < frameCount)
            throw new SourceException(truthFile + ": truth covers " + truth.frames().size() + " frames but the video has " + frameCount
                    + "; is it the truth of another clip?");
        for (Map.Entry<String, FrameTruth> e : truth.frames().entrySet())
            for (ProjectedFeature f : e.getValue().features())
                if (!(f.u() >= -0.5 && f.v() >= -0.5 && f.u() <= width - 0.5 && f.v() <= height - 0.5))
                    throw new SourceException(String.format(Locale.ROOT, "%s: points[\"%s\"] id %d at (%.1f, %.1f) px lies outside the %d x %d frames; "
                            + "is it the truth of other footage?", truthFile, e.getKey(), f.featureId(), f.u(), f.v(), width, height));
    }
}
