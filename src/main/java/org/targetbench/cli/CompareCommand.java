package org.targetbench.cli;

import org.targetbench.export.AtomicOutput;
import org.targetbench.export.CompareWriter;
import org.targetbench.formats.CompareDotBias;
import org.targetbench.pipeline.CompareResult;
import org.targetbench.pipeline.CompareRun;
import org.targetbench.report.OverlayWriter;
import org.targetbench.source.ImageFolderSource;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

import java.nio.file.Path;
import java.util.concurrent.Callable;

@Command(name = "compare", mixinStandardHelpOptions = true,
        description = {"Runs detectors on a folder of frames and scores repeatability against the reference frame.",
                "Frames are PNG/JPEG files sorted by name; truth.json in the folder (or --truth) gives the homography from the "
                        + "reference frame to each frame. Writes detections.csv, repeatability.csv, summary.json and overlays/."})
final class CompareCommand implements Callable<Integer> {
    @Spec CommandSpec spec;

    @Option(names = "--frames", required = true, paramLabel = "DIR", description = "Folder of PNG/JPEG frames.")
    Path frames;

    @Option(names = "--truth", paramLabel = "FILE", description = "Ground-truth file (default: truth.json in the frame folder, if present).")
    Path truth;

    @Option(names = "--target", paramLabel = "FILE", description = "In place of --truth: register the frames to this printed design (target.json) and score against that; see the register command.")
    Path target;

    @Option(names = "--camera", paramLabel = "FILE", description = "With --target: intrinsics with distortion to register with (camera.json, OpenCV or ROS YAML).")
    Path camera;

    @Option(names = "--out", required = true, paramLabel = "DIR", description = "Output folder, written atomically.")
    Path out;

    @Mixin DetectorOptions detectorOptions;

    @Override
    public Integer call() throws Exception {
        var configs = detectorOptions.configs();
        if (camera != null && target == null) throw new UserError("--camera goes with --target (the intrinsics to register with)");
        try (AtomicOutput output = AtomicOutput.open(out); SweepJob job = new SweepJob()) {
            Path truthFile = truth;
            TargetTruth.Registered registered = null;
            if (target != null)
                try (ImageFolderSource footage = ImageFolderSource.open(frames, null)) {
                    registered = TargetTruth.registered(footage, target, camera, truth, output);
                    truthFile = registered.truthFile();
                }
            return compare(configs, truthFile, registered, output, job);
        }
    }

    private int compare(java.util.List<org.targetbench.detect.DetectorConfig> configs, Path truthFile, TargetTruth.Registered registered,
                        AtomicOutput output, SweepJob job) throws Exception {
        try (ImageFolderSource source = ImageFolderSource.open(frames, truthFile)) {
            StoppableFrames stoppable = new StoppableFrames(source, job::cancelled, 2 * Runtime.getRuntime().availableProcessors());
            CompareRun run = new CompareRun(configs, detectorOptions.epsilon);
            if (registered != null) registered.applyTo(run);
            CompareResult result = run.run(stoppable, stoppable.progress(new ConsoleProgress("detecting")));
            CompareWriter.write(result, output);
            OverlayWriter.write(result, output);
            var dotBias = CompareDotBias.rows(frames, result);
            if (!dotBias.isEmpty()) org.targetbench.export.DotBiasWriter.write(dotBias, output.file("dot-bias.csv"));
            output.commit();
            var w = spec.commandLine().getOut();
            ConsoleTable.print(result, w);
            if (!dotBias.isEmpty()) w.println(DotBiasLine.of(dotBias, "dot-bias.csv"));
            w.println();
            w.println("Results written to " + output.target());
            if (stoppable.stopped()) w.println(SweepJob.stoppedLine(stoppable.read(), source.frameCount(), "frames", output.target()));
            w.flush();
            return stoppable.stopped() ? SweepJob.EXIT_CANCELLED : 0;
        }
    }
}
