package org.targetbench.app;

import org.targetbench.pipeline.Reasons;
import org.targetbench.Version;
import org.targetbench.export.AtomicOutput;
import org.targetbench.export.CompareWriter;
import org.targetbench.export.FrameSetWriter;
import org.targetbench.export.ServoWriters;
import org.targetbench.pipeline.CompareResult;
import org.targetbench.pipeline.CompareRun;
import org.targetbench.pipeline.PickRun;
import org.targetbench.pipeline.Progress;
import org.targetbench.score.Repeatability;
import org.targetbench.select.Candidate;
import org.targetbench.select.CandidateConfig;
import org.targetbench.select.SelectConfig;
import org.targetbench.camera.InteractionMatrix;
import org.targetbench.servo.ServoPoint;
import org.targetbench.servo.ServoSet;
import org.targetbench.source.CameraFile;
import org.targetbench.source.PosesFile;
import org.targetbench.formats.ResultsFolder;
import org.targetbench.source.SourceException;
import org.targetbench.source.TargetFile;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.stream.Stream;

/**
 * Servo point choice for the workbench, through exactly the path the command line takes: the loaded frames are
 * compared and written as a results folder (with the scene's target, camera and poses), read back and picked from by
 * {@link PickRun}; and hand edits of the chosen set, whose figures are recomputed the same way {@link ServoSet} does.
 */
final class ServoChoice {
    private ServoChoice() {}

    /** Compares the session's frames and picks {@code count} points; needs a rendered scene (for depths). */
    static PickRun.Result pick(List<org.targetbench.source.SourceFrame> frames, String reference, String sourceName,
                               Session.Scene scene, List<org.targetbench.detect.DetectorConfig> configs, int count) throws Exception {
        Path dir = Files.createTempDirectory("targetbench-pick-");
        try {
            CompareResult cr = new CompareRun(configs, Repeatability.DEFAULT_EPSILON)
                    .run(CompareView.memorySource(sourceName, frames, reference), Progress.NONE);
            try (AtomicOutput out = AtomicOutput.open(dir.resolve("results"))) {
                FrameSetWriter.write(CompareView.memorySource(sourceName, frames, reference), out, "frames", Progress.NONE);
                CompareWriter.write(cr, out);
                TargetFile.write(scene.design(), out.file("target.json"));
                CameraFile.write(scene.camera(), out.file("camera.json"));
                PosesFile.write(scene.poses(), out.file("poses.json"));
                out.commit();
            }
            ResultsFolder.Data data = ResultsFolder.read(dir.resolve("results"), ResultsFolder.Overrides.none(), sourceName);
            SelectConfig sc = new SelectConfig();
            sc.count = count;
            try {
                return PickRun.run(data.pickInput(), null, new CandidateConfig(), sc, Version.get(), ServoWriters.now());
            } catch (PickRun.Refused e) {
                throw new SourceException(Reasons.pickRefusal(e, data.where()));
            }
        } finally {
            delete(dir);
        }
    }

    /** The set with the candidate {@code id} added or removed, figures recomputed; null when the set would be empty. */
    static ServoSet toggle(ServoSet set, List<Candidate> candidates, int id) {
        List<ServoPoint> pts = new ArrayList<>(set.points());
        boolean removed = pts.removeIf(p -> p.id() == id);
        if (!removed) {
            Candidate c = candidates.stream().filter(x -> x.id() == id).findFirst()
                    .orElseThrow(() -> new IllegalArgumentException("no candidate with id " + id));
            pts.add(new ServoPoint(c.id(), c.u(), c.v(), c.x(), c.y(), c.zM(), c.targetXMm(), c.targetYMm(), c.featureId(),
                    c.robustness(), Reasons.ADDED_BY_HAND));
        }
        if (pts.isEmpty()) return null;
        InteractionMatrix.Conditioning k = ServoSet.conditioning(pts);
        return new ServoSet(set.toolVersion(), set.created(), set.camera(), set.targetId(), set.targetDesign(), set.referencePose(),
                set.poseMethod(), set.detector(), set.detectorConfig(), set.trackerConfig(), pts, k.condition(), k.sigmaMin());
    }

    /** The candidate nearest to an image point within {@code radius} px, or null. */
    static Candidate nearest(List<Candidate> candidates, double x, double y, double radius) {
        return candidates.stream().filter(c -> Math.hypot(c.u() - x, c.v() - y) <= radius)
                .min(Comparator.comparingDouble(c -> Math.hypot(c.u() - x, c.v() - y))).orElse(null);
    }

    private static void delete(Path dir) {
        try (Stream<Path> s = Files.walk(dir)) {
            s.sorted(Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
        } catch (Exception ignored) {
            // temporary folder: the system cleans it eventually
        }
    }

    static SourceException noScene() {
        return new SourceException("choosing servo points needs the depth of each point: load the demo scene or render a target "
                + "from the Targets view (frame folders carry no reference pose in the workbench yet; use 'targetbench pick --from' "
                + "with --camera, --target and --poses for those)");
    }
}
