package org.targetbench.app;

import org.targetbench.formats.ServoSetReader;
import org.targetbench.formats.SessionFile;
import org.targetbench.pipeline.PickRun;
import org.targetbench.servo.Rehearsal;
import org.targetbench.servo.RehearsalResult;
import org.targetbench.servo.ServoSet;
import org.targetbench.source.SourceException;

import javax.swing.SwingWorker;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.function.Consumer;

/**
 * Puts a saved session's servo work back once its source has loaded: the choice is made again with the saved detector,
 * count and settings (the run is deterministic), the hand edits are clicked again in order (so undo and redo hold the
 * same steps), and the kept rehearsal is run again from its settings (seeded, so its figures are the same). When the
 * choice cannot be repeated exactly (the frames or the code changed), the saved set is loaded as it was written, without
 * its candidates, and the status line says so. Work runs off the event-dispatch thread; {@code done} gets a sentence.
 */
final class SessionRestore {
    private final AppContext ctx;
    private final Session session;

    SessionRestore(AppContext ctx) {
        this.ctx = ctx;
        this.session = ctx.session();
    }

    /** Restores the servo part of {@code st}; calls {@code done} on the event-dispatch thread with what happened. */
    void servo(SessionFile.State st, Consumer<String> done) {
        SessionFile.Servo sv = st.servo();
        Optional<ServoSet> saved;
        try {
            saved = sv.set().isPresent() ? Optional.of(ServoSetReader.read(sv.set().get())) : Optional.empty();
        } catch (SourceException e) {
            done.accept("the session's servo set could not be read: " + e.getMessage());
            return;
        }
        if (sv.pick().isEmpty() || session.scene().isEmpty()) {
            saved.ifPresent(session::loadServoSet);
            rehearse(sv, saved.map(List::of).orElse(List.of()), done, saved.isPresent() ? "servo set loaded" : "");
            return;
        }
        SessionFile.Pick p = sv.pick().get();
        var frames = session.frames();
        String ref = session.reference().name(), name = session.sourceName();
        var scene = session.scene().get();
        var configs = session.configs();
        new SwingWorker<PickRun.Result, Void>() {
            @Override protected PickRun.Result doInBackground() throws Exception {
                return ServoChoice.pick(frames, ref, name, scene, configs, p.count(), p.detector());
            }
            @Override protected void done() {
                List<ServoSet> states = new ArrayList<>();
                try {
                    PickRun.Result r = get();
                    r = new PickRun.Result(r.detector(), r.candidates(), r.selection(), r.set().map(s -> created(s, p.created())), r.poseMethod());
                    session.setPick(r);
                    if (session.servoSet() != null) states.add(session.servoSet());
                    for (int id : sv.edits()) states.add(click(r, id));
                    for (int id : sv.undone()) states.add(click(r, id));
                    for (int i = 0; i < sv.undone().size(); i++) session.undoServoEdit();
                } catch (Exception e) {
                    states.clear();
                }
                boolean same = !states.isEmpty() && (saved.isEmpty() || saved.get().equals(session.servoSet()));
                if (!same) {
                    saved.ifPresent(session::loadServoSet);
                    states = new ArrayList<>(saved.map(List::of).orElse(List.of()));
                }
                rehearse(sv, states, done, same ? "servo choice and " + sv.edits().size() + " hand edits repeated"
                        : "the servo choice could not be repeated exactly; the saved set is loaded without its candidates");
            }
        }.execute();
    }

    private ServoSet click(PickRun.Result r, int id) {
        ServoSet next = ServoChoice.toggle(session.servoSet(), r.candidates(), r.selection().rejected(), id);
        if (next == null) throw new IllegalStateException("edit " + id + " would empty the set");
        session.setServoSet(next);
        return next;
    }

    private void rehearse(SessionFile.Servo sv, List<ServoSet> states, Consumer<String> done, String sofar) {
        if (sv.rehearsed().isEmpty()) {
            done.accept(sofar);
            return;
        }
        SessionFile.Rehearsed r = sv.rehearsed().get();
        if (r.position() < 0 || r.position() >= states.size()) {
            done.accept(sofar + "; the kept rehearsal's set is not among the restored ones, so it was not run again");
            return;
        }
        ServoSet on = states.get(r.position());
        new SwingWorker<RehearsalResult, Void>() {
            @Override protected RehearsalResult doInBackground() throws Exception { return Rehearsal.run(on, r.config()); }
            @Override protected void done() {
                try {
                    session.restoreRehearsal(on, get(), r.elapsedS());
                    done.accept(sofar + "; rehearsal run again from its settings");
                } catch (Exception e) {
                    done.accept(sofar + "; the rehearsal could not be run again: " + e.getMessage());
                }
            }
        }.execute();
    }

    /** The set with another creation time (a repeated choice keeps the time of the first). */
    static ServoSet created(ServoSet s, String created) {
        if (created == null || created.isEmpty()) return s;
        return new ServoSet(s.toolVersion(), created, s.camera(), s.targetId(), s.targetDesign(), s.referencePose(), s.poseMethod(),
                s.detector(), s.detectorConfig(), s.trackerConfig(), s.points(), s.condition(), s.sigmaMin());
    }
}
