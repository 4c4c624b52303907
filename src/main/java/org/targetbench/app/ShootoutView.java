package org.targetbench.app;

import org.targetbench.camera.CameraModel;
import org.targetbench.detect.DetectorType;
import org.targetbench.export.AtomicOutput;
import org.targetbench.export.ShootoutWriter;
import org.targetbench.perturb.PerturbKind;
import org.targetbench.perturb.Perturbation;
import org.targetbench.pipeline.DemoScenario;
import org.targetbench.pipeline.ShootoutRun;
import org.targetbench.pipeline.SweepConfig;
import org.targetbench.pipeline.SweepSummary;
import org.targetbench.report.ShootoutReport;
import org.targetbench.source.CameraFiles;
import org.targetbench.source.EnvelopeFile;
import org.targetbench.target.TargetDesign;

import javax.swing.BorderFactory;
import javax.swing.DefaultListModel;
import javax.swing.JButton;
import javax.swing.JCheckBox;
import javax.swing.JFileChooser;
import javax.swing.JLabel;
import javax.swing.JList;
import javax.swing.JPanel;
import javax.swing.JProgressBar;
import javax.swing.JScrollPane;
import javax.swing.JSpinner;
import javax.swing.JTable;
import javax.swing.ListSelectionModel;
import javax.swing.SpinnerNumberModel;
import javax.swing.SwingWorker;
import javax.swing.table.DefaultTableModel;
import java.awt.BorderLayout;
import java.awt.Dimension;
import java.awt.GridLayout;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.function.Supplier;

/**
 * The target shoot-out from the workbench: choose two or more of the listed designs, the camera, stand-off, tilt and
 * conditions (as the command line's {@code shootout} offers), run it on a worker with progress and cancel, read the
 * ranking with every figure and reason in full, and save the same {@code shootout.csv} and {@code shootout.html} the
 * command line writes. The run is {@link ShootoutRun}, the same as the command line's.
 */
final class ShootoutView extends JPanel {
    private final AppContext ctx;
    private final Supplier<List<TargetDesign>> listed;
    private final DefaultListModel<TargetDesign> designs = new DefaultListModel<>();
    private final JList<TargetDesign> designList = Ui.named(new JList<>(designs), "shootout.designs",
            "Designs to compare (from the Targets view); select two or more with Ctrl or Shift");
    private final JLabel cameraLabel = Ui.named(new JLabel(), "shootout.camera", null);
    private final JSpinner standoff = Ui.named(new JSpinner(new SpinnerNumberModel(250.0, 20.0, 5000.0, 10.0)), "shootout.standoff",
            "Distance from the camera to the target's centre, mm (the command line's --standoff-mm)");
    private final JSpinner tilt = Ui.named(new JSpinner(new SpinnerNumberModel(20.0, 0.0, 80.0, 5.0)), "shootout.tilt",
            "Largest tilt for the feasibility check, degrees (--tilt)");
    private final JSpinner levels = Ui.named(new JSpinner(new SpinnerNumberModel(5, 2, 32, 1)), "shootout.levels", "Levels per condition (--levels)");
    private final JSpinner views = Ui.named(new JSpinner(new SpinnerNumberModel(6, 1, 200, 1)), "shootout.views",
            "Rendered views per design in the sweep (--views)");
    private final JList<DetectorType> detectors = Ui.named(new JList<>(DetectorType.values()), "shootout.detectors",
            "Detectors to sweep and to choose the servo set with (--detectors); select with Ctrl or Shift");
    private final JSpinner seed = Ui.named(new JSpinner(new SpinnerNumberModel(1, 0, 999_999, 1)), "shootout.seed",
            "Seed of every random choice (--seed)");
    private final Map<PerturbKind, JCheckBox> kinds = new EnumMap<>(PerturbKind.class);
    private final JLabel envelopeLabel = Ui.named(new JLabel("Envelope: every swept level"), "shootout.envelope", null);
    private final JProgressBar progress = Ui.named(new JProgressBar(), "shootout.progress", null);
    private final JLabel verdict = Ui.named(new JLabel(" "), "shootout.verdict", null);
    private final DefaultTableModel ranking = new DefaultTableModel(ShootoutRows.COLUMNS, 0) {
        @Override public boolean isCellEditable(int r, int c) { return false; }
    };
    private final JTable table = Ui.named(new JTable(ranking), "shootout.ranking", null);
    private final DetailPane detail = new DetailPane("shootout.detail", "Select a design's row to read every figure and reason in full.", table);
    private final JButton run, cancel, save;
    private final AtomicBoolean cancelFlag = new AtomicBoolean();
    private Map<Perturbation, Double> envelope = Map.of();
    private SwingWorker<List<ShootoutRun.Entry>, Integer> worker;
    private List<ShootoutRun.Entry> last;
    private double lastStandoffM, lastTiltDeg;
    private String lastCamera = "";
    private Map<Perturbation, Double> lastEnvelope = Map.of();

