package org.targetbench.arm;

import org.targetbench.servo.RehearsalConfig;

import java.util.Arrays;

/**
 * Settings of a rehearsal on the arm. The servo side (law, gain, noise, convergence, envelope, seed, starts) is a
 * {@link RehearsalConfig}; its {@code dtS} is the controller period.
 */
public final class ArmRehearsalConfig {
    /** Servo settings; {@code servo.dtS} is the controller period, seconds. */
    public RehearsalConfig servo = new RehearsalConfig();
    /** The image used by the law is this many control periods old, 0..100. */
    public int latencyFrames = 0;
    /** Largest damping factor μ0 of damped least squares, &gt;= 0 (same units as J: metres and radians). */
    public double dampingMax = 0.05;
    /** Manipulability below which damping starts, &gt; 0 (units of w for the arm: m³ for a 6-joint arm). */
    public double dampingThreshold = 0.004;
    /** Manipulability below which a pose counts as singular for the flags, &gt;= 0. */
    public double singularThreshold = 5e-4;
    /** Injected hand-eye rotation error, rotation vector in the camera frame, degrees. */
    public double[] handEyeErrorDeg = {0, 0, 0};
    /** Injected hand-eye translation error, millimetres in the flange frame. */
    public double[] handEyeErrorMm = {0, 0, 0};
    /** Error norm growth over this many consecutive periods flags an oscillation, &gt;= 2. */
    public int oscillationPeriods = 4;
    /** Reference joints (where the reference view was taught), radians; null = the arm's default. */
    public double[] referenceJointsRad;
    /** A converged run whose joints differ from the reference by more than this counts as another configuration, degrees. */
    public double configurationTolDeg = 0.5;

    public void checkValidity() {
        if (servo == null) throw new IllegalArgumentException("servo settings must be set");
        servo.checkValidity();
        if (latencyFrames < 0 || latencyFrames > 100) throw new IllegalArgumentException("latency must be within 0..100 periods, got " + latencyFrames);
        if (!(dampingMax >= 0) || !Double.isFinite(dampingMax)) throw new IllegalArgumentException("damping must be >= 0, got " + dampingMax);
        if (!(dampingThreshold > 0) || !Double.isFinite(dampingThreshold)) throw new IllegalArgumentException("damping threshold must be > 0, got " + dampingThreshold);
        if (!(singularThreshold >= 0)) throw new IllegalArgumentException("singular threshold must be >= 0, got " + singularThreshold);
        if (handEyeErrorDeg == null || handEyeErrorDeg.length != 3 || handEyeErrorMm == null || handEyeErrorMm.length != 3)
            throw new IllegalArgumentException("hand-eye error needs 3 rotation and 3 translation values");
        for (double v : handEyeErrorDeg) if (!Double.isFinite(v) || Math.abs(v) > 90) throw new IllegalArgumentException("hand-eye rotation error must be within ±90 deg, got " + Arrays.toString(handEyeErrorDeg));
        for (double v : handEyeErrorMm) if (!Double.isFinite(v) || Math.abs(v) > 1000) throw new IllegalArgumentException("hand-eye translation error must be within ±1000 mm, got " + Arrays.toString(handEyeErrorMm));
        if (oscillationPeriods < 2) throw new IllegalArgumentException("oscillation periods must be >= 2, got " + oscillationPeriods);
        if (referenceJointsRad != null && referenceJointsRad.length != ArmModel.JOINTS)
            throw new IllegalArgumentException("reference joints need 6 values, got " + referenceJointsRad.length);
        if (!(configurationTolDeg > 0)) throw new IllegalArgumentException("configuration tolerance must be > 0 deg, got " + configurationTolDeg);
    }

    public ArmRehearsalConfig copy() {
        ArmRehearsalConfig c = new ArmRehearsalConfig();
        c.servo = servo.copy();
        c.latencyFrames = latencyFrames;
        c.dampingMax = dampingMax;
        c.dampingThreshold = dampingThreshold;
        c.singularThreshold = singularThreshold;
        c.handEyeErrorDeg = handEyeErrorDeg.clone();
        c.handEyeErrorMm = handEyeErrorMm.clone();
        c.oscillationPeriods = oscillationPeriods;
        c.referenceJointsRad = referenceJointsRad == null ? null : referenceJointsRad.clone();
        c.configurationTolDeg = configurationTolDeg;
        return c;
    }

    /** Damping schedule of [Nakamura & Hanafusa 1986]: μ² = μ0² (1 - w/w0)² below w0, else 0 (from memory). */
    public double dampingSquared(double w) {
        if (w >= dampingThreshold) return 0;
        double f = 1 - w / dampingThreshold;
        return dampingMax * dampingMax * f * f;
    }
}
