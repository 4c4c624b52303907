package org.targetbench.app;

import org.targetbench.export.ServoSetJson;
import org.targetbench.formats.SessionFile;

import javax.swing.JFileChooser;
import javax.swing.JMenu;
import javax.swing.JMenuItem;
import javax.swing.JOptionPane;
import javax.swing.KeyStroke;
import javax.swing.SwingUtilities;
import java.awt.event.InputEvent;
import java.awt.event.KeyEvent;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * Sessions of the workbench: File menu (new, open, save as, recent sessions, quit), the unsaved-work prompt and the
 * keyboard shortcuts list. A session file ({@link SessionFile}) references the source (and the design and camera it was
 * registered to), keeps every detector setting, the servo choice with its hand edits, the kept rehearsal, the views'
 * controls (rehearsal and stress settings, the rehearsal runs side by side) and the stress results folder; the edited
 * servo set is written beside it as NAME.servo-set.json.
 */
final class SessionMenu implements Session.Listener {
    /** How many recent sessions the File menu lists. */
    static final int RECENT = 6;
    static final String SUFFIX = ".session.json";
    static final String UNSAVED_TITLE = "Unsaved work";
    /** The keyboard shortcuts, as Help lists them. */
    static final String[][] SHORTCUTS = {
            {"Ctrl+N", "New session (the demo scene)"}, {"Ctrl+O", "Open a session"}, {"Ctrl+S", "Save the session"}, {"Ctrl+Shift+S", "Save the session as..."},
            {"Ctrl+Q", "Quit (asks first when work is unsaved)"}, {"Ctrl+E", "Export the servo set"}, {"Ctrl+T", "Switch light/dark theme"},
            {"Ctrl+Z", "Servo set: take back the latest point click"}, {"Ctrl+Shift+Z", "Servo set: do the undone click again"},
            {"Space", "Play or pause the frames"}, {"Left / Right", "Previous / next frame"},
            {"Click on the frame", "Servo set: add or remove the nearest candidate"}, {"Mouse wheel, drag", "Zoom and pan the frame"}};

    private final AppContext ctx;
    private final Session session;
    private final LiveView live;
    private final Runnable dispose;
    private final JMenu recent = new JMenu("Recent sessions");
    private boolean dirty;
    private Path current;

    SessionMenu(AppContext ctx, LiveView live, Runnable dispose) {
        this.ctx = ctx;
        this.session = ctx.session();
        this.live = live;
        this.dispose = dispose;
        session.addListener(this);
    }

    @Override
    public void changed(Session.Change c) {
        if (restoring) return;
        if (c == Session.Change.SERVO || c == Session.Change.DETECTORS || c == Session.Change.SHOWN) dirty = true;
        if (c == Session.Change.SOURCE && session.origin() != null && session.origin().kind() != SessionFile.SourceKind.DEMO) dirty = true;
    }

    boolean dirty() { return dirty; }

    JMenu fileMenu() {
        JMenu file = new JMenu("File");
        file.setName("menu.file");
        file.add(item("menu.new", "New session", KeyEvent.VK_N, 0, this::newSession));
        file.add(item("menu.open", "Open session...", KeyEvent.VK_O, 0, this::chooseAndOpen));
        file.add(item("menu.save", "Save session", KeyEvent.VK_S, 0, this::saveOrChoose));
        file.add(item("menu.saveas", "Save session as...", KeyEvent.VK_S, InputEvent.SHIFT_DOWN_MASK, this::chooseAndSave));
        recent.setName("menu.recent");
        file.add(recent);
        file.addSeparator();
        file.add(item("menu.quit", "Quit", KeyEvent.VK_Q, 0, this::quit));
        file.addMenuListener(new javax.swing.event.MenuListener() {
            @Override public void menuSelected(javax.swing.event.MenuEvent e) { fillRecent(); }
            @Override public void menuDeselected(javax.swing.event.MenuEvent e) {}
            @Override public void menuCanceled(javax.swing.event.MenuEvent e) {}
        });
        fillRecent();
        return file;
    }

    JMenuItem shortcutsItem() {
        JMenuItem i = new JMenuItem("Keyboard shortcuts");
        i.setName("menu.shortcuts");
        i.addActionListener(e -> {
            StringBuilder b = new StringBuilder("<html><table>");
            for (String[] s : SHORTCUTS) b.append("<tr><td><b>").append(s[0]).append("</b></td><td>").append(s[1]).append("</td></tr>");
            JOptionPane.showMessageDialog(ctx.window(), b.append("</table></html>").toString(), "Keyboard shortcuts", JOptionPane.INFORMATION_MESSAGE);
        });
        return i;
    }

