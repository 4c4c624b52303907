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
    @Mixin CameraOption camera;
    @Mixin StandoffOption standoff;

    @Option(names = "--standoff", hidden = true, paramLabel = "MM")
    void oldStandoff(double mm) {
        OldSpelling.note(spec, "--standoff", "--standoff-mm MM");
        standoff.mm = mm;
    }
    @Option(names = "--tilt", paramLabel = "DEG", defaultValue = "20", description = "Largest tilt for the feasibility check, degrees (default: ${DEFAULT-VALUE}).")
    double tiltDeg;
    @Option(names = "--levels", paramLabel = "N", defaultValue = "5", description = "Levels per condition (default: ${DEFAULT-VALUE}).")
    int levels;
    @Option(names = "--views", paramLabel = "N", defaultValue = "6", description = "Rendered views per design in the sweep (default: ${DEFAULT-VALUE}).")
    int views;
    @Option(names = "--out", required = true, paramLabel = "DIR", description = "Output folder, written atomically.")
    Path out;

    @Mixin ConditionOptions conditions;

    @Mixin DetectorOptions detectorOptions;

    @Override
    public Integer call() throws Exception {
        if (targets.size() < 2) throw new UserError("--targets needs at least two designs to compare, got " + targets.size());
        double standoffMm = standoff.required();
        if (!(tiltDeg >= 0 && tiltDeg <= 80)) throw new UserError("--tilt must be within 0..80 degrees, got " + tiltDeg);
        SweepConfig sc = SweepCommand.config(detectorOptions, conditions.kinds, levels, views, conditions.seed);
        Map<Perturbation, Double> env = SweepCommand.envelope(conditions.envelope);
        List<TargetDesign> designs = new ArrayList<>();
        for (Path t : targets) {
            TargetDesign d = TargetFile.read(t);
            for (int i = 0; i < designs.size(); i++)
                if (designs.get(i).id().equals(d.id())) throw new UserError("two designs have the id \"" + d.id() + "\": " + targets.get(i) + " and " + t + "; ids must differ within a shoot-out");
            designs.add(d);
        }
        CameraModel cam = camera.required("the intrinsics of the camera that will see the targets");
        try (AtomicOutput output = AtomicOutput.open(out); SweepJob job = new SweepJob()) {
            List<ShootoutRun.Entry> entries = new ShootoutRun(cam, standoffMm / 1000, tiltDeg, sc, env)
                    .run(designs, DemoScenario.lighting(), new ConsoleProgress("designs"), job::cancelled);
            if (entries.size() < designs.size()) throw new UserError("stopped before every design was measured; nothing written");
            ShootoutWriter.write(entries, output.file("shootout.csv"));
            ShootoutReport.write(entries, camera.file.getFileName().toString(), standoffMm / 1000, tiltDeg, env, output.file("shootout.html"));
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
