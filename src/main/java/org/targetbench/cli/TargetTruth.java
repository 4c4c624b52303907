package org.targetbench.cli;

import org.targetbench.camera.CameraModel;
import org.targetbench.export.AtomicOutput;
import org.targetbench.export.RegistrationWriter;
import org.targetbench.pipeline.RegisterRun;
import org.targetbench.register.RegisterConfig;
import org.targetbench.source.CameraFiles;
import org.targetbench.source.FrameSource;
import org.targetbench.source.SourceException;
import org.targetbench.source.TargetFile;
import org.targetbench.target.TargetDesign;

import java.io.IOException;
import java.nio.file.Path;
import java.util.Optional;

/**
 * {@code --target T.json [--camera C]} in place of {@code --truth}: registers the footage to the design first and
 * writes what the registration found into the output's {@code registration/} folder (registration.csv,
 * registered.csv, truth.json), whose truth.json the command then reads like any other; target.json and camera.json
 * are copied beside the results for {@code pick}.
 */
final class TargetTruth {
    private TargetTruth() {}

    /**
     * @param footage a freshly opened source of the same footage the command will read (it is read to the end)
     * @return the truth file written inside the (uncommitted) output
     */
    /** What the registration gave: the truth file, and the run with the intrinsics it used. */
    record Registered(Path truthFile, RegisterRun.Result result, Optional<CameraModel> camera) {
        /** Points a comparison at the registered poses where lens distortion leaves no homography. */
        org.targetbench.pipeline.CompareRun applyTo(org.targetbench.pipeline.CompareRun run) {
            if (camera.isPresent() && camera.get().isDistorted())
                run.withRegisteredTruth(camera.get(), RegisterRun.undistortedFromReference(result));
            return run;
        }
    }

    static Path register(FrameSource footage, Path target, Path camera, Path truth, AtomicOutput output) throws SourceException, IOException {
        return registered(footage, target, camera, truth, output).truthFile();
    }

    static Registered registered(FrameSource footage, Path target, Path camera, Path truth, AtomicOutput output) throws SourceException, IOException {
        if (truth != null) throw new UserError("give either --truth or --target, not both");
        if (camera != null && target == null) throw new UserError("--camera goes with --target (the intrinsics to register with)");
        TargetDesign design = TargetFile.read(target);
        Optional<CameraModel> cam = RegisterCommand.camera(camera, footage);
        RegisterRun.Result result = new RegisterRun(design, cam, new RegisterConfig()).run(footage, null);
        if (result.registeredCount() == 0) throw RegisterCommand.neverRegistered(design, result);
        Path dir = output.folder("registration");
        RegistrationWriter.writeCsvs(result, dir.resolve("registration.csv"), dir.resolve("registered.csv"));
        Path file = dir.resolve("truth.json");
        RegistrationWriter.writeTruth(result, design, cam, file);
        // the design and intrinsics beside the results, where pick looks for them
        java.nio.file.Files.copy(target, output.file("target.json"));
        if (cam.isPresent()) CameraFiles.write(cam.get(), output.file("camera.json"), CameraFiles.Layout.JSON);
        return new Registered(file, result, cam);
    }
}
