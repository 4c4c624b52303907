package org.targetbench.app;

import org.jfree.chart.ChartPanel;
import org.targetbench.export.AtomicOutput;
import org.targetbench.export.DotBiasWriter;
import org.targetbench.export.SweepWriter;
import org.targetbench.perturb.Perturbation;
import org.targetbench.pipeline.DotBiasTable;
import org.targetbench.pipeline.SweepBase;
import org.targetbench.pipeline.SweepConfig;
import org.targetbench.pipeline.SweepResult;
import org.targetbench.pipeline.SweepRow;
import org.targetbench.pipeline.SweepRun;
import org.targetbench.pipeline.SweepSummary;
import org.targetbench.report.SweepReport;

import javax.swing.JButton;
import javax.swing.JComboBox;
import javax.swing.JFileChooser;
import javax.swing.JLabel;
import javax.swing.JPanel;
import javax.swing.JProgressBar;
import javax.swing.JScrollPane;
import javax.swing.JSplitPane;
import javax.swing.SwingUtilities;
import javax.swing.SwingWorker;
import javax.swing.Timer;
import java.awt.BorderLayout;
import java.awt.GridLayout;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ConcurrentLinkedQueue;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.atomic.AtomicBoolean;

/**
 * Runs a stress sweep from the workbench, the same run as {@code targetbench sweep} ({@link SweepRun} with a
 * {@link SweepConfig} from {@link StressControls}): choose detectors, conditions, envelope, levels, views, seed and
 * tracking, watch the curves fill in as cells finish, cancel at any time (finished cells are kept), read the ranking
 * of a complete sweep ({@link StressRanking}) and save the same files the command line writes.
 */
final class StressView extends JPanel {
    /** How often the charts redraw while a sweep runs, milliseconds. */
    static final int REDRAW_MS = 400;

    private final AppContext ctx;
    private final StressControls controls;
    private final StressRanking ranking = new StressRanking();
    private final JComboBox<StressCharts.Metric> metric = Ui.named(new JComboBox<>(StressCharts.Metric.values()), "stress.metric",
            "What the charts plot: repeatability, or KLT survival when the sweep tracked (Track frames > 0)");
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
    private Map<Perturbation, Double> runningEnvelope = Map.of();
    private SweepBase lastBase;
    private SweepResult last;

    StressView(AppContext ctx) {
        super(new BorderLayout(6, 6));
        this.ctx = ctx;
        setName("view.stress");
        controls = new StressControls(this::chooseEnvelope);
        run = Ui.button("stress.run", "Run sweep", "Degrade the base frames at every level and score every chosen detector", this::start);
        cancel = Ui.button("stress.cancel", "Cancel", "Stop the sweep; finished cells are kept", () -> cancelFlag.set(true));
        save = Ui.button("stress.save", "Save report...",
                "Write what the command line's sweep writes: sweep.csv, ranking.csv, report.html (and dot-bias.csv for rendered dot designs)", this::save);
        cancel.setEnabled(false);
        save.setEnabled(false);
        metric.addActionListener(e -> drainAndDraw(true));
        JPanel top = new JPanel(new BorderLayout());
        top.add(controls, BorderLayout.CENTER);
        JPanel actions = new JPanel(new BorderLayout());
        actions.add(Ui.row(run, cancel, save, new JLabel("Charts"), metric, progress), BorderLayout.NORTH);
        actions.add(Ui.row(verdict), BorderLayout.SOUTH); // full width, so the verdict and what did not run read in full
        top.add(actions, BorderLayout.SOUTH);
        add(top, BorderLayout.NORTH);
        JSplitPane split = new JSplitPane(JSplitPane.VERTICAL_SPLIT, new JScrollPane(charts), ranking);
        split.setName("stress.split");
        split.setResizeWeight(1.0);
        split.setOneTouchExpandable(true);
        ranking.setPreferredSize(new java.awt.Dimension(400, 190));
        add(split, BorderLayout.CENTER);
        ctx.session().addListener(c -> {
            if (c == Session.Change.SOURCE) controls.sceneAvailable(ctx.session().scene().isPresent(), ctx.session().registration() != null);
        });
        controls.sceneAvailable(ctx.session().scene().isPresent(), ctx.session().registration() != null);
        charts.add(new JLabel("<html><body style='width:380px'>Choose detectors and conditions above, then Run sweep: a chart per condition fills in as cells finish,"
                + " and the ranking appears below when every cell has run.</html>"));
    }

