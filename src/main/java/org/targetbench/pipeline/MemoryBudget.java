package org.targetbench.pipeline;

import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.DetectorType;

import java.util.List;
import java.util.Locale;
import java.util.function.Consumer;

/**
 * Memory a run needs, estimated before it starts, so that a run too large for the heap is refused with one line (or
 * drops to one worker) instead of ending in an OutOfMemoryError.
 *
 * <p>Estimate: every worker holds its own instance of every chosen detector (they keep their scratch images between
 * frames), so a worker needs the sum of the detectors' bytes per pixel ({@link #bytesPerPixel}) times the frame's
 * pixels, plus {@code framesPerWorker} grey frames of 4 bytes per pixel in flight. The figures per detector are the
 * peak heap growth of one detection on a 2000 x 1500 frame (measured with the serial collector, garbage included, so
 * on the high side), rounded up: Harris 34, Shi-Tomasi 62, FAST 10, SURF-style 37, SIFT-style 103, dot centres 22, x-corners 54 bytes per pixel.
 * A run may use {@value #HEAP_SHARE} of the heap limit less what is already in use (the rest is slack for the
 * collector and for results).
 */
public final class MemoryBudget {
    /** Share of the heap limit a run plans to use. */
    public static final double HEAP_SHARE = 0.8;

    private static volatile Consumer<String> notices = m -> { };

    private MemoryBudget() {}

    /** Where the one-line note goes when a run drops to fewer workers. */
    public static void onNotice(Consumer<String> sink) { notices = sink; }

    /** A run that does not fit in the heap even on one worker; its message is the one line to show. */
    public static final class TooLarge extends RuntimeException {
        TooLarge(String message) { super(message); }
    }

    /** Planned workers and the memory they need, bytes. */
    public record Plan(int workers, long neededBytes, long availableBytes) {}

    /** Peak scratch memory of one detection, bytes per frame pixel (see the class comment). */
    public static int bytesPerPixel(DetectorType t) {
        return switch (t) {
            case HARRIS -> 40;
            case SHI_TOMASI -> 64;
            case FAST -> 16;
            case SURF -> 48;
            case SIFT -> 128;
            case DOTS -> 32;
            case XCORNER -> 64;
        };
    }

    /** Bytes one worker needs for frames of {@code w} x {@code h} with these detectors. */
    public static long perWorker(int w, int h, List<DetectorConfig> detectors, int framesPerWorker) {
        long perPx = 4L * framesPerWorker;
        for (DetectorConfig c : detectors) perPx += bytesPerPixel(c.type());
        return perPx * w * h;
    }

    /**
     * Workers to run with: {@code threads}, or fewer when they would not fit (with a one-line note).
     *
     * @throws TooLarge when one worker does not fit
     */
    public static Plan plan(int w, int h, List<DetectorConfig> detectors, int threads, int framesPerWorker) {
        Runtime rt = Runtime.getRuntime();
        long available = (long) (rt.maxMemory() * HEAP_SHARE) - (rt.totalMemory() - rt.freeMemory());
        long one = perWorker(w, h, detectors, framesPerWorker);
        if (one > available)
            throw new TooLarge(String.format(Locale.ROOT, "%d x %d px frames with %s need about %s of memory, but only %s of the heap is free; "
                            + "raise the heap with TARGETBENCH_JAVA_OPTS=-Xmx%dg or use smaller frames or fewer detectors",
                    w, h, names(detectors), size(one), size(Math.max(0, available)), gigabytesFor(one, rt)));
        int workers = (int) Math.max(1, Math.min(threads, available / Math.max(1, one)));
        if (workers < threads)
            notices.accept(String.format(Locale.ROOT, "%d workers would need about %s of memory, more than the %s free; running on %d "
                    + "(raise the heap with TARGETBENCH_JAVA_OPTS=-Xmx%dg for more)", threads, size(one * threads), size(Math.max(0, available)), workers,
                    gigabytesFor(one * threads, rt)));
        return new Plan(workers, one * workers, available);
    }

    private static long gigabytesFor(long bytes, Runtime rt) {
        long used = rt.totalMemory() - rt.freeMemory();
        return Math.max(1, (long) Math.ceil((bytes + used) / HEAP_SHARE / (1L << 30)));
    }

    private static String names(List<DetectorConfig> detectors) {
        return String.join(", ", detectors.stream().map(c -> c.type().label()).toList());
    }

    static String size(long bytes) {
        return bytes >= (1L << 30) ? String.format(Locale.ROOT, "%.1f GB", bytes / (double) (1L << 30))
                : String.format(Locale.ROOT, "%d MB", bytes >> 20);
    }
}