    ShootoutView(AppContext ctx, Supplier<List<TargetDesign>> listed) {
        super(new BorderLayout(6, 6));
        this.ctx = ctx;
        this.listed = listed;
        setName("view.shootout");
        designList.setSelectionMode(ListSelectionModel.MULTIPLE_INTERVAL_SELECTION);
        designList.setCellRenderer(new javax.swing.DefaultListCellRenderer() {
            @Override public java.awt.Component getListCellRendererComponent(JList<?> l, Object v, int i, boolean s, boolean f) {
                JLabel c = (JLabel) super.getListCellRendererComponent(l, v, i, s, f);
                if (v instanceof TargetDesign d) c.setText("<html><b>" + d.id() + "</b><br>" + d.name() + "</html>");
                return c;
            }
        });
        JScrollPane ls = new JScrollPane(designList);
        ls.setPreferredSize(new Dimension(330, 165));
        JPanel left = new JPanel(new BorderLayout());
        left.add(Ui.heading("Designs to compare"), BorderLayout.NORTH);
        left.add(ls, BorderLayout.CENTER);
        left.add(Ui.row(Ui.button("shootout.refresh", "Refresh list", "Take the designs listed in the Targets view again", this::refresh)),
                BorderLayout.SOUTH);
        detectors.setCellRenderer(Ui.detectorRenderer());
        detectors.setSelectionMode(ListSelectionModel.MULTIPLE_INTERVAL_SELECTION);
        detectors.setSelectionInterval(0, DetectorType.values().length - 1); // the command line's default: every detector
        JScrollPane ds = new JScrollPane(detectors);
        ds.setPreferredSize(new Dimension(150, 165));
        JPanel dets = new JPanel(new BorderLayout());
        dets.add(Ui.heading("Detectors"), BorderLayout.NORTH);
        dets.add(ds, BorderLayout.CENTER);
        JPanel lists = new JPanel(new BorderLayout(6, 0));
        lists.add(left, BorderLayout.CENTER);
        lists.add(dets, BorderLayout.EAST);

        JPanel kindRow = Ui.row(new JLabel("Conditions"));
        for (PerturbKind k : PerturbKind.values()) {
            Perturbation p = Perturbation.primary(k);
            JCheckBox box = Ui.named(new JCheckBox(k.cliName(), true), "shootout.kind." + k.cliName(), "Sweep " + p.id() + " over its default range");
            kinds.put(k, box);
            kindRow.add(box);
        }
        kindRow.add(new JLabel("   Seed"));
        kindRow.add(seed);
        JPanel envelopeRow = Ui.row(Ui.button("shootout.envelope.open", "Envelope...", "Operating envelope: the harshest value of each parameter "
                + "the cell will see (JSON, as --envelope)", this::chooseEnvelope),
                Ui.button("shootout.envelope.clear", "No envelope", "Rank over every swept level", () -> setEnvelope(Map.of(), "every swept level")),
                envelopeLabel);
        run = Ui.button("shootout.run", "Run shoot-out", "Check, sweep and choose a servo set for every selected design", this::start);
        cancel = Ui.button("shootout.cancel", "Cancel", "Stop the shoot-out; nothing is ranked from an incomplete run", () -> cancelFlag.set(true));
        save = Ui.button("shootout.save", "Save...", "Write shootout.csv and shootout.html to a folder, as the command line does", this::save);
        cancel.setEnabled(false);
        save.setEnabled(false);
        progress.setStringPainted(true);
        progress.setString("not run");
        progress.setPreferredSize(new Dimension(320, progress.getPreferredSize().height));
        JPanel settings = new JPanel(new GridLayout(0, 1));
        settings.add(Ui.row(cameraLabel, Ui.button("shootout.camera.open", "Camera...", "Intrinsics of the camera that will see the targets: "
                + "camera.json, OpenCV or ROS YAML; becomes the session's camera", this::chooseCamera)));
        settings.add(Ui.row(new JLabel("Stand-off mm"), standoff, new JLabel("Tilt up to deg"), tilt, new JLabel("Levels"), levels,
                new JLabel("Views"), views));
        settings.add(kindRow);
        settings.add(envelopeRow);
        settings.add(Ui.row(run, cancel, save, progress));
        JPanel top = new JPanel(new BorderLayout(6, 0));
        top.add(lists, BorderLayout.WEST);
        top.add(settings, BorderLayout.CENTER);
        top.add(Ui.row(verdict), BorderLayout.SOUTH);
        add(top, BorderLayout.NORTH);

        table.setAutoResizeMode(JTable.AUTO_RESIZE_OFF);
        DetailPane.columnTips(table, ShootoutRows.TIPS);
        int[] widths = {50, 150, 175, 110, 90, 60, 70, 80, 80, 80, 160, 300, 300, 240};
        javax.swing.table.TableCellRenderer header = table.getTableHeader().getDefaultRenderer();
        for (int c = 0; c < ShootoutRows.COLUMNS.length; c++) { // wide enough for the header's full text, so no header is cut off
            int w = header.getTableCellRendererComponent(table, ShootoutRows.COLUMNS[c], false, false, -1, c).getPreferredSize().width + 16;
            table.getColumnModel().getColumn(c).setPreferredWidth(Math.max(widths[c], w));
        }
        JLabel note = new JLabel("<html>" + ShootoutRows.NOTE + "</html>");
        note.setBorder(BorderFactory.createEmptyBorder(2, 4, 2, 4));
        javax.swing.JSplitPane split = new javax.swing.JSplitPane(javax.swing.JSplitPane.VERTICAL_SPLIT, new JScrollPane(table), detail);
        split.setResizeWeight(0.35); // the detail pane gets most of the height: it holds every figure and reason in full
        split.setBorder(null);
        add(split, BorderLayout.CENTER);
        add(note, BorderLayout.SOUTH);
        ctx.session().addListener(c -> {
            if (c == Session.Change.CAMERA) updateCameraLabel();
        });
        addComponentListener(new java.awt.event.ComponentAdapter() {
            @Override public void componentShown(java.awt.event.ComponentEvent e) { refresh(); }
        });
        updateCameraLabel();
        refresh();
    }

