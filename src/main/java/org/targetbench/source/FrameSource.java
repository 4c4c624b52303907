package org.targetbench.source;

import java.util.Optional;

/**
 * A sequence of grey frames of one fixed size, with whatever truth the source knows.
 *
 * <p>Contract (checked for every source by one contract test): {@link #next()} returns frames with consecutive
 * indices from 0 and the advertised size, then empty forever; {@link #close()} is idempotent. A source that cannot
 * deliver a frame it promised throws {@link SourceException} with a one-line, user-facing message. A video source may
 * skip a single undecodable frame: its index is then missing from the sequence and it is counted by
 * {@link #skippedFrames()}. A live source that ends on its own (a camera unplugged) returns empty and says why in
 * {@link #endNote()}.
 */
public interface FrameSource extends AutoCloseable {
    /** Human-readable description, e.g. the folder path. */
    String description();

    int width();

    int height();

    /** Number of frames when known in advance, or -1 for live sources. */
    int frameCount();

    /** Name of the reference frame (the first one unless truth says otherwise). */
    String referenceName();

    Optional<SourceFrame> next() throws SourceException;

    /** Frames skipped so far because they could not be decoded. */
    default int skippedFrames() { return 0; }

    /** Why the source ended before it was asked to stop (for instance, the camera went away), if it did. */
    default Optional<String> endNote() { return Optional.empty(); }

    @Override
    void close();
}
