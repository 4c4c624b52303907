package org.targetbench.cli;

import org.targetbench.formats.ServoSetReader;
import org.targetbench.export.AtomicOutput;
import org.targetbench.export.Safety;
import org.targetbench.servo.ControlLaw;
import org.targetbench.servo.DepthMode;
import org.targetbench.servo.RehearsalConfig;
import org.targetbench.servo.RehearsalResult;
import org.targetbench.servo.ServoSet;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;

@Command(name = "rehearse", mixinStandardHelpOptions = true,
        description = {"Rehearses a servo set in simulation before any robot moves: the closed loop v = -lambda L^+ (s - s*) "
                + "from many start poses, with the real intrinsics and distortion, pixel noise and depth errors.",
                "Writes rehearsal.csv (one row per run), rehearsal-summary.json, three PNG charts and rehearsal.html."})
final class RehearseCommand implements Callable<Integer> {
    @Spec CommandSpec spec;

    @Option(names = "--set", required = true, paramLabel = "FILE", description = "Servo set, servo-set.json or servo-set.csv.")
    Path set;

    @Option(names = "--out", required = true, paramLabel = "DIR", description = "Output folder, written atomically.")
    Path out;

    @Option(names = "--starts", paramLabel = "N", defaultValue = "200", description = "Monte-Carlo start poses, 1..100000 (default: ${DEFAULT-VALUE}).")
    int starts;

    @Option(names = "--lambda", paramLabel = "L", defaultValue = "0.5", description = "Control gain, 1/s, > 0 (default: ${DEFAULT-VALUE}).")
    double lambda;

    @Option(names = "--law", paramLabel = "LAW", defaultValue = "averaged",
            description = "Interaction matrix L in v = -lambda L+ (s - s*) (Chaumette & Hutchinson 2006): current (L at the current view and depth "
                    + "estimates), reference (the set's own L*, constant) or averaged (the mean of the two) (default: ${DEFAULT-VALUE}).")
    String law;

    @Option(names = "--depth", paramLabel = "MODE", description = "Depths the controller believes: true, constant (Z*) or scaled (Z* x --depth-error) (default: true, or scaled when --depth-error is given).")
    String depth;

    @Option(names = "--depth-error", paramLabel = "F", description = "Factor on Z* for --depth scaled, > 0 (1.2 = the controller thinks the target is 20 %% further).")
    Double depthError;

    @Option(names = "--noise", paramLabel = "PX", description = "Pixel noise standard deviation, >= 0 (default: each point's measured jitter, 0 where not measured).")
    Double noise;

    @Option(names = "--envelope", paramLabel = "T,R|TX,TY,TZ,RX,RY,RZ", split = ",",
            description = "Start envelope: +- millimetres along and +- degrees about the reference camera's x, y, z axes; two values apply to all axes (default: 20,20,20,10,10,20).")
    List<Double> envelope;

    @Option(names = "--dt", paramLabel = "S", defaultValue = "0.01", description = "Control period, seconds (default: ${DEFAULT-VALUE}).")
    double dt;

    @Option(names = "--timeout", paramLabel = "S", defaultValue = "20", description = "Time limit of one run, seconds (default: ${DEFAULT-VALUE}).")
    double timeout;

    @Option(names = "--seed", paramLabel = "N", defaultValue = "1", description = "Random seed (default: ${DEFAULT-VALUE}).")
    long seed;

    /** The law's name, with the old spellings (desired, mean) mapped to the new ones and noted on stderr. */
    private String newLawName(String name) {
        String n = name.trim().toLowerCase(java.util.Locale.ROOT);
        String now = n.equals("desired") ? "reference" : n.equals("mean") ? "averaged" : null;
        if (now == null) return name;
        OldSpelling.note(spec, "--law " + n, "--law " + now);
        return now;
    }

    @Option(names = "--arm", paramLabel = "demo|ARM.json|ROBOT.urdf", description = "Rehearse on a six-axis arm with the camera on its flange: "
            + "the invented demo arm, an arm.json (DH) or a URDF file. Without it the camera flies free.")
    String arm;

    @Option(names = "--tip", paramLabel = "LINK", description = "URDF link that carries the camera mount (default: the chain's only leaf).")
    String tip;

    @Option(names = "--hand-eye", paramLabel = "FILE|demo", description = "handeye.json: the camera pose in the flange frame (demo: the demo mount, default with the demo arm).")
    String handEye;

    @Option(names = "--start-joints", paramLabel = "FILE", description = "CSV of start joints, six angles in degrees per row (default: starts drawn from --envelope).")
    Path startJoints;

    @Option(names = "--reference-joints", paramLabel = "Q1,..,Q6", split = ",", description = "Joints where the reference view was taught, degrees (default: from arm.json, or the demo arm's).")
    List<Double> referenceJoints;

