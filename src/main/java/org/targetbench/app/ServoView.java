package org.targetbench.app;

import org.targetbench.pipeline.Reasons;
import org.targetbench.pipeline.PickRun;
import org.targetbench.select.Candidate;
import org.targetbench.select.Selection;
import org.targetbench.servo.ServoPoint;
import org.targetbench.servo.ServoSet;
import org.targetbench.servo.SetDiagnostics;

import javax.swing.JButton;
import javax.swing.JLabel;
import javax.swing.JPanel;
import javax.swing.JScrollPane;
import javax.swing.JSpinner;
import javax.swing.JSplitPane;
import javax.swing.JTable;
import javax.swing.SpinnerNumberModel;
import javax.swing.SwingWorker;
import javax.swing.table.DefaultTableModel;
import java.awt.BorderLayout;
import java.awt.Color;
import java.awt.Dimension;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.concurrent.ExecutionException;
import java.util.stream.Collectors;

/**
 * The servo set: choose points servo-aware (robust, spread, a well-conditioned interaction matrix) on the reference
 * frame, see why each was chosen and why every other candidate was not, and click a point to add or remove it; the
 * figures of the set recompute at once.
 */
final class ServoView extends JPanel implements Session.Listener {
    /** Click distance within which a candidate is picked, image pixels. */
    static final double CLICK_RADIUS_PX = 8;
    static final Color CHOSEN = new Color(0, 158, 115), CANDIDATE = new Color(160, 160, 160), FAILED = new Color(213, 94, 0),
            WARNED = new Color(240, 228, 66);
    /** The detector choice that lets the selection take the comparison's top-ranked detector. */
    static final String TOP_RANKED = "top-ranked";

    private final AppContext ctx;
    private final Session session;
    private final FrameCanvas canvas = new FrameCanvas("servo.canvas");
    private final JSpinner count = Ui.named(new JSpinner(new SpinnerNumberModel(4, 1, 64, 1)), "servo.count",
            "Points in the set: shows the set's size; Choose points asks for 4 to 8");
    private final javax.swing.JComboBox<String> detector = Ui.named(new javax.swing.JComboBox<>(detectorChoices()), "servo.detector",
            "Detector whose reference-frame points are the candidates; top-ranked takes the comparison's best");
    private JButton undoButton, redoButton;
    private DetailPane detail;
    private final JLabel figures = Ui.named(new JLabel("No set yet: press Choose points."), "servo.figures", Ui.TIP_COND);
    private final JLabel findings = Ui.named(new JLabel(" "), "servo.findings", null);
    private final DefaultTableModel chosen = table("Id", "u px", "v px", "Z m", "Why chosen");
    private final DefaultTableModel rejected = table("Id", "u px", "v px", "Why not");
    private final JButton choose;

    private static DefaultTableModel table(Object... cols) {
        return new DefaultTableModel(cols, 0) {
            @Override public boolean isCellEditable(int r, int c) { return false; }
        };
    }

