package org.targetbench.app;

import org.assertj.swing.core.BasicRobot;
import org.assertj.swing.core.Robot;
import org.assertj.swing.edt.GuiActionRunner;
import org.assertj.swing.fixture.FrameFixture;
import org.assertj.swing.timing.Condition;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

import java.awt.GraphicsEnvironment;
import java.util.function.Supplier;
import java.util.prefs.Preferences;

import static org.assertj.swing.timing.Pause.pause;
import static org.assertj.swing.timing.Timeout.timeout;
import static org.junit.jupiter.api.Assertions.*;
import static org.junit.jupiter.api.Assumptions.assumeFalse;

/**
 * Playback in the live view: while it plays, the frame counter, the frame index and the detections drawn always name
 * the same frame, and the dropped count is shown; pausing scores the shown frame with every detector again. No timing
 * is asserted (speed is the benchmark's business); the pacing itself is tested on a fake clock in PlaybackTest.
 */
class LivePlaybackGuiTest {
    static final long WAIT_MS = 120_000;
    static Robot robot;
    static FrameFixture window;
    static Workbench workbench;
    static Preferences prefs;

    @BeforeAll
    static void open() throws Exception {
        assumeFalse(GraphicsEnvironment.isHeadless(), "no display: GUI tests need one (CI runs them under Xvfb)");
        prefs = Preferences.userRoot().node("org/targetbench/playback-gui-test-" + ProcessHandle.current().pid());
        robot = BasicRobot.robotWithNewAwtHierarchy();
        workbench = WorkbenchApp.open(prefs);
        window = new FrameFixture(robot, workbench);
    }

    @AfterAll
    static void close() throws Exception {
        if (window != null) {
            GuiActionRunner.execute(() -> workbench.dispose());
            robot.waitForIdle();
            window.cleanUp();
        }
        if (prefs != null) prefs.removeNode();
    }

    static void waitFor(String what, Supplier<Boolean> test) {
        pause(new Condition(what) {
            @Override public boolean test() { return GuiActionRunner.execute(test::get); }
        }, timeout(WAIT_MS));
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
