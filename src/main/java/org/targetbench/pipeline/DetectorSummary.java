package org.targetbench.pipeline;

import org.targetbench.detect.DetectorType;
import org.targetbench.score.LocalisationResult;

import java.util.OptionalDouble;

/**
 * One detector over a whole run.
 *
 * @param meanRepeatability mean over frames where repeatability is defined (empty when none)
 * @param minRepeatability  worst frame
 * @param framesScored      frames with a defined repeatability
 * @param meanCount         mean detections per frame
 * @param localisation      pooled over all frames with true feature positions (empty result when none)
 * @param meanHullFraction  mean convex-hull area fraction
 * @param meanOccupancy     mean 4x4 cell occupancy
 * @param meanMillisPerFrame mean wall time of detection per frame, milliseconds (for orientation only; the bench
 *                          command measures speed properly)
 */
public record DetectorSummary(DetectorType detector, OptionalDouble meanRepeatability, OptionalDouble minRepeatability,
                              int framesScored, double meanCount, LocalisationResult localisation,
                              double meanHullFraction, double meanOccupancy, double meanMillisPerFrame) {}
