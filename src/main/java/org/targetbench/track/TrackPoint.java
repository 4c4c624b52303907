package org.targetbench.track;

/**
 * One track on one frame.
 *
 * @param trackId   track number, unique within a run, in order of starting
 * @param frame     0-based frame index
 * @param x         column, pixels (pixel-centre convention); on the frame a track died, where the forward track put
 *                  it (lost_fb, flat) or its last tracked position (otherwise)
 * @param y         row, pixels
 * @param outcome   what happened on this frame
 * @param fbError   forward-backward error, pixels; NaN when not measured (started, forward-backward check off, or a
 *                  track that failed before or during the backward pass)
 */
public record TrackPoint(int trackId, int frame, double x, double y, TrackOutcome outcome, double fbError) {}