    ServoView(AppContext ctx) {
        super(new BorderLayout(6, 6));
        this.ctx = ctx;
        this.session = ctx.session();
        setName("view.servo");
        choose = Ui.button("servo.choose", "Choose points", "Compare the loaded frames and choose the servo points on the reference frame", this::choose);
        undoButton = Ui.button("servo.undo", "Undo", "Take back the latest point click (Ctrl+Z)", session::undoServoEdit);
        redoButton = Ui.button("servo.redo", "Redo", "Do the undone point click again (Ctrl+Shift+Z)", session::redoServoEdit);
        undoButton.setEnabled(false);
        redoButton.setEnabled(false);
        add(Ui.row(choose, new JLabel("Detector"), detector, new JLabel("Points"), count, undoButton, redoButton,
                new JLabel("  Click a point to add or remove it. Green ring: chosen; grey ring: passed the filters; orange cross: failed a filter (hover for why).")),
                BorderLayout.NORTH);
        bindKey("ctrl Z", "servo.undo", session::undoServoEdit);
        bindKey("ctrl shift Z", "servo.redo", session::redoServoEdit);
        canvas.onClick(p -> toggleAt(p.getX(), p.getY()));
        JPanel right = new JPanel(new BorderLayout());
        JPanel figs = new JPanel(new java.awt.GridLayout(0, 1));
        figs.add(figures);
        figs.add(findings);
        right.add(figs, BorderLayout.NORTH);
        JTable ct = Ui.named(new JTable(chosen), "servo.chosen", null), rt = Ui.named(new JTable(rejected), "servo.rejected", null);
        // ids and positions whole; the reasons take the room left and read in full in the detail pane below
        JSplitPane tables = new JSplitPane(JSplitPane.VERTICAL_SPLIT, Ui.fitColumns(new JScrollPane(ct), 4), Ui.fitColumns(new JScrollPane(rt), 3));
        tables.setResizeWeight(0.4);
        right.add(tables, BorderLayout.CENTER);
        DetailPane.columnTips(ct, "Candidate id (index of the detection in the reference frame)", "Image column, px (pixel-centre convention)",
                "Image row, px", "Depth in the reference camera frame, m", "Why the point is in the set: its robustness against the filter limits and what cond(L*) would be without it");
        DetailPane.columnTips(rt, "Candidate id", "Image column, px", "Image row, px",
                "Why the candidate is not in the set: the filter it failed (limits from the selection settings) or how it lost to the chosen points");
        detail = new DetailPane("servo.detail", "Select a row to read its reason in full.", ct, rt);
        detail.setPreferredSize(new Dimension(520, 170)); // a chosen point's reason, wrapped, in view whole
        right.add(detail, BorderLayout.SOUTH);
        right.setPreferredSize(new Dimension(520, 400));
        JSplitPane split = new JSplitPane(JSplitPane.HORIZONTAL_SPLIT, canvas, right);
        split.setResizeWeight(0.68);
        add(split, BorderLayout.CENTER);
        session.addListener(this);
    }

    FrameCanvas canvas() { return canvas; }

    DetailPane detail() { return detail; }

    private static String[] detectorChoices() {
        List<String> names = new ArrayList<>();
        names.add(TOP_RANKED);
        for (org.targetbench.detect.DetectorType t : org.targetbench.detect.DetectorType.values()) names.add(t.cliName());
        return names.toArray(String[]::new);
    }

    /** Ctrl+Z and Ctrl+Shift+Z while this view shows, whatever inside the window has the focus. */
    private void bindKey(String key, String name, Runnable r) {
        getInputMap(WHEN_IN_FOCUSED_WINDOW).put(javax.swing.KeyStroke.getKeyStroke(key), name);
        getActionMap().put(name, new javax.swing.AbstractAction() {
            @Override public void actionPerformed(java.awt.event.ActionEvent e) { r.run(); }
        });
    }

