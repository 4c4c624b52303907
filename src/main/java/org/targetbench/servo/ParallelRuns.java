package org.targetbench.servo;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.function.Supplier;

/**
 * Independent simulation runs spread over a fixed pool of daemon worker threads in blocks, with one reusable worker
 * (a closed loop and its workspace) per thread; shared by the free-flying rehearsal and the rehearsal on the arm. Each
 * run writes only its own slots, so the results do not depend on the number of threads.
 */
public final class ParallelRuns {
    /** One run: the thread's worker and the run's index. */
    public interface Body<W> {
        void run(W worker, int index);
    }

    private ParallelRuns() {}

    /**
     * Runs {@code body} for indices 0..n-1 in blocks of {@code block} on {@code threads} threads.
     *
     * @throws RuntimeException the first run's unchecked failure, as thrown
     */
    public static <W> void run(int n, int threads, int block, String threadName, Supplier<W> worker, Body<W> body) throws InterruptedException {
        ExecutorService pool = Executors.newFixedThreadPool(threads, r -> {
            Thread t = new Thread(r, threadName);
            t.setDaemon(true);
            return t;
        });
        try {
            List<Future<?>> futures = new ArrayList<>();
            ThreadLocal<W> workers = ThreadLocal.withInitial(worker);
            for (int b = 0; b < n; b += block) {
                int from = b, to = Math.min(n, b + block);
                futures.add(pool.submit(() -> {
                    W w = workers.get();
                    for (int i = from; i < to; i++) body.run(w, i);
                }));
            }
            for (Future<?> f : futures) f.get();
        } catch (ExecutionException e) {
            if (e.getCause() instanceof RuntimeException re) throw re;
            throw new IllegalStateException(e.getCause());
        } finally {
            pool.shutdownNow();
        }
    }
}
