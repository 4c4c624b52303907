package org.targetbench.source;

import boofcv.struct.image.GrayF32;

/**
 * One frame delivered by a {@link FrameSource}.
 *
 * @param index 0-based position in the source
 * @param name  stable name of the frame (file name, or a generated name such as {@code frame_007.png})
 * @param image grey levels 0..255; owned by the receiver (sources never reuse a delivered image)
 * @param truth what is known to be true about the frame
 */
public record SourceFrame(int index, String name, GrayF32 image, FrameTruth truth) {}
