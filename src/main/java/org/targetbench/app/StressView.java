package org.targetbench.app;

import org.jfree.chart.ChartPanel;
import org.targetbench.detect.DetectorType;
import org.targetbench.export.AtomicOutput;
import org.targetbench.export.SweepWriter;
import org.targetbench.perturb.PerturbKind;
import org.targetbench.perturb.Perturbation;
import org.targetbench.pipeline.SweepBase;
import org.targetbench.pipeline.SweepConfig;
import org.targetbench.pipeline.SweepResult;
import org.targetbench.pipeline.SweepRow;
import org.targetbench.pipeline.SweepRun;
import org.targetbench.pipeline.SweepSummary;
import org.targetbench.report.Charts;
import org.targetbench.report.Palette;
import org.targetbench.report.SweepReport;

import javax.swing.JButton;
import javax.swing.JCheckBox;
import javax.swing.JComboBox;
import javax.swing.JFileChooser;
import javax.swing.JLabel;
import javax.swing.JPanel;
import javax.swing.JProgressBar;
import javax.swing.JScrollPane;
import javax.swing.JSpinner;
import javax.swing.SpinnerNumberModel;
import javax.swing.SwingWorker;
import javax.swing.Timer;
import java.awt.BorderLayout;
import java.awt.Dimension;
import java.awt.GridLayout;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ConcurrentLinkedQueue;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.atomic.AtomicBoolean;

/**
 * Runs a stress sweep from the workbench: choose the conditions and levels, watch the repeatability curves fill in
 * as cells finish, cancel at any time (finished cells are kept), and save the same report the command line writes.
 */
final class StressView extends JPanel {
    /** How often the charts redraw while a sweep runs, milliseconds. */
    static final int REDRAW_MS = 400;

    private final AppContext ctx;
    private final Map<PerturbKind, JCheckBox> kindBoxes = new EnumMap<>(PerturbKind.class);
    private final Map<PerturbKind, JComboBox<Perturbation>> paramBoxes = new EnumMap<>(PerturbKind.class);
    private final JSpinner levels = Ui.named(new JSpinner(new SpinnerNumberModel(5, 2, 32, 1)), "stress.levels", "Perturbation levels per condition");
    private final JSpinner views = Ui.named(new JSpinner(new SpinnerNumberModel(3, 1, 200, 1)), "stress.views", "Base frames: rendered views of the scene's target, or the first loaded frames");
    private final JProgressBar progress = Ui.named(new JProgressBar(), "stress.progress", null);
    private final JPanel charts = new JPanel(new GridLayout(0, 2, 4, 4));
    private final JLabel verdict = Ui.named(new JLabel(" "), "stress.verdict", null);
    private final JButton run, cancel, save;
    private final ConcurrentLinkedQueue<SweepRow> incoming = new ConcurrentLinkedQueue<>();
    private final List<SweepRow> rows = new ArrayList<>();
    private final Timer redraw = new Timer(REDRAW_MS, e -> drainAndDraw(false));
    private final AtomicBoolean cancelFlag = new AtomicBoolean();
    private SwingWorker<SweepResult, Integer> worker;
    private SweepConfig running;
    private SweepResult last;

