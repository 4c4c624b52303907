package org.targetbench.formats;

import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.pipeline.CompareResult;
import org.targetbench.pipeline.DotBiasTable;
import org.targetbench.pipeline.FrameScore;
import org.targetbench.source.CameraFiles;
import org.targetbench.source.PosesFile;
import org.targetbench.source.SourceException;
import org.targetbench.source.TargetFile;
import org.targetbench.target.TargetDesign;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.TreeMap;

/**
 * The dot bias of a compared frame folder, when the scene is known: {@code target.json}, {@code camera.json} and
 * {@code poses.json} (one pose per frame, in frame order) in the frame folder or in the folder above it, the layout
 * {@code demo} writes. Nothing otherwise. Shared by the command line's {@code compare} and the workbench's Compare save.
 */
public final class CompareDotBias {
    private CompareDotBias() {}

    public static List<DotBiasTable.Row> rows(Path frames, CompareResult result) throws SourceException {
        for (Path dir : new Path[]{frames, frames.toAbsolutePath().getParent()}) {
            if (dir == null) continue;
            Path t = dir.resolve("target.json"), c = dir.resolve("camera.json"), p = dir.resolve("poses.json");
            if (!Files.isRegularFile(t) || !Files.isRegularFile(c) || !Files.isRegularFile(p)) continue;
            TargetDesign design = TargetFile.read(t);
            CameraModel camera = CameraFiles.read(c);
            List<Pose> poses = PosesFile.read(p, design);
            if (poses.size() != result.frameCount()) return List.of();
            TreeMap<Integer, String> names = new TreeMap<>();
            for (FrameScore f : result.frames()) names.put(f.frameIndex(), f.frameName());
            if (names.size() != poses.size()) return List.of();
            return DotBiasTable.forPoses(design, camera, List.copyOf(names.values()), poses);
        }
        return List.of();
    }
}
