package org.targetbench.score;

/**
 * Tracking figures of one frame.
 *
 * @param frame         0-based frame index
 * @param aliveFraction fraction of the first frame's tracks still alive after this frame
 * @param alive         all tracks alive after this frame (respawned ones included)
 * @param drift         endpoint error of this frame's tracked points against truth, pixels (empty without truth)
 * @param isStatic      truth (or the user) says nothing moved since the previous frame
 */
public record FrameTracking(int frame, double aliveFraction, int alive, Distribution drift, boolean isStatic) {}
