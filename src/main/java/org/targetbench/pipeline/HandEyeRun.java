package org.targetbench.pipeline;

import org.targetbench.arm.HandEyeCalibration;
import org.targetbench.arm.Rigid;
import org.targetbench.camera.Calibration;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.PoseEstimation;
import org.targetbench.source.FrameSource;
import org.targetbench.source.SourceException;
import org.targetbench.source.SourceFrame;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * The hand-eye run: for each frame with a flange pose, the checkerboard's inner corners are detected and the target
 * pose in the camera is found by PnP on them; then {@link HandEyeCalibration} solves AX = XB. A board with 180°
 * symmetry (odd-by-odd or even-by-even squares) gets its half turn resolved per view by AX = XB consistency.
 */
public final class HandEyeRun {
    /** A frame that was not used, and why. */
    public record Skipped(String frame, String reason) {}

    /** The calibration outcome, the views used and the frames skipped. */
    public record Result(HandEyeCalibration.Outcome outcome, List<String> used, List<Skipped> skipped, boolean symmetricBoard) {}

    private HandEyeRun() {}

    /**
     * @param flangeByFrame flange pose per frame name (matched on the full name or the name without its extension)
     */
    public static Result run(FrameSource frames, Map<String, double[]> flangeByFrame, CameraModel camera, Calibration.Board board, Progress progress)
            throws SourceException {
        Calibration cal = new Calibration(board, new org.targetbench.camera.CalibrationConfig());
        List<double[]> layout = cal.layoutMm();
        double cx = 0, cy = 0;
        for (double[] p : layout) { cx += p[0] / layout.size(); cy += p[1] / layout.size(); }
        boolean symmetric = (board.innerCols() + 1) % 2 == (board.innerRows() + 1) % 2;
        List<double[]> flange = new ArrayList<>(), target = new ArrayList<>();
        List<String> used = new ArrayList<>();
        List<Skipped> skipped = new ArrayList<>();
        Optional<SourceFrame> f;
        int n = 0;
        while ((f = frames.next()).isPresent()) {
            String name = f.get().name();
            n++;
            if (progress != null) progress.update(n, frames.frameCount(), name);
            double[] fl = flangeByFrame.get(name);
            if (fl == null) {
                int dot = name.lastIndexOf('.');
                if (dot > 0) fl = flangeByFrame.get(name.substring(0, dot));
            }
            if (fl == null) { skipped.add(new Skipped(name, "no flange pose for this frame")); continue; }
            Optional<double[]> corners = cal.detect(f.get().image());
            if (corners.isEmpty()) { skipped.add(new Skipped(name, "board not found whole")); continue; }
            List<double[]> px = new ArrayList<>();
            double[] c = corners.get();
            for (int i = 0; i < c.length / 2; i++) px.add(new double[]{c[2 * i], c[2 * i + 1]});
            Optional<PoseEstimation.Estimate> est = PoseEstimation.planar(camera, px, layout);
            if (est.isEmpty()) { skipped.add(new Skipped(name, "PnP failed")); continue; }
            flange.add(fl);
            target.add(Rigid.of(est.get().pose().rotation(), est.get().pose().translation()));
            used.add(name);
        }
        double[] flip = symmetric ? HandEyeCalibration.halfTurn(cx / 1000, cy / 1000) : null;
        return new Result(HandEyeCalibration.calibrate(flange, target, used, flip), used, skipped, symmetric);
    }
}
