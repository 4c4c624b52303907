package org.targetbench.app;

import org.targetbench.camera.Calibration;
import org.targetbench.camera.CalibrationConfig;
import org.targetbench.camera.CalibrationResult;
import org.targetbench.camera.CameraChecks;
import org.targetbench.camera.CameraModel;
import org.targetbench.export.AtomicOutput;
import org.targetbench.export.CalibrationWriter;
import org.targetbench.pipeline.CalibrateRun;
import org.targetbench.pipeline.Reasons;
import org.targetbench.report.CoveragePlot;
import org.targetbench.source.ImageFolderSource;

import javax.swing.BorderFactory;
import javax.swing.ImageIcon;
import javax.swing.JButton;
import javax.swing.JFileChooser;
import javax.swing.JLabel;
import javax.swing.JOptionPane;
import javax.swing.JPanel;
import javax.swing.JProgressBar;
import javax.swing.JScrollPane;
import javax.swing.JSpinner;
import javax.swing.JTable;
import javax.swing.SpinnerNumberModel;
import javax.swing.SwingWorker;
import javax.swing.table.DefaultTableModel;
import java.awt.BorderLayout;
import java.awt.Dimension;
import java.awt.GridLayout;
import java.awt.Image;
import java.awt.image.BufferedImage;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.atomic.AtomicBoolean;

/**
 * Camera calibration from the workbench: choose a folder of chessboard photos, the board's inner corners and square
 * size, run on a worker ({@link CalibrateRun}, the same run as the command line's {@code calibrate}), read the
 * intrinsics and distortion with their spread over the views, the RMS reprojection error overall and per view, which
 * frames the board was not found in, and where the corners fell; "Use this camera" makes the result the session's
 * camera, and Save writes the files the command line writes.
 */
final class CalibrationView extends JPanel {
    static final String[] PARAM_COLUMNS = {"Parameter", "Value", "± (jackknife)"};
    /** Width of the coverage image shown, pixels. */
    static final int COVERAGE_W = 270;
    static final String[] VIEW_COLUMNS = {"Frame", "Board", "Corners", "RMS error", "Max error", "Flag"};

    private final AppContext ctx;
    private final JLabel folderLabel = Ui.named(new JLabel("Frames: none chosen"), "calibration.folder", null);
    private final JSpinner cols = Ui.named(new JSpinner(new SpinnerNumberModel(9, 2, 100, 1)), "calibration.cols",
            "Inner corners across the board (a board of 10 x 7 squares has 9 x 6 inner corners)");
    private final JSpinner rows = Ui.named(new JSpinner(new SpinnerNumberModel(6, 2, 100, 1)), "calibration.rows", "Inner corners down the board");
    private final JSpinner square = Ui.named(new JSpinner(new SpinnerNumberModel(25.0, 0.1, 1000.0, 0.5)), "calibration.square",
            "Side of one square, mm, as measured on the print");
    private final JProgressBar progress = Ui.named(new JProgressBar(), "calibration.progress", null);
    private final JLabel summary = Ui.named(new JLabel(" "), "calibration.summary", null);
    private final JLabel message = Ui.named(new JLabel(" "), "calibration.message", null);
    private final JLabel coverage = Ui.named(new JLabel(), "calibration.coverage", null);
    private final DefaultTableModel params = new DefaultTableModel(PARAM_COLUMNS, 0) {
        @Override public boolean isCellEditable(int r, int c) { return false; }
    };
    private final DefaultTableModel views = new DefaultTableModel(VIEW_COLUMNS, 0) {
        @Override public boolean isCellEditable(int r, int c) { return false; }
    };
    private final JTable paramTable = Ui.named(new JTable(params), "calibration.intrinsics", null);
    private final JTable viewTable = Ui.named(new JTable(views), "calibration.views", null);
    private final JButton run, cancel, use, save;
    private final AtomicBoolean cancelFlag = new AtomicBoolean();
    private Path folder;
    private SwingWorker<Done, Integer> worker;
    private CalibrationResult last;
    private Path lastFolder;
    private final CalibrationConfig config = new CalibrationConfig();

