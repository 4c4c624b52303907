package org.targetbench.source;

import org.targetbench.track.TrackScenes;

import java.awt.image.BufferedImage;

/**
 * A simulated camera for tests: delivers {@code frames} images of a slowly moving texture, then behaves as if
 * unplugged (returns null, or throws when {@code failHard}). With an interval it paces its images as a real camera
 * does (one every {@code intervalMs} ms); without, it delivers as fast as asked.
 */
public final class FakeCamera implements Camera {
    private final int width, height, frames;
    private final boolean failHard;
    private final long intervalMs;
    private long nextAt;
    private int delivered;
    private boolean closed;
    /** Images shown in turn instead of the moving texture (a rendered target), or null. */
    private final java.util.List<BufferedImage> scene;

    public FakeCamera(int width, int height, int frames, boolean failHard) {
        this(width, height, frames, failHard, 0);
    }

    public FakeCamera(int width, int height, int frames, boolean failHard, long intervalMs) {
        this(width, height, frames, failHard, intervalMs, null);
    }

    /** A camera that shows {@code scene}'s images in turn (e.g. renders of a target as the camera moves). */
    public FakeCamera(java.util.List<BufferedImage> scene, int frames, long intervalMs) {
        this(scene.get(0).getWidth(), scene.get(0).getHeight(), frames, false, intervalMs, java.util.List.copyOf(scene));
    }

    private FakeCamera(int width, int height, int frames, boolean failHard, long intervalMs, java.util.List<BufferedImage> scene) {
        this.scene = scene;
        this.intervalMs = intervalMs;
        this.width = width;
        this.height = height;
        this.frames = frames;
        this.failHard = failHard;
    }

    @Override public String name() { return "simulated camera"; }
    @Override public int width() { return width; }
    @Override public int height() { return height; }

    @Override
    public BufferedImage grab() throws InterruptedException {
        if (intervalMs > 0) {
            long now = System.nanoTime();
            if (nextAt > now) Thread.sleep((nextAt - now) / 1_000_000, (int) ((nextAt - now) % 1_000_000));
            nextAt = Math.max(now, nextAt) + intervalMs * 1_000_000;
        }
        if (closed) return null;
        if (delivered >= frames) {
            if (failHard) throw new IllegalStateException("device /dev/video0 vanished");
            return null;
        }
        if (scene != null) return scene.get(delivered++ % scene.size());
        return ImageFiles.toBuffered(TrackScenes.texture(width, height, 5, 0.5 * delivered++, 0.25 * delivered));
    }

    public boolean closed() { return closed; }

    @Override public void close() { closed = true; }
}
