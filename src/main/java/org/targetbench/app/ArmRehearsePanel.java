package org.targetbench.app;

import org.jfree.chart.ChartPanel;
import org.jfree.chart.JFreeChart;
import org.targetbench.arm.ArmRehearsalConfig;
import org.targetbench.arm.ArmRehearsalResult;
import org.targetbench.arm.ArmRunResult;
import org.targetbench.pipeline.ArmWords;
import org.targetbench.arm.HandEye;
import org.targetbench.export.Safety;
import org.targetbench.pipeline.ArmInputs;
import org.targetbench.pipeline.ArmRun;
import org.targetbench.report.ArmReport;
import org.targetbench.servo.ServoSet;
import org.targetbench.source.SourceException;

import javax.swing.BoxLayout;
import javax.swing.ImageIcon;
import javax.swing.JButton;
import javax.swing.JCheckBox;
import javax.swing.JComboBox;
import javax.swing.JComponent;
import javax.swing.JFileChooser;
import javax.swing.JLabel;
import javax.swing.JPanel;
import javax.swing.JScrollPane;
import javax.swing.JSpinner;
import javax.swing.JTabbedPane;
import javax.swing.JTable;
import javax.swing.JTextField;
import javax.swing.SpinnerNumberModel;
import javax.swing.SwingWorker;
import javax.swing.table.DefaultTableModel;
import java.awt.BorderLayout;
import java.awt.Dimension;
import java.io.File;
import java.util.Locale;
import java.util.concurrent.ExecutionException;

/**
 * The rehearse view's "On the arm" tab: the current set rehearsed on the demo arm, an arm.json or a URDF arm, with a
 * hand-eye file, image latency and controller period; shows the per-run figures and flags, the warnings, what is not
 * modelled with the safety notice, the joint, manipulability and limit-margin charts and the three-view drawing.
 */
final class ArmRehearsePanel extends JPanel {
    static final String DEMO = "Demo arm (invented)", DH = "arm.json (DH)...", URDF = "URDF...";

    private final AppContext ctx;
    private final JComboBox<String> armChoice = Ui.named(new JComboBox<>(new String[]{DEMO, DH, URDF}), "arm.choice",
            "The arm that carries the camera: the invented demo arm, an arm.json with a DH table, or a URDF file");
    private final JTextField tip = Ui.named(new JTextField(8), "arm.tip", "URDF link that carries the camera mount (empty: the chain's only leaf)");
    private final JLabel armFile = Ui.named(new JLabel("demo"), "arm.file", null);
    private final JLabel handEyeFile = Ui.named(new JLabel("demo mount"), "arm.handeye.file", null);
    private final JSpinner latency = Ui.named(new JSpinner(new SpinnerNumberModel(1, 0, 20, 1)), "arm.latency", "Image latency in controller periods");
    private final JSpinner period = Ui.named(new JSpinner(new SpinnerNumberModel(10.0, 1.0, 200.0, 1.0)), "arm.period", "Controller period, ms");
    private final JSpinner starts = Ui.named(new JSpinner(new SpinnerNumberModel(24, 1, 1000, 1)), "arm.starts", "Start poses drawn in the envelope");
    private final JCheckBox sweep = Ui.named(new JCheckBox("Gain sweep"), "arm.sweep", "Find the largest gain that converges from every start without oscillation");
    private final DefaultTableModel table = new DefaultTableModel(new Object[]{Ui.head("run", "#"), Ui.head("outcome", ""), Ui.head("time", "s"),
            Ui.head("min manipulability", "m³"), Ui.head("limit margin", "deg"), Ui.head("peak speed", "% of limit"), Ui.head("flags", "")}, 0) {
        @Override public boolean isCellEditable(int r, int c) { return false; }
    };
    private final JLabel notes = Ui.named(new JLabel(" "), "arm.warnings", null);
    private final JPanel charts = new JPanel();
    private final JButton run;
    private File armPath, handEyePath;

    ArmRehearsePanel(AppContext ctx, java.util.function.Supplier<Double> lambda) {
        super(new BorderLayout(6, 6));
        this.ctx = ctx;
        setName("arm.panel");
        armChoice.addActionListener(e -> chooseArm());
        JButton he = Ui.button("arm.handeye", "Hand-eye...", "Choose a handeye.json (camera pose in the flange frame)", this::chooseHandEye);
        run = Ui.button("arm.run", "Rehearse on the arm", "Simulate the closed loop with the camera on the arm's flange", () -> rehearse(lambda.get()));
        JPanel top = new JPanel();
        top.setLayout(new BoxLayout(top, BoxLayout.Y_AXIS));
        top.add(Ui.row(run, new JLabel("Arm"), armChoice, armFile, new JLabel("Tip"), tip, he, handEyeFile));
        top.add(Ui.row(new JLabel("Latency, periods"), latency, new JLabel("Period, ms"), period, new JLabel("Starts"), starts, sweep));
        JLabel safety = new JLabel("<html><body style='width:640px'><b>Not modelled:</b> " + ArmWords.NOT_MODELLED + "<br><b>Safety:</b> "
                + Safety.NOTICE + "</body></html>");
        safety.setName("arm.safety");
        top.add(Ui.row(safety));
        JTable t = Ui.named(new JTable(table), "arm.table", null);
        DetailPane.columnTips(t, "Start pose drawn in the envelope, in order.", "How the run on the arm ended (never a clearance).",
                "Time to converge, s; a run is stopped at the rehearsal's time limit.",
                "Smallest manipulability w = sqrt(det J Jᵀ) along the run, m³ for a 6-joint arm (Yoshikawa 1985); damped least squares "
                        + "starts below 0.004 and a pose counts as singular below 0.0005 (the arm rehearsal's default thresholds).",
                "Smallest distance of any joint to its position limit along the run, degrees; 0 means a limit was reached.",
                "Largest joint speed as a share of that joint's limit, percent; speeds are scaled down to the limit (100 %).",
                "Warnings about the run (rehearsal flags); a run without flags is still no clearance.");
        t.setDefaultRenderer(Object.class, DetailPane.renderer(t.getDefaultRenderer(Object.class)));
        JScrollPane sp = new JScrollPane(t);
        sp.setPreferredSize(new Dimension(700, 150));
        Ui.fitColumns(sp); // every column whole; a long flags line scrolls sideways rather than being cut
        top.add(sp);
        top.add(Ui.row(notes));
        add(top, BorderLayout.NORTH);
        charts.setLayout(new BoxLayout(charts, BoxLayout.Y_AXIS));
        add(new JScrollPane(charts), BorderLayout.CENTER);
    }