    void choose() {
        if (!session.hasFrames()) return;
        if (session.scene().isEmpty()) {
            ctx.status().accept(ServoChoice.noScene().getMessage());
            figures.setText("This source has no reference pose: load the demo scene or use a target from the Targets view.");
            return;
        }
        var frames = session.frames();
        String ref = session.reference().name(), name = session.sourceName();
        var scene = session.scene().get();
        var configs = session.configs();
        int k = Math.max(4, Math.min(8, (Integer) count.getValue()));
        String det = TOP_RANKED.equals(detector.getSelectedItem()) ? null : (String) detector.getSelectedItem();
        choose.setEnabled(false);
        ctx.status().accept("Choosing " + k + " servo points...");
        new SwingWorker<PickRun.Result, Void>() {
            @Override protected PickRun.Result doInBackground() throws Exception {
                return ServoChoice.pick(frames, ref, name, scene, configs, k, det);
            }
            @Override protected void done() {
                choose.setEnabled(true);
                try {
                    PickRun.Result r = get();
                    session.setPick(r);
                    ctx.status().accept(r.set().isPresent() ? "Chose " + r.set().get().points().size() + " points from " + r.candidates().size()
                            + " " + r.detector() + " candidates" : "No acceptable set: " + Reasons.selection(r.selection()));
                } catch (ExecutionException e) {
                    ctx.status().accept("Could not choose points: " + e.getCause().getMessage());
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
            }
        }.execute();
    }

    private void toggleAt(double x, double y) {
        PickRun.Result pick = session.pick();
        ServoSet set = session.servoSet();
        if (pick == null || set == null) return;
        Candidate c = ServoChoice.nearest(pick.candidates(), x, y, CLICK_RADIUS_PX);
        if (c == null) return;
        toggle(c.id());
    }

    /** Adds or removes a candidate by id (the click handler's work; also for keyboard and tests). */
    void toggle(int id) {
        PickRun.Result pick = session.pick();
        ServoSet set = session.servoSet();
        if (pick == null || set == null) return;
        ServoSet next = ServoChoice.toggle(set, pick.candidates(), pick.selection().rejected(), id);
        if (next == null) {
            ctx.status().accept("A servo set needs points; the last one stays");
            return;
        }
        session.setServoSet(next);
    }

    @Override
    public void changed(Session.Change c) {
        if (c == Session.Change.SOURCE) {
            chosen.setRowCount(0);
            rejected.setRowCount(0);
            figures.setText("No set yet: press Choose points.");
            findings.setText(" ");
            canvas.setMarkers(List.of());
            undoButton.setEnabled(false);
            redoButton.setEnabled(false);
            if (session.hasFrames()) canvas.setFrame(session.reference().image());
        }
        if (c != Session.Change.SERVO) return;
        PickRun.Result pick = session.pick();
        ServoSet set = session.servoSet();
        canvas.setFrame(session.reference().image());
        List<FrameCanvas.Marker> marks = new ArrayList<>();
        Set<Integer> in = set == null ? Set.of() : set.points().stream().map(ServoPoint::id).collect(Collectors.toSet());
        java.util.Map<Integer, Selection.Rejected> why = new java.util.HashMap<>();
        if (pick != null) for (Selection.Rejected r : pick.selection().rejected()) why.put(r.candidate().id(), r);
        if (pick != null) for (Candidate cand : pick.candidates()) {
            if (in.contains(cand.id())) continue;
            Selection.Rejected r = why.get(cand.id());
            boolean failed = r != null && r.why().isFilter();
            String tip = "#" + cand.id() + ": " + (r != null ? Reasons.rejected(r) : Reasons.REMOVED_BY_HAND);
            marks.add(new FrameCanvas.Marker(cand.u(), cand.v(), "", failed ? FAILED : CANDIDATE, failed ? 4 : 5,
                    failed ? FrameCanvas.Shape.CROSS : FrameCanvas.Shape.RING, tip));
        }
        List<ServoPoint> failing = new ArrayList<>();
        if (set != null) for (ServoPoint p : set.points()) {
            boolean bad = pick != null && ServoChoice.failedFilter(pick.selection().rejected(), p.id()) != null;
            if (bad) failing.add(p);
            marks.add(new FrameCanvas.Marker(p.u(), p.v(), "#" + p.id() + (bad ? " !" : ""), bad ? WARNED : CHOSEN, 9, FrameCanvas.Shape.RING,
                    "#" + p.id() + " in the set: " + p.reason()));
        }
        canvas.setMarkers(marks);
        undoButton.setEnabled(session.canUndo());
        redoButton.setEnabled(session.canRedo());
        if (set != null && (Integer) count.getValue() != set.points().size()) count.setValue(set.points().size());
        chosen.setRowCount(0);
        rejected.setRowCount(0);
        if (set == null) {
            figures.setText(pick == null ? "No set yet." : "No acceptable set: " + Reasons.selection(pick.selection()));
            findings.setText(" ");
            return;
        }
        figures.setText(String.format(Locale.ROOT, "<html><b>cond(L*) %.2f</b> &nbsp; sigma_min %.4f &nbsp; %d points &nbsp; detector %s</html>",
                set.condition(), set.sigmaMin(), set.points().size(), set.detector()));
        var f = SetDiagnostics.check(set.points());
        List<String> lines = new ArrayList<>();
        for (ServoPoint p : failing) lines.add("WARN: point #" + p.id() + " was added by hand and failed a filter: "
                + Reasons.rejected(ServoChoice.failedFilter(pick.selection().rejected(), p.id())));
        f.forEach(x -> lines.add(x.severity() + ": " + Reasons.finding(x)));
        String better = ServoChoice.betterDesignedNote(pick, set);
        if (better != null) lines.add(better);
        findings.setText(lines.isEmpty() ? "No warnings." : "<html>" + String.join("<br>", lines) + "</html>");
        for (ServoPoint p : set.points())
            chosen.addRow(new Object[]{p.id(), Ui.fmt(p.u(), 2), Ui.fmt(p.v(), 2), Ui.fmt(p.zM(), 4), p.reason()});
        if (pick != null) for (Selection.Rejected r : pick.selection().rejected())
            if (!in.contains(r.candidate().id()))
                rejected.addRow(new Object[]{r.candidate().id(), Ui.fmt(r.candidate().u(), 1), Ui.fmt(r.candidate().v(), 1), Reasons.rejected(r)});
    }
}
