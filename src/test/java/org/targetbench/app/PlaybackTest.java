package org.targetbench.app;

import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.OptionalLong;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Playback pacing on a fake clock, with a simulated worker and a simulated event-dispatch thread: what is shown always
 * carries its own frame (counter == picture), frames come in order, and frames that are never shown are counted as
 * dropped whichever side is too slow. No real time is involved.
 */
class PlaybackTest {
    static final double FPS = 30;
    static final long PERIOD = Math.round(1e9 / FPS);
    /** The frames each prepared frame carries: its own index, as the picture would. */
    static final int FRAMES = 90;

    /** A run of the simulation: the ticks shown, and the pacing's counters at the end. */
    record Run(List<Playback.Shown<Integer>> shown, long dropped, boolean finished) {}

    static Run simulate(long prepareNs, long pollNs, boolean loop, int first, long steps) {
        return simulate(1, prepareNs, pollNs, loop, first, steps);
    }

    /**
     * Simulates {@code steps} clock steps of 1/10 period: each of {@code workers} workers needs {@code prepareNs} per
     * frame, the display looks for a frame every {@code pollNs}.
     */
    static Run simulate(int workers, long prepareNs, long pollNs, boolean loop, int first, long steps) {
        long start = 1_000_000;
        Playback<Integer> p = new Playback<>(FRAMES, FPS, first, loop, start);
        List<Playback.Shown<Integer>> shown = new ArrayList<>();
        long[] busyUntil = new long[workers], working = new long[workers];
        java.util.Arrays.fill(working, -1);
        long nextPoll = start;
        for (long now = start; now < start + steps * PERIOD / 10; now += PERIOD / 10) {
            for (int w = 0; w < workers; w++) {
                if (working[w] >= 0 && now >= busyUntil[w]) {
                    p.prepared(working[w], p.indexOf(working[w])); // the picture of the frame it was asked for
                    working[w] = -1;
                }
                if (working[w] < 0) {
                    OptionalLong t = p.nextToPrepare(now);
                    if (t.isPresent()) {
                        working[w] = t.getAsLong();
                        busyUntil[w] = now + prepareNs;
                    }
                }
            }
            if (now >= nextPoll) {
                p.take(now).ifPresent(shown::add);
                nextPoll = now + pollNs;
            }
            if (p.finished()) break;
        }
        return new Run(shown, p.dropped(), p.finished());
    }

    static void assertCounterMatchesPicture(Run r) {
        long last = -1;
        for (var s : r.shown()) {
            assertEquals(s.index(), (int) s.frame(), "tick " + s.tick() + ": the counter names the frame shown");
            assertTrue(s.tick() > last, "ticks only move forward");
            last = s.tick();
        }
    }

    /** Ticks skipped between shown frames (and before the first), which the pacing must have counted. */
    static long gaps(Run r) {
        long last = -1, gaps = 0;
        for (var s : r.shown()) {
            gaps += s.tick() - last - 1;
            last = s.tick();
        }
        return gaps;
    }

    @Test
    void aFastWorkerAndDisplayShowEveryFrameInOrder() {
        Run r = simulate(PERIOD / 3, PERIOD / 10, false, 0, 200 * 10);
        assertCounterMatchesPicture(r);
        assertTrue(r.finished());
        assertEquals(FRAMES, r.shown().size());
        assertEquals(0, r.dropped());
        for (int i = 0; i < FRAMES; i++) assertEquals(i, r.shown().get(i).index());
    }

    @Test
    void aSlowDisplayDropsFramesAndCountsThem() {
        // the display comes round only every 3 periods: two of every three frames are never shown
        Run r = simulate(PERIOD / 3, 3 * PERIOD, false, 0, 200 * 10);
        assertCounterMatchesPicture(r);
        assertTrue(r.finished());
        assertEquals(gaps(r), r.dropped());
        assertEquals(FRAMES, r.shown().size() + r.dropped(), "every frame is shown or counted as dropped");
        assertTrue(r.dropped() >= 50, "dropped " + r.dropped());
    }

