package org.targetbench.source;

import java.util.Optional;

/** A source that hands on another source's frames and properties; a subclass changes {@link #next()} only. */
public abstract class ForwardingSource implements FrameSource {
    /** The source handed on. */
    protected final FrameSource source;

    protected ForwardingSource(FrameSource source) { this.source = source; }

    @Override public String description() { return source.description(); }
    @Override public int width() { return source.width(); }
    @Override public int height() { return source.height(); }
    @Override public int frameCount() { return source.frameCount(); }
    @Override public String referenceName() { return source.referenceName(); }
    @Override public int skippedFrames() { return source.skippedFrames(); }
    @Override public Optional<String> endNote() { return source.endNote(); }
    @Override public void close() { source.close(); }
}
