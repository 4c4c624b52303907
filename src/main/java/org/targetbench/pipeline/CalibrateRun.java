package org.targetbench.pipeline;

import org.targetbench.camera.Calibration;
import org.targetbench.camera.CalibrationConfig;
import org.targetbench.source.FrameSource;
import org.targetbench.source.SourceException;
import org.targetbench.source.SourceFrame;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.function.BooleanSupplier;

/**
 * The calibration run, as the command line and the workbench make it: the board's inner corners are looked for in
 * every frame of a source, in order ({@link Calibration#detect}), then the intrinsics are estimated from the frames
 * where the board was found whole ({@link Calibration#solve}, Zhang's method).
 *
 * <p>Expected failures are data: no board in any frame gives an empty outcome with {@link Result#found()} zero; too
 * few views or no convergence give a {@link Calibration.Failure}; a cancelled run gives an empty outcome and
 * {@link Result#cancelled()}.
 */
public final class CalibrateRun {
    /**
     * What a run found.
     *
     * @param names      frame names, in the order read
     * @param detections the board's corners per frame, empty where it was not found whole
     * @param width      frame width, pixels
     * @param height     frame height, pixels
     * @param outcome    the calibration, or empty when the board was found in no frame or the run was cancelled
     * @param cancelled  true when the run stopped before every frame was looked at
     */
    public record Result(List<String> names, List<Optional<double[]>> detections, int width, int height,
                         Optional<Calibration.Outcome> outcome, boolean cancelled) {
        public Result {
            names = List.copyOf(names);
            detections = List.copyOf(detections);
        }

        /** Frames in which the board was found whole. */
        public long found() { return detections.stream().filter(Optional::isPresent).count(); }

        /** Names of the frames in which the board was found whole, in order. */
        public List<String> foundIn() {
            List<String> out = new ArrayList<>();
            for (int i = 0; i < names.size(); i++) if (detections.get(i).isPresent()) out.add(names.get(i));
            return out;
        }

        /** Names of the frames in which the board was not found whole, in order. */
        public List<String> notFoundIn() {
            List<String> out = new ArrayList<>();
            for (int i = 0; i < names.size(); i++) if (detections.get(i).isEmpty()) out.add(names.get(i));
            return out;
        }
    }

    private final Calibration.Board board;
    private final CalibrationConfig config;

    public CalibrateRun(Calibration.Board board, CalibrationConfig config) {
        config.checkValidity();
        this.board = board;
        this.config = config.copy();
    }

    /** Looks for the board in every frame of {@code frames}, then calibrates; {@code progress} counts frames read. */
    public Result run(FrameSource frames, Progress progress, BooleanSupplier cancelled) throws SourceException {
        Calibration cal = new Calibration(board, config);
        List<String> names = new ArrayList<>();
        List<Optional<double[]>> found = new ArrayList<>();
        int width = frames.width(), height = frames.height();
        Optional<SourceFrame> f;
        while ((f = frames.next()).isPresent()) {
            if (cancelled.getAsBoolean()) return new Result(names, found, width, height, Optional.empty(), true);
            names.add(f.get().name());
            found.add(cal.detect(f.get().image()));
            progress.update(names.size(), frames.frameCount(), f.get().name());
        }
        if (found.stream().noneMatch(Optional::isPresent)) return new Result(names, found, width, height, Optional.empty(), false);
        return new Result(names, found, width, height, Optional.of(cal.solve(width, height, names, found)), false);
    }

    /** Names of the parameters {@link #spread} gives, in order, with their units. */
    public static final List<String> PARAMETERS = List.of("fx px", "fy px", "cx px", "cy px", "k1", "k2", "k3", "p1", "p2");

    /**
     * Standard errors of the nine parameters ({@link #PARAMETERS}) by the leave-one-view-out jackknife [1]: with
     * θ_(i) the estimate without used view i, n views and θ_(.) the mean of the θ_(i),
     * <pre>
     *   se(θ) = sqrt( (n - 1) / n · Σ_i (θ_(i) - θ_(.))² ).                                   (1)
     * </pre>
     * It says how much the figures move with the choice of views, not how far they are from the truth. Empty when
     * fewer than {@link CalibrationConfig#minViews} + 1 views were used or one of the n solves fails.
     *
     * <p>[1] B. Efron and R. J. Tibshirani, An Introduction to the Bootstrap, Chapman and Hall 1993, section 11.2,
     * eq. (11.5) (section and equation from memory).
     */
    public Optional<double[]> spread(Result r, BooleanSupplier cancelled) {
        List<Integer> used = new ArrayList<>();
        for (int i = 0; i < r.detections().size(); i++) if (r.detections().get(i).isPresent()) used.add(i);
        int n = used.size();
        if (n < config.minViews + 1) return Optional.empty();
        Calibration cal = new Calibration(board, config);
        double[][] theta = new double[n][];
        for (int k = 0; k < n; k++) {
            if (cancelled.getAsBoolean()) return Optional.empty();
            List<Optional<double[]>> without = new ArrayList<>(r.detections());
            without.set(used.get(k), Optional.empty());
            if (!(cal.solve(r.width(), r.height(), r.names(), without) instanceof org.targetbench.camera.CalibrationResult c)) return Optional.empty();
            var m = c.camera();
            theta[k] = new double[]{m.fx(), m.fy(), m.cx(), m.cy(), m.k1(), m.k2(), m.k3(), m.p1(), m.p2()};
        }
        return Optional.of(jackknifeSe(theta));
    }

    /** Eq. (1) of {@link #spread} for each column of {@code theta}: one row per leave-one-out estimate. */
    static double[] jackknifeSe(double[][] theta) {
        int n = theta.length;
        double[] se = new double[theta[0].length];
        for (int j = 0; j < se.length; j++) {
            double mean = 0;
            for (double[] t : theta) mean += t[j] / n;
            double ss = 0;
            for (double[] t : theta) ss += (t[j] - mean) * (t[j] - mean);
            se[j] = Math.sqrt((n - 1.0) / n * ss); // eq. (1)
        }
        return se;
    }
}