    /** Takes the designs listed in the Targets view again, keeping the selection of those still listed. */
    void refresh() {
        Set<String> chosen = new HashSet<>();
        for (TargetDesign d : designList.getSelectedValuesList()) chosen.add(d.id());
        designs.clear();
        listed.get().forEach(designs::addElement);
        List<Integer> again = new ArrayList<>();
        for (int i = 0; i < designs.size(); i++) if (chosen.contains(designs.get(i).id())) again.add(i);
        if (again.isEmpty() && designs.size() >= 2) designList.setSelectionInterval(0, 1);
        else designList.setSelectedIndices(again.stream().mapToInt(Integer::intValue).toArray());
    }

    private CameraModel camera() {
        CameraModel c = ctx.session().camera();
        return c != null ? c : DemoScenario.camera();
    }

    private String cameraName() {
        return ctx.session().camera() != null ? ctx.session().cameraName() : "the demo camera";
    }

    private void updateCameraLabel() {
        CameraModel c = camera();
        cameraLabel.setText(String.format(Locale.ROOT, "Camera: %s, %d x %d px, fx %.0f px", cameraName(), c.width(), c.height(), c.fx()));
    }

    private void chooseCamera() {
        JFileChooser fc = new JFileChooser(ctx.prefs().get("lastCamera", DesignsView.DESIGNS.toString()));
        if (fc.showOpenDialog(ctx.window()) != JFileChooser.APPROVE_OPTION) return;
        try {
            Path p = fc.getSelectedFile().toPath();
            ctx.session().setCamera(CameraFiles.read(p), p.getFileName().toString());
            ctx.prefs().put("lastCamera", p.toString());
        } catch (Exception e) {
            javax.swing.JOptionPane.showMessageDialog(ctx.window(), e.getMessage(), "Cannot read the camera", javax.swing.JOptionPane.WARNING_MESSAGE);
        }
    }