    void start() {
        Session s = ctx.session();
        if (worker != null) return;
        if (!s.hasFrames()) {
            ctx.status().accept("Load a source first (the demo scene or a frame folder)");
            return;
        }
        SweepConfig c = controls.config(s.configs());
        if (c.detectors.isEmpty() || c.parameters.isEmpty()) {
            ctx.status().accept(c.detectors.isEmpty() ? "Choose at least one detector" : "Choose at least one condition to sweep");
            return;
        }
        Map<Perturbation, Double> env = controls.envelope();
        // the command line's two inputs: a design renders base views (--target), or the frames are degraded (--frames)
        Optional<Session.Scene> scene = controls.renderBase() ? s.scene() : Optional.empty();
        List<SweepBase.BaseFrame> frames = new ArrayList<>();
        if (scene.isEmpty())
            for (var f : s.frames().subList(0, Math.min(c.syntheticFrames, s.frames().size())))
                frames.add(new SweepBase.BaseFrame(f.name(), f.image(), f.truth().features(), Optional.empty()));
        String sourceName = s.sourceName();
        SweepRun sweep = new SweepRun(c);
        running = c;
        runningEnvelope = env;
        last = null;
        lastBase = null;
        rows.clear();
        incoming.clear();
        cancelFlag.set(false);
        progress.setValue(0);
        progress.setStringPainted(true);
        controls.setRunning(true);
        run.setEnabled(false);
        cancel.setEnabled(true);
        save.setEnabled(false);
        ranking.clear("The ranking appears when the sweep has run every cell.");
        verdict.setText("Preparing the base frames...");
        redraw.start();
        worker = new SwingWorker<>() {
            @Override protected SweepResult doInBackground() throws Exception {
                // the same base the command line builds: rendered views of the scene (seeded), or the first loaded frames
                SweepBase base = scene.map(sc -> SweepBase.render(sc.design(), sc.camera(), sc.lighting(), sc.standoffM(), c.syntheticFrames, c.seed))
                        .orElseGet(() -> new SweepBase(sourceName, frames, Optional.empty()));
                lastBase = base;
                int cells = sweep.cellCount(base);
                SwingUtilities.invokeLater(() -> {
                    progress.setMaximum(cells);
                    if (worker != null) verdict.setText("Running " + cells + " cells on " + base.description() + "...");
                });
                return sweep.run(base, (d, t, w) -> publish(d), cancelFlag::get, incoming::addAll);
            }
            @Override protected void process(List<Integer> chunks) { progress.setValue(chunks.get(chunks.size() - 1)); }
            @Override protected void done() { finished(this); }
        };
        worker.execute();
    }

