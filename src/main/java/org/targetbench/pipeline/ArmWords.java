package org.targetbench.pipeline;

import org.targetbench.arm.ArmFlag;
import org.targetbench.arm.ArmModel;
import org.targetbench.arm.ArmRehearsalResult;
import org.targetbench.arm.ArmRunResult;
import org.targetbench.arm.GainAdvice;
import org.targetbench.arm.HandEyeCalibration;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Every sentence about an arm rehearsal, rendered from its typed results (flags, outcomes, configuration, advice) in one
 * place beside {@link Reasons}, for the console, the files and the workbench alike.
 */
public final class ArmWords {
    /** What the arm rehearsal does not model; shown beside the usual safety notice. */
    public static final String NOT_MODELLED = "This arm rehearsal is kinematic only: it models no dynamics, no payload, no collisions with "
            + "the cell and none of the robot controller's own limits or filters. Its flags are warnings, never a clearance; rehearse "
            + "on the real robot at reduced speed with the enabling device and emergency stop within reach and nobody in the cell.";

    private ArmWords() {}

    /** A flag in plain words. */
    public static String flag(ArmFlag f) {
        return switch (f) {
            case JOINT_LIMIT_REACHED -> "joint limit reached";
            case WRIST_SINGULARITY_CROSSED -> "wrist singularity crossed";
            case DAMPING_ACTIVE -> "damped near a singularity";
            case SPEED_LIMITED_MOST -> "speed-limited for most of the run";
            case OSCILLATION -> "oscillation (the image error grew for several periods in a row)";
            case TARGET_LEFT_VIEW -> "target left the view";
            case OTHER_CONFIGURATION -> "reached the same camera view in another joint configuration";
        };
    }

    /** Warnings over all runs, derived from the runs' flags and the configuration. */
    public static List<String> warnings(ArmRehearsalResult r) {
        List<String> w = new ArrayList<>();
        int n = r.runs().size();
        if (r.arm().isDemo()) w.add("The arm is the invented demo arm, not a model of any real robot.");
        long lim = r.flagged(ArmFlag.JOINT_LIMIT_REACHED);
        if (lim > 0) w.add(lim + " of " + n + " runs drove a joint into its limit; a real controller stops there. Teach the reference "
                + "further from the limits or narrow the starts.");
        long sing = r.flagged(ArmFlag.WRIST_SINGULARITY_CROSSED);
        if (sing > 0) w.add(sing + " of " + n + " runs crossed or touched the wrist singularity (joints 4 and 6 aligned): the joint "
                + "speeds for a modest camera turn blow up there, and the rehearsal had to damp them.");
        long speed = r.flagged(ArmFlag.SPEED_LIMITED_MOST);
        if (speed > 0) w.add(speed + " of " + n + " runs were speed-limited for most of the run: the camera moved slower than the law asked.");
        long osc = r.flagged(ArmFlag.OSCILLATION);
        if (osc > 0) w.add(String.format(Locale.ROOT, "%d of %d runs oscillated: at latency %d periods the gain %.3g 1/s is too high "
                + "(the bound for this latency is %.3g 1/s).", osc, n, r.config().latencyFrames, r.config().servo.lambda,
                GainAdvice.boundOnGain(r.config().latencyFrames) / r.config().servo.dtS));
        long view = r.flagged(ArmFlag.TARGET_LEFT_VIEW);
        if (view > 0) w.add(view + " of " + n + " runs lost the target out of the view.");
        for (ArmRunResult run : r.runs())
            if (run.flags().contains(ArmFlag.OTHER_CONFIGURATION)) {
                w.add(otherConfiguration(run, r.referenceJointsRad()));
                break;
            }
        if (r.config().latencyFrames > 0)
            w.add(String.format(Locale.ROOT, "The image used by the law was %d controller periods (%.0f ms) old.", r.config().latencyFrames,
                    r.config().latencyFrames * r.config().servo.dtS * 1000));
        double[] he = r.config().handEyeErrorDeg, hm = r.config().handEyeErrorMm;
        if (norm(he) > 0 || norm(hm) > 0)
            w.add(String.format(Locale.ROOT, "The controller used a hand-eye transform off by %.2f deg and %.1f mm from the simulated mount.", norm(he), norm(hm)));
        return w;
    }

