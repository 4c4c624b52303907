package org.targetbench.cli;

import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.export.AtomicOutput;
import org.targetbench.export.FrameSetWriter;
import org.targetbench.source.CameraFiles;
import org.targetbench.source.PosesFile;
import org.targetbench.source.RenderConfig;
import org.targetbench.source.SyntheticSource;
import org.targetbench.source.TargetFile;
import org.targetbench.target.TargetDesign;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;

@Command(name = "render", mixinStandardHelpOptions = true,
        description = {"Renders a target design seen by a camera at a list of poses, with ground truth.",
                "Writes frame_000.png, frame_001.png, ... and truth.json (homographies from the first frame when the camera has "
                        + "no lens distortion, and the true pixel of every visible feature), ready for 'compare --frames'."})
final class RenderCommand implements Callable<Integer> {
    @Spec CommandSpec spec;

    @Option(names = "--target", required = true, paramLabel = "FILE", description = "Target design (target.json).")
    Path target;

    @Option(names = "--camera", required = true, paramLabel = "FILE", description = "Camera intrinsics: camera.json, OpenCV FileStorage YAML or ROS camera_info YAML (told apart by content).")
    Path camera;

    @Option(names = "--poses", required = true, paramLabel = "FILE", description = "Target poses in the camera frame (poses.json).")
    Path poses;

    @Option(names = "--out", required = true, paramLabel = "DIR", description = "Output folder, written atomically.")
    Path out;

    @Option(names = "--noise", paramLabel = "GREY", defaultValue = "0", description = "Sensor noise standard deviation, grey levels (default: ${DEFAULT-VALUE}).")
    double noise;

    @Option(names = "--seed", paramLabel = "N", defaultValue = "1", description = "Noise seed (default: ${DEFAULT-VALUE}).")
    long seed;

    @Option(names = "--supersample", paramLabel = "N", defaultValue = "4", description = "Sub-samples per pixel along each axis, 4..16 (default: ${DEFAULT-VALUE}).")
    int supersample;

    @Option(names = "--background", paramLabel = "GREY", defaultValue = "110", description = "Grey level around the target, 0..255 (default: ${DEFAULT-VALUE}).")
    double background;

    @Override
    public Integer call() throws Exception {
        RenderConfig rc = new RenderConfig();
        rc.noiseSigma = noise;
        rc.noiseSeed = seed;
        rc.supersample = supersample;
        rc.backgroundGrey = background;
        try {
            rc.checkValidity();
        } catch (IllegalArgumentException e) {
            throw new UserError(e.getMessage());
        }
        TargetDesign design = TargetFile.read(target);
        CameraModel cam = CameraFiles.read(camera);
        List<Pose> list = PosesFile.read(poses, design);
        try (AtomicOutput output = AtomicOutput.open(out)) {
            int n = FrameSetWriter.write(new SyntheticSource(design, cam, list, rc), output, "", new ConsoleProgress("rendering"));
            output.commit();
            var w = spec.commandLine().getOut();
            w.println("Rendered " + n + " frames of " + design.id() + " (" + cam.width() + "x" + cam.height() + ") to " + output.target()
                    + (cam.isDistorted() ? "; the camera has lens distortion, so truth.json holds true points but no homographies" : ""));
            w.flush();
        }
        return 0;
    }
}