    /** What the worker hands back: the run, and the spread of the parameters when it could be had. */
    private record Done(CalibrateRun.Result run, Optional<double[]> spread) {}

    CalibrationView(AppContext ctx) {
        super(new BorderLayout(6, 6));
        this.ctx = ctx;
        setName("view.calibration");
        run = Ui.button("calibration.run", "Calibrate", "Find the board in every photo and estimate the intrinsics (Zhang's method)", this::start);
        cancel = Ui.button("calibration.cancel", "Cancel", "Stop looking for the board; nothing is estimated", () -> cancelFlag.set(true));
        use = Ui.button("calibration.use", "Use this camera", "Make these intrinsics the session's camera: the Targets and Shoot-out views plan with it",
                this::useCamera);
        save = Ui.button("calibration.save", "Save...", "Write camera.json, its OpenCV and ROS YAML twins, the report, the per-view CSV and "
                + "the coverage image, as the command line does", this::save);
        cancel.setEnabled(false);
        use.setEnabled(false);
        save.setEnabled(false);
        progress.setStringPainted(true);
        progress.setString("not run");
        JPanel top = new JPanel(new GridLayout(0, 1));
        top.add(Ui.row(Ui.button("calibration.choose", "Frames folder...", "A folder of chessboard photos (PNG/JPEG, one size, read in name order)",
                this::chooseFolder), folderLabel));
        top.add(Ui.row(new JLabel("Inner corners"), cols, new JLabel("x"), rows, new JLabel("   Square mm"), square, run, cancel, progress, use, save));
        top.add(Ui.row(summary));
        add(top, BorderLayout.NORTH);

        DetailPane.columnTips(paramTable, "Focal lengths fx, fy and principal point cx, cy in pixels; k1, k2, k3 radial and p1, p2 tangential "
                        + "distortion of the Brown-Conrady model, unit-free (normalised image coordinates). Skew is fixed at zero. RMS error: the "
                        + "reprojection error over every corner of every used view, pixels. Coverage: share of a grid of image cells holding a corner.",
                "The estimate from every view where the board was found whole (Zhang 2000, BoofCV's implementation).",
                "Leave-one-view-out jackknife standard error, in the parameter's unit (Efron and Tibshirani 1993, eq. 11.5): how much the "
                        + "figure moves with the choice of views, not a bound on its error. Needs at least 4 views.");
        DetailPane.columnTips(viewTable, "The photo's file name.", "Whether the board's inner corners were all found in this photo; a photo "
                        + "without the whole board is not used.", "Inner corners found, count.",
                "RMS reprojection error of this view's corners, pixels: sqrt(Σ e² / n), as OpenCV's calibration sample reports.",
                "Largest reprojection error in this view, pixels.",
                String.format(Locale.ROOT, "OK, or WARN when the view's RMS error is more than %.1f x the median view's (a rule of thumb, common "
                        + "practice, no source): check it for blur or a bent board.", config.outlierFactor));
        widths(paramTable, 95, 95, 115);
        paramTable.setAutoResizeMode(JTable.AUTO_RESIZE_LAST_COLUMN);
        JScrollPane ps = new JScrollPane(paramTable);
        ps.setPreferredSize(new Dimension(310, 190));
        // every column but the flag fits its widest text; the flag's sentence is read in full in the detail pane
        JScrollPane vs = Ui.fitColumns(new JScrollPane(viewTable), 5, new Object[]{"left01.jpg", "NOT FOUND", "54", "0.000 px", "0.000 px", "OK"});
        vs.setPreferredSize(new Dimension(420, 190));
        JScrollPane cs = new JScrollPane(coverage);
        cs.setBorder(BorderFactory.createTitledBorder("Where the corners fell"));
        cs.setPreferredSize(new Dimension(COVERAGE_W + 24, 190));
        JPanel left = new JPanel(new BorderLayout());
        left.add(Ui.heading("Intrinsics and distortion"), BorderLayout.NORTH);
        left.add(ps, BorderLayout.CENTER);
        JPanel mid = new JPanel(new BorderLayout());
        mid.add(Ui.heading("Views"), BorderLayout.NORTH);
        mid.add(vs, BorderLayout.CENTER);
        JPanel centre = new JPanel(new BorderLayout(6, 0));
        centre.add(left, BorderLayout.WEST);
        centre.add(mid, BorderLayout.CENTER);
        centre.add(cs, BorderLayout.EAST);
        add(centre, BorderLayout.CENTER);
        JPanel bottom = new JPanel(new BorderLayout());
        message.setBorder(BorderFactory.createEmptyBorder(2, 4, 2, 4));
        say("Choose a folder of chessboard photos (the whole board in view, tilted and in different parts of the image), its inner corners "
                + "and square size, then Calibrate.");
        bottom.add(message, BorderLayout.NORTH);
        DetailPane detail = new DetailPane("calibration.detail", "Select a row to read it in full.", paramTable, viewTable);
        detail.setPreferredSize(new Dimension(300, 125));
        bottom.add(detail, BorderLayout.CENTER);
        add(bottom, BorderLayout.SOUTH);
    }

