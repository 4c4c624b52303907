package org.targetbench.cli;

import org.targetbench.camera.Feasibility;
import org.targetbench.camera.FeasibilityConfig;
import org.targetbench.export.AtomicOutput;
import org.targetbench.export.CompareWriter;
import org.targetbench.export.FrameSetWriter;
import org.targetbench.export.Safety;
import org.targetbench.pipeline.CompareResult;
import org.targetbench.pipeline.CompareRun;
import org.targetbench.pipeline.DemoScenario;
import org.targetbench.report.OverlayWriter;
import org.targetbench.pipeline.PickRun;
import org.targetbench.select.SelectConfig;
import org.targetbench.servo.RehearsalConfig;
import org.targetbench.servo.RehearsalResult;
import org.targetbench.source.CameraFile;
import org.targetbench.source.ResultsFolder;
import org.targetbench.source.ImageFolderSource;
import org.targetbench.source.PosesFile;
import org.targetbench.source.TargetFile;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Map;
import java.util.List;
import java.util.concurrent.Callable;
import org.targetbench.perturb.PerturbKind;
import org.targetbench.perturb.Perturbation;
import org.targetbench.pipeline.SweepBase;
import org.targetbench.pipeline.SweepConfig;
import org.targetbench.pipeline.SweepResult;
import org.targetbench.pipeline.SweepRun;

@Command(name = "demo", mixinStandardHelpOptions = true,
        description = {"Runs the bench on the built-in demo scenario: a checkerboard target on the fixture plate of a small "
                + "machining cell, seen by the flange camera from twelve arm positions.",
                "Renders the frames with ground truth, compares every detector on them, runs a short stress sweep, and writes the "
                        + "frames, the target, camera and poses files, CSV and JSON results, overlay images and the sweep report.",
                "Then picks a servo set from those results, rehearses it in simulation and exports it (servo-set.json, servo-set.csv, rehearsal/)."})
final class DemoCommand implements Callable<Integer> {
    /** Size of the demo's short stress sweep: every kind's main parameter at this many levels on this many views. */
    static final int SWEEP_LEVELS = 5, SWEEP_VIEWS = 3;
    /** The demo sweep also measures KLT survival over this many frames of slow drift per cell. */
    static final int SWEEP_TRACK_FRAMES = 4;
    /** Rehearsal starts in the demo: enough for a convergence rate, few enough to keep the demo quick. */
    static final int REHEARSAL_STARTS = 100;
    /** The demo's tracking run: the last 3 s of a servo convergence (20° roll, 1.5x zoom, wide-angle lens) at 30 fps. */
    static final String TRACK_MOTION = "converge,frames=90";

    @Spec CommandSpec spec;

    @Option(names = "--out", paramLabel = "DIR", defaultValue = "results/demo", description = "Output folder (default: ${DEFAULT-VALUE}).")
    Path out;

    @Mixin DetectorOptions detectorOptions;

    static SweepConfig demoSweep(java.util.List<org.targetbench.detect.DetectorConfig> configs) {
        SweepConfig c = new SweepConfig();
        c.detectors = configs;
        for (PerturbKind k : PerturbKind.values()) c.parameters.add(Perturbation.primary(k));
        c.levels = SWEEP_LEVELS;
        c.seed = 1;
        c.trackFrames = SWEEP_TRACK_FRAMES;
        return c;
    }
    /** Tilt range of the demo's feasibility section, degrees: the demo poses tilt the target by up to 40 degrees. */
    static final double DEMO_TILT_DEG = 40;

