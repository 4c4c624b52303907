package org.targetbench.cli;

import org.targetbench.arm.ArmModel;
import org.targetbench.arm.ArmRehearsal;
import org.targetbench.arm.ArmRehearsalConfig;
import org.targetbench.arm.ArmRehearsalResult;
import org.targetbench.arm.ArmRunResult;
import org.targetbench.pipeline.ArmWords;
import org.targetbench.arm.HandEye;
import org.targetbench.export.ArmWriters;
import org.targetbench.export.AtomicOutput;
import org.targetbench.pipeline.ArmRun;
import org.targetbench.report.ArmReport;
import org.targetbench.servo.RehearsalConfig;
import org.targetbench.servo.ServoSet;
import org.targetbench.pipeline.ArmInputs;
import org.targetbench.source.JointsFile;
import org.targetbench.source.SourceException;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;

/** The arm rehearsal's steps shared by {@code rehearse --arm} and {@code demo}: read, check, run, write, print. */
final class ArmSteps {
    private ArmSteps() {}

    /** Everything read and checked before any output is opened. */
    record Prepared(ServoSet set, String setName, ArmModel arm, HandEye handEye, ArmRehearsalConfig config, List<double[]> starts, boolean advise) {}

    /** The arm options of {@code rehearse}. */
    record Options(String arm, String tip, String handEye, Path startJoints, List<Double> referenceJointsDeg, int latencyFrames, Double periodMs,
                   List<Double> handEyeError, boolean adviseGain) {}

    static Prepared prepare(ServoSet set, String setName, RehearsalConfig servo, Options o) throws SourceException {
        if (o.tip() != null && o.arm().trim().equalsIgnoreCase("demo")) throw new UserError("--tip applies to a URDF arm, not the demo arm");
        ArmInputs.Arm loaded = ArmInputs.arm(o.arm(), o.tip());
        HandEye he;
        if (o.handEye() == null) {
            if (!loaded.model().isDemo()) throw new UserError("--hand-eye FILE is needed with an arm other than the demo arm");
            he = HandEye.demo();
        } else he = ArmInputs.handEye(o.handEye());
        ArmRehearsalConfig c = new ArmRehearsalConfig();
        c.servo = servo.copy();
        if (o.periodMs() != null) {
            if (!(o.periodMs() > 0) || o.periodMs() > 1000) throw new UserError("--period-ms must be within 0..1000 ms, got " + o.periodMs());
            c.servo.dtS = o.periodMs() / 1000;
        }
        if (o.latencyFrames() < 0 || o.latencyFrames() > 100) throw new UserError("--latency-frames must be within 0..100, got " + o.latencyFrames());
        c.latencyFrames = o.latencyFrames();
        if (o.referenceJointsDeg() != null) {
            if (o.referenceJointsDeg().size() != 6) throw new UserError("--reference-joints needs 6 angles in degrees, got " + o.referenceJointsDeg().size());
            c.referenceJointsRad = o.referenceJointsDeg().stream().mapToDouble(d -> Math.toRadians(d)).toArray();
        } else if (loaded.referenceJointsRad() != null) c.referenceJointsRad = loaded.referenceJointsRad();
        if (o.handEyeError() != null) {
            if (o.handEyeError().size() != 6) throw new UserError("--hand-eye-error needs RX,RY,RZ (deg),TX,TY,TZ (mm), got " + o.handEyeError().size() + " values");
            c.handEyeErrorDeg = new double[]{o.handEyeError().get(0), o.handEyeError().get(1), o.handEyeError().get(2)};
            c.handEyeErrorMm = new double[]{o.handEyeError().get(3), o.handEyeError().get(4), o.handEyeError().get(5)};
        }
        try {
            c.checkValidity();
        } catch (IllegalArgumentException e) {
            throw new UserError(e.getMessage());
        }
        List<double[]> starts = null;
        if (o.startJoints() != null) {
            starts = JointsFile.read(o.startJoints());
            try {
                ArmRehearsal.checkStarts(loaded.model(), starts);
            } catch (IllegalArgumentException e) {
                throw new UserError(o.startJoints() + ": " + e.getMessage());
            }
        }
        return new Prepared(set, setName, loaded.model(), he, c, starts, o.adviseGain());
    }

    /** Runs and writes the arm outputs under {@code prefix}. */
    static ArmRehearsalResult run(Prepared p, AtomicOutput out, String prefix) throws IOException, InterruptedException {
        ArmRehearsalResult r;
        try {
            r = ArmRun.run(new ArmRun.Request(p.set(), p.arm(), p.handEye(), p.config(), p.starts(), p.advise()));
        } catch (IllegalArgumentException e) {
            throw new UserError("arm rehearsal of " + p.setName() + ": " + e.getMessage());
        }
        write(r, p.set(), p.setName(), out, prefix);
        return r;
    }

    /** Writes a rehearsal on the arm under {@code prefix}: runs, summary, hand-eye, arm (for a DH arm) and the report. */
    static void write(ArmRehearsalResult r, ServoSet set, String setName, AtomicOutput out, String prefix) throws IOException {
        ArmWriters.writeRuns(r, out.file(prefix + "arm-rehearsal.csv"));
        ArmWriters.writeSummary(r, out.file(prefix + "arm-rehearsal-summary.json"));
        ArmWriters.writeHandEye(r.handEye(), out.file(prefix + "handeye.json"));
        if (!r.arm().dh().isEmpty()) ArmWriters.writeArm(r.arm(), r.referenceJointsRad(), out.file(prefix + "arm.json"));
        ArmReport.write(r, set, setName, out, prefix);
    }

    static void print(ArmRehearsalResult r, PrintWriter w) {
        var c = r.config();
        w.printf(Locale.ROOT, "Rehearsal on the arm %s: %d starts, law %s, lambda %.3g 1/s, period %.0f ms, latency %d periods%n", r.arm().name(),
                r.runs().size(), c.servo.law.cliName(), c.servo.lambda, c.servo.dtS * 1000, c.latencyFrames);
        w.printf(Locale.ROOT, "  converged            %d of %d%n", r.converged(), r.runs().size());
        r.worstRun().ifPresent(x -> w.printf(Locale.ROOT, "  smallest manipulability %.3g in run %d at %.2f s%n", x.minManipulability(), x.index(),
                x.minManipulabilityTimeS()));
        ArmRunResult tight = r.runs().stream().min((a, b) -> Double.compare(a.minLimitMarginDeg(), b.minLimitMarginDeg())).orElse(null);
        if (tight != null) w.printf(Locale.ROOT, "  smallest limit margin %.1f deg (joint %d, run %d)%n", tight.minLimitMarginDeg(), tight.minLimitMarginJoint(), tight.index());
        ArmRunResult fast = r.runs().stream().max((a, b) -> Double.compare(a.peakSpeedRatio(), b.peakSpeedRatio())).orElse(null);
        if (fast != null) w.printf(Locale.ROOT, "  peak joint speed     %.0f %% of its limit (joint %d, run %d)%n", 100 * fast.peakSpeedRatio(), fast.peakSpeedJoint(), fast.index());
        r.advice().ifPresent(a -> w.println("  gain advice          " + ArmWords.advice(a)));
        for (String s : ArmWords.warnings(r)) w.println("Warning: " + s);
        w.println("Not modelled: " + ArmWords.NOT_MODELLED);
    }
}
