package org.targetbench.cli;

import org.targetbench.camera.CameraModel;
import org.targetbench.export.AtomicOutput;
import org.targetbench.export.ShootoutWriter;
import org.targetbench.perturb.Perturbation;
import org.targetbench.pipeline.DemoScenario;
import org.targetbench.pipeline.ShootoutRun;
import org.targetbench.pipeline.SweepConfig;
import org.targetbench.report.ShootoutReport;
import org.targetbench.source.CameraFiles;
import org.targetbench.source.TargetFile;
import org.targetbench.target.TargetDesign;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;

@Command(name = "shootout", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Compares candidate target designs for a fixture under the same camera, stand-off and conditions.",
                "Per design: the feasibility check, a stress sweep at the stand-off (best detector over the envelope), the points that "
                        + "stay robust across the envelope, the best 4-point servo set's cond(L*), and image coverage. Writes shootout.csv "
                        + "and shootout.html (one column per design)."})
final class ShootoutCommand implements Callable<Integer> {
    @Spec CommandSpec spec;

    @Option(names = "--targets", required = true, split = ",", arity = "1..*", paramLabel = "DESIGN.json",
            description = "Two or more target designs (target.json files), comma or space separated.")
    List<Path> targets;
    @Option(names = "--camera", required = true, paramLabel = "FILE", description = "Camera intrinsics: camera.json, OpenCV or ROS YAML.")
    Path camera;
    @Option(names = "--standoff", required = true, paramLabel = "MM", description = "Distance from the camera to the target, mm.")
    double standoffMm;
    @Option(names = "--tilt", paramLabel = "DEG", defaultValue = "20", description = "Largest tilt for the feasibility check, degrees (default: ${DEFAULT-VALUE}).")
    double tiltDeg;
    @Option(names = "--kinds", split = ",", paramLabel = "KIND", description = "Conditions, as for 'sweep' (default: the five kinds).")
    List<String> kinds;
    @Option(names = "--levels", paramLabel = "N", defaultValue = "5", description = "Levels per condition (default: ${DEFAULT-VALUE}).")
    int levels;
    @Option(names = "--views", paramLabel = "N", defaultValue = "6", description = "Rendered views per design in the sweep (default: ${DEFAULT-VALUE}).")
    int views;
    @Option(names = "--envelope", paramLabel = "FILE", description = "Operating envelope (JSON), as for 'sweep'.")
    Path envelope;
    @Option(names = "--seed", paramLabel = "S", defaultValue = "1", description = "Seed (default: ${DEFAULT-VALUE}).")
    long seed;
    @Option(names = "--out", required = true, paramLabel = "DIR", description = "Output folder, written atomically.")
    Path out;

    @Mixin DetectorOptions detectorOptions;

    @Override
    public Integer call() throws Exception {
        if (targets.size() < 2) throw new UserError("--targets needs at least two designs to compare, got " + targets.size());
        if (!(standoffMm > 0) || !Double.isFinite(standoffMm)) throw new UserError("--standoff must be > 0 mm, got " + standoffMm);
        if (!(tiltDeg >= 0 && tiltDeg <= 80)) throw new UserError("--tilt must be within 0..80 degrees, got " + tiltDeg);
        SweepConfig sc = SweepCommand.config(detectorOptions, kinds, levels, views, seed);
        Map<Perturbation, Double> env = SweepCommand.envelope(envelope);
        List<TargetDesign> designs = new ArrayList<>();
        for (Path t : targets) designs.add(TargetFile.read(t));
        CameraModel cam = CameraFiles.read(camera);
        try (AtomicOutput output = AtomicOutput.open(out); SweepJob job = new SweepJob()) {
            List<ShootoutRun.Entry> entries = new ShootoutRun(cam, standoffMm / 1000, tiltDeg, sc, env)
                    .run(designs, DemoScenario.lighting(), new ConsoleProgress("designs"), job::cancelled);
            if (entries.size() < designs.size()) throw new UserError("stopped before every design was measured; nothing written");
            ShootoutWriter.write(entries, output.file("shootout.csv"));
            ShootoutReport.write(entries, camera.getFileName().toString(), standoffMm / 1000, tiltDeg, env, output.file("shootout.html"));
            output.commit();
            PrintWriter w = spec.commandLine().getOut();
            w.printf(Locale.ROOT, "%-4s %-24s %-6s %-11s %9s %7s %7s %10s %8s%n", "rank", "design", "check", "detector", "env.score", "points", "robust", "cond(L*)", "cover");
            for (var e : entries)
                w.printf(Locale.ROOT, "%-4d %-24s %-6s %-11s %9.3f %7d %7d %10s %7.0f%%%n", e.rank(), e.design().id(), e.feasibility().overall(),
                        e.bestDetector().label(), e.envelopeScore(), e.points(), e.robustPoints(),
                        Double.isNaN(e.bestCondition()) ? "none" : String.format(Locale.ROOT, "%.2f", e.bestCondition()), 100 * e.coverage());
            w.println("Design-matched detector beside the best generic one:");
            for (var e : entries) {
                w.printf(Locale.ROOT, "  %-24s matched  %s%n", e.design().id(), org.targetbench.report.ShootoutText.matched(e));
                w.printf(Locale.ROOT, "  %-24s generic  %s%n", "", org.targetbench.report.ShootoutText.generic(e));
                if (!Double.isNaN(e.dotBiasPx())) w.printf(Locale.ROOT, "  %-24s dot bias %s%n", "", org.targetbench.report.ShootoutText.dotBias(e));
            }
            w.println("Written to " + output.target() + ": shootout.csv, shootout.html. Figures describe the rendered bench conditions, not a guarantee.");
            w.flush();
        }
        return 0;
    }
}
