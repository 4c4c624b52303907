package org.targetbench.servo;

/**
 * One rehearsed run.
 *
 * @param index             run number, 0-based
 * @param start             the start pose's offset from the reference camera pose
 * @param outcome           how it ended
 * @param timeS             time to converge, or time when it ended otherwise, seconds
 * @param steps             control steps taken
 * @param initialErrorPx    true image error at the start, RMS over points of the distance to the reference pixel
 * @param finalErrorPx      the same at the end
 * @param maxRetreatMm      how far the camera moved back along the reference optical axis beyond both its start and the
 *                          reference position, millimetres (0 when it never did): the unwanted retreat of the
 *                          current-L law under rotation about the optical axis
 * @param minPlaneDistanceM smallest distance of the camera centre from the target plane, metres
 * @param maxDepthRatio     largest distance from the target plane divided by the reference distance
 * @param lostPoint         id of the point that was lost (out of view or track dropped), -1 for none
 * @param redrawnStarts     start poses drawn before this one and discarded because a point was out of view
 */
public record RunResult(int index, StartOffset start, RunOutcome outcome, double timeS, int steps, double initialErrorPx,
                        double finalErrorPx, double maxRetreatMm, double minPlaneDistanceM, double maxDepthRatio, int lostPoint,
                        int redrawnStarts) {

    /**
     * A start pose relative to the reference camera pose: translation along and rotation vector about the reference
     * camera's axes (x right, y down, z along the optical axis).
     *
     * @param txMm translation, millimetres
     * @param rxDeg rotation vector components (axis times angle), degrees
     */
    public record StartOffset(double txMm, double tyMm, double tzMm, double rxDeg, double ryDeg, double rzDeg) {
        /** Length of the translation, millimetres. */
        public double translationMm() { return Math.sqrt(txMm * txMm + tyMm * tyMm + tzMm * tzMm); }

        /** Rotation angle, degrees. */
        public double rotationDeg() { return Math.sqrt(rxDeg * rxDeg + ryDeg * ryDeg + rzDeg * rzDeg); }
    }
}
