package org.targetbench.cli;

import org.targetbench.camera.Calibration;
import org.targetbench.camera.CalibrationConfig;
import org.targetbench.camera.CalibrationResult;
import org.targetbench.camera.CameraModel;
import org.targetbench.export.AtomicOutput;
import org.targetbench.export.CalibrationWriter;
import org.targetbench.pipeline.CalibrateRun;
import org.targetbench.report.CoveragePlot;
import org.targetbench.source.ImageFolderSource;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;

@Command(name = "calibrate", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Calibrates a camera from a folder of chessboard photos (PNG/JPEG, one size, sorted by name).",
                "Finds the board's inner corners in each frame, estimates the intrinsics (Zhang's method: focal lengths, principal point, "
                        + "k1, k2, k3, p1, p2, zero skew) and writes them as camera.json, camera.opencv.yml (OpenCV FileStorage) and "
                        + "camera.ros.yaml (ROS camera_info), with the RMS reprojection error overall and per view, outlier flags "
                        + "(camera.calibration.json, camera.views.csv) and a coverage image of where the corners fell (camera.coverage.png)."})
final class CalibrateCommand implements Callable<Integer> {
    @Spec CommandSpec spec;

    @Option(names = "--frames", required = true, paramLabel = "DIR", description = "Folder of chessboard photos.")
    Path frames;
    @Option(names = "--inner-corners", paramLabel = "COLSxROWS",
            description = "Inner corners across and down the board, e.g. 9x6 for a board of 10 x 7 squares (required).")
    String board;
    @Option(names = "--square-mm", paramLabel = "MM", description = "Side of one square, mm, as measured on the print (required).")
    Double squareMm;

    @Option(names = "--board", hidden = true, paramLabel = "COLSxROWS")
    void oldBoard(String b) {
        OldSpelling.note(spec, "--board", "--inner-corners COLSxROWS");
        board = b;
    }

    @Option(names = "--square", hidden = true, paramLabel = "MM")
    void oldSquare(double mm) {
        OldSpelling.note(spec, "--square", "--square-mm MM");
        squareMm = mm;
    }
    @Option(names = "--out", paramLabel = "FILE", defaultValue = "results/calibration/camera.json",
            description = "The camera.json to write; the other files go beside it, named after it (default: ${DEFAULT-VALUE}).")
    Path out;

    @Override
    public Integer call() throws Exception {
        Calibration.Board b = parseBoard();
        String fileName = out.getFileName() == null ? "" : out.getFileName().toString();
        if (!fileName.endsWith(".json") || fileName.length() <= ".json".length())
            throw new UserError("--out names the camera .json file to write (e.g. camera.json), got " + out
                    + "; the OpenCV and ROS YAML files are written beside it");
        String stem = fileName.substring(0, fileName.length() - ".json".length());
        Path dir = out.toAbsolutePath().getParent();

        CalibrationConfig config = new CalibrationConfig();
        CalibrateRun.Result run;
        try (ImageFolderSource src = ImageFolderSource.open(frames, null)) {
            run = new CalibrateRun(b, config).run(src, new ConsoleProgress("detecting"), () -> false);
        }
        if (run.found() == 0)
            throw new UserError("chessboard of " + b.innerCols() + "x" + b.innerRows() + " inner corners not found in any of the " + run.names().size()
                    + " frames in " + frames + "; check --inner-corners (inner corners, not squares), focus, glare and that the whole board is in view");
        Calibration.Outcome outcome = run.outcome().orElseThrow();
        if (outcome instanceof Calibration.Failure fail)
            throw new UserError(org.targetbench.pipeline.Reasons.calibrationFailure(fail) + " (board found in: " + String.join(", ", run.foundIn()) + ")");
        CalibrationResult r = (CalibrationResult) outcome;
        List<String> written;
        try (AtomicOutput output = AtomicOutput.openBeside(dir)) {
            written = new ArrayList<>(CalibrationWriter.write(r, frames.toString(), output, stem));
            written.add(CoveragePlot.write(r, output, stem + ".coverage.png"));
            output.commit();
        }
        print(r, config, frames, written, dir, spec.commandLine().getOut());
        org.targetbench.camera.CameraChecks.problem(r.camera()).ifPresent(p -> spec.commandLine().getOut().println(
                "Warning: the calibrated camera's " + p + ". Other commands will refuse it: take more photos with the board near the image corners."));
        spec.commandLine().getOut().flush();
        return 0;
    }

    private Calibration.Board parseBoard() {
        if (board == null) throw new UserError("--inner-corners COLSxROWS is required: the board's inner corners across and down");
        if (squareMm == null) throw new UserError("--square-mm MM is required: the side of one square as measured on the print");
        String[] p = board.toLowerCase(Locale.ROOT).split("x");
        int cols, rows;
        try {
            if (p.length != 2) throw new NumberFormatException();
            cols = Integer.parseInt(p[0].trim());
            rows = Integer.parseInt(p[1].trim());
        } catch (NumberFormatException e) {
            throw new UserError("--inner-corners must be COLSxROWS inner corners, e.g. 9x6, got \"" + board + "\"");
        }
        if (cols < 2 || rows < 2) throw new UserError("--inner-corners needs at least 2x2 inner corners, got " + board);
        if (!(squareMm > 0) || !Double.isFinite(squareMm)) throw new UserError("--square-mm must be > 0 mm, got " + squareMm);
        return new Calibration.Board(cols, rows, squareMm);
    }

    private static void print(CalibrationResult r, CalibrationConfig config, Path frames, List<String> written, Path dir, PrintWriter w) {
        CameraModel c = r.camera();
        w.printf(Locale.ROOT, "Calibrated from %d of %d frames in %s (board %s), %dx%d:%n", r.usedViews(), r.views().size(), frames,
                r.board(), c.width(), c.height());
        w.printf(Locale.ROOT, "  fx %.2f  fy %.2f  cx %.2f  cy %.2f px%n", c.fx(), c.fy(), c.cx(), c.cy());
        w.printf(Locale.ROOT, "  k1 %.5f  k2 %.5f  k3 %.5f  p1 %.6f  p2 %.6f%n", c.k1(), c.k2(), c.k3(), c.p1(), c.p2());
        int corners = r.views().stream().mapToInt(CalibrationResult.View::cornerCount).sum();
        w.printf(Locale.ROOT, "RMS reprojection error %.3f px over %d corners%n", r.rmsPx(), corners);
        w.printf(Locale.ROOT, "  %-24s %7s %8s %8s%n", "frame", "corners", "rms px", "max px");
        for (CalibrationResult.View v : r.views()) {
            if (!v.found()) {
                w.printf(Locale.ROOT, "  %-24s %7s %8s %8s  not used: board not found whole%n", v.name(), "-", "-", "-");
                continue;
            }
            w.printf(Locale.ROOT, "  %-24s %7d %8.3f %8.3f%s%n", v.name(), v.cornerCount(), v.rmsPx(), v.maxPx(),
                    v.outlier() ? String.format(Locale.ROOT, "  OUTLIER (rms > %.1f x the median view): check it for blur or a bent board; try without it",
                            config.outlierFactor) : "");
        }
        w.printf(Locale.ROOT, "Coverage: corners fell in %.0f %% of a %d x %d grid of image cells%s%n", 100 * r.coverageFraction(),
                r.coverageCols(), r.coverageRows(), r.coverageFraction() < 0.5 ? "; add views with the board near the edges and corners" : "");
        w.println("Written to " + dir + ": " + String.join(", ", written));
        w.flush();
    }
}
