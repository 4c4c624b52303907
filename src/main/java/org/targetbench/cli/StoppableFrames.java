package org.targetbench.cli;

import org.targetbench.pipeline.Progress;
import org.targetbench.source.ForwardingSource;
import org.targetbench.source.FrameSource;
import org.targetbench.source.SourceException;
import org.targetbench.source.SourceFrame;

import java.util.Optional;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.BooleanSupplier;

/**
 * A frame source that ends early once a run is asked to stop, so a frame-by-frame run (compare) finishes the frames
 * it has started and scores those. It also keeps reading at most {@code ahead} frames ahead of the frames finished (as
 * reported through {@link #progress}), so that "the frames it has started" stays a handful, not the whole folder.
 */
final class StoppableFrames extends ForwardingSource {
    private final BooleanSupplier stop;
    private final int ahead;
    private final AtomicInteger finished = new AtomicInteger();
    private int read;
    private boolean stopped;

    StoppableFrames(FrameSource source, BooleanSupplier stop, int ahead) {
        super(source);
        this.stop = stop;
        this.ahead = Math.max(1, ahead);
    }

    /** Progress that also tells this source how many frames are finished; wraps {@code inner}. */
    Progress progress(Progress inner) {
        return (done, total, what) -> {
            finished.accumulateAndGet(done, Math::max);
            inner.update(done, total, what);
        };
    }

    /** True when the source ended because the run was asked to stop. */
    boolean stopped() { return stopped; }

    /** Frames handed out. */
    int read() { return read; }

    @Override
    public Optional<SourceFrame> next() throws SourceException {
        while (read > 0 && read - finished.get() >= ahead && !stop.getAsBoolean()) {
            try {
                Thread.sleep(2);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                break;
            }
        }
        if (stop.getAsBoolean() && read > 0) { // the first (reference) frame is always read, so there is something to keep
            stopped = read < source.frameCount() || source.frameCount() < 0;
            return Optional.empty();
        }
        Optional<SourceFrame> f = source.next();
        if (f.isPresent()) read++;
        return f;
    }

}
