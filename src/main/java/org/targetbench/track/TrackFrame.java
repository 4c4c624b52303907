package org.targetbench.track;

import java.util.List;

/**
 * What the tracker reports for one frame.
 *
 * @param frame        0-based frame index
 * @param points       one row per track that was alive on entering the frame (tracked, or the row where it died),
 *                     then one per track started on this frame
 * @param alive        tracks alive after this frame
 * @param initialAlive tracks of the first frame's set still alive after this frame
 */
public record TrackFrame(int frame, List<TrackPoint> points, int alive, int initialAlive) {
    public TrackFrame {
        points = List.copyOf(points);
    }
}
