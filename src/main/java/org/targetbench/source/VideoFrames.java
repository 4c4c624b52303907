package org.targetbench.source;

import boofcv.struct.image.GrayF32;

import javax.imageio.ImageIO;
import java.awt.image.BufferedImage;
import java.awt.image.DataBufferByte;
import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.nio.file.Path;
import java.util.LinkedHashSet;
import java.util.Locale;
import java.util.Set;

/** Helpers shared by the video sources: JPEG frame decoding, frame names and the truth file beside a video. */
final class VideoFrames {
    /** Undecodable frames a video may contain before it counts as corrupt: this many, or a tenth of its frames. */
    static final int MOST_SKIPPED = 3;

    private VideoFrames() {}

    /**
     * Decodes one JPEG image to grey levels (BT.601 luma for colour); null when it cannot be decoded strictly
     * ({@link StrictImage}: a frame cut short, even one closed with an end-of-image marker, is skipped and counted).
     */
    static GrayF32 decodeJpeg(byte[] jpeg) {
        if (!StrictImage.endsWithEoi(jpeg)) return null;
        BufferedImage bi;
        try {
            bi = StrictImage.readBuffered(jpeg);
        } catch (IOException | RuntimeException e) {
            return null;
        }
        if (bi == null) return null;
        if (bi.getType() == BufferedImage.TYPE_BYTE_GRAY && bi.getRaster().getDataBuffer() instanceof DataBufferByte db
                && bi.getRaster().getNumBands() == 1 && bi.getRaster().getSampleModelTranslateX() == 0) {
            byte[] b = db.getData();
            GrayF32 out = new GrayF32(bi.getWidth(), bi.getHeight());
            if (b.length == out.data.length) {
                for (int i = 0; i < b.length; i++) out.data[i] = b[i] & 0xFF;
                return out;
            }
        }
        return ImageFiles.toGray(bi);
    }

    /** Name of the frame at position {@code i} of a video: the name it gets when extracted as a PNG. */
    static String name(int i) {
        return SyntheticSource.frameName(i);
    }

    static Set<String> names(int count) {
        Set<String> s = new LinkedHashSet<>();
        for (int i = 0; i < count; i++) s.add(name(i));
        return s;
    }

    /** {@code clip.truth.json} beside {@code clip.mp4}. */
    static Path truthBeside(Path video) {
        String n = video.getFileName().toString();
        int dot = n.lastIndexOf('.');
        return video.resolveSibling((dot > 0 ? n.substring(0, dot) : n) + ".truth.json");
    }

    /** Truth of a video: the given file, or the one beside the video when it exists, or none. */
    static TruthFile.Truth truth(Path video, Path truthFile, int frameCount) throws SourceException {
        Path t = truthFile != null ? truthFile : truthBeside(video);
        if (truthFile == null && !java.nio.file.Files.exists(t)) return new TruthFile.Truth(name(0), java.util.Map.of());
        return TruthFile.read(t, names(frameCount));
    }

    static String ext(Path p) {
        String n = p.getFileName().toString().toLowerCase(Locale.ROOT);
        int dot = n.lastIndexOf('.');
        return dot < 0 ? "" : n.substring(dot + 1);
    }

    /** As {@link #truth(Path, Path, int)}, refusing truth that does not fit the video ({@link TruthFit}). */
    static TruthFile.Truth truth(Path video, Path truthFile, int frameCount, int width, int height) throws SourceException {
        TruthFile.Truth t = truth(video, truthFile, frameCount);
        TruthFit.check(t, truthFile != null ? truthFile : truthBeside(video), frameCount, true, width, height);
        return t;
    }

    /** Refuses a video once it has skipped too many frames to be trusted. */
    static void checkSkipped(int skipped, int frames, Path file) throws SourceException {
        if (skipped > Math.max(MOST_SKIPPED, frames / 10))
            throw new SourceException("corrupt video " + file + ": " + skipped + " of " + frames + " frames cannot be decoded");
    }
}
