package org.targetbench.pipeline;

import org.targetbench.arm.ArmModel;
import org.targetbench.arm.ArmRehearsal;
import org.targetbench.arm.ArmRehearsalConfig;
import org.targetbench.arm.ArmRehearsalResult;
import org.targetbench.arm.GainAdvice;
import org.targetbench.arm.HandEye;
import org.targetbench.servo.ServoSet;

import java.util.List;

/**
 * The rehearsal on the arm, shared by the CLI, the demo and the app: the set, the arm, the hand-eye, the starts
 * (joint vectors, or null for the servo envelope) and, when asked, the gain sweep.
 */
public final class ArmRun {
    /** Gains swept for the advice, as fractions of the delay bound's gain (common practice, no source: a coarse grid). */
    public static final double[] SWEEP_FRACTIONS = {0.05, 0.1, 0.15, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1.0, 1.1};

    /** What to run. */
    public record Request(ServoSet set, ArmModel arm, HandEye handEye, ArmRehearsalConfig config, List<double[]> startJointsRad, boolean advise) {}

    private ArmRun() {}

    /** @throws IllegalArgumentException for starts outside the limits, a reference the arm cannot hold, unreachable starts */
    public static ArmRehearsalResult run(Request q) throws InterruptedException {
        if (!q.advise()) return ArmRehearsal.run(q.set(), q.arm(), q.handEye(), q.config(), q.startJointsRad());
        double bound = GainAdvice.boundOnGain(q.config().latencyFrames) / q.config().servo.dtS;
        double[] lambdas = new double[SWEEP_FRACTIONS.length];
        for (int i = 0; i < lambdas.length; i++) lambdas[i] = SWEEP_FRACTIONS[i] * bound;
        return ArmRehearsal.runWithAdvice(q.set(), q.arm(), q.handEye(), q.config(), q.startJointsRad(), lambdas);
    }
}
