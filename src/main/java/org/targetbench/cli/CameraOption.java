package org.targetbench.cli;

import org.targetbench.camera.CameraModel;
import org.targetbench.source.CameraFiles;
import org.targetbench.source.SourceException;
import picocli.CommandLine.Option;

import java.nio.file.Path;
import java.util.Optional;

/** {@code --camera FILE}, always read by {@link CameraFiles#read} (camera.json, OpenCV or ROS YAML). */
final class CameraOption {
    @Option(names = "--camera", paramLabel = "FILE",
            description = "Camera intrinsics: camera.json, OpenCV FileStorage YAML or ROS camera_info YAML (told apart by content).")
    Path file;

    /** The camera, when given. */
    Optional<CameraModel> read() throws SourceException {
        return file == null ? Optional.empty() : Optional.of(CameraFiles.read(file));
    }

    /** The camera; a one-line error when it was not given. */
    CameraModel required(String what) throws SourceException {
        if (file == null) throw new UserError("--camera is required: " + what);
        return CameraFiles.read(file);
    }
}