    private void chooseEnvelope() {
        JFileChooser fc = new JFileChooser(ctx.prefs().get("lastEnvelope", System.getProperty("user.dir")));
        if (fc.showOpenDialog(ctx.window()) != JFileChooser.APPROVE_OPTION) return;
        Path p = fc.getSelectedFile().toPath();
        try {
            setEnvelope(SweepSummary.envelope(EnvelopeFile.read(p)), p.getFileName().toString());
            ctx.prefs().put("lastEnvelope", p.toString());
        } catch (Exception e) {
            javax.swing.JOptionPane.showMessageDialog(ctx.window(), p + ": " + e.getMessage(), "Cannot read the envelope", javax.swing.JOptionPane.WARNING_MESSAGE);
        }
    }

    void setEnvelope(Map<Perturbation, Double> env, String name) {
        envelope = Map.copyOf(env);
        envelopeLabel.setText("Envelope: " + name);
    }

    /** The sweep settings, as the command line builds them from its options; a one-line message when one is out of range. */
    private SweepConfig config() {
        SweepConfig c = new SweepConfig();
        List<DetectorType> chosen = detectors.getSelectedValuesList();
        c.detectors = ctx.session().configs().stream().filter(d -> chosen.contains(d.type())).toList();
        for (PerturbKind k : PerturbKind.values()) if (kinds.get(k).isSelected()) c.parameters.add(Perturbation.primary(k));
        c.levels = (Integer) levels.getValue();
        c.syntheticFrames = (Integer) views.getValue();
        c.seed = ((Number) seed.getValue()).longValue();
        c.checkValidity();
        return c;
    }

