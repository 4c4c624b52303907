package org.targetbench.formats;

import org.targetbench.perturb.MotionSource;
import org.targetbench.pipeline.MotionScenarios;
import org.targetbench.source.FrameSource;
import org.targetbench.source.ImageFolderSource;
import org.targetbench.source.MjpegSource;
import org.targetbench.source.FfmpegSource;
import org.targetbench.source.SourceException;
import org.targetbench.source.TruthCheckedSource;
import org.targetbench.source.Webcams;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.regex.Pattern;

/**
 * What {@code --source} names: a folder of frames, a video file, {@code webcam[:INDEX]} or {@code synthetic:NAME}.
 */
public final class SourceSpec {
    /** Kept in step with {@link MotionScenarios#NAMES} (a constant, for annotations). */
    public static final String HELP = "a folder of PNG/JPEG frames, a video file (.mp4, .mov, .mkv, .avi, .webm, .mjpeg, ... any FFmpeg reads), webcam[:INDEX] or synthetic:NAME[,key=value...] "
            + "with NAME one of approach, converge, orbit, shake, vibration, still";
    private static final Pattern IMAGE = Pattern.compile(".*\\.(png|jpe?g|bmp|gif|tiff?|pgm|ppm)$");
    /** Files of this tool's own formats and other documents, which are never frames. */
    private static final Pattern NOT_VIDEO = Pattern.compile(".*\\.(json|csv|txt|ya?ml|md|html?|pdf|svg|xml)$");
    private static final Pattern SCHEME = Pattern.compile("^([A-Za-z][A-Za-z0-9+.-]*):.*");

    private SourceSpec() {}

    public static boolean isLive(String spec) {
        String s = spec.trim().toLowerCase(Locale.ROOT);
        return s.equals("webcam") || s.startsWith("webcam:");
    }

    public static FrameSource open(String spec, Path truth) throws SourceException {
        String s = spec.trim();
        String lower = s.toLowerCase(Locale.ROOT);
        if (lower.startsWith("synthetic:")) {
            if (truth != null) throw new SourceException("--truth goes with folders and videos; synthetic sources carry their own truth");
            try {
                return MotionScenarios.open(s.substring("synthetic:".length()));
            } catch (IllegalArgumentException e) {
                throw new SourceException(e.getMessage());
            }
        }
        if (isLive(s)) {
            if (truth != null) throw new SourceException("--truth goes with folders and videos, not with a live camera");
            int index = 0;
            if (lower.startsWith("webcam:")) {
                String n = s.substring("webcam:".length()).trim();
                try {
                    index = Integer.parseInt(n);
                } catch (NumberFormatException e) {
                    throw new SourceException("webcam index must be a whole number, got \"" + n + "\" (use webcam or webcam:0)");
                }
            }
            return Webcams.open(index, Webcams.DISCOVERY_TIMEOUT);
        }
        Path p = Path.of(s);
        if (!Files.exists(p)) {
            var m = SCHEME.matcher(s);
            if (m.matches() && m.group(1).length() > 1)
                throw new SourceException("unknown source scheme \"" + m.group(1) + ":\"; use " + HELP);
            throw new SourceException("source not found: " + s);
        }
        if (Files.isDirectory(p)) return TruthCheckedSource.wrap(ImageFolderSource.open(p, truth));
        String n = p.getFileName().toString().toLowerCase(Locale.ROOT);
        if (n.endsWith(".mjpeg") || n.endsWith(".mjpg")) return TruthCheckedSource.wrap(MjpegSource.open(p, truth));
        if (NOT_VIDEO.matcher(n).matches()) throw new SourceException("unsupported source file " + p + ": use " + HELP);
        if (IMAGE.matcher(n).matches())
            throw new SourceException("not a video: " + p + " is a single image; put the frames in a folder and give the folder");
        return TruthCheckedSource.wrap(FfmpegSource.open(p, truth));
    }
}
