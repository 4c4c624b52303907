package org.targetbench.pipeline;

import org.targetbench.camera.CameraModel;
import org.targetbench.camera.DotBias;
import org.targetbench.camera.Pose;
import org.targetbench.perturb.Perturbation;
import org.targetbench.target.TargetDesign;

import java.util.ArrayList;
import java.util.List;

/**
 * The perspective bias of the dots ({@link DotBias}) for the views of a run, one row per view: how far the centre of
 * each imaged dot lies from the image of the dot's centre, which is what the truth and the localisation scores use.
 * Written beside compare and sweep results for dot designs as {@code dot-bias.csv}.
 */
public final class DotBiasTable {
    private DotBiasTable() {}

    /**
     * One view's figures.
     *
     * @param frame        the view's name
     * @param extraTiltDeg the sweep's added tilt, degrees (0 for compare and untilted views)
     * @param dots         dots whose centre is in the image
     * @param meanBiasPx   mean bias over them, pixels
     * @param worstBiasPx  largest bias, pixels
     */
    public record Row(String frame, double extraTiltDeg, int dots, double meanBiasPx, double worstBiasPx) {}

    /** One row per pose; empty when the design has no dots. */
    public static List<Row> forPoses(TargetDesign design, CameraModel camera, List<String> names, List<Pose> poses) {
        if (names.size() != poses.size()) throw new IllegalArgumentException("need one name per pose, got " + names.size() + " and " + poses.size());
        List<Row> out = new ArrayList<>();
        if (!DotBias.hasDots(design)) return out;
        for (int i = 0; i < poses.size(); i++) out.add(row(design, camera, names.get(i), 0, poses.get(i)));
        return out;
    }

    /**
     * One row per rendered base frame and per tilt level of the sweep (only the untilted view when the sweep has no
     * tilt); empty for frames that were not rendered from a design or a design without dots.
     */
    public static List<Row> forSweep(SweepBase base, SweepConfig config) {
        List<Row> out = new ArrayList<>();
        if (base.scene().isEmpty() || !DotBias.hasDots(base.scene().get().design())) return out;
        SweepBase.Scene s = base.scene().get();
        double[] tilts = config.parameters.contains(Perturbation.TILT) ? config.valuesOf(Perturbation.TILT) : new double[]{0};
        for (SweepBase.BaseFrame f : base.frames()) {
            if (f.facing().isEmpty()) continue;
            for (double t : tilts) out.add(row(s.design(), s.camera(), f.name(), t, f.facing().get().pose(s.design(), t)));
        }
        return out;
    }

    /** Largest bias over the rows, pixels; NaN when there are none. */
    public static double worst(List<Row> rows) {
        double w = Double.NaN;
        for (Row r : rows) if (r.dots() > 0 && !(r.worstBiasPx() <= w)) w = r.worstBiasPx();
        return w;
    }

    private static Row row(TargetDesign d, CameraModel c, String name, double tilt, Pose pose) {
        List<DotBias.DotView> v = DotBias.view(d, c, pose);
        double sum = 0, worst = 0;
        for (DotBias.DotView x : v) { sum += x.biasPx(); worst = Math.max(worst, x.biasPx()); }
        return new Row(name, tilt, v.size(), v.isEmpty() ? Double.NaN : sum / v.size(), v.isEmpty() ? Double.NaN : worst);
    }
}
