package org.targetbench.cli;

import org.targetbench.detect.DetectorType;
import org.targetbench.export.AtomicOutput;
import org.targetbench.export.Safety;
import org.targetbench.pipeline.PickRun;
import org.targetbench.select.SelectConfig;
import org.targetbench.formats.ResultsFolder;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;

@Command(name = "pick", mixinStandardHelpOptions = true,
        description = {"Chooses the servo points from a results folder written by 'demo' or 'compare'.",
                "Candidates are the reference-frame detections of one detector; hard filters on their measured robustness, "
                        + "a border margin and a minimum separation come first, then the set with the best-conditioned interaction "
                        + "matrix and widest image coverage is chosen. Writes the set as servo-set.json and servo-set.csv, and "
                        + "every candidate with its reason as servo-set-selection.csv. Exit code 1 when no acceptable set exists."})
final class PickCommand implements Callable<Integer> {
    @Spec CommandSpec spec;

    @Option(names = "--from", required = true, paramLabel = "RESULTS_DIR", description = "Results folder (summary.json, detections.csv, and camera.json, target.json, poses.json, frames/truth.json when present).")
    Path from;

    @Option(names = "--count", paramLabel = "K", defaultValue = "4", description = "Number of servo points, 4..8 (default: ${DEFAULT-VALUE}).")
    int count;

    @Option(names = "--detector", paramLabel = "NAME", description = "Detector whose points to use (default: the top-ranked in summary.json).")
    String detector;

    @Option(names = "--out", paramLabel = "FILE", description = "Servo set file, ending in .json; the .csv and -selection.csv go beside it (default: RESULTS_DIR/servo-set.json).")
    Path out;

    @Option(names = "--camera", paramLabel = "FILE", description = "Camera intrinsics (default: camera.json in RESULTS_DIR).")
    Path camera;

    @Option(names = "--target", paramLabel = "FILE", description = "Target design (default: target.json in RESULTS_DIR).")
    Path target;

    @Option(names = "--poses", paramLabel = "FILE", description = "Poses, the first being the reference view (default: poses.json in RESULTS_DIR).")
    Path poses;

    @Option(names = "--truth", paramLabel = "FILE", description = "Ground truth of the frames (default: frames/truth.json in RESULTS_DIR).")
    Path truth;

    @Option(names = "--min-separation", paramLabel = "PX", description = "Least distance between chosen points, pixels (default: 24).")
    Double minSeparation;

    @Option(names = "--tracks", paramLabel = "DIR", description = "Output of track --target on the same design: fills each candidate's track survival and jitter with measured values.")
    Path tracks;

    @Option(names = "--min-repeatability", paramLabel = "R", description = "Least per-point repeatability, 0..1 (default: 0.7).")
    Double minRepeatability;

    @Override
    public Integer call() throws Exception {
        SelectConfig sc = new SelectConfig();
        sc.count = count;
        if (minSeparation != null) sc.minSeparationPx = minSeparation;
        if (minRepeatability != null) sc.minRepeatability = minRepeatability;
        if (count < 4 || count > 8) throw new UserError("--count must be within 4..8, got " + count);
        if (minSeparation != null && !(minSeparation >= 0 && Double.isFinite(minSeparation))) throw new UserError("--min-separation must be >= 0 px, got " + minSeparation);
        if (minRepeatability != null && !(minRepeatability >= 0 && minRepeatability <= 1)) throw new UserError("--min-repeatability must be within 0..1, got " + minRepeatability);
        if (detector != null) {
            try {
                detector = DetectorType.parse(detector).cliName();
            } catch (IllegalArgumentException e) {
                throw new UserError(e.getMessage());
            }
        }
        Path file = out != null ? out : from.resolve("servo-set.json");
        String name = file.getFileName().toString();
        if (!name.endsWith(".json")) throw new UserError("--out must name a .json file, got " + file);
        ResultsFolder.Data data = ResultsFolder.read(from, new ResultsFolder.Overrides(truth, camera, target, poses));
        PickRun.Result r = ServoSteps.pick(data, detector, sc,
                tracks == null ? java.util.Optional.empty() : java.util.Optional.of(org.targetbench.source.TrackRunFiles.read(tracks)));
        Path dir = file.toAbsolutePath().getParent();
        String stem = name.substring(0, name.length() - ".json".length());
        List<String> written;
        try (AtomicOutput output = AtomicOutput.openBeside(dir)) {
            written = ServoSteps.writePick(r, output, stem);
            output.commit();
        }
        PrintWriter w = spec.commandLine().getOut();
        ServoSteps.printPick(r, from.toString(), w);
        w.println();
        w.println("Written to " + dir + ": " + String.join(", ", written));
        w.println("Next: targetbench rehearse --set " + file + " --out " + dir.resolve("rehearsal"));
        w.println("Safety: " + Safety.NOTICE);
        w.flush();
        return 0;
    }
}
