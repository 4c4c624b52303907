package org.targetbench.app;

import org.jfree.chart.ChartPanel;
import org.jfree.chart.JFreeChart;
import org.targetbench.report.RehearsalReport;
import org.targetbench.servo.ControlLaw;
import org.targetbench.servo.Rehearsal;
import org.targetbench.servo.RehearsalConfig;
import org.targetbench.servo.RehearsalResult;
import org.targetbench.servo.ServoSet;

import javax.swing.JButton;
import javax.swing.JComboBox;
import javax.swing.JLabel;
import javax.swing.JPanel;
import javax.swing.JScrollPane;
import javax.swing.JSpinner;
import javax.swing.JTable;
import javax.swing.SpinnerNumberModel;
import javax.swing.SwingWorker;
import javax.swing.table.DefaultTableModel;
import java.awt.BorderLayout;
import java.awt.Dimension;
import java.awt.GridLayout;
import java.util.Locale;
import java.util.concurrent.ExecutionException;

/**
 * Rehearses the current servo set in simulation: Monte-Carlo starts in an envelope around the reference pose, the
 * chosen control law and gain, and the convergence table, error curves, camera paths and convergence map that the
 * command line's report shows.
 */
final class RehearseView extends JPanel implements Session.Listener {
    private final AppContext ctx;
    private final Session session;
    private final JSpinner starts = Ui.named(new JSpinner(new SpinnerNumberModel(200, 10, 5000, 10)), "rehearse.starts", "Start poses drawn in the envelope");
    private final JSpinner lambda = Ui.named(new JSpinner(new SpinnerNumberModel(0.5, 0.01, 10.0, 0.05)), "rehearse.lambda", "Gain lambda of v = -lambda L^+ (s - s*), 1/s");
    private final JComboBox<ControlLaw> law = Ui.named(new JComboBox<>(ControlLaw.values()), "rehearse.law",
            "Which interaction matrix the law inverts: current (L at the current view), reference (the set's own L*) or averaged (their mean; Chaumette & Hutchinson 2006, Malis 2004)");
    private final DefaultTableModel table = new DefaultTableModel(new Object[]{"Figure", "Value"}, 0) {
        @Override public boolean isCellEditable(int r, int c) { return false; }
    };
    private final JSpinner envelopeMm = Ui.named(new JSpinner(new SpinnerNumberModel(20.0, 0.0, 500.0, 5.0)), "rehearse.envelope.mm",
            "Start envelope: +- millimetres along each axis of the reference camera (the command line's --envelope T,R)");
    private final JSpinner envelopeDeg = Ui.named(new JSpinner(new SpinnerNumberModel(10.0, 0.0, 90.0, 1.0)), "rehearse.envelope.deg",
            "Start envelope: +- degrees about the reference camera's x and y axes; about z twice this (the command line's default 10,10,20)");
    private final JComboBox<org.targetbench.servo.DepthMode> depth = Ui.named(new JComboBox<>(org.targetbench.servo.DepthMode.values()), "rehearse.depth",
            "Depths the controller believes (--depth): true, constant (Z* held) or scaled (Z* x depth error)");
    private final JSpinner depthError = Ui.named(new JSpinner(new SpinnerNumberModel(1.0, 0.1, 5.0, 0.05)), "rehearse.depth.error",
            "Factor on Z* for depth scaled (--depth-error): 1.2 = the controller thinks the target is 20 % further");
    private final javax.swing.JCheckBox measuredNoise = Ui.named(new javax.swing.JCheckBox("measured", true), "rehearse.noise.measured",
            "Pixel noise: each point's measured jitter (0 where not measured); untick to give one figure (--noise)");
    private final JSpinner noise = Ui.named(new JSpinner(new SpinnerNumberModel(0.1, 0.0, 10.0, 0.05)), "rehearse.noise",
            "Pixel noise standard deviation, px (--noise)");
    private final JSpinner seed = Ui.named(new JSpinner(new SpinnerNumberModel(1, 0, 999_999, 1)), "rehearse.seed", "Random seed of the start poses and noise (--seed)");
    /** One row per rehearsal of this session, side by side: what was run and its headline figures. */
    private final DefaultTableModel runs = new DefaultTableModel(new Object[]{Ui.head("Run", "#"), Ui.head("Set", "points, cond"),
            Ui.head("Law", ""), Ui.head("Lambda", "1/s"), Ui.head("Depth", "Z*"), Ui.head("Noise", "px"), Ui.head("Envelope", "+-mm, +-deg xy/z"),
            Ui.head("Converged", "of starts"), Ui.head("Median time", "s"), Ui.head("Median final error", "px RMS"), Ui.head("Largest retreat", "mm")}, 0) {
        @Override public boolean isCellEditable(int r, int c) { return false; }
    };
    private final JPanel charts = new Ui.WidthPanel(new GridLayout(0, 1, 4, 4)); // as wide as the room beside the figures
    private final JLabel warnings = Ui.named(new JLabel(" "), "rehearse.warnings", null);
    private final JButton run;

