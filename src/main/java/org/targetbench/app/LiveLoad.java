package org.targetbench.app;

import org.targetbench.source.SourceException;

import javax.swing.JOptionPane;
import javax.swing.SwingWorker;
import java.util.concurrent.ExecutionException;

/** Loads a source into the session off the event-dispatch thread; a bad source gives a message, never a dead window. */
final class LiveLoad {
    private LiveLoad() {}

    interface Job {
        SourceLoader.Loaded load() throws SourceException;
    }

    static void load(AppContext ctx, String what, Job job) {
        load(ctx, what, job, true);
    }

    /** @param bringForward show the live view when the source has loaded */
    static void load(AppContext ctx, String what, Job job, boolean bringForward) {
        load(ctx, what, job, bringForward, () -> { });
    }

    /** @param failed runs on the event-dispatch thread after the message when the source could not be loaded */
    static void load(AppContext ctx, String what, Job job, boolean bringForward, Runnable failed) {
        ctx.status().accept("Loading " + what + "...");
        new SwingWorker<SourceLoader.Loaded, Void>() {
            @Override protected SourceLoader.Loaded doInBackground() throws Exception { return job.load(); }
            @Override protected void done() {
                try {
                    SourceLoader.Loaded l = get();
                    ctx.session().setSource(l.name(), l.frames(), l.reference(), l.scene());
                    ctx.status().accept("Loaded " + l.frames().size() + " frames: " + l.name()
                            + (l.truncated() ? " (first " + SourceLoader.MAX_FRAMES + " frames only)" : ""));
                    if (bringForward) ctx.showView().accept("Live");
                } catch (ExecutionException e) {
                    ctx.session().expectOrigin(null);
                    String msg = e.getCause() == null ? e.toString() : e.getCause().getMessage();
                    ctx.status().accept("Could not load " + what + ": " + msg);
                    JOptionPane.showMessageDialog(ctx.window(), msg, "Could not load the source", JOptionPane.WARNING_MESSAGE);
                    failed.run();
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
            }
        }.execute();
    }
}