    StressView(AppContext ctx) {
        super(new BorderLayout(6, 6));
        this.ctx = ctx;
        setName("view.stress");
        JPanel choose = new JPanel(new GridLayout(0, 1));
        for (PerturbKind k : PerturbKind.values()) {
            JCheckBox box = Ui.named(new JCheckBox(k.cliName(), true), "stress.kind." + k.cliName(), "Sweep this kind of condition");
            JComboBox<Perturbation> param = Ui.named(new JComboBox<>(Perturbation.ofKind(k).toArray(Perturbation[]::new)),
                    "stress.param." + k.cliName(), "Which parameter of " + k.cliName() + " to sweep over its default range");
            kindBoxes.put(k, box);
            paramBoxes.put(k, param);
            choose.add(Ui.row(box, param));
        }
        run = Ui.button("stress.run", "Run sweep", "Degrade the base frames at every level and score every detector", this::start);
        cancel = Ui.button("stress.cancel", "Cancel", "Stop the sweep; finished cells are kept", () -> cancelFlag.set(true));
        save = Ui.button("stress.save", "Save report...", "Write sweep.csv, ranking.csv and report.html to a folder", this::save);
        cancel.setEnabled(false);
        save.setEnabled(false);
        JPanel left = new JPanel(new BorderLayout());
        left.add(Ui.heading("Conditions"), BorderLayout.NORTH);
        left.add(choose, BorderLayout.CENTER);
        left.add(Ui.row(new JLabel("Perturbation levels"), levels, new JLabel("Views"), views), BorderLayout.SOUTH);
        JPanel top = new JPanel(new BorderLayout());
        top.add(left, BorderLayout.WEST);
        JPanel actions = new JPanel(new GridLayout(0, 1));
        actions.add(Ui.row(run, cancel, save));
        actions.add(Ui.row(progress));
        top.add(actions, BorderLayout.CENTER);
        top.add(Ui.row(verdict), BorderLayout.SOUTH); // full width, so the verdict and what did not run read in full
        add(top, BorderLayout.NORTH);
        add(new JScrollPane(charts), BorderLayout.CENTER);
    }

    private SweepConfig config() {
        SweepConfig c = new SweepConfig();
        Session s = ctx.session();
        c.detectors = s.configs();
        for (PerturbKind k : PerturbKind.values())
            if (kindBoxes.get(k).isSelected()) c.parameters.add((Perturbation) paramBoxes.get(k).getSelectedItem());
        c.levels = (Integer) levels.getValue();
        c.syntheticFrames = (Integer) views.getValue();
        return c;
    }

