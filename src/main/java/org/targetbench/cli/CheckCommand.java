package org.targetbench.cli;

import picocli.CommandLine.Mixin;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Feasibility;
import org.targetbench.camera.FeasibilityConfig;
import org.targetbench.camera.FeasibilityReport;
import org.targetbench.source.CameraFiles;
import org.targetbench.source.TargetFile;
import org.targetbench.target.TargetDesign;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;

@Command(name = "check", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Checks before printing whether a camera will resolve a target design at a stand-off, square on and tilted.",
                "Reports the smallest feature and the feature spacing in pixels against the tracking window, the quiet zone in pixels, "
                        + "how much of the view the target fills and whether it stays in view; each line is PASS, WARN or FAIL with "
                        + "its threshold and where that comes from. Exit code 0 when nothing fails, 1 when a line fails."})
final class CheckCommand implements Callable<Integer> {
    @Spec CommandSpec spec;

    @Option(names = "--target", required = true, paramLabel = "FILE", description = "Target design (target.json).")
    Path target;
    @Mixin CameraOption camera;
    @Mixin StandoffOption standoff;
    double standoffMm;

    @Option(names = "--standoff", hidden = true, paramLabel = "MM")
    void oldStandoff(double mm) {
        OldSpelling.note(spec, "--standoff", "--standoff-mm MM");
        standoff.mm = mm;
    }
    @Option(names = "--tilt", paramLabel = "DEG", defaultValue = "0", description = "Largest tilt of the target, degrees, 0..80 (default: ${DEFAULT-VALUE}).")
    double tiltDeg;
    @Option(names = "--window-radius", paramLabel = "PX",
            description = "Half-size r of the corner refinement / tracking window, px; the window is 2r+1 wide (default: ${DEFAULT-VALUE}).")
    int window = 4;

    @Option(names = "--window", hidden = true, paramLabel = "PX")
    void oldWindow(int r) {
        OldSpelling.note(spec, "--window", "--window-radius PX");
        window = r;
    }

    @Override
    public Integer call() throws Exception {
        standoffMm = standoff.required();
        if (!(tiltDeg >= 0 && tiltDeg <= 80)) throw new UserError("--tilt must be within 0..80 degrees, got " + tiltDeg);
        FeasibilityConfig config = new FeasibilityConfig();
        config.windowHalfSizePx = window;
        try {
            config.checkValidity();
        } catch (IllegalArgumentException e) {
            throw new UserError("--window: " + e.getMessage());
        }
        TargetDesign design = TargetFile.read(target);
        CameraModel cam = camera.required("the intrinsics of the camera that will see the target");
        FeasibilityReport report = Feasibility.check(design, cam, standoffMm / 1000, tiltDeg, config);
        PrintWriter w = spec.commandLine().getOut();
        w.printf(Locale.ROOT, "Target %s (%s, %s x %s mm) with a %dx%d camera (fx %.1f, fy %.1f px)%n", design.id(), design.name(),
                DesignCommand.num(design.widthMm()), DesignCommand.num(design.heightMm()), cam.width(), cam.height(), cam.fx(), cam.fy());
        print(report, w);
        w.flush();
        return report.overall() == FeasibilityReport.Status.FAIL ? 1 : 0;
    }

    /** The report as lines of text; shared with 'demo'. */
    static void print(FeasibilityReport r, PrintWriter w) {
        w.printf(Locale.ROOT, "Feasibility at %s mm stand-off, tilt up to %s deg:%n", DesignCommand.num(r.standoffM() * 1000), DesignCommand.num(r.tiltDeg()));
        for (FeasibilityReport.Check c : r.checks()) {
            w.printf(Locale.ROOT, "  %-4s  %-21s %s%n", c.status(), c.name(), c.measured());
            w.printf(Locale.ROOT, "        %-21s threshold %s (%s)%n", "", c.threshold(), c.basis());
        }
        w.printf(Locale.ROOT, "Overall: %s (%d pass, %d warn, %d fail)%n", r.overall(), r.count(FeasibilityReport.Status.PASS),
                r.count(FeasibilityReport.Status.WARN), r.count(FeasibilityReport.Status.FAIL));
    }
}
