package org.targetbench.pipeline;

import org.targetbench.detect.DetectorType;
import org.targetbench.perturb.Perturbation;

import java.util.OptionalDouble;

/**
 * One cell of a sweep for one detector: a base frame degraded by one parameter at one level.
 *
 * @param repeatability    against the same detector on the unperturbed frame (empty when undefined)
 * @param localisationPx   RMS distance of found true features, pixels (NaN without truth or when none was found)
 * @param count            points detected on the perturbed frame
 * @param coverage         fraction of the 4 x 4 image cells holding a point
 * @param kltSurvival      share of KLT tracks started at the detector's points that survive a short slow motion
 *                         degraded the same way (NaN when tracking was not asked for)
 */
public record SweepRow(DetectorType detector, Perturbation parameter, int level, double value, int frame,
                       OptionalDouble repeatability, double localisationPx, int count, double coverage, double kltSurvival) {}
