package org.targetbench.score;

import java.util.OptionalDouble;

/**
 * Repeatability of one frame against the reference.
 *
 * @param repeatability matches / min(nReference, nFrame), empty when that minimum is 0
 * @param nReference    |P'|: reference points whose image under H falls inside the frame
 * @param nFrame        |Q'|: frame points whose image under H⁻¹ falls inside the reference
 * @param nMatched      one-to-one pairs within ε
 */
public record RepeatabilityResult(OptionalDouble repeatability, int nReference, int nFrame, int nMatched) {}