    /** The rehearse view's centre: the free-flying charts and this tab. */
    static JTabbedPane tabs(JComponent freeFlying, ArmRehearsePanel arm) {
        JTabbedPane t = new JTabbedPane();
        t.setName("rehearse.tabs");
        t.addTab("Free-flying camera", freeFlying);
        t.addTab("On the arm", arm);
        return t;
    }

    private void chooseArm() {
        String c = (String) armChoice.getSelectedItem();
        if (DEMO.equals(c)) {
            armPath = null;
            armFile.setText("demo");
            return;
        }
        JFileChooser fc = new JFileChooser();
        if (fc.showOpenDialog(ctx.window()) == JFileChooser.APPROVE_OPTION) {
            armPath = fc.getSelectedFile();
            armFile.setText(armPath.getName());
        } else armChoice.setSelectedItem(DEMO);
    }

    private void chooseHandEye() {
        JFileChooser fc = new JFileChooser();
        if (fc.showOpenDialog(ctx.window()) == JFileChooser.APPROVE_OPTION) {
            handEyePath = fc.getSelectedFile();
            handEyeFile.setText(handEyePath.getName());
        }
    }

    void rehearse(double lambda) {
        ServoSet set = ctx.session().servoSet();
        if (set == null) {
            ctx.status().accept("Choose a servo set first (Servo set view)");
            return;
        }
        ArmInputs.Arm arm;
        HandEye he;
        try {
            arm = ArmInputs.arm(armPath == null ? "demo" : armPath.getPath(), tip.getText().isBlank() ? null : tip.getText().trim());
            if (handEyePath == null && !arm.model().isDemo()) {
                ctx.status().accept("Choose the hand-eye file for this arm (Hand-eye...)");
                return;
            }
            he = handEyePath == null ? HandEye.demo() : ArmInputs.handEye(handEyePath.getPath());
        } catch (SourceException e) {
            ctx.status().accept(e.getMessage());
            return;
        }
        ArmRehearsalConfig c = new ArmRehearsalConfig();
        c.servo.starts = (Integer) starts.getValue();
        c.servo.lambda = lambda;
        c.servo.dtS = (Double) period.getValue() / 1000;
        c.servo.tracedRuns = 8;
        c.latencyFrames = (Integer) latency.getValue();
        c.referenceJointsRad = arm.referenceJointsRad();
        boolean advise = sweep.isSelected();
        run.setEnabled(false);
        ctx.status().accept("Rehearsing on " + arm.model().name() + "...");
        new SwingWorker<ArmRehearsalResult, Void>() {
            @Override protected ArmRehearsalResult doInBackground() throws Exception {
                return ArmRun.run(new ArmRun.Request(set, arm.model(), he, c, null, advise));
            }
            @Override protected void done() {
                run.setEnabled(true);
                try {
                    ArmRehearsalResult r = get();
                    show(r, set);
                    ctx.status().accept(String.format(Locale.ROOT, "Rehearsal on the arm: %d of %d converged", r.converged(), r.runs().size()));
                } catch (ExecutionException e) {
                    ctx.status().accept("Rehearsal on the arm failed: " + e.getCause().getMessage());
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
            }
        }.execute();
    }

    void show(ArmRehearsalResult r, ServoSet set) {
        table.setRowCount(0);
        for (ArmRunResult x : r.runs())
            table.addRow(new Object[]{x.index(), x.outcome().label(), Ui.fmt(x.timeS(), 2), String.format(Locale.ROOT, "%.3g", x.minManipulability()),
                    Ui.fmt(x.minLimitMarginDeg(), 1), Ui.fmt(100 * x.peakSpeedRatio(), 0) + " %", ArmWords.flags(x)});
        StringBuilder w = new StringBuilder("<html>");
        for (String s : ArmWords.warnings(r)) w.append(s).append("<br>");
        r.advice().ifPresent(a -> w.append(ArmWords.advice(a)));
        notes.setText(w.append("</html>").toString());
        charts.removeAll();
        charts.add(new JLabel(new ImageIcon(ArmReport.drawing(r, set))));
        for (JFreeChart ch : new JFreeChart[]{ArmReport.jointsChart(r), ArmReport.manipulabilityChart(r), ArmReport.marginChart(r)}) {
            ChartPanel cp = new ChartPanel(ch);
            cp.setPreferredSize(new Dimension(680, 320));
            charts.add(cp);
        }
        charts.revalidate();
        charts.repaint();
    }
}