    RehearseView(AppContext ctx) {
        super(new BorderLayout(6, 6));
        this.ctx = ctx;
        this.session = ctx.session();
        setName("view.rehearse");
        law.setSelectedItem(ControlLaw.MEAN);
        law.setRenderer(new javax.swing.DefaultListCellRenderer() {
            @Override public java.awt.Component getListCellRendererComponent(javax.swing.JList<?> l, Object v, int i, boolean sel, boolean f) {
                return super.getListCellRendererComponent(l, v instanceof ControlLaw c ? c.cliName() : v, i, sel, f);
            }
        });
        run = Ui.button("rehearse.run", "Rehearse", "Simulate the closed loop from every start pose", this::rehearse);
        depth.setRenderer(new javax.swing.DefaultListCellRenderer() {
            @Override public java.awt.Component getListCellRendererComponent(javax.swing.JList<?> l, Object v, int i, boolean sel, boolean f) {
                return super.getListCellRendererComponent(l, v instanceof org.targetbench.servo.DepthMode d ? d.cliName() : v, i, sel, f);
            }
        });
        noise.setEnabled(false);
        measuredNoise.addActionListener(e -> noise.setEnabled(!measuredNoise.isSelected()));
        depthError.setEnabled(false);
        depth.addActionListener(e -> depthError.setEnabled(depth.getSelectedItem() == org.targetbench.servo.DepthMode.SCALED));
        JButton load = Ui.button("rehearse.load", "Load servo set...", "Read an exported servo-set.json to rehearse or re-export it", this::chooseAndLoad);
        JPanel controls = new JPanel(new GridLayout(0, 1));
        controls.add(Ui.row(run, load, new JLabel("Starts"), starts, new JLabel("Lambda 1/s"), lambda, new JLabel("Law"), law, new JLabel("Seed"), seed));
        controls.add(Ui.row(new JLabel("Envelope +- mm"), envelopeMm, new JLabel("+- deg"), envelopeDeg, new JLabel("Depth"), depth,
                new JLabel("depth error x"), depthError, new JLabel("Noise"), measuredNoise, noise, new JLabel("px")));
        add(controls, BorderLayout.NORTH);
        JTable runsTable = Ui.named(new JTable(runs), "rehearse.runs", null);
        DetailPane.columnTips(runsTable, "Order of the rehearsal in this session", "Points and cond(L*) of the set rehearsed",
                "Control law: which interaction matrix it inverts", "Gain lambda, 1/s", "Depths the controller believes",
                "Pixel noise standard deviation, px, or each point's measured jitter", "Start envelope: +- mm on each axis, +- deg about x,y / about z",
                "Runs that converged below the threshold (0.5 px RMS by default)", "Median time to converge, s",
                "Median final image error, px RMS over points", "Largest retreat along the optical axis, mm");
        JScrollPane runsPane = new JScrollPane(runsTable);
        runsPane.setPreferredSize(new Dimension(600, 130));
        Ui.fitColumns(runsPane, new Object[]{"99", "12 points, cond 999.9", "reference", "0.50", "scaled x1.20", "measured", "100, 20/30",
                "1000 of 1000", "10.00", "0.000", "100.0"});
        runsPane.setBorder(javax.swing.BorderFactory.createTitledBorder("Runs of this session, side by side"));
        add(runsPane, BorderLayout.SOUTH);
        JPanel left = new JPanel(new BorderLayout());
        JTable t = Ui.named(new JTable(table), "rehearse.table", null);
        DetailPane.columnTips(t, "What was measured over the rehearsal's runs (one run per start pose drawn in the envelope, --starts).",
                "The figure with its unit. Converged: final image error below the threshold (0.5 px RMS by default) within the time limit (20 s by default); "
                        + "the warnings under the table say which figures crossed their limits.");
        JScrollPane sp = new JScrollPane(t);
        sp.setPreferredSize(new Dimension(420, 260));
        Ui.fitColumns(sp, new Object[]{"", "1000 of 1000 (100.0 %)"}, new Object[]{"", "999.9 mm (9.99 x reference distance)"});
        left.add(sp, BorderLayout.CENTER);
        JPanel under = new JPanel(new BorderLayout());
        under.add(warnings, BorderLayout.NORTH);
        under.add(new DetailPane("rehearse.detail", "Select a figure or a run to read it in full.", t, runsTable), BorderLayout.CENTER);
        left.add(under, BorderLayout.SOUTH);
        add(left, BorderLayout.WEST);
        add(ArmRehearsePanel.tabs(new JScrollPane(charts), new ArmRehearsePanel(ctx, () -> (Double) lambda.getValue())), BorderLayout.CENTER);
        session.addListener(this);
    }

