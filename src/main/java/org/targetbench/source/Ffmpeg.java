package org.targetbench.source;

import org.bytedeco.ffmpeg.global.avcodec;
import org.bytedeco.ffmpeg.global.avformat;
import org.bytedeco.ffmpeg.global.avutil;
import org.bytedeco.ffmpeg.global.swscale;
import org.bytedeco.javacpp.Loader;

import java.nio.charset.StandardCharsets;

/**
 * Loads FFmpeg's native libraries (JavaCPP's build of FFmpeg 7.1.1 for this machine) once, with FFmpeg's own log
 * silenced ({@code av_log_set_level(AV_LOG_QUIET)}) before anything else runs, and JavaCPP's loader messages sent to
 * SLF4J (whose no-op binding drops them), so the console stays ours.
 */
public final class Ffmpeg {
    private static boolean loaded;
    private static String problem;

    private Ffmpeg() {}

    /** @throws SourceException with one line when the native libraries cannot be loaded here */
    public static synchronized void load() throws SourceException {
        if (loaded) return;
        if (problem != null) throw new SourceException(problem);
        try {
            if (System.getProperty("org.bytedeco.javacpp.logger") == null) System.setProperty("org.bytedeco.javacpp.logger", "slf4j");
            Loader.load(avutil.class);
            avutil.av_log_set_level(avutil.AV_LOG_QUIET);
            Loader.load(avcodec.class);
            Loader.load(avformat.class);
            Loader.load(swscale.class);
            loaded = true;
        } catch (Throwable t) {
            problem = "FFmpeg, which reads video files, could not be loaded on this machine (" + ImageFiles.oneLine(t)
                    + "); the build carries FFmpeg for " + System.getProperty("os.name") + " " + System.getProperty("os.arch")
                    + " only when it was built there";
            throw new SourceException(problem);
        }
    }

    /** FFmpeg's text for an error code. */
    static String error(int code) {
        byte[] b = new byte[256];
        avutil.av_strerror(code, b, b.length);
        int n = 0;
        while (n < b.length && b[n] != 0) n++;
        return new String(b, 0, n, StandardCharsets.UTF_8);
    }
}