    @Option(names = "--latency-frames", paramLabel = "N", defaultValue = "0", description = "The image used by the law is N controller periods old (default: ${DEFAULT-VALUE}).")
    int latencyFrames;

    @Option(names = "--period-ms", paramLabel = "T", description = "Controller period, milliseconds (with --arm; default: --dt).")
    Double periodMs;

    @Option(names = "--hand-eye-error", paramLabel = "RX,RY,RZ,TX,TY,TZ", split = ",", description = "Hand-eye error the controller believes: rotation vector, degrees, and translation, mm.")
    List<Double> handEyeError;

    @Option(names = "--gain-sweep", description = "With --arm: sweep the gain and report the largest that converges from every start without oscillation.")
    boolean gainSweep;

    @Override
    public Integer call() throws Exception {
        RehearsalConfig c = config();
        ServoSet s = ServoSetReader.read(set);
        ServoSteps.checkSet(s, set.toString());
        if (arm != null) return callArm(c, s);
        RehearsalResult r;
        try (AtomicOutput output = AtomicOutput.open(out)) {
            r = ServoSteps.rehearse(s, set.toString(), c, output, "");
            output.commit();
        }
        PrintWriter w = spec.commandLine().getOut();
        ServoSteps.printRehearsal(r, set.toString(), w);
        w.println();
        w.println("Written to " + out.toAbsolutePath().normalize() + ": rehearsal.csv, rehearsal-summary.json, rehearsal.html and 3 charts");
        w.println("Safety: " + Safety.NOTICE);
        w.flush();
        return 0;
    }

    private int callArm(RehearsalConfig c, ServoSet s) throws Exception {
        ArmSteps.Prepared p = ArmSteps.prepare(s, set.toString(), c, new ArmSteps.Options(arm, tip, handEye, startJoints, referenceJoints,
                latencyFrames, periodMs, handEyeError, gainSweep));
        org.targetbench.arm.ArmRehearsalResult r;
        try (AtomicOutput output = AtomicOutput.open(out)) {
            r = ArmSteps.run(p, output, "");
            output.commit();
        }
        PrintWriter w = spec.commandLine().getOut();
        ArmSteps.print(r, w);
        w.println();
        w.println("Written to " + out.toAbsolutePath().normalize() + ": arm-rehearsal.html, arm-rehearsal.csv, arm-rehearsal-summary.json, handeye.json and 4 images");
        w.println("Safety: " + Safety.NOTICE);
        w.flush();
        return 0;
    }

    RehearsalConfig config() {
        RehearsalConfig c = new RehearsalConfig();
        if (!(lambda > 0) || !Double.isFinite(lambda)) throw new UserError("--lambda must be > 0 1/s, got " + lambda);
        if (starts < 1 || starts > 100_000) throw new UserError("--starts must be within 1..100000, got " + starts);
        c.starts = starts;
        c.lambda = lambda;
        try {
            c.law = ControlLaw.parse(newLawName(law));
            c.depthMode = depth != null ? DepthMode.parse(depth) : depthError != null ? DepthMode.SCALED : DepthMode.TRUE;
        } catch (IllegalArgumentException e) {
            throw new UserError(e.getMessage());
        }
        if (depthError != null) {
            if (!(depthError > 0) || !Double.isFinite(depthError)) throw new UserError("--depth-error must be > 0, got " + depthError);
            if (c.depthMode != DepthMode.SCALED) throw new UserError("--depth-error needs --depth scaled, got --depth " + depth);
            c.depthErrorFactor = depthError;
        }
        if (noise != null) {
            if (!(noise >= 0) || !Double.isFinite(noise)) throw new UserError("--noise must be >= 0 px, got " + noise);
            c.noiseSigmaPx = noise;
        }
        if (envelope != null) {
            if (envelope.size() != 2 && envelope.size() != 6)
                throw new UserError("--envelope takes 2 values (mm,deg) or 6 (tx,ty,tz mm, rx,ry,rz deg), got " + envelope.size());
            double[] v = envelope.stream().mapToDouble(Double::doubleValue).toArray();
            c.envelopeMm = v.length == 2 ? new double[]{v[0], v[0], v[0]} : new double[]{v[0], v[1], v[2]};
            c.envelopeDeg = v.length == 2 ? new double[]{v[1], v[1], v[1]} : new double[]{v[3], v[4], v[5]};
        }
        c.dtS = dt;
        c.timeoutS = timeout;
        c.seed = seed;
        try {
            c.checkValidity();
        } catch (IllegalArgumentException e) {
            throw new UserError(e.getMessage());
        }
        return c;
    }
}