    private void finished(SwingWorker<SweepResult, Integer> w) {
        worker = null;
        redraw.stop();
        controls.setRunning(false);
        run.setEnabled(true);
        cancel.setEnabled(false);
        try {
            last = w.get();
            drainAndDraw(true);
            save.setEnabled(true);
            if (last.cancelled() || last.cellsDone() < last.cellsTotal()) {
                // no verdict from an incomplete sweep: a detector's score would rest on the conditions that happened to run
                List<String> notRun = conditionsNotRun().stream().map(Perturbation::id).toList();
                String incomplete = "incomplete: " + last.cellsDone() + " of " + last.cellsTotal() + " cells";
                verdict.setText("Stopped: " + incomplete + "; no ranking from an incomplete sweep."
                        + (notRun.isEmpty() ? "" : " Not run: " + String.join(", ", notRun) + "."));
                ranking.clear(incomplete + "; no ranking from an incomplete sweep");
            } else {
                var best = SweepSummary.rankEnvelope(last, runningEnvelope).get(0);
                verdict.setText("Done. Best over " + (runningEnvelope.isEmpty() ? "the swept range" : "the operating envelope") + ": "
                        + best.detector().label() + " (" + Ui.fmt(best.score(), 3) + ", weakest under "
                        + (best.weakest() == null ? "-" : best.weakest().id()) + ")");
                ranking.show(last, runningEnvelope, running.trackFrames);
            }
            ctx.status().accept(String.format(java.util.Locale.ROOT, "Sweep: %d cells in %.1f s", last.cellsDone(), last.wallSeconds()));
        } catch (ExecutionException e) {
            verdict.setText("Sweep failed: " + e.getCause().getMessage());
            ranking.clear("The sweep failed; no ranking.");
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
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

    /** Moves finished cells into the view and redraws one chart per condition. */
    private void drainAndDraw(boolean force) {
        SweepRow r;
        boolean any = false;
        while ((r = incoming.poll()) != null) {
            rows.add(r);
            any = true;
        }
        if (running == null || !any && !force && charts.getComponentCount() > 0) return; // before the first sweep the hint stays
        charts.removeAll();
        for (ChartPanel cp : StressCharts.build(running, rows, worker != null, (StressCharts.Metric) metric.getSelectedItem())) charts.add(cp);
        charts.revalidate();
        charts.repaint();
    }

    /** Charts follow a theme switch (the menu updates every component's look; JFreeChart keeps its own colours). */
    @Override public void updateUI() {
        super.updateUI();
        if (charts != null) SwingUtilities.invokeLater(() -> drainAndDraw(true));
    }

    private void chooseEnvelope() {
        JFileChooser fc = new JFileChooser(ctx.prefs().get("lastEnvelopeFolder", System.getProperty("user.dir")));
        fc.setDialogTitle("Envelope file (harshest value of each parameter)");
        if (fc.showOpenDialog(ctx.window()) != JFileChooser.APPROVE_OPTION) return;
        Path file = fc.getSelectedFile().toPath();
        if (file.getParent() != null) ctx.prefs().put("lastEnvelopeFolder", file.getParent().toString());
        loadEnvelope(file);
    }

    /** Reads an envelope file into the conditions; a bad file is one line in the status bar and changes nothing. */
    void loadEnvelope(Path file) {
        try {
            ctx.status().accept("Envelope from " + file.getFileName() + ": " + controls.loadEnvelope(file));
        } catch (org.targetbench.source.SourceException | IllegalArgumentException e) {
            ctx.status().accept("Could not use the envelope file: " + e.getMessage());
        }
    }

    private void save() {
        if (last == null) return;
        Folders.choose(ctx, "lastReportFolder", "Folder for the sweep report", Folders.Use.SAVE).ifPresent(this::saveTo);
    }

    /** Writes the files of the command line's sweep for the latest run, with the envelope it ran with. */
    void saveTo(Path dir) {
        if (last == null) return;
        ctx.prefs().put("lastReportFolder", dir.toString());
        try (AtomicOutput out = AtomicOutput.open(dir)) {
            SweepWriter.write(last, runningEnvelope, out);
            SweepReport.write(last, runningEnvelope, out.file("report.html"));
            var dotBias = lastBase == null ? List.<DotBiasTable.Row>of() : DotBiasTable.forSweep(lastBase, running);
            if (!dotBias.isEmpty()) DotBiasWriter.write(dotBias, out.file("dot-bias.csv"));
            out.commit();
            ctx.session().setStressResults(dir); // a saved session references the results
            ctx.status().accept("Report written to " + dir.resolve("report.html"));
        } catch (Exception e) {
            ctx.status().accept("Could not write the report: " + e.getMessage());
        }
    }

    StressControls controls() { return controls; }

    StressRanking ranking() { return ranking; }

    /** The latest finished sweep, if any. */
    Optional<SweepResult> result() { return Optional.ofNullable(last); }
}