    private static JMenuItem item(String name, String text, int key, int extra, Runnable r) {
        JMenuItem i = new JMenuItem(text);
        i.setName(name);
        i.setAccelerator(KeyStroke.getKeyStroke(key, InputEvent.CTRL_DOWN_MASK | extra));
        i.addActionListener(e -> r.run());
        return i;
    }

    private void fillRecent() {
        recent.removeAll();
        for (String p : recentList()) {
            JMenuItem i = new JMenuItem(p);
            i.addActionListener(e -> {
                if (askToSave()) open(Path.of(p));
            });
            recent.add(i);
        }
        recent.setEnabled(recent.getItemCount() > 0);
    }

    List<String> recentList() {
        List<String> out = new ArrayList<>();
        for (String s : ctx.prefs().get("recentSessions", "").split("\n")) if (!s.isBlank()) out.add(s);
        return out;
    }

    private void remember(Path file) {
        List<String> r = recentList();
        String p = file.toAbsolutePath().normalize().toString();
        r.remove(p);
        r.add(0, p);
        ctx.prefs().put("recentSessions", String.join("\n", r.subList(0, Math.min(RECENT, r.size()))));
    }

    /** True when the work may be discarded: nothing unsaved, the user saved it, or chose not to. */
    boolean askToSave() {
        if (!dirty) return true;
        int a = JOptionPane.showConfirmDialog(ctx.window(), "The session has unsaved work (source, servo set edits or rehearsals). Save it first?",
                UNSAVED_TITLE, JOptionPane.YES_NO_CANCEL_OPTION, JOptionPane.WARNING_MESSAGE);
        if (a == JOptionPane.YES_OPTION) return saveOrChoose();
        return a == JOptionPane.NO_OPTION;
    }

    void quit() {
        if (askToSave()) dispose.run();
    }

    void newSession() {
        if (!askToSave()) return;
        current = null;
        restoring = true; // the fresh settings are not unsaved work
        for (var t : org.targetbench.detect.DetectorType.values()) session.setConfig(org.targetbench.detect.DetectorConfig.defaults(t));
        session.setStressResults(null);
        restoring = false;
        live.loadDemo();
        dirty = false;
    }

    private void chooseAndOpen() {
        if (!askToSave()) return;
        JFileChooser fc = new JFileChooser(ctx.prefs().get("lastSessionFolder", System.getProperty("user.dir")));
        fc.setFileFilter(new javax.swing.filechooser.FileNameExtensionFilter("Sessions (*.session.json)", "json"));
        if (fc.showOpenDialog(ctx.window()) != JFileChooser.APPROVE_OPTION) return;
        open(fc.getSelectedFile().toPath());
    }

    /** Saves to the session's own file, or asks for one the first time. */
    private boolean saveOrChoose() {
        return current != null ? save(current) : chooseAndSave();
    }

    private boolean chooseAndSave() {
        JFileChooser fc = new JFileChooser(ctx.prefs().get("lastSessionFolder", System.getProperty("user.dir")));
        fc.setDialogTitle("Save the session as");
        if (current != null) fc.setSelectedFile(current.toFile());
        if (fc.showSaveDialog(ctx.window()) != JFileChooser.APPROVE_OPTION) return false;
        Path f = fc.getSelectedFile().toPath();
        if (!f.getFileName().toString().endsWith(".json")) f = f.resolveSibling(f.getFileName() + SUFFIX);
        return save(f);
    }

    /** Writes the session (and the edited servo set beside it); false with a message when it cannot. */
    boolean save(Path file) {
        Session.Origin o = session.origin();
        if (o == null) {
            String msg = "These frames cannot be reopened from a file (a camera or a rendered design); save the source as a folder first.";
            ctx.status().accept("Could not save the session: " + msg);
            JOptionPane.showMessageDialog(ctx.window(), msg, "Could not save the session", JOptionPane.WARNING_MESSAGE);
            return false;
        }
        try {
            SessionFile.write(state(file), file);
            current = file;
            dirty = false;
            remember(file);
            ctx.prefs().put("lastSessionFolder", String.valueOf(file.toAbsolutePath().getParent()));
            ctx.status().accept("Saved the session to " + file);
            return true;
        } catch (Exception e) {
            ctx.status().accept("Could not save the session: " + e.getMessage());
            JOptionPane.showMessageDialog(ctx.window(), e.getMessage(), "Could not save the session", JOptionPane.WARNING_MESSAGE);
            return false;
        }
    }