    void start() {
        if (worker != null) return;
        List<TargetDesign> chosen = designList.getSelectedValuesList();
        String refusal = null;
        if (chosen.size() < 2) refusal = "Select at least two designs to compare (Ctrl-click), got " + chosen.size();
        for (int i = 0; i < chosen.size() && refusal == null; i++)
            for (int j = 0; j < i; j++)
                if (chosen.get(i).id().equals(chosen.get(j).id())) refusal = "Two selected designs have the id \"" + chosen.get(i).id() + "\"; ids must differ within a shoot-out";
        if (refusal == null && kinds.values().stream().noneMatch(JCheckBox::isSelected)) refusal = "Choose at least one condition to sweep";
        if (refusal == null && detectors.getSelectedValuesList().isEmpty()) refusal = "Choose at least one detector";
        if (refusal != null) {
            verdict.setText(refusal);
            ctx.status().accept(refusal);
            return;
        }
        SweepConfig c = config();
        double standoffM = (Double) standoff.getValue() / 1000, tiltDeg = (Double) tilt.getValue();
        CameraModel cam = camera();
        Map<Perturbation, Double> env = envelope;
        String camName = cameraName();
        ShootoutRun runner = new ShootoutRun(cam, standoffM, tiltDeg, c, env);
        cancelFlag.set(false);
        last = null;
        ranking.setRowCount(0);
        progress.setMaximum(chosen.size());
        progress.setValue(0);
        progress.setString("design 1 of " + chosen.size() + ": " + chosen.get(0).id());
        run.setEnabled(false);
        cancel.setEnabled(true);
        save.setEnabled(false);
        verdict.setText("Running: " + chosen.size() + " designs, " + c.parameters.size() + " conditions x " + c.levels + " levels, "
                + c.syntheticFrames + " views each...");
        long t0 = System.nanoTime();
        worker = new SwingWorker<>() {
            @Override protected List<ShootoutRun.Entry> doInBackground() throws Exception {
                return runner.run(chosen, DemoScenario.lighting(), (d, t, w) -> publish(d), cancelFlag::get);
            }
            @Override protected void process(List<Integer> chunks) {
                int d = chunks.get(chunks.size() - 1);
                progress.setValue(d);
                progress.setString(d >= chosen.size() ? "finishing" : "design " + (d + 1) + " of " + chosen.size() + ": " + chosen.get(d).id());
            }
            @Override protected void done() {
                worker = null;
                run.setEnabled(true);
                cancel.setEnabled(false);
                try {
                    List<ShootoutRun.Entry> got = get();
                    boolean complete = !cancelFlag.get() && got.size() == chosen.size() && got.stream().noneMatch(e -> e.sweep().cancelled());
                    if (!complete) {
                        progress.setString("stopped");
                        verdict.setText("Stopped: incomplete: " + got.stream().filter(e -> !e.sweep().cancelled()).count() + " of " + chosen.size()
                                + " designs measured; no ranking from an incomplete shoot-out, and nothing to save.");
                        return;
                    }
                    last = got;
                    lastStandoffM = standoffM;
                    lastTiltDeg = tiltDeg;
                    lastCamera = camName;
                    lastEnvelope = env;
                    show(got);
                    progress.setValue(chosen.size());
                    progress.setString("done");
                    save.setEnabled(true);
                    ShootoutRun.Entry top = got.get(0);
                    verdict.setText("Done. First: " + top.design().id() + " (check " + top.feasibility().overall() + ", " + top.robustPoints()
                            + " robust points, cond(L*) " + ShootoutRows.cond(top) + "). Not a guarantee: rehearse the set before the cell relies on it.");
                    ctx.status().accept(String.format(Locale.ROOT, "Shoot-out of %d designs in %.1f s", got.size(), (System.nanoTime() - t0) / 1e9));
                } catch (ExecutionException e) {
                    progress.setString("failed");
                    verdict.setText("Shoot-out failed: " + (e.getCause() == null ? e : e.getCause().getMessage()));
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
            }
        };
        worker.execute();
    }

    private void show(List<ShootoutRun.Entry> entries) {
        ranking.setRowCount(0);
        for (ShootoutRun.Entry e : entries) ranking.addRow(ShootoutRows.row(e));
        if (!entries.isEmpty()) table.setRowSelectionInterval(0, 0);
    }

    /** The latest complete shoot-out, or null. */
    List<ShootoutRun.Entry> result() { return last; }

    boolean running() { return worker != null; }

    JTable table() { return table; }

    DetailPane detail() { return detail; }

    private void save() {
        if (last == null) return;
        Folders.choose(ctx, "lastReportFolder", "Folder for shootout.csv and shootout.html", Folders.Use.SAVE).ifPresent(this::saveTo);
    }

    /** Writes the files the command line writes, atomically; says where, or why not. */
    void saveTo(Path dir) {
        if (last == null) return;
        ctx.prefs().put("lastReportFolder", dir.toString());
        try (AtomicOutput out = AtomicOutput.open(dir)) {
            ShootoutWriter.write(last, out.file("shootout.csv"));
            ShootoutReport.write(last, lastCamera, lastStandoffM, lastTiltDeg, lastEnvelope, out.file("shootout.html"));
            out.commit();
            ctx.status().accept("Written to " + dir + ": shootout.csv, shootout.html. Figures describe the rendered bench conditions, not a guarantee.");
        } catch (Exception e) {
            ctx.status().accept("Could not write the shoot-out: " + e.getMessage());
        }
    }
}
