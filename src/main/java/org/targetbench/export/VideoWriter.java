package org.targetbench.export;

import boofcv.struct.image.GrayF32;

import java.io.IOException;
import java.nio.file.Path;
import java.util.Locale;

/**
 * Writes grey frames as a video file the video sources read back: Motion-JPEG as a raw stream ({@code .mjpeg},
 * {@code .mjpg}) or inside AVI ({@code .avi}), or H.264 in MP4 ({@code .mp4}). Frames are rounded and clipped to
 * 8 bits and must all have the size of the first.
 */
public interface VideoWriter extends AutoCloseable {
    void write(GrayF32 frame) throws IOException;

    /** Finishes the file (headers, index). */
    @Override
    void close() throws IOException;

    /** File types written, by extension. */
    String EXTENSIONS = "mp4, avi, mjpeg, mjpg";

    /**
     * @param quality JPEG quality 1..100 (IJG scale) for MJPEG; for MP4 the H.264 quantiser is derived from it (see
     *                {@link Mp4Writer#quantiser})
     * @param fps     frame rate recorded in the file
     */
    static VideoWriter open(Path file, int quality, double fps) throws IOException {
        String n = file.getFileName().toString().toLowerCase(Locale.ROOT);
        if (quality < 1 || quality > 100) throw new IllegalArgumentException("quality must be 1..100, got " + quality);
        if (!(fps > 0) || !Double.isFinite(fps)) throw new IllegalArgumentException("fps must be > 0, got " + fps);
        if (n.endsWith(".mp4")) return new Mp4Writer(file, Mp4Writer.quantiser(quality), fps);
        if (n.endsWith(".avi")) return new MjpegWriter(file, quality, fps, true);
        if (n.endsWith(".mjpeg") || n.endsWith(".mjpg")) return new MjpegWriter(file, quality, fps, false);
        throw new IllegalArgumentException("cannot write video " + file.getFileName() + ": use one of " + EXTENSIONS);
    }
}
