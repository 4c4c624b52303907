package org.targetbench.app;

import java.util.Map;
import java.util.Optional;
import java.util.OptionalLong;
import java.util.TreeMap;

/**
 * The pacing of playback, without threads or a clock of its own (both are the caller's, so it is tested with a fake
 * clock): tick {@code k} of playback is due at {@code start + k / fps} and shows frame {@code (first + k) mod n} (without
 * looping, playback ends after the last frame). A worker prepares ticks ahead of time ({@link #nextToPrepare}, at most
 * {@link #AHEAD} ahead of the clock; one already overdue is skipped for the one due now), and the event-dispatch thread
 * shows only the newest prepared tick that is due ({@link #take}). A frame of the clip that is never shown is dropped,
 * whoever was too slow, and counted ({@link #dropped}). What is shown carries its own frame index, so the counter drawn
 * with it always names the picture.
 *
 * @param <T> what a prepared frame is (the picture with its detections)
 */
final class Playback<T> {
    /** Ticks the worker may prepare ahead of the clock. */
    static final int AHEAD = 2;

    /** A frame to show: its tick, its index in the source and what was prepared for it. */
    record Shown<T>(long tick, int index, T frame) {}

    private final int frameCount, first;
    private final boolean loop;
    private final long startNanos;
    private final double periodNanos;
    private final TreeMap<Long, T> ready = new TreeMap<>();
    /** The latest tick handed to a worker (workers may share a playback: each tick is handed out once). */
    private long lastClaimed = -1, lastShown = -1;
    private long dropped;
    private long shown;
    private boolean stopped;

    /**
     * @param frameCount frames in the source, at least 1
     * @param fps        playback rate, frames per second, > 0
     * @param first      index of the frame shown at tick 0
     * @param loop       start again at frame 0 after the last frame
     * @param startNanos the clock's reading at tick 0, nanoseconds
     */
    Playback(int frameCount, double fps, int first, boolean loop, long startNanos) {
        if (frameCount < 1) throw new IllegalArgumentException("playback needs a frame, got " + frameCount);
        if (!(fps > 0) || !Double.isFinite(fps)) throw new IllegalArgumentException("fps must be > 0, got " + fps);
        if (first < 0 || first >= frameCount) throw new IllegalArgumentException("first frame " + first + " is not within 0.." + (frameCount - 1));
        this.frameCount = frameCount;
        this.first = first;
        this.loop = loop;
        this.startNanos = startNanos;
        this.periodNanos = 1e9 / fps;
    }

    /** The source index shown at a tick. */
    int indexOf(long tick) { return (int) ((first + tick) % frameCount); }

    /** The tick due at a clock reading (-1 before the start). */
    long dueTick(long nowNanos) {
        return nowNanos < startNanos ? -1 : (long) Math.floor((nowNanos - startNanos) / periodNanos);
    }

    /** When a tick is due, clock nanoseconds. */
    long dueNanos(long tick) { return startNanos + (long) Math.ceil(tick * periodNanos); }

    private boolean exists(long tick) { return loop || first + tick < frameCount; }

    /**
     * The tick a worker should prepare next, handed out once: the one after the last handed out, or the one due now when that is later
     * (ticks in between are overdue and will be dropped). Empty when it would run more than {@link #AHEAD} ticks ahead of
     * the clock (ask again at {@link #dueNanos} of the tick {@code AHEAD} before it), after the last frame, or once stopped.
     */
    synchronized OptionalLong nextToPrepare(long nowNanos) {
        if (stopped) return OptionalLong.empty();
        long t = Math.max(lastClaimed + 1, dueTick(nowNanos));
        if (!loop && lastClaimed + 1 < frameCount - first) t = Math.min(t, frameCount - first - 1); // the last frame is always shown
        if (!exists(t) || t > dueTick(nowNanos) + AHEAD) return OptionalLong.empty();
        lastClaimed = t;
        return OptionalLong.of(t);
    }

    /** True when nothing is left to prepare: stopped, or past the last frame without looping. */
    synchronized boolean preparedAll() { return stopped || !exists(lastClaimed + 1); }

    /** The worker's prepared frame for a tick. */
    synchronized void prepared(long tick, T frame) {
        if (stopped || tick <= lastShown) return; // too late: a newer frame is already on screen
        ready.put(tick, frame);
    }

    /**
     * The newest prepared frame that is due, if it is newer than the one shown; older prepared frames are discarded.
     * Every tick between the last shown and this one is counted as dropped.
     */
    synchronized Optional<Shown<T>> take(long nowNanos) {
        Map.Entry<Long, T> e = ready.floorEntry(dueTick(nowNanos));
        if (e == null) return Optional.empty();
        long tick = e.getKey();
        ready.headMap(tick, true).clear();
        dropped += tick - lastShown - 1;
        lastShown = tick;
        shown++;
        return Optional.of(new Shown<>(tick, indexOf(tick), e.getValue()));
    }

    /** True when the last frame has been shown (never, while looping). */
    synchronized boolean finished() { return !loop && first + lastShown + 1 >= frameCount; }

    /** Frames of the clip not shown so far. */
    synchronized long dropped() { return dropped; }

    /** Frames shown so far. */
    synchronized long shownCount() { return shown; }

    synchronized void stop() {
        stopped = true;
        ready.clear();
    }

    synchronized boolean stopped() { return stopped; }
}
