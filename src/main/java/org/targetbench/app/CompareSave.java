package org.targetbench.app;

import org.targetbench.export.AtomicOutput;
import org.targetbench.export.CompareWriter;
import org.targetbench.export.DotBiasWriter;
import org.targetbench.formats.CompareDotBias;
import org.targetbench.formats.SessionFile;
import org.targetbench.pipeline.CompareResult;
import org.targetbench.pipeline.DotBiasTable;
import org.targetbench.pipeline.FrameScore;
import org.targetbench.report.OverlayWriter;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.TreeMap;

/**
 * Saves a comparison as the command line's {@code compare} does, through the same writers: {@code detections.csv},
 * {@code repeatability.csv} and {@code summary.json} ({@link CompareWriter}), {@code overlays/} ({@link OverlayWriter}),
 * and {@code dot-bias.csv} when the scene is known: from the scene files beside a loaded folder
 * ({@link CompareDotBias}, as the command line finds them), or from the rendered scene of the demo.
 */
final class CompareSave {
    private CompareSave() {}

    /** @return the files written, in the order the command line lists them */
    static List<String> write(CompareResult r, Session session, Path dir) throws Exception {
        List<String> files = new ArrayList<>(List.of("detections.csv", "repeatability.csv", "summary.json"));
        try (AtomicOutput out = AtomicOutput.open(dir)) {
            CompareWriter.write(r, out);
            if (!OverlayWriter.write(r, out).isEmpty()) files.add("overlays/");
            List<DotBiasTable.Row> dotBias = dotBias(r, session);
            if (!dotBias.isEmpty()) {
                DotBiasWriter.write(dotBias, out.file("dot-bias.csv"));
                files.add("dot-bias.csv");
            }
            out.commit();
        }
        return files;
    }

    private static List<DotBiasTable.Row> dotBias(CompareResult r, Session session) throws Exception {
        Session.Origin o = session.origin();
        if (o != null && o.kind() == SessionFile.SourceKind.FOLDER && o.path().isPresent()) return CompareDotBias.rows(o.path().get(), r);
        if (session.scene().isEmpty()) return List.of();
        Session.Scene sc = session.scene().get();
        TreeMap<Integer, String> names = new TreeMap<>();
        for (FrameScore f : r.frames()) names.put(f.frameIndex(), f.frameName());
        if (sc.poses().size() != r.frameCount() || names.size() != sc.poses().size()) return List.of();
        return DotBiasTable.forPoses(sc.design(), sc.camera(), List.copyOf(names.values()), sc.poses());
    }
}
