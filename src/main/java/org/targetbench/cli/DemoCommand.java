package org.targetbench.cli;

import org.targetbench.formats.PickRefusals;
import org.targetbench.camera.Feasibility;
import org.targetbench.camera.FeasibilityConfig;
import org.targetbench.export.AtomicOutput;
import org.targetbench.export.CompareWriter;
import org.targetbench.export.FrameSetWriter;
import org.targetbench.export.Safety;
import org.targetbench.pipeline.CompareResult;
import org.targetbench.pipeline.DemoScenario;
import org.targetbench.report.OverlayWriter;
import org.targetbench.pipeline.PickRun;
import org.targetbench.servo.RehearsalResult;
import org.targetbench.source.CameraFile;
import org.targetbench.source.PosesFile;
import org.targetbench.source.TargetFile;
import org.targetbench.export.TrackWriter;
import org.targetbench.pipeline.DemoRun;
import org.targetbench.pipeline.Progress;
import org.targetbench.pipeline.TrackSink;
import org.targetbench.pipeline.Reasons;
import org.targetbench.formats.PickInputs;
import org.targetbench.source.FrameList;
import org.targetbench.Version;
import org.targetbench.export.ServoWriters;
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
import org.targetbench.pipeline.SweepResult;

@Command(name = "demo", mixinStandardHelpOptions = true,
        description = {"Runs the bench on the built-in demo scenario: a checkerboard target on the fixture plate of a small "
                + "machining cell, seen by the flange camera from twelve arm positions.",
                "Renders the frames with ground truth, compares every detector on them, runs a short stress sweep, and writes the "
                        + "frames, the target, camera and poses files, CSV and JSON results, overlay images and the sweep report.",
                "Then picks a servo set from those results, rehearses it in simulation and exports it (servo-set.json, servo-set.csv, rehearsal/)."})
final class DemoCommand implements Callable<Integer> {
    /** Tilt range of the demo's feasibility section, degrees: the demo poses tilt the target by up to 40 degrees. */
    static final double DEMO_TILT_DEG = 40;

    @Spec CommandSpec spec;

    @Option(names = "--out", paramLabel = "DIR", defaultValue = "results/demo", description = "Output folder (default: ${DEFAULT-VALUE}).")
    Path out;

    @Mixin DetectorOptions detectorOptions;

    /** The demo's stages, as the run has them. */
    static final List<String> STAGES = DemoRun.STAGES;

    /** Commits the stages done and says so in one line; exit code 130. */
    private static int stopped(AtomicOutput output, PrintWriter w, int stagesDone) throws org.targetbench.export.OutputException {
        output.commit();
        w.println(SweepJob.stoppedLine(stagesDone, STAGES.size(), "stages (" + String.join(", ", STAGES.subList(0, stagesDone)) + ")", output.target()));
        w.flush();
        return SweepJob.EXIT_CANCELLED;
    }

    @Override
    public Integer call() throws Exception {
        var configs = detectorOptions.configs();
        PrintWriter w = spec.commandLine().getOut();
        try (AtomicOutput output = AtomicOutput.open(out); SweepJob job = new SweepJob()) {
            w.println("Demo scenario: target " + DemoScenario.target().name() + " on the fixture plate, camera "
                    + DemoScenario.camera().width() + "x" + DemoScenario.camera().height() + " at " + DemoScenario.STANDOFF_M + " m.");
            w.flush();
            DemoRun.Result demo;
            String setName = out.resolve("servo-set.json").toString();
            TrackWriter[] tw = {null};
            try {
                DemoRun.Steps steps = new DemoRun.Steps() {
                    @Override public Progress progress(String step) { return new ConsoleProgress(step); }
                    @Override public boolean cancelled() { return job.cancelled(); }
                    @Override public TrackSink trackSink() {
                        try {
                            if (tw[0] == null) tw[0] = new TrackWriter(output.sub("tracking"));
                        } catch (java.io.IOException e) {
                            throw new java.io.UncheckedIOException(e);
                        }
                        return tw[0];
                    }
                };
                try {
                    demo = DemoRun.run(configs, detectorOptions.epsilon, out.resolve("frames").toString(),
                            (cr, frames) -> PickInputs.fromComparison(cr, frames, DemoScenario.camera(),
                                    DemoScenario.target(), DemoScenario.poses().get(0)),
                            steps, Version.get(), ServoWriters.now());
                } catch (PickRun.Refused e) {
                    throw new UserError(PickRefusals.explain(e, new PickRefusals.Where(out.toString(), "frames/truth.json", "poses.json", "frame_000.png")));
                }
                if (demo.tracking() != null) tw[0].finish(demo.tracking());
            } finally {
                if (tw[0] != null) tw[0].close();
            }
            TargetFile.write(DemoScenario.target(), output.file("target.json"));
            CameraFile.write(DemoScenario.camera(), output.file("camera.json"));
            PosesFile.write(DemoScenario.poses(), output.file("poses.json"));
            FrameSetWriter.write(new FrameList(out.resolve("frames").toString(), demo.frames(), DemoScenario.source().referenceName()), output,
                    "frames", Progress.NONE);
            if (demo.stagesDone() < 2) return stopped(output, w, demo.stagesDone());
            CompareResult result = demo.compare();
            CompareWriter.write(result, output);
            var overlays = OverlayWriter.write(result, output);
            if (demo.stagesDone() < 3) return stopped(output, w, demo.stagesDone());
            SweepResult sweep = demo.sweep();
            SweepCommand.write(sweep, Map.of(), output.sub("sweep"));
            if (demo.stagesDone() < 4) return stopped(output, w, demo.stagesDone());
            PickRun.Result pick = demo.pick();
            if (pick.set().isEmpty()) throw new ServoSteps.NoAcceptableSet(Reasons.selection(pick.selection()));
            RehearsalResult rehearsal = demo.rehearsal();
            // the rehearsal ran on exactly this set, so servo-set.json records it (the same export as the workbench's)
            List<String> setFiles = ServoSteps.writePick(pick, java.util.Optional.ofNullable(rehearsal), demo.rehearsalSeconds(), output, "servo-set");
            if (demo.stagesDone() < 6) return stopped(output, w, demo.stagesDone());
            org.targetbench.pipeline.TrackResult tracking = demo.tracking();
            var armRehearsal = demo.arm();
            ArmSteps.write(armRehearsal, pick.set().get(), setName, output, "arm/");
            if (job.cancelled()) return stopped(output, w, STAGES.size());
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
            w.println("  sweep/report.html    stress sweep: " + sweep.parameters().size() + " conditions x " + DemoRun.SWEEP_LEVELS + " levels x "
                    + DemoRun.SWEEP_VIEWS + " views (full sweep: targetbench sweep --target " + target.resolve("target.json") + " --out results/sweep)");
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
            ArmSteps.print(armRehearsal, w);
            w.println("Arm:         " + target.resolve("arm/arm-rehearsal.html") + " (joint, manipulability and limit-margin charts, three-view drawing)");
            w.println("Try:         targetbench rehearse --set " + target.resolve("servo-set.json") + " --arm " + target.resolve("arm/arm.json")
                    + " --hand-eye " + target.resolve("arm/handeye.json") + " --latency-frames 2 --gain-sweep --out results/arm-what-if");
            w.println();
            w.println("Safety: " + Safety.NOTICE);
            w.flush();
        }
        return 0;
    }
}
