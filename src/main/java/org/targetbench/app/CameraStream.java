package org.targetbench.app;

import boofcv.struct.image.GrayF32;
import org.targetbench.export.VideoWriter;
import org.targetbench.pipeline.LiveScoring;
import org.targetbench.source.FrameSource;
import org.targetbench.source.SourceException;
import org.targetbench.source.SourceFrame;

import javax.swing.SwingUtilities;
import java.io.IOException;
import java.nio.file.Path;
import java.util.Optional;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicReference;
import java.util.function.Supplier;

/**
 * One run of the live camera for {@link CameraView}: a grabbing thread that takes every image (and records it when
 * asked), a scoring thread that scores only the newest image (older ones are counted as dropped), and the rates of
 * both. What happens is told to a {@link Listener} on the event-dispatch thread.
 */
final class CameraStream {
    /** Events of a stream, each called on the event-dispatch thread. */
    interface Listener {
        /** A frame was scored. */
        void scored(CameraStream from, LiveScoring.Scored s);

        /** The recording stopped on a write error; the sentence says why. */
        void recordingFailed(String sentence);

        /** The stream has fully stopped; {@code why} is null when the user stopped it, {@code kept} the recording note or null. */
        void ended(CameraStream from, String why, String kept);
    }

    /** Quality of recordings, JPEG scale (MP4: the H.264 quantiser derived from it). */
    static final int RECORD_QUALITY = 90;
    /** Frame rate written into a recording when the camera's own has not been measured yet. */
    static final double DEFAULT_FPS = 30;
    /** Window over which the achieved rates are measured, seconds. */
    static final double RATE_WINDOW_S = 1.0;

    final FrameSource source;
    final AtomicReference<GrayF32> newest = new AtomicReference<>();
    final Rate cameraRate = new Rate(), shownRate = new Rate();
    final AtomicInteger delivered = new AtomicInteger(), dropped = new AtomicInteger();
    final Object recordLock = new Object();
    final Thread grabber, scorer;
    final AtomicInteger registeredFrames = new AtomicInteger(), triedFrames = new AtomicInteger();
    private final AppContext ctx;
    private final Supplier<LiveScoring.Registration> registrations;
    private final Listener listener;
    volatile boolean frozen, halted;
    private VideoWriter writer;
    private Path recording;
    private int recorded;

    CameraStream(FrameSource source, AppContext ctx, Supplier<LiveScoring.Registration> registrations, Listener listener) {
        this.source = source;
        this.ctx = ctx;
        this.registrations = registrations;
        this.listener = listener;
        grabber = new Thread(this::grabLoop, "targetbench-camera-grab");
        scorer = new Thread(this::scoreLoop, "targetbench-camera-score");
        grabber.setDaemon(true);
        scorer.setDaemon(true);
    }

    void begin() {
        grabber.start();
        scorer.start();
    }

    Path recording() {
        synchronized (recordLock) {
            return recording;
        }
    }

    void startRecording(Path file) throws IOException {
        double fps = cameraRate.perSecond();
        synchronized (recordLock) {
            if (writer != null) return;
            writer = VideoWriter.open(file, RECORD_QUALITY, fps >= 1 ? fps : DEFAULT_FPS);
            recording = file;
            recorded = 0;
        }
    }

    /** Finishes the recording; returns a sentence saying what was kept, or null when none was running. */
    String finishRecording() {
        synchronized (recordLock) {
            if (writer == null) return null;
            String note;
            try {
                writer.close();
                note = recorded + " frames recorded to " + recording + " and kept";
            } catch (IOException e) {
                note = "the recording " + recording + " could not be finished: " + e.getMessage();
            }
            writer = null;
            recording = null;
            return note;
        }
    }

    private void grabLoop() {
        String end = null;
        try {
            while (!halted) {
                Optional<SourceFrame> f;
                try {
                    f = source.next();
                } catch (SourceException e) {
                    end = e.getMessage();
                    break;
                }
                if (f.isEmpty()) {
                    if (!halted) end = source.endNote().orElse("the camera stopped delivering images");
                    break;
                }
                GrayF32 img = f.get().image();
                delivered.incrementAndGet();
                cameraRate.tick();
                synchronized (recordLock) {
                    if (writer != null) {
                        try {
                            writer.write(img);
                            recorded++;
                        } catch (IOException | IllegalArgumentException e) {
                            String failed = "recording stopped: " + e.getMessage();
                            try {
                                writer.close();
                            } catch (IOException ignored) {
                                // already failing; the message says so
                            }
                            writer = null;
                            recording = null;
                            SwingUtilities.invokeLater(() -> listener.recordingFailed(failed));
                        }
                    }
                }
                if (frozen) continue;
                if (newest.getAndSet(img) != null) dropped.incrementAndGet();
                synchronized (newest) {
                    newest.notifyAll();
                }
            }
        } finally {
            source.close();
            if (end != null) halt(end);
        }
    }

    private void scoreLoop() {
        int version = ctx.session().configVersion();
        LiveScoring.Registration registration = registrations.get();
        LiveScoring scoring = new LiveScoring(ctx.session().configs(), registration);
        while (!halted) {
            GrayF32 img;
            synchronized (newest) {
                while ((img = newest.getAndSet(null)) == null && !halted) {
                    try {
                        newest.wait(100);
                    } catch (InterruptedException e) {
                        return;
                    }
                }
            }
            if (img == null) return;
            if (ctx.session().configVersion() != version) {
                version = ctx.session().configVersion();
                scoring = new LiveScoring(ctx.session().configs(), registration);
            }
            LiveScoring.Scored s = scoring.score(img);
            if (s.registration() != LiveScoring.RegistrationState.NONE) triedFrames.incrementAndGet();
            if (s.registration() == LiveScoring.RegistrationState.REGISTERED) registeredFrames.incrementAndGet();
            shownRate.tick();
            SwingUtilities.invokeLater(() -> listener.scored(this, s));
        }
    }

    /** Ends the stream; {@code why} is the camera's reason when it ended on its own, null when the user stopped it. */
    void halt(String why) {
        if (halted) return;
        halted = true;
        grabber.interrupt();
        synchronized (newest) {
            newest.notifyAll();
        }
        new Thread(() -> {
            try {
                grabber.join();
                scorer.join();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
            String kept = finishRecording();
            SwingUtilities.invokeLater(() -> listener.ended(this, why, kept));
        }, "targetbench-camera-stop").start();
    }

    /** Counts events and gives their rate over the last {@link #RATE_WINDOW_S} s. */
    static final class Rate {
        private final long[] times = new long[512];
        private int n, head;

        synchronized void tick() {
            times[head] = System.nanoTime();
            head = (head + 1) % times.length;
            n = Math.min(n + 1, times.length);
        }

        synchronized double perSecond() {
            long now = System.nanoTime(), window = (long) (RATE_WINDOW_S * 1e9);
            int count = 0;
            for (int k = 0; k < n; k++) {
                long t = times[(head - 1 - k + times.length) % times.length];
                if (now - t > window) break;
                count++;
            }
            return count / RATE_WINDOW_S;
        }
    }
}
