package org.targetbench.bench;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.BrokenBarrierException;
import java.util.concurrent.CyclicBarrier;
import java.util.concurrent.atomic.AtomicLong;
import java.util.function.Supplier;

/**
 * Wall-clock timing of {@link FrameTask}s with {@link System#nanoTime()}.
 *
 * <p>Single thread: {@code warmup} untimed calls, then {@code runs} individually timed calls cycling through the
 * frames; the median is reported (robust to the odd garbage collection or scheduler hiccup), with the 10th and 90th
 * percentiles as a spread. All cores: one task per thread, each warmed up, then all released together by a barrier;
 * throughput is the total number of calls over the wall time from release until the last thread finishes.
 *
 * <p>Caveats: the frames are few and small, so they stay in cache more than camera frames would; memory-bound
 * detectors may look slightly better than in a cell. Throughput on all cores shares memory bandwidth and turbo
 * headroom between threads, so it is usually less than threads times the single-thread rate.
 */
final class Timing {
    /** Sum of all point counts: a visible side effect, so that no detector call can be removed as dead code. */
    private static final AtomicLong SINK = new AtomicLong();

    private Timing() {}

    /** Single-thread result; times in milliseconds per frame, points per frame averaged over the timed calls. */
    record Single(double medianMs, double p10Ms, double p90Ms, double meanPoints) {
        double framesPerSecond() { return 1000 / medianMs; }
    }

    /** All-cores result: {@code calls} detector calls by {@code threads} threads in {@code seconds} of wall time. */
    record Throughput(int threads, long calls, double seconds) {
        double framesPerSecond() { return calls / seconds; }

        /** Effective wall time per frame when all threads work, milliseconds. */
        double effectiveMsPerFrame() { return 1000 * seconds / calls; }
    }

    static Single singleThread(FrameTask task, int frames, int warmup, int runs) {
        long points = 0;
        for (int i = 0; i < warmup; i++) points += task.detect(i % frames);
        long[] nanos = new long[runs];
        long counted = 0;
        for (int i = 0; i < runs; i++) {
            long t0 = System.nanoTime();
            int n = task.detect(i % frames);
            nanos[i] = System.nanoTime() - t0;
            counted += n;
        }
        SINK.addAndGet(points + counted);
        Arrays.sort(nanos);
        return new Single(percentile(nanos, 0.5) / 1e6, percentile(nanos, 0.1) / 1e6, percentile(nanos, 0.9) / 1e6,
                (double) counted / runs);
    }

    static Throughput allCores(Supplier<FrameTask> perThread, int threads, int frames, int warmup, int runs)
            throws InterruptedException {
        long[] start = new long[1];
        CyclicBarrier go = new CyclicBarrier(threads, () -> start[0] = System.nanoTime());
        List<Thread> workers = new ArrayList<>();
        Throwable[] failure = new Throwable[1];
        for (int t = 0; t < threads; t++) {
            int offset = t;
            Thread w = new Thread(() -> {
                try {
                    FrameTask task = perThread.get();
                    long points = 0;
                    for (int i = 0; i < warmup; i++) points += task.detect((offset + i) % frames);
                    go.await();
                    for (int i = 0; i < runs; i++) points += task.detect((offset + i) % frames);
                    SINK.addAndGet(points);
                } catch (InterruptedException | BrokenBarrierException e) {
                    Thread.currentThread().interrupt();
                } catch (Throwable e) {
                    synchronized (failure) { if (failure[0] == null) failure[0] = e; }
                    go.reset(); // release the others rather than leave them waiting
                }
            }, "bench-" + t);
            workers.add(w);
            w.start();
        }
        for (Thread w : workers) w.join();
        long end = System.nanoTime();
        if (failure[0] != null) throw new IllegalStateException("a bench thread failed: " + failure[0], failure[0]);
        return new Throughput(threads, (long) threads * runs, (end - start[0]) / 1e9);
    }

    /** Percentile of sorted samples, linearly interpolated between ranks (q = 0.5 is the usual median). */
    private static double percentile(long[] sorted, double q) {
        double pos = q * (sorted.length - 1);
        int lo = (int) Math.floor(pos), hi = (int) Math.ceil(pos);
        return sorted[lo] + (pos - lo) * (sorted[hi] - sorted[lo]);
    }
}
