package org.targetbench.formats;

import org.targetbench.pipeline.PickRun;

import java.util.Locale;

/**
 * Sentences for a pick that could not start ({@link PickRun.Problem}): they name the results files and the options
 * that supply what is missing, so they live here, beside the results-folder reader, and not in the pipeline. The
 * console and the workbench both use them.
 */
public final class PickRefusals {
    private PickRefusals() {}

    /**
     * How the sentences of a refused pick name its inputs.
     *
     * @param folder         the results (or what stands for them)
     * @param truthFile      where the truth came from
     * @param posesFile      where the poses came from
     * @param referenceFrame the reference frame's name
     */
    public record Where(String folder, String truthFile, String posesFile, String referenceFrame) {}

    /** Why a pick could not start, naming the files and options that would fix it. */
    public static String explain(PickRun.Refused r, Where w) {
        return switch (r.problem) {
            case EMPTY_RANKING -> w.folder() + "/summary.json: the ranking is empty; name a detector with --detector";
            case UNKNOWN_DETECTOR -> "detector \"" + r.detector + "\" is not in the results in " + w.folder() + "; choose from "
                    + String.join(", ", r.choices);
            case NO_CAMERA -> "camera.json not found in " + w.folder()
                    + ": the camera intrinsics are needed to undistort the points and place them in depth (give --camera FILE)";
            case POSE_NOT_ESTIMABLE -> "cannot estimate the reference pose: only " + r.count + " " + r.detector
                    + " detections of the reference frame match designed features (4 non-collinear are needed); give poses.json with --poses";
            case NO_DEPTH -> "cannot place the points in depth: no poses.json in " + w.folder() + " (the reference pose)"
                    + (r.designMissing ? " and no target.json (the design, for a PnP estimate)" : "")
                    + (r.truthMissing ? " and no true feature pixels for the reference frame in " + w.truthFile() + " (to match detections to designed features)" : "")
                    + "; give --poses, or --target and --truth";
            case POSE_MISMATCH -> String.format(Locale.ROOT, "%s: pose 0 does not match the reference frame %s: designed features land a median %.1f px "
                    + "from their true pixels in %s of %s (is the first pose the reference view?)", w.posesFile(), w.referenceFrame(), r.medianPx,
                    w.truthFile(), w.folder());
        };
    }

}
