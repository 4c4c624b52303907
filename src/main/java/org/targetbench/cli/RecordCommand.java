package org.targetbench.cli;

import org.targetbench.formats.SourceSpec;
import org.targetbench.export.AtomicOutput;
import org.targetbench.export.VideoWriter;
import org.targetbench.source.FrameSource;
import org.targetbench.source.FrameTruth;
import org.targetbench.perturb.MotionSource;
import org.targetbench.source.SourceFrame;
import org.targetbench.source.TruthFile;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.Callable;

@Command(name = "record", mixinStandardHelpOptions = true,
        description = {"Records frames from any source into a video file that 'track --source FILE' reads back, with its truth "
                + "beside it as NAME.truth.json when the source has truth.",
                "Writes MP4 (H.264), AVI (Motion-JPEG) or a raw .mjpeg stream, chosen by the file name. A camera records until "
                        + "--frame-count or Ctrl-C."})
final class RecordCommand implements Callable<Integer> {
    @Spec CommandSpec spec;

    @Option(names = "--source", required = true, paramLabel = "SOURCE", description = "What to record: " + SourceSpec.HELP + ".")
    String source;

    @Option(names = "--frame-count", paramLabel = "N", description = "Most frames to record (default: all).")
    int frames = 0;

    @Option(names = "--frames", hidden = true, paramLabel = "N")
    void oldFrames(int n) {
        OldSpelling.note(spec, "--frames N", "--frame-count N (--frames always names a folder)");
        frames = n;
    }

    @Option(names = "--quality", paramLabel = "Q", defaultValue = "85",
            description = "1..100: JPEG quality for MJPEG; for MP4 the H.264 quantiser is 51 (100 - Q) / 100 (default: ${DEFAULT-VALUE}).")
    int quality;

    @Option(names = "--fps", paramLabel = "FPS", description = "Frame rate written into the file (default: the source's, or 30).")
    Double fps;

    @Option(names = "--out", required = true, paramLabel = "FILE", description = "Video file to write: .mp4, .avi, .mjpeg or .mjpg.")
    Path out;

    @Override
    public Integer call() throws Exception {
        if (quality < 1 || quality > 100) throw new UserError("--quality must be 1..100, got " + quality);
        var parsed = spec.commandLine().getParseResult();
        if (frames < 0 || frames == 0 && (parsed.hasMatchedOption("--frame-count") || parsed.hasMatchedOption("--frames")))
            throw new UserError("--frame-count must be >= 1, got " + frames + " (leave it out to record every frame)");
        String name = out.getFileName().toString();
        String lower = name.toLowerCase(java.util.Locale.ROOT);
        if (!(lower.endsWith(".mp4") || lower.endsWith(".avi") || lower.endsWith(".mjpeg") || lower.endsWith(".mjpg")))
            throw new UserError("--out must name a .mp4, .avi, .mjpeg or .mjpg file, got " + name);
        if (Files.isDirectory(out)) throw new UserError("--out must name a video file, not a folder: " + out);
        Path folder = out.toAbsolutePath().getParent();
        String truthName = name.substring(0, name.lastIndexOf('.')) + ".truth.json";
        try (FrameSource src = SourceSpec.open(source, null); AtomicOutput output = AtomicOutput.openBeside(folder); SweepJob job = new SweepJob()) {
            double rate = fps != null ? fps : src instanceof MotionSource m ? m.config().fps : 30;
            if (!(rate > 0) || !Double.isFinite(rate)) throw new UserError("--fps must be > 0, got " + rate);
            Map<String, FrameTruth> truth = new LinkedHashMap<>();
            int n = 0;
            ConsoleProgress progress = new ConsoleProgress("recording");
            int total = src.frameCount() < 0 ? frames : frames > 0 ? Math.min(frames, src.frameCount()) : src.frameCount();
            try (VideoWriter vw = VideoWriter.open(output.file(name), quality, rate)) {
                Optional<SourceFrame> f;
                while (!job.cancelled() && (frames == 0 || n < frames) && (f = src.next()).isPresent()) {
                    vw.write(f.get().image());
                    FrameTruth t = f.get().truth();
                    if (t.fromReference().isPresent() || !t.features().isEmpty()) truth.put(f.get().name(), t);
                    progress.update(++n, total, f.get().name());
                }
            }
            if (n == 0) throw new org.targetbench.source.SourceException("the source delivered no frames: " + src.description());
            // a source without truth still gives its reference frame the identity: that alone is no truth to write
            boolean hasTruth = truth.size() > 1 || truth.values().stream().anyMatch(t -> !t.features().isEmpty());
            if (!hasTruth) truth.clear();
            if (hasTruth) TruthFile.write(src.referenceName(), truth, output.file(truthName), false);
            output.commit();
            PrintWriter w = spec.commandLine().getOut();
            w.println("Recorded " + n + " frames of " + src.description() + " to " + out + " (" + Files.size(out) / 1024 + " KB)"
                    + (truth.isEmpty() ? "" : " with truth in " + out.resolveSibling(truthName)));
            src.endNote().ifPresent(note -> w.println("Note: " + note));
            w.flush();
            return job.cancelled() ? SweepJob.EXIT_CANCELLED : 0;
        }
    }
}
