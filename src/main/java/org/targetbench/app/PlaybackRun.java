package org.targetbench.app;

import org.targetbench.detect.DetectorConfig;
import org.targetbench.perturb.Perturbation;
import org.targetbench.source.SourceFrame;

import javax.swing.SwingUtilities;
import javax.swing.Timer;
import java.util.List;
import java.util.OptionalLong;
import java.util.concurrent.locks.LockSupport;
import java.util.function.LongSupplier;

/**
 * One playback of the loaded frames: worker threads prepare frames ahead of time (the previewed degradation and the
 * drawn detectors' points and figures; the frames themselves were decoded when the source was loaded), paced by
 * {@link Playback}, and a Swing timer shows on the event-dispatch thread only the newest prepared frame that is due,
 * frame index and detections together ({@link Session#showPlayed}). Frames that could not be shown in time are dropped
 * and counted. Only the drawn detectors run while playing (pausing scores the frame with all of them again), so three
 * detectors keep up with a 30 fps clip where the machine allows; where it does not, the count of dropped frames says so.
 */
final class PlaybackRun {
    /** How often the event-dispatch thread looks for a due frame, at most, milliseconds. */
    static final int POLL_MS = 4;

    private final Session session;
    private final Playback<Session.FrameDetections> pacing;
    private final Timer timer;
    /** Workers preparing frames side by side (each with its own detectors): two where the machine has two cores. */
    static final int WORKERS = Math.max(1, Math.min(2, Runtime.getRuntime().availableProcessors()));

    private final List<Thread> workers = new java.util.ArrayList<>();
    private final Runnable onEnd, onShown;
    private final java.util.function.Consumer<String> onFailure;
    private final LongSupplier clock = System::nanoTime;

    /**
     * @param fps     playback rate, frames per second
     * @param onShown called on the event-dispatch thread after each shown frame (to update the dropped count)
     * @param onEnd     called on the event-dispatch thread when playback ends by itself (the end without looping, a failure)
     * @param onFailure called on the event-dispatch thread with the reason when preparing a frame failed
     */
    PlaybackRun(Session session, double fps, boolean loop, Runnable onShown, Runnable onEnd, java.util.function.Consumer<String> onFailure) {
        this.session = session;
        this.onFailure = onFailure;
        this.onShown = onShown;
        this.onEnd = onEnd;
        int n = session.frames().size();
        int first = session.frameIndex() + 1 < n ? session.frameIndex() + 1 : 0;
        pacing = new Playback<>(n, fps, first, loop, clock.getAsLong());
        List<SourceFrame> frames = List.copyOf(session.frames());
        SourceFrame ref = session.reference();
        List<DetectorConfig> configs = session.configs().stream().filter(c -> session.shown().contains(c.type())).toList();
        int version = session.configVersion();
        Perturbation p = session.degrade();
        double value = session.degradeValue();
        for (int i = 0; i < WORKERS; i++) {
            Thread w = new Thread(() -> prepare(frames, ref, configs, version, p, value), "targetbench-playback-" + i);
            w.setDaemon(true);
            workers.add(w);
        }
        timer = new Timer(Math.max(1, Math.min(POLL_MS, (int) (250 / fps))), e -> show());
    }

    void start() {
        session.setPlaying(true);
        workers.forEach(Thread::start);
        timer.start();
    }

    /** Stops playback; the frame shown stays, and is scored again by every detector. */
    void stop() {
        pacing.stop();
        timer.stop();
        workers.forEach(LockSupport::unpark); // a waiting worker sees the stop at once; a busy one after its frame
        session.setPlaying(false);
    }

    long dropped() { return pacing.dropped(); }

    long shown() { return pacing.shownCount(); }

    private void prepare(List<SourceFrame> frames, SourceFrame ref, List<DetectorConfig> configs, int version, Perturbation p, double value) {
        DetectionRunner.Scorer scorer = new DetectionRunner.Scorer();
        while (!pacing.stopped()) {
            long now = clock.getAsLong();
            OptionalLong t = pacing.nextToPrepare(now);
            if (t.isEmpty()) {
                if (pacing.preparedAll()) return;
                // too far ahead: wait until the clock catches up by a tick
                long wake = pacing.dueNanos(pacing.dueTick(now) + 1);
                LockSupport.parkNanos(Math.max(100_000, wake - now));
                continue;
            }
            int index = pacing.indexOf(t.getAsLong());
            try {
                pacing.prepared(t.getAsLong(), scorer.detect(frames.get(index), ref, index, configs, version, p, value));
            } catch (RuntimeException e) {
                failure = e.getMessage() == null ? e.toString() : e.getMessage();
                pacing.stop(); // the display thread ends playback and says why
                return;
            }
        }
    }

    /** Why a worker stopped playback, or null. */
    private volatile String failure;

    private void show() {
        if (!SwingUtilities.isEventDispatchThread()) return;
        if (failure != null) {
            String why = failure;
            failure = null;
            stop();
            onEnd.run();
            onFailure.accept(why);
            return;
        }
        if (pacing.stopped()) return;
        pacing.take(clock.getAsLong()).ifPresent(s -> {
            session.showPlayed(s.frame());
            onShown.run();
        });
        if (pacing.finished()) {
            stop();
            onEnd.run();
        }
    }
}
