package org.targetbench.source;

import org.targetbench.camera.CameraModel;

import java.io.IOException;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * The one way commands read camera intrinsics: our {@code camera.json} ({@link CameraFile}), an OpenCV FileStorage
 * YAML or a ROS camera_info YAML ({@link CameraYaml}), told apart by content, not by file name: a file whose first
 * non-blank character is '{' is JSON, anything else is YAML.
 */
public final class CameraFiles {
    /** The three layouts, for writing. */
    public enum Layout { JSON, OPENCV, ROS }

    /** Largest camera file read, bytes; intrinsics files are a few kilobytes. */
    private static final long MAX_BYTES = 1 << 20;

    private CameraFiles() {}

    /**
     * Reads intrinsics and refuses an implausible camera ({@link org.targetbench.camera.CameraChecks}): a principal
     * point outside the image, or radial distortion that folds or wildly magnifies the image before its corners.
     */
    public static CameraModel read(Path file) throws SourceException {
        CameraModel c = readUnchecked(file);
        var implausible = org.targetbench.camera.CameraChecks.problem(c);
        if (implausible.isPresent()) throw new SourceException(file + ": camera " + implausible.get());
        return c;
    }

    /**
     * As {@link #read}, without the plausibility checks: for looking at a file exactly as written (a calibration
     * whose model folds near the corners is still written, with a warning, so that it can be inspected).
     */
    public static CameraModel readUnchecked(Path file) throws SourceException {
        if (Files.isDirectory(file)) throw new SourceException("camera file " + file + " is a folder, expected a file");
        if (!Files.isRegularFile(file)) throw new SourceException("camera file not found: " + file);
        String text;
        try {
            if (Files.size(file) > MAX_BYTES) throw new SourceException("camera file " + file + " is larger than 1 MiB; not an intrinsics file");
            text = StandardCharsets.UTF_8.newDecoder().decode(java.nio.ByteBuffer.wrap(Files.readAllBytes(file))).toString();
        } catch (CharacterCodingException e) {
            throw new SourceException("camera file " + file + " is not UTF-8 text");
        } catch (IOException e) {
            throw new SourceException("cannot read " + file + ": " + ImageFiles.oneLine(e));
        }
        String s = text.startsWith("\uFEFF") ? text.substring(1) : text;
        if (s.isBlank()) throw new SourceException("camera file " + file + " is empty");
        if (s.stripLeading().startsWith("{")) return CameraFile.readUnchecked(file);
        return CameraYaml.read(file, s);
    }

    public static void write(CameraModel c, Path file, Layout layout) throws IOException {
        switch (layout) {
            case JSON -> CameraFile.write(c, file);
            case OPENCV -> CameraYaml.write(c, file, CameraYaml.Layout.OPENCV);
            case ROS -> CameraYaml.write(c, file, CameraYaml.Layout.ROS);
        }
    }
}
