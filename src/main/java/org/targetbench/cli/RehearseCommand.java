package org.targetbench.cli;

import org.targetbench.export.AtomicOutput;
import org.targetbench.export.Safety;
import org.targetbench.export.ServoSetFiles;
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

    @Option(names = "--law", paramLabel = "LAW", defaultValue = "mean", description = "Interaction matrix in the law: current, desired or mean (default: ${DEFAULT-VALUE}).")
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

    @Override
    public Integer call() throws Exception {
        RehearsalConfig c = config();
        ServoSet s = ServoSetFiles.read(set);
        ServoSteps.checkSet(s, set.toString());
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

    RehearsalConfig config() {
        RehearsalConfig c = new RehearsalConfig();
        if (!(lambda > 0) || !Double.isFinite(lambda)) throw new UserError("--lambda must be > 0 1/s, got " + lambda);
        if (starts < 1 || starts > 100_000) throw new UserError("--starts must be within 1..100000, got " + starts);
        c.starts = starts;
        c.lambda = lambda;
        try {
            c.law = ControlLaw.parse(law);
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