    /** Column widths, pixels, each at least wide enough for its header's full text. */
    private static void widths(JTable t, int... w) {
        javax.swing.table.TableCellRenderer header = t.getTableHeader().getDefaultRenderer();
        for (int c = 0; c < w.length; c++) {
            int need = header.getTableCellRendererComponent(t, t.getColumnName(c), false, false, -1, c).getPreferredSize().width + 16;
            t.getColumnModel().getColumn(c).setPreferredWidth(Math.max(w[c], need));
            t.getColumnModel().getColumn(c).setMinWidth(need);
        }
    }

    private void chooseFolder() {
        Folders.choose(ctx, "lastCalibrationFrames", "Folder of chessboard photos", Folders.Use.OPEN).ifPresent(this::setFolder);
        ctx.prefs().put("lastCalibrationFrames", folder.toString());
    }

    void setFolder(Path dir) {
        folder = dir;
        folderLabel.setText("Frames: " + dir);
    }

    void start() {
        if (worker != null) return;
        if (folder == null) {
            say("Choose a folder of chessboard photos first.");
            return;
        }
        Calibration.Board board = new Calibration.Board((Integer) cols.getValue(), (Integer) rows.getValue(), (Double) square.getValue());
        Path dir = folder;
        CalibrateRun calibrate = new CalibrateRun(board, config);
        cancelFlag.set(false);
        last = null;
        params.setRowCount(0);
        views.setRowCount(0);
        coverage.setIcon(null);
        summary.setText(" ");
        say("Looking for a board of " + board + " in " + dir + "...");
        progress.setValue(0);
        progress.setString("starting");
        run.setEnabled(false);
        cancel.setEnabled(true);
        use.setEnabled(false);
        save.setEnabled(false);
        worker = new SwingWorker<>() {
            @Override protected Done doInBackground() throws Exception {
                CalibrateRun.Result r;
                try (ImageFolderSource src = ImageFolderSource.open(dir, null)) {
                    int count = Math.max(1, src.frameCount());
                    javax.swing.SwingUtilities.invokeLater(() -> progress.setMaximum(count));
                    r = calibrate.run(src, (d, t, w) -> publish(d), cancelFlag::get);
                }
                boolean solved = r.outcome().isPresent() && r.outcome().get() instanceof CalibrationResult;
                publish(-1);
                return new Done(r, solved ? calibrate.spread(r, cancelFlag::get) : Optional.empty());
            }
            @Override protected void process(List<Integer> chunks) {
                int d = chunks.get(chunks.size() - 1);
                if (d < 0) {
                    progress.setString("estimating the spread over the views");
                    return;
                }
                progress.setValue(d);
                progress.setString("frame " + d + " of " + progress.getMaximum());
            }
            @Override protected void done() {
                worker = null;
                run.setEnabled(true);
                cancel.setEnabled(false);
                try {
                    finish(get(), board, dir);
                } catch (ExecutionException e) {
                    progress.setString("failed");
                    say("Cannot calibrate: " + (e.getCause() == null ? e : e.getCause().getMessage()));
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
            }
        };
        worker.execute();
    }

    private void finish(Done done, Calibration.Board board, Path dir) {
        CalibrateRun.Result r = done.run();
        List<String> missing = r.notFoundIn();
        String notFound = missing.isEmpty() ? "" : " The board was not found whole in " + missing.size() + " of " + r.names().size()
                + " frames (" + String.join(", ", missing) + "): they are not used.";
        if (r.cancelled()) {
            progress.setString("stopped");
            say("Stopped after " + r.names().size() + " frames; nothing estimated.");
            return;
        }
        if (r.found() == 0) {
            progress.setString("no board");
            say("The chessboard of " + board.innerCols() + " x " + board.innerRows() + " inner corners was not found in any of the " + r.names().size()
                    + " frames: check the inner corners (inner corners, not squares), focus, glare and that the whole board is in view.");
            showViews(r, null);
            return;
        }
        if (r.outcome().orElseThrow() instanceof Calibration.Failure f) {
            progress.setString("not calibrated");
            say("Cannot calibrate: " + Reasons.calibrationFailure(f) + "." + notFound);
            showViews(r, null);
            return;
        }
        CalibrationResult c = (CalibrationResult) r.outcome().get();
        last = c;
        lastFolder = dir;
        CameraModel m = c.camera();
        double[] v = {m.fx(), m.fy(), m.cx(), m.cy(), m.k1(), m.k2(), m.k3(), m.p1(), m.p2()};
        Optional<double[]> se = done.spread();
        for (int i = 0; i < v.length; i++) {
            String[] nameUnit = CalibrateRun.PARAMETERS.get(i).split(" ");
            String unit = nameUnit.length > 1 ? " " + nameUnit[1] : "";
            int dec = i < 4 ? 2 : 5, k = i;
            params.addRow(new Object[]{nameUnit[0], Ui.fmt(v[i], dec) + unit,
                    se.map(s -> "± " + Ui.fmt(s[k], dec) + unit).orElse("- (needs 4 or more views)")});
        }
        int corners = c.views().stream().mapToInt(CalibrationResult.View::cornerCount).sum();
        params.addRow(new Object[]{"RMS error", Ui.fmt(c.rmsPx(), 3) + " px", corners + " corners"});
        params.addRow(new Object[]{"Coverage", Ui.pct(c.coverageFraction()).replace("%", " %"), c.coverageCols() + " x " + c.coverageRows() + " cells"});
        showViews(r, c);
        summary.setText(String.format(Locale.ROOT, "Calibrated from %d of %d frames (board %s), %d x %d px: RMS reprojection error %.3f px.",
                c.usedViews(), c.views().size(), c.board(), m.width(), m.height(), c.rmsPx()));
        BufferedImage img = CoveragePlot.draw(c);
        int w = COVERAGE_W, h = (int) Math.round((double) COVERAGE_W * img.getHeight() / img.getWidth());
        coverage.setIcon(new ImageIcon(img.getScaledInstance(w, h, Image.SCALE_SMOOTH)));
        List<String> advice = new ArrayList<>();
        if (!notFound.isEmpty()) advice.add(notFound.trim());
        if (!c.outliers().isEmpty()) advice.add(c.outliers().size() + " outlier view(s) flagged WARN: check them for blur or a bent board; try without them.");
        if (c.coverageFraction() < 0.5) advice.add("The corners cover less than half the image: add views with the board near the edges and corners.");
        Optional<String> problem = CameraChecks.problem(m);
        problem.ifPresent(p -> advice.add("Warning: the calibrated camera's " + p + ". The other views and commands refuse it: take more photos "
                + "with the board near the image corners."));
        say(advice.isEmpty() ? "Board found in every frame. A low error is not a guarantee: check the camera on the cell before relying on it."
                : String.join(" ", advice));
        progress.setValue(progress.getMaximum());
        progress.setString("done");
        use.setEnabled(problem.isEmpty());
        save.setEnabled(true);
        ctx.status().accept(String.format(Locale.ROOT, "Calibrated: RMS %.3f px from %d views", c.rmsPx(), c.usedViews()));
    }

    private void showViews(CalibrateRun.Result r, CalibrationResult c) {
        views.setRowCount(0);
        for (int i = 0; i < r.names().size(); i++) {
            boolean found = r.detections().get(i).isPresent();
            CalibrationResult.View v = c == null ? null : c.views().get(i);
            String flag = !found ? "WARN not used: the board was not found whole in this frame"
                    : v == null ? "-" : v.outlier() ? "WARN outlier: RMS above " + config.outlierFactor + " x the median view; check for blur or a bent board" : "OK";
            views.addRow(new Object[]{r.names().get(i), found ? "found" : "NOT FOUND", found ? r.detections().get(i).get().length / 2 : 0,
                    v == null || !found ? "-" : Ui.fmt(v.rmsPx(), 3) + " px", v == null || !found ? "-" : Ui.fmt(v.maxPx(), 3) + " px", flag});
        }
    }

    private void say(String text) {
        message.setText("<html>" + text.replace("&", "&amp;").replace("<", "&lt;") + "</html>");
    }

    private void useCamera() {
        if (last == null) return;
        ctx.session().setCamera(last.camera(), "calibrated from " + lastFolder.getFileName());
        ctx.status().accept("The session's camera is now the one calibrated from " + lastFolder + " (Targets and Shoot-out plan with it).");
    }

    /** The latest calibration, or null. */
    CalibrationResult result() { return last; }

    boolean running() { return worker != null; }

    private void save() {
        if (last == null) return;
        JFileChooser fc = new JFileChooser(ctx.prefs().get("lastCalibrationOut", System.getProperty("user.dir")));
        fc.setSelectedFile(new java.io.File("camera.json"));
        fc.setDialogTitle("The camera .json to write (the other files go beside it)");
        if (fc.showSaveDialog(ctx.window()) != JFileChooser.APPROVE_OPTION) return;
        saveTo(fc.getSelectedFile().toPath());
    }

    /** Writes what the command line writes for {@code --out file}: the .json, its twins, the report, the CSV and the coverage image. */
    void saveTo(Path file) {
        if (last == null) return;
        String name = file.getFileName() == null ? "" : file.getFileName().toString();
        if (!name.endsWith(".json") || name.length() <= ".json".length()) {
            JOptionPane.showMessageDialog(ctx.window(), "Name the camera .json file to write (e.g. camera.json), got " + name,
                    "Cannot save", JOptionPane.WARNING_MESSAGE);
            return;
        }
        String stem = name.substring(0, name.length() - ".json".length());
        Path dir = file.toAbsolutePath().getParent();
        ctx.prefs().put("lastCalibrationOut", dir.toString());
        try (AtomicOutput out = AtomicOutput.openBeside(dir)) {
            List<String> written = new ArrayList<>(CalibrationWriter.write(last, lastFolder.toString(), out, stem));
            written.add(CoveragePlot.write(last, out, stem + ".coverage.png"));
            out.commit();
            ctx.status().accept("Written to " + dir + ": " + String.join(", ", written));
        } catch (Exception e) {
            ctx.status().accept("Could not write the calibration: " + e.getMessage());
        }
    }
}
