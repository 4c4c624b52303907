package org.targetbench.score;

/**
 * Localisation error of detections against true feature positions.
 *
 * @param nTrue        true features in the frame
 * @param nFound       true features with a detection within the search radius
 * @param foundFraction nFound / nTrue (NaN when nTrue is 0)
 * @param rmsPx        RMS distance over found features, pixels (NaN when none found)
 * @param medianPx     median distance, pixels
 * @param p95Px        95th percentile distance (nearest rank), pixels
 */
public record LocalisationResult(int nTrue, int nFound, double foundFraction, double rmsPx, double medianPx, double p95Px) {}