    /** The plain-word sentence for a run that converged in another joint configuration. */
    public static String otherConfiguration(ArmRunResult run, double[] ref) {
        double[] q = run.finalJointsRad();
        StringBuilder b = new StringBuilder(String.format(Locale.ROOT,
                "Run %d: the arm reached the same camera pose (within %.3f mm and %.4f deg) in another joint configuration:", run.index(),
                run.cameraErrorMm(), run.cameraErrorDeg()));
        for (int i = 0; i < ArmModel.JOINTS; i++) {
            double d = Math.toDegrees(q[i] - ref[i]);
            if (Math.abs(d) > 0.01) b.append(String.format(Locale.ROOT, " joint %d %+.2f deg", i + 1, d));
        }
        double d4 = Math.toDegrees(q[3] - ref[3]), d6 = Math.toDegrees(q[5] - ref[5]);
        if (Math.abs(d4) > 0.01 && Math.abs(d6) > 0.01 && Math.abs(d4 + d6) < 0.05 * Math.max(Math.abs(d4), Math.abs(d6)))
            b.append(" from the reference. Joints 4 and 6 turn about the same line at the wrist singularity, so only their sum "
                    + "moves the camera there and they can end at equal and opposite offsets.");
        else b.append(" from the reference.");
        return b.toString();
    }

    /** One run's flags, comma separated, or "none". */
    public static String flags(ArmRunResult run) {
        if (run.flags().isEmpty()) return "none";
        List<String> s = new ArrayList<>();
        for (ArmFlag f : ArmFlag.values()) if (run.flags().contains(f)) s.add(flag(f));
        return String.join(", ", s);
    }

    /** The gain advice in one sentence. */
    public static String advice(GainAdvice a) {
        String best = Double.isNaN(a.bestLambda()) ? "no swept gain converged from every start without oscillation"
                : String.format(Locale.ROOT, "the largest swept gain that converged from every start without oscillation is %.3g 1/s (g = lambda T = %.3g)",
                a.bestLambda(), a.bestLambda() * a.periodS());
        return String.format(Locale.ROOT, "At latency %d periods of %.0f ms %s; the stability bound of the delayed loop is g < 2 cos(d pi/(2d+1)) = %.3f, "
                        + "lambda < %.3g 1/s (Levin & May 1976).", a.latencyFrames(), a.periodS() * 1000, best, GainAdvice.boundOnGain(a.latencyFrames()),
                a.boundLambda());
    }

    /** Why a hand-eye calibration could not be made, in one line; {@code where} names the poses file, or null. */
    public static String handEyeFailure(HandEyeCalibration.Outcome o, String where) {
        return switch (o.failure()) {
            case TOO_FEW_VIEWS -> "hand-eye calibration needs at least 3 views with flange poses and target poses, got " + o.views()
                    + (where == null ? "" : " in " + where);
            case ONE_ROTATION_AXIS -> "degenerate hand-eye views: every flange rotation between views is about one axis ("
                    + (Double.isNaN(o.axisSpreadDeg()) ? "no view pair rotates more than " + HandEyeCalibration.MIN_ROTATION_DEG + " deg"
                    : String.format(Locale.ROOT, "their axes spread by %.2f deg", o.axisSpreadDeg()))
                    + "); tilt the flange about at least two different axes between views (Tsai & Lenz 1989)";
            case NO_SOLUTION -> "hand-eye calibration failed: " + o.detail();
        };
    }

    private static double norm(double[] v) { return Math.sqrt(v[0] * v[0] + v[1] * v[1] + v[2] * v[2]); }
}
