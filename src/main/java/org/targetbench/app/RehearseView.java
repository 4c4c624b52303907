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
    private final JPanel charts = new JPanel(new GridLayout(0, 1, 4, 4));
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
        add(Ui.row(run, new JLabel("Starts"), starts, new JLabel("Lambda 1/s"), lambda, new JLabel("Law"), law), BorderLayout.NORTH);
        JPanel left = new JPanel(new BorderLayout());
        JTable t = Ui.named(new JTable(table), "rehearse.table", null);
        JScrollPane sp = new JScrollPane(t);
        sp.setPreferredSize(new Dimension(420, 260));
        left.add(sp, BorderLayout.CENTER);
        left.add(warnings, BorderLayout.SOUTH);
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
            warnings.setText(r.warnings().isEmpty() ? "No warnings." : "<html>" + String.join("<br>", r.warnings()) + "</html>");
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
}
