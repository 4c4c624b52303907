package org.targetbench.arm;

import java.util.List;
import java.util.Optional;

/**
 * The result of a rehearsal on the arm. Its warnings follow from the runs' flags and the configuration; {@code
 * pipeline.ArmWords} renders them.
 *
 * @param arm              the arm
 * @param handEye          the hand-eye transform the cell has (the truth of the simulation)
 * @param handEyeBelieved  the one the controller uses (with any injected error)
 * @param referenceJointsRad joints where the reference view was taught
 * @param poseMethod       how the set's reference pose was obtained
 * @param runs             every run
 * @param traces           the kept traces
 * @param advice           the gain advice, when asked for
 * @param baseToTarget     the target's pose in the base frame, 4 x 4 row major (for drawings)
 */
public record ArmRehearsalResult(ArmModel arm, HandEye handEye, HandEye handEyeBelieved, ArmRehearsalConfig config, double[] referenceJointsRad,
                                 String poseMethod, List<ArmRunResult> runs, List<ArmRunTrace> traces,
                                 Optional<GainAdvice> advice, double[] baseToTarget) {
    public ArmRehearsalResult {
        config = config.copy();
        referenceJointsRad = referenceJointsRad.clone();
        runs = List.copyOf(runs);
        traces = List.copyOf(traces);
        baseToTarget = baseToTarget.clone();
    }

    @Override public double[] baseToTarget() { return baseToTarget.clone(); }

    @Override public ArmRehearsalConfig config() { return config.copy(); }
    @Override public double[] referenceJointsRad() { return referenceJointsRad.clone(); }

    public long converged() { return runs.stream().filter(r -> r.outcome() == ArmOutcome.CONVERGED).count(); }

    public long flagged(ArmFlag f) { return runs.stream().filter(r -> r.flags().contains(f)).count(); }

    /** The run with the smallest manipulability (the worst pose), or empty. */
    public Optional<ArmRunResult> worstRun() {
        return runs.stream().min((a, b) -> Double.compare(a.minManipulability(), b.minManipulability()));
    }
}
