package org.targetbench.pipeline;

import org.targetbench.score.FrameTracking;
import org.targetbench.track.TrackFrame;

import java.io.IOException;

/** Receives a tracking run frame by frame, as it happens (so long runs need no memory for their rows). */
@FunctionalInterface
public interface TrackSink {
    void frame(TrackFrame rows, FrameTracking figures) throws IOException;

    TrackSink NONE = (r, f) -> { };
}
