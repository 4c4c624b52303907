package org.targetbench.source;

import java.util.List;
import java.util.Optional;

/** Frames already in memory, delivered as a {@link FrameSource} (for runs over frames a screen or a run holds). */
public final class FrameList implements FrameSource {
    private final String description;
    private final List<SourceFrame> frames;
    private final String reference;
    private int next;

    /** @param reference the name of the reference frame */
    public FrameList(String description, List<SourceFrame> frames, String reference) {
        if (frames.isEmpty()) throw new IllegalArgumentException("a frame list needs at least one frame");
        this.description = description;
        this.frames = List.copyOf(frames);
        this.reference = reference;
    }

    /** Reads a whole source into memory. */
    public static List<SourceFrame> readAll(FrameSource source) throws SourceException {
        List<SourceFrame> out = new java.util.ArrayList<>();
        Optional<SourceFrame> f;
        while ((f = source.next()).isPresent()) out.add(f.get());
        return out;
    }

    @Override public String description() { return description; }
    @Override public int width() { return frames.get(0).image().width; }
    @Override public int height() { return frames.get(0).image().height; }
    @Override public int frameCount() { return frames.size(); }
    @Override public String referenceName() { return reference; }
    @Override public Optional<SourceFrame> next() { return next < frames.size() ? Optional.of(frames.get(next++)) : Optional.empty(); }
    @Override public void close() { next = frames.size(); }
}
