package org.targetbench.export;

import boofcv.struct.image.GrayF32;
import org.bytedeco.ffmpeg.global.avcodec;
import org.bytedeco.ffmpeg.global.avutil;
import org.bytedeco.javacv.FFmpegFrameRecorder;
import org.bytedeco.javacv.Frame;
import org.targetbench.source.Ffmpeg;
import org.targetbench.source.SourceException;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.file.Path;

/**
 * H.264 in MP4 through FFmpeg (JavaCV's {@link FFmpegFrameRecorder} with the OpenH264 encoder that JavaCPP's FFmpeg
 * build carries) at a constant quantiser: grey frames become full-range ("pc", JPEG-range) YUV 4:2:0 pictures whose
 * luma is the grey level and whose chroma is neutral (128), with a key frame every {@value #KEY_INTERVAL} frames and
 * predicted frames between. The stream is flagged full range, so the video sources read the grey levels back as
 * they were written.
 */
public final class Mp4Writer implements VideoWriter {
    /** Frames between key frames. */
    static final int KEY_INTERVAL = 30;
    /** The H.264 encoder of the FFmpeg build (the build has no x264). */
    static final String ENCODER = "libopenh264";

    private final Path file;
    private final int qp;
    private final double fps;
    private FFmpegFrameRecorder recorder;
    private ByteBuffer picture;
    private int width = -1, height = -1;

    Mp4Writer(Path file, int qp, double fps) throws IOException {
        try {
            Ffmpeg.load();
        } catch (SourceException e) {
            throw new IOException(e.getMessage());
        }
        this.file = file;
        this.qp = qp;
        this.fps = fps;
    }

    /**
     * H.264 quantiser for a quality on the JPEG scale: qp = round(51 (100 - quality) / 100), clamped to 1..51 (the
     * encoder's range), so 100 is near lossless and 50 is a typical streaming quantiser of about 26 (a mapping of
     * our own).
     */
    public static int quantiser(int quality) {
        return Math.max(1, Math.min(51, (int) Math.round(51 * (100 - quality) / 100.0)));
    }

    @Override
    public void write(GrayF32 frame) throws IOException {
        if (width < 0) start(frame.width, frame.height);
        else if (frame.width != width || frame.height != height)
            throw new IllegalArgumentException("frame is " + frame.width + "x" + frame.height + " but the video is " + width + "x" + height);
        for (int r = 0; r < height; r++)
            for (int c = 0; c < width; c++) {
                float v = frame.unsafe_get(c, r);
                picture.put(r * width + c, (byte) (v <= 0 ? 0 : v >= 255 ? 255 : (int) (v + 0.5f)));
            }
        try {
            recorder.recordImage(width, height, Frame.DEPTH_UBYTE, 1, width, avutil.AV_PIX_FMT_YUV420P, picture);
        } catch (FFmpegFrameRecorder.Exception e) {
            throw new IOException("cannot encode a frame of " + file + ": " + e.getMessage());
        }
    }

    private void start(int w, int h) throws IOException {
        if (w % 2 != 0 || h % 2 != 0) throw new IOException("cannot write " + file.getFileName() + ": H.264 in MP4 needs an even frame size, got " + w + "x" + h + "; write AVI or MJPEG instead");
        width = w;
        height = h;
        int luma = w * h, chroma = (w / 2) * (h / 2);
        picture = ByteBuffer.allocateDirect(luma + 2 * chroma);
        for (int i = luma; i < luma + 2 * chroma; i++) picture.put(i, (byte) 128);
        recorder = new FFmpegFrameRecorder(file.toFile(), w, h, 0);
        recorder.setFormat("mp4");
        recorder.setVideoCodec(avcodec.AV_CODEC_ID_H264);
        recorder.setVideoCodecName(ENCODER);
        recorder.setPixelFormat(avutil.AV_PIX_FMT_YUV420P);
        recorder.setFrameRate(fps);
        recorder.setGopSize(KEY_INTERVAL);
        recorder.setVideoBitrate((int) Math.min(Integer.MAX_VALUE, 8L * w * h * Math.max(1, fps)));
        recorder.setVideoOption("qmin", Integer.toString(qp));
        recorder.setVideoOption("qmax", Integer.toString(qp));
        recorder.setVideoOption("color_range", "pc");
        recorder.setVideoOption("threads", "1");
        try {
            recorder.start();
        } catch (FFmpegFrameRecorder.Exception e) {
            throw new IOException("cannot start writing " + file + ": " + e.getMessage());
        }
    }

    @Override
    public void close() throws IOException {
        if (recorder == null) return;
        try {
            recorder.stop();
            recorder.release();
        } catch (FFmpegFrameRecorder.Exception e) {
            throw new IOException("cannot finish " + file + ": " + e.getMessage());
        } finally {
            recorder = null;
        }
    }
}