    void rehearse() {
        ServoSet set = session.servoSet();
        if (set == null) {
            ctx.status().accept("Choose a servo set first (Servo set view)");
            return;
        }
        RehearsalConfig c = new RehearsalConfig();
        c.starts = (Integer) starts.getValue();
        c.lambda = (Double) lambda.getValue();
        c.law = (ControlLaw) law.getSelectedItem();
        c.seed = ((Number) seed.getValue()).longValue();
        double mm = (Double) envelopeMm.getValue(), deg = (Double) envelopeDeg.getValue();
        c.envelopeMm = new double[]{mm, mm, mm};
        c.envelopeDeg = new double[]{deg, deg, 2 * deg};
        c.depthMode = (org.targetbench.servo.DepthMode) depth.getSelectedItem();
        if (c.depthMode == org.targetbench.servo.DepthMode.SCALED) c.depthErrorFactor = (Double) depthError.getValue();
        c.noiseSigmaPx = measuredNoise.isSelected() ? Double.NaN : (Double) noise.getValue();
        try {
            c.checkValidity();
        } catch (IllegalArgumentException e) {
            ctx.status().accept("Cannot rehearse: " + e.getMessage());
            return;
        }
        run.setEnabled(false);
        ctx.status().accept("Rehearsing " + c.starts + " starts...");
        long t0 = System.nanoTime();
        new SwingWorker<RehearsalResult, Void>() {
            @Override protected RehearsalResult doInBackground() throws Exception { return Rehearsal.run(set, c); }
            @Override protected void done() {
                run.setEnabled(true);
                try {
                    RehearsalResult r = get();
                    if (session.servoSet() == set) session.setRehearsal(r, (System.nanoTime() - t0) / 1e9);
                    addRun(r, set);
                    ctx.status().accept(String.format(Locale.ROOT, "Rehearsal: %d of %d converged", r.summary().converged(), r.summary().runs()));
                } catch (ExecutionException e) {
                    ctx.status().accept("Rehearsal failed: " + e.getCause().getMessage());
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
            }
        }.execute();
    }

    @Override
    public void changed(Session.Change c) {
        if (c != Session.Change.SERVO && c != Session.Change.SOURCE) return;
        RehearsalResult r = session.rehearsal();
        table.setRowCount(0);
        charts.removeAll();
        if (r == null) {
            warnings.setText(session.servoSet() == null ? "No servo set yet." : "The current set has not been rehearsed.");
        } else {
            var s = r.summary();
            row("converged", String.format(Locale.ROOT, "%d of %d (%.1f %%)", s.converged(), s.runs(), 100 * s.convergenceRate()));
            row("time to converge, median", Ui.fmt(s.medianTimeS(), 2) + " s");
            row("time to converge, p95", Ui.fmt(s.p95TimeS(), 2) + " s");
            row("final error, median", Ui.fmt(s.medianFinalErrorPx(), 3) + " px");
            row("largest retreat", Ui.fmt(s.maxRetreatMm(), 1) + " mm (" + Ui.fmt(s.maxDepthRatio(), 2) + " x reference distance)");
            row("closest approach to the target", Ui.fmt(s.minPlaneDistanceM(), 3) + " m");
            row("lost a point out of view", Integer.toString(s.lostFieldOfView()));
            row("lost track / timed out / retreated / singular", s.trackLost() + " / " + s.timeouts() + " / " + s.retreated() + " / " + s.singular());
            warnings.setText(r.warnings().isEmpty() ? "No warnings." : "<html>" + String.join("<br>", org.targetbench.pipeline.Reasons.warnings(r)) + "</html>");
            for (JFreeChart ch : new JFreeChart[]{RehearsalReport.errorChart(r), RehearsalReport.pathsChart(r), RehearsalReport.mapChart(r)}) {
                ChartPanel cp = new ChartPanel(ch);
                cp.setPreferredSize(new Dimension(680, 340));
                charts.add(cp);
            }
        }
        charts.revalidate();
        charts.repaint();
    }

    private void row(String k, String v) { table.addRow(new Object[]{k, v}); }

    private void addRun(RehearsalResult r, ServoSet set) {
        var c = r.config();
        var m = r.summary();
        runs.addRow(new Object[]{runs.getRowCount() + 1,
                String.format(Locale.ROOT, "%d points, cond %.1f", set.points().size(), set.condition()), c.law.cliName(), Ui.fmt(c.lambda, 2),
                c.depthMode == org.targetbench.servo.DepthMode.SCALED ? "scaled x" + Ui.fmt(c.depthErrorFactor, 2) : c.depthMode.cliName(),
                Double.isNaN(c.noiseSigmaPx) ? "measured" : Ui.fmt(c.noiseSigmaPx, 2),
                Ui.fmt(c.envelopeMm[0], 0) + ", " + Ui.fmt(c.envelopeDeg[0], 0) + "/" + Ui.fmt(c.envelopeDeg[2], 0),
                String.format(Locale.ROOT, "%d of %d", m.converged(), m.runs()), Ui.fmt(m.medianTimeS(), 2), Ui.fmt(m.medianFinalErrorPx(), 3),
                Ui.fmt(m.maxRetreatMm(), 1)});
    }

    /** Rows of the side-by-side runs table. */
    int runCount() { return runs.getRowCount(); }

    private void chooseAndLoad() {
        javax.swing.JFileChooser fc = new javax.swing.JFileChooser(ctx.prefs().get("lastExportFolder", System.getProperty("user.dir")));
        fc.setFileFilter(new javax.swing.filechooser.FileNameExtensionFilter("Servo set (servo-set.json)", "json"));
        if (fc.showOpenDialog(ctx.window()) != javax.swing.JFileChooser.APPROVE_OPTION) return;
        loadSet(fc.getSelectedFile().toPath());
    }

    /** Reads an exported servo set into the session, to rehearse or re-export it; a bad file gets a message. */
    boolean loadSet(java.nio.file.Path file) {
        try {
            session.loadServoSet(org.targetbench.formats.ServoSetReader.read(file));
            ctx.status().accept("Loaded the servo set " + file);
            return true;
        } catch (org.targetbench.source.SourceException e) {
            ctx.status().accept("Could not read the servo set: " + e.getMessage());
            javax.swing.JOptionPane.showMessageDialog(ctx.window(), e.getMessage(), "Could not read the servo set", javax.swing.JOptionPane.WARNING_MESSAGE);
            return false;
        }
    }
}
