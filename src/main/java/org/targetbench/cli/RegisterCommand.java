package org.targetbench.cli;

import org.targetbench.camera.CameraModel;
import org.targetbench.export.AtomicOutput;
import org.targetbench.formats.SourceSpec;
import org.targetbench.export.RegistrationWriter;
import org.targetbench.pipeline.RegisterRun;
import org.targetbench.register.RegisterConfig;
import org.targetbench.report.RegistrationOverlay;
import org.targetbench.source.CameraFiles;
import org.targetbench.source.FrameSource;
import org.targetbench.source.ImageFiles;
import org.targetbench.source.ImageFolderSource;
import org.targetbench.source.SourceException;
import org.targetbench.source.TargetFile;
import org.targetbench.target.TargetDesign;
import picocli.CommandLine.ArgGroup;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Spec;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Optional;
import java.util.concurrent.Callable;

@Command(name = "register", mixinStandardHelpOptions = true,
        description = {"Registers each frame of real footage to the printed design, so scores on it have truth.",
                "Writes registration.csv (per frame: registered or not, why, features used, RMS residual), registered.csv "
                        + "(every designed feature's predicted pixel), truth.json (read by compare and track; per-frame poses "
                        + "when --camera is given) and overlays/."})
final class RegisterCommand implements Callable<Integer> {
    @Spec CommandSpec spec;

    static final class Input {
        @Option(names = "--frames", paramLabel = "DIR", description = "Folder of PNG/JPEG frames.")
        Path frames;
        @Option(names = "--source", paramLabel = "VIDEO", description = "A video file (.avi, .mjpeg, .mjpg, .mp4).")
        String source;
    }

    @ArgGroup(exclusive = true, multiplicity = "1")
    Input input;

    @Option(names = "--target", required = true, paramLabel = "FILE", description = "The printed design (target.json).")
    Path target;

    @Option(names = "--camera", paramLabel = "FILE", description = "Intrinsics with distortion (camera.json, OpenCV or ROS YAML); without it frames are registered with homographies (exact only without lens distortion).")
    Path camera;

    @Option(names = "--max-rms", paramLabel = "PX", defaultValue = "1.0", description = "Largest RMS residual of a registered frame, px (default: ${DEFAULT-VALUE}).")
    double maxRms;

    @Option(names = "--out", required = true, paramLabel = "DIR", description = "Output folder, written atomically.")
    Path out;

    /** Opens the footage named by --frames or --source. */
    static FrameSource open(Path frames, String source) throws SourceException {
        return frames != null ? ImageFolderSource.open(frames, null) : SourceSpec.open(source, null);
    }

    /** Reads the intrinsics and refuses a size that differs from the footage's. */
    static Optional<CameraModel> camera(Path file, FrameSource footage) throws SourceException {
        if (file == null) return Optional.empty();
        CameraModel c = CameraFiles.read(file);
        if (c.width() != footage.width() || c.height() != footage.height())
            throw new UserError(String.format(Locale.ROOT, "intrinsics %s are for %d x %d images but the footage %s is %d x %d",
                    file, c.width(), c.height(), footage.description(), footage.width(), footage.height()));
        return Optional.of(c);
    }

    /** The one-line refusal of a design that never registered. */
    static UserError neverRegistered(TargetDesign design, RegisterRun.Result r) {
        return new UserError(String.format(Locale.ROOT, "design %s never registered: %d frames tried, best residual %s",
                design.id(), r.frames().size(), Double.isNaN(r.bestRmsPx()) ? "none (the layout was never found)" : String.format(Locale.ROOT, "%.3f px", r.bestRmsPx())));
    }

    @Override
    public Integer call() throws Exception {
        RegisterConfig config = new RegisterConfig();
        config.maxRmsPx = maxRms;
        try {
            config.checkValidity();
        } catch (IllegalArgumentException e) {
            throw new UserError("--max-rms: " + e.getMessage());
        }
        TargetDesign design = TargetFile.read(target);
        try (FrameSource footage = open(input.frames, input.source)) {
            Optional<CameraModel> cam = camera(camera, footage);
            try (AtomicOutput output = AtomicOutput.open(out)) {
                Path overlays = output.folder("overlays");
                RegisterRun.Result result = new RegisterRun(design, cam, config).run(footage, (frame, reg) -> {
                    try {
                        String stem = frame.name().replaceAll("\\.[^.]+$", "");
                        ImageFiles.writePng(RegistrationOverlay.draw(frame.image(), reg), overlays.resolve(stem + ".png"));
                    } catch (IOException e) {
                        throw new UncheckedIOException(e);
                    }
                });
                if (result.registeredCount() == 0) throw neverRegistered(design, result);
                RegistrationWriter.writeCsvs(result, output.file("registration.csv"), output.file("registered.csv"));
                RegistrationWriter.writeTruth(result, design, cam, output.file("truth.json"));
                output.commit();
                var w = spec.commandLine().getOut();
                w.printf(Locale.ROOT, "%d of %d frames registered to %s%s%n", result.registeredCount(), result.frames().size(), design.id(),
                        footage.skippedFrames() > 0 ? " (" + footage.skippedFrames() + " undecodable frames skipped)" : "");
                w.println("Results written to " + output.target());
                w.flush();
            }
        }
        return 0;
    }
}
