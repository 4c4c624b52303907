package org.targetbench.camera;

import org.targetbench.target.TargetDesign;

import java.util.List;

/**
 * The feasibility line for dot designs: the worst perspective bias of the imaged dot centres ({@link DotBias}) over
 * the square-on view and the tilted views of the check. It warns above the threshold and never fails: the bias is a
 * known, computable offset (and can be corrected when the pose is known), not a reason the camera cannot see the dots.
 */
public final class DotBiasCheck {
    private DotBiasCheck() {}

    /** The line, from the poses and their labels as {@link Feasibility} tries them. */
    public static FeasibilityReport.Check check(TargetDesign design, CameraModel camera, List<Pose> poses, List<String> labels,
                                                double maxBiasPx) {
        double worst = 0;
        String where = labels.get(0);
        for (int i = 0; i < poses.size(); i++) {
            double b = DotBias.worst(design, camera, poses.get(i));
            if (b > worst) { worst = b; where = labels.get(i); }
        }
        FeasibilityReport.Status s = worst > maxBiasPx ? FeasibilityReport.Status.WARN : FeasibilityReport.Status.PASS;
        return new FeasibilityReport.Check("dot centre bias", s, worst, "px",
                Feasibility.fmt(worst, 3) + " px between the imaged dot centre and the projected centre (worst: " + where + ")",
                "<= " + Feasibility.fmt(maxBiasPx, 2) + " px (a warning at most; correctable when the pose is known)",
                "derived: centre of the image conic H^-T C H^-1 against H c (Heikkila 2000); the threshold is a rule of thumb, common practice, no source");
    }
}
