package org.targetbench.bench;

import boofcv.concurrency.BoofConcurrency;
import org.opencv.core.Core;
import org.targetbench.detect.DetectorType;
import org.targetbench.detect.Detectors;
import org.targetbench.detect.PointDetector;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * Speed benchmark of our point detectors, with OpenCV side by side; run by {@code ./targetbench bench}.
 *
 * <p>Measures, for each detector with its default configuration on the 12 rendered VGA demo frames:
 * <ol>
 *   <li>ours on one thread: median wall time of a detect call ({@link Timing#singleThread});</li>
 *   <li>ours on all cores: frames per second with one detector per thread ({@link Timing#allCores});</li>
 *   <li>OpenCV on one thread with comparable settings ({@link OpenCvReference}).</li>
 * </ol>
 * BoofCV's internal threading is switched off and OpenCV is limited to one thread, so the single-thread columns
 * compare one core against one core, and the all-cores column scales by running independent frames in parallel,
 * as a cell with several cameras or a pipelined loop would.
 *
 * <p>Caveats: a wall-clock benchmark on a shared machine; numbers vary by a few percent between runs and much more
 * between machines, so compare rows of one run. It is never run as a test (speed is not a pass/fail property); it
 * lives in the test sources only so that OpenCV stays out of the shipped jar.
 */
public final class BenchMain {
    private BenchMain() {}

    public static void main(String[] args) throws InterruptedException {
        BenchOptions options;
        try {
            options = BenchOptions.parse(args);
        } catch (BenchOptions.HelpRequested h) {
            System.out.print(BenchOptions.USAGE);
            return;
        } catch (IllegalArgumentException e) {
            System.err.println("bench: error: " + e.getMessage());
            System.err.print(BenchOptions.USAGE);
            System.exit(2);
            return;
        }

        BoofConcurrency.USE_CONCURRENT = false; // before any detector is built: the factories pick their variant then
        nu.pattern.OpenCV.loadLocally();
        Core.setNumThreads(1);

        BenchFrames frames = BenchFrames.renderDemo();
        BenchEnvironment.printHeader(options, frames, System.out);
        int threads = Runtime.getRuntime().availableProcessors();

        List<BenchRow> rows = new ArrayList<>();
        for (DetectorType type : options.detectors()) rows.add(measure(type, frames, options, threads));

        BenchTable.print(rows, threads, System.out);
        System.out.println();
        System.out.println("OpenCV calls:");
        for (DetectorType type : options.detectors())
            System.out.printf("  %-11s %s%n", type.cliName(), OpenCvReference.describe(type));
    }

    private static BenchRow measure(DetectorType type, BenchFrames frames, BenchOptions o, int threads)
            throws InterruptedException {
        int n = frames.count();
        progress(type, "ours, 1 thread");
        Timing.Single ours = Timing.singleThread(ours(type, frames), n, o.warmup(), o.runs());
        progress(type, "ours, " + threads + " threads");
        Timing.Throughput all = Timing.allCores(() -> ours(type, frames), threads, n, o.warmup(), o.runs());
        Optional<String> note = OpenCvReference.unavailable(type);
        Optional<Timing.Single> cv = Optional.empty();
        if (note.isEmpty()) {
            progress(type, "OpenCV, 1 thread");
            cv = Optional.of(Timing.singleThread(OpenCvReference.task(type, frames.mats), n, o.warmup(), o.runs()));
        }
        return new BenchRow(type, ours, all, cv, note);
    }

    private static FrameTask ours(DetectorType type, BenchFrames frames) {
        // like for like with OpenCV's detectors, which do not refine: the refinement stage has its own row in
        // TrackBench (against cornerSubPix)
        org.targetbench.detect.DetectorConfig c = org.targetbench.detect.DetectorConfig.defaults(type);
        c.refine.enabled = false;
        PointDetector detector = Detectors.create(c);
        return f -> detector.detect(frames.gray.get(f)).size();
    }

    private static void progress(DetectorType type, String what) {
        System.err.println("bench: " + type.cliName() + ": " + what + "...");
    }
}
