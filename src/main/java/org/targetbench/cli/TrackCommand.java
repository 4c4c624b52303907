package org.targetbench.cli;

import org.targetbench.formats.SourceSpec;
import org.targetbench.detect.DetectorConfig;
import org.targetbench.detect.DetectorType;
import org.targetbench.export.AtomicOutput;
import org.targetbench.export.TrackWriter;
import org.targetbench.pipeline.TrackResult;
import org.targetbench.pipeline.TrackRun;
import org.targetbench.source.FrameSource;
import org.targetbench.track.KltConfig;
import org.targetbench.track.RespawnPolicy;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.concurrent.Callable;

@Command(name = "track", mixinStandardHelpOptions = true,
        description = {"Tracks points with a pyramidal KLT tracker and a forward-backward check, and measures how long they "
                + "survive, how far they drift from truth and how much they jitter.",
                "Writes tracks.csv, survival.csv, drift.csv (with truth) and summary.json. A live camera runs until --frame-count or "
                        + "Ctrl-C; both keep what was measured."})
final class TrackCommand implements Callable<Integer> {
    @Spec CommandSpec spec;

    @Option(names = "--source", required = true, paramLabel = "SOURCE", description = "What to track: " + SourceSpec.HELP + ".")
    String source;

    @Option(names = "--detector", paramLabel = "NAME", defaultValue = "shi-tomasi",
            description = "Detector that picks the points: harris, shi-tomasi, fast, surf, sift (default: ${DEFAULT-VALUE}).")
    String detector;

    @Option(names = "--frame-count", paramLabel = "N", description = "Most frames to track (default: all; a camera runs until Ctrl-C).")
    int frames = 0;

    @Option(names = "--frames", hidden = true, paramLabel = "N")
    void oldFrames(int n) {
        OldSpelling.note(spec, "--frames N", "--frame-count N (--frames always names a folder)");
        frames = n;
    }

    @Option(names = "--truth", paramLabel = "FILE", description = "truth.json for a folder or video (default: truth.json in the folder, or NAME.truth.json beside the video).")
    Path truth;

    @Option(names = "--target", paramLabel = "FILE", description = "In place of --truth: register the footage to this printed design (target.json); drift is then measured against the registered truth.")
    Path target;

    @Option(names = "--camera", paramLabel = "FILE", description = "With --target: intrinsics with distortion to register with (camera.json, OpenCV or ROS YAML).")
    Path camera;

    @Option(names = "--out", required = true, paramLabel = "DIR", description = "Output folder, written atomically.")
    Path out;

    @Option(names = "--static", description = "Nothing moved during the recording: jitter is measured over the whole run.")
    boolean wholeRunStatic;

    @Option(names = "--max-tracks", paramLabel = "N", defaultValue = "200", description = "Points started on the first frame (default: ${DEFAULT-VALUE}).")
    int maxTracks;

    @Option(names = "--respawn", paramLabel = "POLICY", defaultValue = "off",
            description = "off: measure the survival of the first frame's points; top-up: replace lost points up to --max-tracks (default: ${DEFAULT-VALUE}).")
    String respawn;

    @Option(names = "--window-radius", paramLabel = "PX", description = "Tracking window half-size r, px; the window is 2r+1 wide (default: ${DEFAULT-VALUE}).")
    int window = 7;

    @Option(names = "--window", hidden = true, paramLabel = "PX")
    void oldWindow(int r) {
        OldSpelling.note(spec, "--window", "--window-radius PX");
        window = r;
    }

    @Option(names = "--pyramid-levels", paramLabel = "N", description = "Pyramid levels, full resolution included (default: ${DEFAULT-VALUE}).")
    int levels = 4;

    @Option(names = "--levels", hidden = true, paramLabel = "N")
    void oldLevels(int n) {
        OldSpelling.note(spec, "--levels (track)", "--pyramid-levels N");
        levels = n;
    }

    @Option(names = "--fb-threshold", paramLabel = "PX", defaultValue = "0.5", description = "Largest forward-backward error kept, px (default: ${DEFAULT-VALUE}).")
    double fbThreshold;

    @Option(names = "--survival-at", paramLabel = "N", defaultValue = "30", description = "Frame at which survival is reported on its own (default: ${DEFAULT-VALUE}).")
    int survivalAt;

    KltConfig trackerConfig() {
        KltConfig k = new KltConfig();
        k.maxTracks = maxTracks;
        k.windowRadius = window;
        k.pyramidLevels = levels;
        k.fbThreshold = fbThreshold;
        try {
            k.respawn = RespawnPolicy.parse(respawn);
        } catch (IllegalArgumentException e) {
            throw new UserError("--respawn: " + e.getMessage());
        }
        try {
            k.checkValidity();
        } catch (IllegalArgumentException e) {
            throw new UserError(e.getMessage().replace("maxTracks", "--max-tracks").replace("windowRadius", "--window-radius")
                    .replace("pyramidLevels", "--pyramid-levels").replace("fbThreshold", "--fb-threshold"));
        }
        return k;
    }

    static DetectorConfig seeding(String name) {
        try {
            return DetectorConfig.defaults(DetectorType.parse(name));
        } catch (IllegalArgumentException e) {
            throw new UserError(e.getMessage());
        }
    }

    @Override
    public Integer call() throws Exception {
        KltConfig k = trackerConfig();
        DetectorConfig seed = seeding(detector);
        var parsed = spec.commandLine().getParseResult();
        if (frames < 0 || frames == 0 && (parsed.hasMatchedOption("--frame-count") || parsed.hasMatchedOption("--frames")))
            throw new UserError("--frame-count must be >= 1, got " + frames + " (leave it out to track every frame)");
        if (survivalAt < 0) throw new UserError("--survival-at must be >= 0, got " + survivalAt);
        boolean live = SourceSpec.isLive(source);
        if (target != null && live) throw new UserError("--target registers recorded footage; record the camera first, then track the recording");
        if (camera != null && target == null) throw new UserError("--camera goes with --target (the intrinsics to register with)");
        try (AtomicOutput output = AtomicOutput.open(out)) {
            Path truthFile = truth;
            if (target != null)
                try (FrameSource footage = SourceSpec.open(source, null)) {
                    truthFile = TargetTruth.register(footage, target, camera, truth, output);
                }
            return track(k, seed, live, truthFile, output);
        }
    }

    private int track(KltConfig k, DetectorConfig seed, boolean live, Path truthFile, AtomicOutput output) throws Exception {
        try (FrameSource src = SourceSpec.open(source, truthFile);
             SweepJob job = new SweepJob();
             TrackWriter writer = new TrackWriter(output)) {
            PrintWriter w = spec.commandLine().getOut();
            if (live) {
                w.println("Tracking " + src.description() + (frames > 0 ? " for " + frames + " frames" : "; press Ctrl-C to stop") + "...");
                w.flush();
            }
            TrackResult r = new TrackRun(k, seed, survivalAt, wholeRunStatic, frames)
                    .run(src, writer, new ConsoleProgress("tracking"), job::cancelled);
            writer.finish(r);
            output.commit();
            TrackConsole.print(r, w);
            w.println("Results written to " + output.target() + ": tracks.csv, survival.csv, " + (r.score().framesWithTruth() > 0 ? "drift.csv, " : "") + "summary.json");
            w.flush();
            return r.stop() == TrackResult.Stop.CANCELLED ? SweepJob.EXIT_CANCELLED : 0;
        }
    }
}
