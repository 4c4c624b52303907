package org.targetbench.arm;

/**
 * Time series of one run on the arm, for charts and checks. Arrays are indexed by kept step.
 *
 * @param timeS          time, seconds
 * @param errorPx        true image error, px RMS
 * @param jointsDeg      joints[j][i]: joint j (0..5) at kept step i, degrees
 * @param manipulability w at each kept step
 * @param marginDeg      smallest distance of any joint to a limit, degrees
 * @param cameraXMm      camera centre in the reference camera frame, millimetres (as the free-flying rehearsal)
 */
public record ArmRunTrace(int index, ArmOutcome outcome, double[] timeS, double[] errorPx, double[][] jointsDeg, double[] manipulability,
                          double[] marginDeg, double[] cameraXMm, double[] cameraYMm, double[] cameraZMm) {}
