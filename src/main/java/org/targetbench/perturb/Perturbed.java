package org.targetbench.perturb;

import boofcv.struct.image.GrayF32;
import org.targetbench.camera.Homography;

/**
 * A perturbed frame.
 *
 * @param image    the degraded frame, 8-bit grey levels 0..255
 * @param warp     maps pixels of the input frame to pixels of {@code image} (identity for photometric perturbations)
 */
public record Perturbed(GrayF32 image, Homography warp) {}