    @Test
    void aSlowWorkerSkipsOverdueFramesAndTheyAreCounted() {
        // preparing a frame takes 2.5 periods: the worker skips to the frame due now, the others are dropped
        Run r = simulate(5 * PERIOD / 2, PERIOD / 10, false, 0, 400 * 10);
        assertCounterMatchesPicture(r);
        assertTrue(r.finished());
        assertEquals(gaps(r), r.dropped());
        assertEquals(FRAMES, r.shown().size() + r.dropped());
        assertTrue(r.dropped() >= FRAMES / 2, "dropped " + r.dropped());
    }

    @Test
    void twoWorkersKeepUpWhereOneCannot() {
        // preparing takes 1.5 periods: one worker shows about two frames in three, two workers nearly all
        Run one = simulate(1, 3 * PERIOD / 2, PERIOD / 10, false, 0, 400 * 10);
        Run two = simulate(2, 3 * PERIOD / 2, PERIOD / 10, false, 0, 400 * 10);
        assertCounterMatchesPicture(one);
        assertCounterMatchesPicture(two);
        assertEquals(FRAMES, one.shown().size() + one.dropped());
        assertEquals(FRAMES, two.shown().size() + two.dropped());
        assertTrue(one.dropped() >= FRAMES / 4, "one worker dropped " + one.dropped());
        assertTrue(two.dropped() <= 2, "two workers dropped " + two.dropped() + " (only while starting)");
    }

    @Test
    void loopingWrapsToTheFirstFrameAndNeverFinishes() {
        Run r = simulate(PERIOD / 3, PERIOD / 10, true, 85, 20 * 10);
        assertCounterMatchesPicture(r);
        assertFalse(r.finished());
        assertEquals(85, r.shown().get(0).index());
        assertEquals(0, r.shown().get(5).index(), "after frame 89 comes frame 0");
        assertEquals(0, r.dropped());
    }

    @Test
    void theWorkerStaysAFewFramesAheadAtMost() {
        Playback<Integer> p = new Playback<>(FRAMES, FPS, 0, false, 0);
        for (int i = 0; i <= Playback.AHEAD; i++) {
            OptionalLong t = p.nextToPrepare(0);
            assertEquals(i, t.orElseThrow());
            p.prepared(t.getAsLong(), i);
        }
        assertTrue(p.nextToPrepare(0).isEmpty(), "no further ahead than AHEAD ticks");
        assertEquals(0, (int) p.take(0).orElseThrow().frame(), "only the frame due now is shown");
        assertTrue(p.take(0).isEmpty());
        assertEquals(2, (int) p.take(p.dueNanos(2)).orElseThrow().frame(), "the newest due frame; the one before it is dropped");
        assertEquals(1, p.dropped());
    }

    @Test
    void theSessionMovesCounterAndPictureTogether() throws Exception {
        javax.swing.SwingUtilities.invokeAndWait(() -> {
            Session s = new Session();
            List<org.targetbench.source.SourceFrame> frames = new ArrayList<>();
            for (int i = 0; i < 4; i++)
                frames.add(new org.targetbench.source.SourceFrame(i, "frame_00" + i + ".png", new boofcv.struct.image.GrayF32(8, 8),
                        org.targetbench.source.FrameTruth.none()));
            s.setSource("four frames", frames, "frame_000.png");
            List<String> seen = new ArrayList<>();
            s.addListener(c -> seen.add(c + " " + s.frameIndex() + " " + (s.detections() == null ? "-" : s.detections().frameIndex())));
            s.showPlayed(new Session.FrameDetections(2, frames.get(2).image(), java.util.Map.of(), java.util.Map.of()));
            assertEquals(List.of("FRAME 2 2", "DETECTIONS 2 2"), seen, "both changes see the frame index and its detections agree");
        });
    }
}
