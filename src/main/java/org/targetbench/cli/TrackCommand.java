package org.targetbench.cli;

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
                "Writes tracks.csv, survival.csv, drift.csv (with truth) and summary.json. A live camera runs until --frames or "
                        + "Ctrl-C; both keep what was measured."})
final class TrackCommand implements Callable<Integer> {
    @Spec CommandSpec spec;

    @Option(names = "--source", required = true, paramLabel = "SOURCE", description = "What to track: " + SourceSpec.HELP + ".")
    String source;

    @Option(names = "--detector", paramLabel = "NAME", defaultValue = "shi-tomasi",
            description = "Detector that picks the points: harris, shi-tomasi, fast, surf, sift (default: ${DEFAULT-VALUE}).")
    String detector;

    @Option(names = "--frames", paramLabel = "N", defaultValue = "0", description = "Most frames to track (default: all; a camera runs until Ctrl-C).")
    int frames;

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

    @Option(names = "--window", paramLabel = "R", defaultValue = "7", description = "Tracking window radius, px; the window is 2R+1 wide (default: ${DEFAULT-VALUE}).")
    int window;

    @Option(names = "--levels", paramLabel = "L", defaultValue = "4", description = "Pyramid levels, full resolution included (default: ${DEFAULT-VALUE}).")
    int levels;

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
            throw new UserError(e.getMessage().replace("maxTracks", "--max-tracks").replace("windowRadius", "--window")
                    .replace("pyramidLevels", "--levels").replace("fbThreshold", "--fb-threshold"));
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
        if (frames < 0) throw new UserError("--frames must be >= 1 (or 0 for all), got " + frames);
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
