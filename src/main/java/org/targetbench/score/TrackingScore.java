package org.targetbench.score;

import org.targetbench.track.TrackOutcome;

import java.util.Map;
import java.util.OptionalInt;

/**
 * Tracking figures of a whole run ({@link TrackingMetrics}).
 *
 * @param frames             frames processed
 * @param firstFrame         index of the first frame (where the initial set started)
 * @param lastFrame          index of the last frame
 * @param initialTracks      tracks started on the first frame
 * @param tracksStarted      all tracks started, respawned ones included
 * @param aliveAtEnd         tracks alive after the last frame
 * @param survivalAtEnd      fraction of the initial set alive after the last frame (NaN without an initial set)
 * @param survivalAtFrame    the frame asked for by the survival-at setting
 * @param survivalAtN        fraction of the initial set alive after that frame; NaN when the run ended before it
 * @param medianLifetime     frames from the first frame until half of the initial set had died; empty while more than
 *                           half outlived the run (the lifetime is then longer than the run)
 * @param ended              tracks ended, by outcome (every loss outcome listed, zeros included)
 * @param forwardBackward    forward-backward errors of every tracked step, pixels
 * @param drift              endpoint error against truth pooled over frames and tracks, pixels
 * @param framesWithTruth    frames on which drift could be measured
 * @param jitter             per-track position standard deviation over static segments, pixels, one value per track
 *                           and segment
 * @param staticFrames       frames that truth (or the user) marked as not moved since the previous frame
 */
public record TrackingScore(int frames, int firstFrame, int lastFrame, int initialTracks, int tracksStarted, int aliveAtEnd,
                            double survivalAtEnd, int survivalAtFrame, double survivalAtN, OptionalInt medianLifetime,
                            Map<TrackOutcome, Integer> ended, Distribution forwardBackward, Distribution drift,
                            int framesWithTruth, Distribution jitter, int staticFrames) {
    public TrackingScore {
        ended = Map.copyOf(ended);
    }
}
