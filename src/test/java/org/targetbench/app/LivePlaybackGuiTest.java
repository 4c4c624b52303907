package org.targetbench.app;

import org.assertj.swing.edt.GuiActionRunner;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Playback in the live view: while it plays, the frame counter, the frame index and the detections drawn always name
 * the same frame, and the dropped count is shown; pausing scores the shown frame with every detector again. No timing
 * is asserted (speed is the benchmark's business); the pacing itself is tested on a fake clock in PlaybackTest.
 */
class LivePlaybackGuiTest extends GuiTestBase {
    static final long WAIT_MS = 120_000;

    @BeforeAll
    static void open() throws Exception {
        start(WAIT_MS);
    }

    /** On the event-dispatch thread: the label's "k/n", the session's frame and the detections' frame agree. */
    static void assertCounterMatchesPicture() {
        GuiActionRunner.execute(() -> {
            Session s = workbench.session();
            String label = window.label("play.label").target().getText().trim();
            int k = Integer.parseInt(label.substring(0, label.indexOf('/')));
            assertEquals(s.frameIndex() + 1, k, label);
            if (s.detections() != null && s.playing()) assertEquals(s.frameIndex(), s.detections().frameIndex(), "the picture is the counted frame");
            return null;
        });
    }

    @Test
    void playbackShowsTheCountedFrameAndSaysWhatItDropped() {
        waitFor("demo scored", () -> workbench.session().frames().size() == 12 && workbench.session().detections() != null);
        GuiActionRunner.execute(() -> workbench.live().togglePlay());
        assertTrue(GuiActionRunner.execute(() -> workbench.session().playing()));
        long seen = 0;
        for (int i = 0; i < 30; i++) {
            long at = seen;
            waitFor("another frame shown", () -> workbench.live().playCounts()[0] > at);
            seen = GuiActionRunner.execute(() -> workbench.live().playCounts()[0]);
            assertCounterMatchesPicture();
        }
        // read together on the event-dispatch thread: the label says what the playback counted
        String[] said = GuiActionRunner.execute(() -> {
            long[] c = workbench.live().playCounts();
            return new String[]{window.label("play.dropped").target().getText(), "dropped " + c[1] + (c[1] == 1 ? " frame" : " frames") + " of " + (c[0] + c[1])};
        });
        assertTrue(said[0].contains(said[1]), said[0] + " / " + said[1]);
        GuiActionRunner.execute(() -> workbench.live().togglePlay());
        assertFalse(GuiActionRunner.execute(() -> workbench.session().playing()));
        int at = GuiActionRunner.execute(() -> workbench.session().frameIndex());
        waitFor("paused frame scored by every detector", () -> workbench.session().detections() != null
                && workbench.session().detections().frameIndex() == at
                && workbench.session().detections().points().size() == org.targetbench.detect.DetectorType.values().length);
        assertCounterMatchesPicture();
    }
}