    /** What a session file saved now as {@code file} holds (writing the edited set beside it). */
    private SessionFile.State state(Path file) throws java.io.IOException {
        Session.Origin o = session.origin();
        Optional<Path> set = Optional.empty();
        if (session.servoSet() != null) {
            String stem = file.getFileName().toString().replaceFirst("(\\.session)?\\.json$", "");
            Path sf = file.toAbsolutePath().resolveSibling(stem + ".servo-set.json");
            ServoSetJson.write(session.servoSet(), Optional.ofNullable(session.rehearsal()), "", sf);
            set = Optional.of(sf);
        }
        var pick = session.pick();
        Optional<SessionFile.Pick> p = pick == null || pick.set().isEmpty() ? Optional.empty()
                : Optional.of(new SessionFile.Pick(pick.detector(), pick.set().get().points().size(), pick.set().get().created()));
        Session.ServoEdits edits = session.servoEdits();
        Optional<SessionFile.Rehearsed> rehearsed = session.lastRehearsal() == null || edits.rehearsedPosition() < 0 ? Optional.empty()
                : Optional.of(new SessionFile.Rehearsed(edits.rehearsedPosition(), session.lastRehearsal().config(), session.rehearsalElapsedS()));
        SessionFile.Servo servo = new SessionFile.Servo(set, p, p.isPresent() ? edits.done() : List.of(), p.isPresent() ? edits.undone() : List.of(), rehearsed);
        return new SessionFile.State(o.kind(), o.path(), Optional.ofNullable(session.registration()), session.hasFrames() ? session.frameIndex() : 0,
                session.configs(), session.shown(), servo, ViewSettings.save(ViewSettings.views(ctx.window())), Optional.ofNullable(session.stressResults()));
    }

    private boolean restoring;

    /** True while an opened session is still being put back (its source loading, its choice and rehearsal running). */
    boolean restoring() { return restoring; }

    /**
     * Reads a session: sets the detectors and the views' controls, loads its source (and registers it again), then
     * shows its frame and puts back its servo work ({@link SessionRestore}).
     */
    void open(Path file) {
        SessionFile.State st;
        try {
            st = SessionFile.read(file);
            List<Path> needed = new ArrayList<>();
            st.servoSet().ifPresent(needed::add);
            st.sourcePath().ifPresent(needed::add);
            st.registration().ifPresent(r -> {
                needed.add(r.target());
                r.camera().ifPresent(needed::add);
            });
            for (Path p : needed)
                if (!Files.exists(p)) throw new org.targetbench.source.SourceException(file + ": the session's file " + p + " is missing");
        } catch (org.targetbench.source.SourceException e) {
            ctx.status().accept("Could not open the session: " + e.getMessage());
            JOptionPane.showMessageDialog(ctx.window(), e.getMessage(), "Could not open the session", JOptionPane.WARNING_MESSAGE);
            return;
        }
        restoring = true;
        for (var c : st.detectors()) session.setConfig(c);
        ViewSettings.restore(ViewSettings.views(ctx.window()), st.views());
        if (!st.shown().isEmpty())
            for (var t : org.targetbench.detect.DetectorType.values()) session.setShown(t, st.shown().contains(t));
        session.setStressResults(st.stressResults().orElse(null));
        Session.Listener[] waiting = new Session.Listener[1];
        Runnable failed = () -> { // the source (or its registration) could not be loaded: the message has been shown
            session.removeListener(waiting[0]);
            restoring = false;
            ctx.status().accept("Could not open the session " + file + ": its source did not load");
        };
        session.addListener(waiting[0] = new Session.Listener() {
            private boolean registering;

            @Override public void changed(Session.Change c) {
                if (c != Session.Change.SOURCE) return;
                if (st.registration().isPresent() && !registering) {
                    registering = true;
                    SwingUtilities.invokeLater(() -> {
                        live.onNextLoadFailure(failed);
                        live.registerTo(st.registration().get().target(), st.registration().get().camera().orElse(null));
                    });
                    return;
                }
                session.removeListener(this);
                SwingUtilities.invokeLater(() -> {
                    session.setFrameIndex(st.frameIndex());
                    new SessionRestore(ctx).servo(st, what -> {
                        current = file;
                        dirty = false;
                        restoring = false;
                        remember(file);
                        ctx.status().accept("Opened the session " + file + (what.isEmpty() ? "" : ": " + what));
                    });
                });
            }
        });
        live.onNextLoadFailure(failed);
        switch (st.kind()) {
            case DEMO -> live.loadDemo();
            case VIDEO -> live.loadVideo(st.sourcePath().orElseThrow());
            case FOLDER -> live.loadFolder(st.sourcePath().orElseThrow());
        }
    }
}
