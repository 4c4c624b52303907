package org.targetbench.arm;

import java.util.Set;

/**
 * One run on the arm.
 *
 * @param index              run number
 * @param startJointsRad     start joints, radians
 * @param outcome            how it ended
 * @param timeS              time to converge or to the end, seconds
 * @param steps              control periods taken
 * @param initialErrorPx     true image error at the start, px RMS
 * @param finalErrorPx       the same at the end
 * @param minManipulability  smallest w = sqrt(det J Jᵀ) along the run
 * @param minManipulabilityTimeS when it occurred, seconds
 * @param worstJointsRad     joints at that moment
 * @param minLimitMarginDeg  smallest distance of any joint to a limit along the run, degrees
 * @param minLimitMarginJoint which joint (1..6)
 * @param peakSpeedRatio     largest |q̇i| / q̇i,max along the run (1 = at the limit)
 * @param peakSpeedJoint     which joint (1..6)
 * @param dampedS            time with damped least squares active, seconds
 * @param speedScaledS       time with joint speeds scaled to their limits, seconds
 * @param finalJointsRad     joints at the end
 * @param cameraErrorMm      distance of the final camera pose from the reference camera pose, millimetres
 * @param cameraErrorDeg     rotation between them, degrees
 * @param flags              warnings, never clearances
 */
public record ArmRunResult(int index, double[] startJointsRad, ArmOutcome outcome, double timeS, int steps, double initialErrorPx,
                           double finalErrorPx, double minManipulability, double minManipulabilityTimeS, double[] worstJointsRad,
                           double minLimitMarginDeg, int minLimitMarginJoint, double peakSpeedRatio, int peakSpeedJoint, double dampedS,
                           double speedScaledS, double[] finalJointsRad, double cameraErrorMm, double cameraErrorDeg, Set<ArmFlag> flags) {
    public ArmRunResult {
        startJointsRad = startJointsRad.clone();
        worstJointsRad = worstJointsRad.clone();
        finalJointsRad = finalJointsRad.clone();
        flags = Set.copyOf(flags);
    }

    @Override public double[] startJointsRad() { return startJointsRad.clone(); }
    @Override public double[] worstJointsRad() { return worstJointsRad.clone(); }
    @Override public double[] finalJointsRad() { return finalJointsRad.clone(); }
}
