package org.targetbench.bench;

import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.DetectorType;
import org.targetbench.perturb.PerturbKind;
import org.targetbench.perturb.Perturbation;
import org.targetbench.pipeline.DemoScenario;
import org.targetbench.pipeline.Progress;
import org.targetbench.pipeline.SweepBase;
import org.targetbench.pipeline.SweepConfig;
import org.targetbench.pipeline.SweepResult;
import org.targetbench.pipeline.SweepRun;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;

/**
 * Speed of the default stress sweep on the demo target: every detector x 5 kinds (each kind's main parameter) x 8
 * levels x 30 rendered views at 640 x 480 on all cores. Target: at most 60 s on 2 cores. Prints the wall time of the
 * base renders and of the sweep, cells per second, and the load average before and after (other work on the machine
 * slows the figure down; quote only quiet runs).
 *
 * <p>Run: {@code ./targetbench bench sweep}.
 */
public final class SweepBench {
    /** Goal from the bench's requirements, seconds. */
    static final double GOAL_S = 60;

    private SweepBench() {}

    public static void main(String[] args) throws Exception {
        SweepConfig c = new SweepConfig();
        // "--generic": only the five generic detectors, the set the earlier recorded figures were taken with
        boolean genericOnly = java.util.Arrays.asList(args).contains("--generic");
        for (DetectorType t : DetectorType.values()) if (!genericOnly || !t.designMatched()) c.detectors.add(DetectorConfig.defaults(t));
        for (PerturbKind k : PerturbKind.values()) c.parameters.add(Perturbation.primary(k));
        System.out.printf(Locale.ROOT, "Sweep benchmark: %d detectors x %d kinds x %d levels x %d views, %d threads, load %s%n",
                c.detectors.size(), c.parameters.size(), c.levels, c.syntheticFrames, c.threads, load());
        // warm-up: a small sweep so the timed one runs compiled code
        SweepConfig warm = new SweepConfig();
        warm.detectors = c.detectors;
        warm.parameters = c.parameters;
        warm.levels = 2;
        new SweepRun(warm).run(SweepBase.render(DemoScenario.target(), DemoScenario.camera(), DemoScenario.lighting(),
                DemoScenario.STANDOFF_M, 2, 99), Progress.NONE, () -> false);
        long t0 = System.nanoTime();
        SweepBase base = SweepBase.render(DemoScenario.target(), DemoScenario.camera(), DemoScenario.lighting(), DemoScenario.STANDOFF_M,
                c.syntheticFrames, c.seed);
        double renderS = (System.nanoTime() - t0) / 1e9;
        SweepResult r = new SweepRun(c).run(base, Progress.NONE, () -> false);
        double total = renderS + r.wallSeconds();
        System.out.printf(Locale.ROOT, "base renders %.1f s, sweep %.1f s (%d cells, %.1f cells/s), total %.1f s: %s the %.0f s goal; load after %s%n",
                renderS, r.wallSeconds(), r.cellsDone(), r.cellsDone() / r.wallSeconds(), total, total <= GOAL_S ? "within" : "OVER", GOAL_S, load());
    }

    static String load() {
        try {
            return Files.readString(Path.of("/proc/loadavg")).trim().split(" ")[0];
        } catch (Exception e) {
            return "unknown";
        }
    }
}
