package org.targetbench.source;

import boofcv.struct.image.GrayF32;

import java.awt.image.BufferedImage;
import java.util.Optional;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;

/**
 * Frames from a live camera ({@link Webcams} opens one). Live: no frame count, no truth. When the camera stops
 * delivering (it returns nothing, its driver fails, or no image arrives within {@link #FRAME_TIMEOUT_S} s) the
 * source ends cleanly, keeping what was delivered, and {@link #endNote()} says so. Colour images become BT.601 luma.
 * Frames are named {@code frame_000.png}, ... in order of arrival.
 */
public final class WebcamSource implements FrameSource {
    /** Longest wait for one image before the camera counts as gone, seconds. */
    public static final long FRAME_TIMEOUT_S = 5;

    private final Camera camera;
    private final String description;
    private final ExecutorService grabber;
    private int nextIndex;
    private boolean ended;
    private String endNote;

    public WebcamSource(Camera camera, String description) {
        this.camera = camera;
        this.description = description;
        this.grabber = Executors.newSingleThreadExecutor(r -> {
            Thread t = new Thread(r, "targetbench-camera");
            t.setDaemon(true);
            return t;
        });
    }

    @Override public String description() { return description; }
    @Override public int width() { return camera.width(); }
    @Override public int height() { return camera.height(); }
    @Override public int frameCount() { return -1; }
    @Override public String referenceName() { return SyntheticSource.frameName(0); }
    @Override public Optional<String> endNote() { return Optional.ofNullable(endNote); }

    @Override
    public Optional<SourceFrame> next() {
        if (ended) return Optional.empty();
        BufferedImage bi;
        try {
            Future<BufferedImage> f = grabber.submit(camera::grab);
            bi = f.get(FRAME_TIMEOUT_S, TimeUnit.SECONDS);
        } catch (TimeoutException e) {
            return end("no image from " + camera.name() + " for " + FRAME_TIMEOUT_S + " s after " + nextIndex + " frames; the camera stopped responding");
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            return end("interrupted after " + nextIndex + " frames");
        } catch (Exception e) {
            Throwable c = e.getCause() != null ? e.getCause() : e;
            return end(camera.name() + " failed after " + nextIndex + " frames (" + ImageFiles.oneLine(c) + "); the camera was disconnected or stopped");
        }
        if (bi == null) return end(camera.name() + " stopped delivering images after " + nextIndex + " frames; the camera was disconnected or closed");
        if (bi.getWidth() != camera.width() || bi.getHeight() != camera.height())
            return end(camera.name() + " changed its image size to " + bi.getWidth() + "x" + bi.getHeight() + " after " + nextIndex + " frames");
        GrayF32 img = ImageFiles.toGray(bi);
        int i = nextIndex++;
        return Optional.of(new SourceFrame(i, SyntheticSource.frameName(i), img, FrameTruth.none()));
    }

    private Optional<SourceFrame> end(String note) {
        endNote = note;
        close();
        return Optional.empty();
    }

    @Override
    public void close() {
        if (ended) return;
        ended = true;
        grabber.shutdownNow();
        try {
            camera.close();
        } catch (RuntimeException | LinkageError ignored) {
            // a camera that vanished may fail to close; there is nothing left to release
        }
    }
}
