package org.targetbench.app;

import boofcv.struct.image.GrayF32;
import org.junit.jupiter.api.Test;
import org.targetbench.score.Distribution;
import org.targetbench.score.FrameTracking;
import org.targetbench.source.ImageFiles;
import org.targetbench.track.TrackFrame;
import org.targetbench.track.TrackOutcome;
import org.targetbench.track.TrackPoint;

import java.awt.image.BufferedImage;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.*;

/** What the Track view shows at a frame of a finished run, from the run's rows alone. */
class TrackHistoryTest {
    static final long SEED = 14;

    /** Three tracks over six frames: 1 lives throughout, 2 leaves the image on frame 2, 3 starts on frame 3. */
    private static TrackHistory run() {
        TrackHistory h = new TrackHistory();
        for (int f = 0; f < 6; f++) {
            List<TrackPoint> rows = new ArrayList<>();
            rows.add(new TrackPoint(1, f, 10 + f, 20, f == 0 ? TrackOutcome.STARTED : TrackOutcome.TRACKED, 0.01));
            if (f < 2) rows.add(new TrackPoint(2, f, 50, 20 + f, f == 0 ? TrackOutcome.STARTED : TrackOutcome.TRACKED, 0.02));
            if (f == 2) rows.add(new TrackPoint(2, f, 50, 23, TrackOutcome.LEFT_IMAGE, Double.NaN));
            if (f >= 3) rows.add(new TrackPoint(3, f, 30, 30 - f, f == 3 ? TrackOutcome.STARTED : TrackOutcome.TRACKED, 0.03));
            h.frame(new TrackFrame(f, rows, f < 2 ? 2 : f == 2 ? 1 : 2, f < 2 ? 2 : 1), new FrameTracking(f, 1, 2, Distribution.EMPTY, false));
        }
        return h;
    }

    @Test
    void aFrameShowsItsLiveTracksTheirTrailsAndEveryEndSoFar() {
        TrackHistory h = run();
        TrackHistory.Scene at1 = h.scene(1, 40);
        assertEquals(List.of(1, 2), at1.live().stream().map(TrackPoint::trackId).toList());
        assertTrue(at1.ended().isEmpty());
        TrackHistory.Scene at4 = h.scene(4, 3);
        assertEquals(List.of(1, 3), at4.live().stream().map(TrackPoint::trackId).toList());
        assertEquals(1, at4.ended().size());
        assertEquals(TrackOutcome.LEFT_IMAGE, at4.ended().get(0).outcome());
        assertEquals(2, at4.ended().get(0).frame());
        // trails cover the last 3 frames (2..4) of each live track, ending where it is on frame 4
        assertEquals(3, at4.trails().get(1).size());
        assertArrayEquals(new double[]{14, 20}, at4.trails().get(1).get(2), 0);
        assertEquals(2, at4.trails().get(3).size(), "track 3 started on frame 3");
        assertFalse(at4.trails().containsKey(2), "ended tracks have no trail");
        assertThrows(IllegalArgumentException.class, () -> h.scene(6, 40));
    }

    @Test
    void keptFramesAreTheDisplayConversionOfTheFrame() {
        Random r = new Random(SEED);
        GrayF32 img = new GrayF32(37, 23);
        for (int i = 0; i < img.data.length; i++) img.data[i] = (float) (r.nextDouble() * 300 - 20); // some out of range
        BufferedImage fast = TrackHistory.grey8(img), ref = ImageFiles.toBuffered(img);
        for (int y = 0; y < img.height; y++)
            for (int x = 0; x < img.width; x++) assertEquals(ref.getRaster().getSample(x, y, 0), fast.getRaster().getSample(x, y, 0), x + "," + y);
        GrayF32 sub = img.subimage(3, 4, 20, 15); // a view into a larger image
        BufferedImage subFast = TrackHistory.grey8(sub), subRef = ImageFiles.toBuffered(sub);
        for (int y = 0; y < sub.height; y++)
            for (int x = 0; x < sub.width; x++) assertEquals(subRef.getRaster().getSample(x, y, 0), subFast.getRaster().getSample(x, y, 0));
    }
}