    void start() {
        Session s = ctx.session();
        if (worker != null) return;
        if (!s.hasFrames()) {
            ctx.status().accept("Load a source first (the demo scene or a frame folder)");
            return;
        }
        SweepConfig c = config();
        if (c.detectors.isEmpty() || c.parameters.isEmpty()) {
            ctx.status().accept("Choose at least one condition to sweep");
            return;
        }
        SweepBase base = base(s, c.syntheticFrames);
        SweepRun sweep = new SweepRun(c);
        running = c;
        rows.clear();
        incoming.clear();
        cancelFlag.set(false);
        progress.setMaximum(sweep.cellCount(base));
        progress.setValue(0);
        progress.setStringPainted(true);
        run.setEnabled(false);
        cancel.setEnabled(true);
        save.setEnabled(false);
        verdict.setText("Running " + sweep.cellCount(base) + " cells...");
        redraw.start();
        worker = new SwingWorker<>() {
            @Override protected SweepResult doInBackground() throws Exception {
                return sweep.run(base, (d, t, w) -> publish(d), cancelFlag::get, incoming::addAll);
            }
            @Override protected void process(List<Integer> chunks) { progress.setValue(chunks.get(chunks.size() - 1)); }
            @Override protected void done() {
                worker = null;
                redraw.stop();
                run.setEnabled(true);
                cancel.setEnabled(false);
                try {
                    last = get();
                    drainAndDraw(true);
                    save.setEnabled(true);
                    if (last.cancelled() || last.cellsDone() < last.cellsTotal()) {
                        // no verdict from an incomplete sweep: a detector's score would rest on the conditions that happened to run
                        List<String> notRun = conditionsNotRun().stream().map(Perturbation::id).toList();
                        verdict.setText("Stopped: incomplete: " + last.cellsDone() + " of " + last.cellsTotal() + " cells; no ranking from an incomplete sweep."
                                + (notRun.isEmpty() ? "" : " Not run: " + String.join(", ", notRun) + "."));
                    } else {
                        var best = SweepSummary.rankEnvelope(last, Map.of()).get(0);
                        verdict.setText("Done. Best over the swept range: " + best.detector().label() + " (" + Ui.fmt(best.score(), 3) + ", weakest under "
                                + (best.weakest() == null ? "-" : best.weakest().id()) + ")");
                    }
                    ctx.status().accept(String.format(java.util.Locale.ROOT, "Sweep: %d cells in %.1f s", last.cellsDone(), last.wallSeconds()));
                } catch (ExecutionException e) {
                    verdict.setText("Sweep failed: " + e.getCause().getMessage());
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
            }
        };
        worker.execute();
    }

    private static SweepBase base(Session s, int views) {
        Optional<Session.Scene> scene = s.scene();
        if (scene.isPresent()) {
            Session.Scene sc = scene.get();
            return SweepBase.render(sc.design(), sc.camera(), sc.lighting(), sc.standoffM(), views, 1);
        }
        List<SweepBase.BaseFrame> frames = new ArrayList<>();
        for (var f : s.frames().subList(0, Math.min(views, s.frames().size())))
            frames.add(new SweepBase.BaseFrame(f.name(), f.image(), f.truth().features(), Optional.empty()));
        return new SweepBase(s.sourceName(), frames, Optional.empty());
    }

    /** Conditions of the latest sweep with no finished cell. */
    List<Perturbation> conditionsNotRun() {
        if (running == null) return List.of();
        List<Perturbation> out = new ArrayList<>();
        for (Perturbation p : running.parameters) if (rows.stream().noneMatch(x -> x.parameter() == p)) out.add(p);
        return out;
    }

    /** Titles of the charts now shown, in order. */
    List<String> chartTitles() {
        List<String> out = new ArrayList<>();
        for (java.awt.Component c : charts.getComponents()) if (c instanceof ChartPanel cp) out.add(cp.getChart().getTitle().getText());
        return out;
    }

    /** Moves finished cells into the view and redraws one repeatability chart per condition. */
    private void drainAndDraw(boolean force) {
        SweepRow r;
        boolean any = false;
        while ((r = incoming.poll()) != null) {
            rows.add(r);
            any = true;
        }
        if (!any && !force && charts.getComponentCount() > 0) return;
        charts.removeAll();
        if (running == null) return;
        for (Perturbation p : running.parameters) {
            double[] values = running.valuesOf(p);
            List<Charts.Series> lines = new ArrayList<>();
            for (var d : running.detectors) {
                DetectorType t = d.type();
                double[] y = new double[values.length];
                for (int l = 0; l < values.length; l++) {
                    int level = l;
                    y[l] = SweepRun.meanRepeatability(rows.stream().filter(x -> x.detector() == t && x.parameter() == p && x.level() == level).toList())
                            .orElse(Double.NaN);
                }
                lines.add(new Charts.Series(t.label(), values, y, Palette.of(t)));
            }
            long done = rows.stream().filter(x -> x.parameter() == p).map(SweepRow::level).distinct().count();
            String state = done == 0 ? (worker == null ? " (not run)" : " (waiting)")
                    : done < values.length && worker == null ? " (incomplete: " + done + " of " + values.length + " levels)" : "";
            ChartPanel cp = new ChartPanel(ChartLook.themed(ChartLook.markedAndDistinct(Charts.yRange(Charts.lines("Repeatability vs " + p.id() + state,
                    p.id() + (p.unit().isEmpty() ? "" : " (" + p.unit() + ")"), "repeatability, 0..1", lines, false), -0.02, 1.02))));
            cp.setName("stress.chart." + p.id());
            cp.setPreferredSize(new Dimension(440, 280));
            charts.add(cp);
        }
        charts.revalidate();
        charts.repaint();
    }

    private void save() {
        if (last == null) return;
        JFileChooser fc = new JFileChooser(ctx.prefs().get("lastReportFolder", System.getProperty("user.dir")));
        fc.setFileSelectionMode(JFileChooser.DIRECTORIES_ONLY);
        fc.setDialogTitle("Folder for the sweep report");
        if (fc.showSaveDialog(ctx.window()) != JFileChooser.APPROVE_OPTION) return;
        saveTo(fc.getSelectedFile().toPath());
    }

    void saveTo(Path dir) {
        ctx.prefs().put("lastReportFolder", dir.toString());
        try (AtomicOutput out = AtomicOutput.open(dir)) {
            SweepWriter.write(last, Map.of(), out);
            SweepReport.write(last, Map.of(), out.file("report.html"));
            out.commit();
            ctx.session().setStressResults(dir); // a saved session references the results
            ctx.status().accept("Report written to " + dir.resolve("report.html"));
        } catch (Exception e) {
            ctx.status().accept("Could not write the report: " + e.getMessage());
        }
    }


}