    @Override
    public Integer call() throws Exception {
        var configs = detectorOptions.configs();
        PrintWriter w = spec.commandLine().getOut();
        try (AtomicOutput output = AtomicOutput.open(out)) {
            w.println("Demo scenario: target " + DemoScenario.target().name() + " on the fixture plate, camera "
                    + DemoScenario.camera().width() + "x" + DemoScenario.camera().height() + " at " + DemoScenario.STANDOFF_M + " m.");
            w.flush();
            TargetFile.write(DemoScenario.target(), output.file("target.json"));
            CameraFile.write(DemoScenario.camera(), output.file("camera.json"));
            PosesFile.write(DemoScenario.poses(), output.file("poses.json"));
            FrameSetWriter.write(DemoScenario.source(), output, "frames", new ConsoleProgress("rendering"));
            // compare on the written frames exactly as 'compare --frames' would
            CompareResult result;
            try (ImageFolderSource frames = ImageFolderSource.open(output.folder("frames"), null, out.resolve("frames").toString())) {
                result = new CompareRun(configs, detectorOptions.epsilon).run(frames, new ConsoleProgress("detecting"));
            }
            CompareWriter.write(result, output);
            var overlays = OverlayWriter.write(result, output);
            SweepResult sweep;
            try (SweepJob job = new SweepJob()) {
                sweep = new SweepRun(demoSweep(configs)).run(SweepBase.render(DemoScenario.target(), DemoScenario.camera(),
                        DemoScenario.lighting(), DemoScenario.STANDOFF_M, SWEEP_VIEWS, 1), new ConsoleProgress("stress sweep"), job::cancelled);
                SweepCommand.write(sweep, Map.of(), output.sub("sweep"));
            }
            // pick a servo set from the results just written, exactly as 'pick --from' would, then rehearse it
            ResultsFolder.Data data = ResultsFolder.read(output.folder("."), ResultsFolder.Overrides.none(), out.toString());
            PickRun.Result pick = ServoSteps.pick(data, null, new SelectConfig());
            List<String> setFiles = ServoSteps.writePick(pick, output, "servo-set");
            RehearsalConfig rc = new RehearsalConfig();
            rc.starts = REHEARSAL_STARTS;
            String setName = out.resolve("servo-set.json").toString();
            RehearsalResult rehearsal = ServoSteps.rehearse(pick.set().orElseThrow(), setName, rc, output, "rehearsal/");
            org.targetbench.pipeline.TrackResult tracking;
            try (org.targetbench.export.TrackWriter tw = new org.targetbench.export.TrackWriter(output.sub("tracking"))) {
                tracking = new org.targetbench.pipeline.TrackRun(new org.targetbench.track.KltConfig(), TrackCommand.seeding("shi-tomasi"), 30, false, 0)
                        .run(org.targetbench.pipeline.MotionScenarios.open(TRACK_MOTION), tw, new ConsoleProgress("tracking"), () -> false);
                tw.finish(tracking);
            }
            output.commit();
            Path target = output.target();
            ConsoleTable.print(result, w);
            w.println();
            // the same check 'targetbench check' runs, for the demo target, camera and stand-off
            CheckCommand.print(Feasibility.check(DemoScenario.target(), DemoScenario.camera(), DemoScenario.STANDOFF_M,
                    DEMO_TILT_DEG, new FeasibilityConfig()), w);
            w.println();
            w.println("Written to " + target + ":");
            w.println("  frames/              12 rendered frames with truth.json (try: targetbench compare --frames " + target.resolve("frames") + " --out results/mine)");
            w.println("  detections.csv, repeatability.csv, summary.json");
            w.println("  overlays/            " + overlays.size() + " PNG images of detections on the reference and sample frames");
            w.println("  target.json, camera.json, poses.json (inputs for 'targetbench render')");
            w.println("  sweep/report.html    stress sweep: " + sweep.parameters().size() + " conditions x " + SWEEP_LEVELS + " levels x "
                    + SWEEP_VIEWS + " views (full sweep: targetbench sweep --target " + target.resolve("target.json") + " --out results/sweep)");
            w.println("  tracking/            KLT tracks of the arm's approach: tracks.csv, survival.csv, drift.csv, summary.json (try: targetbench track --source synthetic:orbit --out results/orbit)");
            w.println();
            SweepCommand.print(sweep, Map.of(), w);
            w.println();
            ServoSteps.printPick(pick, target.toString(), w);
            w.println();
            ServoSteps.printRehearsal(rehearsal, setName, w);
            w.println();
            w.println("Servo set:   " + target.resolve(setFiles.get(0)));
            w.println("             " + target.resolve(setFiles.get(1)) + " (flat), " + target.resolve(setFiles.get(2)) + " (every candidate and why)");
            w.println("Rehearsal:   " + target.resolve("rehearsal/rehearsal.html") + " (charts), rehearsal.csv, rehearsal-summary.json");
            w.println("Try:         targetbench rehearse --set " + target.resolve(setFiles.get(0)) + " --law current --envelope 20,20,20,5,5,170 --out results/what-if");
            TrackConsole.print(tracking, w);
            w.println();
            w.println("Safety: " + Safety.NOTICE);
            w.flush();
        }
        return 0;
    }
}
