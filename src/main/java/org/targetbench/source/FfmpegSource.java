package org.targetbench.source;

import boofcv.struct.image.GrayF32;
import org.bytedeco.ffmpeg.avcodec.AVCodecParameters;
import org.bytedeco.ffmpeg.avcodec.AVPacket;
import org.bytedeco.ffmpeg.avformat.AVFormatContext;
import org.bytedeco.ffmpeg.avformat.AVStream;
import org.bytedeco.ffmpeg.avutil.AVFrame;
import org.bytedeco.ffmpeg.global.avcodec;
import org.bytedeco.ffmpeg.global.avformat;
import org.bytedeco.ffmpeg.global.avutil;
import org.bytedeco.javacpp.PointerPointer;
import org.bytedeco.javacv.FFmpegFrameGrabber;
import org.bytedeco.javacv.Frame;
import org.bytedeco.javacv.FrameGrabber;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Optional;
import java.util.Set;

/**
 * Frames of a video file decoded by FFmpeg 7.1.1 (JavaCV's {@link FFmpegFrameGrabber} over JavaCPP's FFmpeg build):
 * MP4, MOV, MKV/WebM, AVI and the other containers FFmpeg reads, with H.264, HEVC, MJPEG, VP8/VP9, AV1 (through
 * libdav1d when the build has it) and the other codecs of the build. Pictures are taken as grey straight from their
 * luma plane ({@link FfmpegLuma}: full-range kept, limited-range stretched to 0..255); audio and other streams are
 * ignored.
 *
 * <p>Opening checks the container's structure where a cut-short file is cheap to see ({@link VideoChecks}: MP4 and
 * QuickTime boxes, AVI chunks), then reads the video stream's packets once without decoding to count the frames and
 * learn their presentation times, then decodes the first frame. A decoded picture is placed by its presentation time,
 * so a frame the decoder could not produce leaves a gap: it is skipped and counted, and frame {@code i} keeps the
 * name {@code frame_iii.png} of its place in the file (the truth file follows {@link MjpegSource}). More than
 * {@value VideoFrames#MOST_SKIPPED} skipped frames (or a tenth of them) make the file corrupt. A file FFmpeg cannot
 * read, or one without a video stream, is refused with one line.
 */
public final class FfmpegSource implements FrameSource {
    /** Demuxers that accept a single still image or a text file; neither is a video. */
    private static final Set<String> NOT_VIDEO_FORMATS = Set.of("tty", "image2", "lavfi");

    private final Path file;
    private final FFmpegFrameGrabber grabber;
    private final FfmpegLuma luma = new FfmpegLuma();
    private final long[] times;
    /** True when the packets lack distinct presentation times: pictures are then placed in decoding order. */
    private final boolean sequential;
    /** Size of the first decoded picture (the display size after the stream's cropping); every frame must have it. */
    private int width = -1, height = -1;
    private final String codec;
    private final TruthFile.Truth truth;
    private SourceFrame pending;
    /** Place of the last picture decoded, and of the last frame handed out. */
    private int lastIndex = -1, delivered = -1;
    private int skipped;
    private boolean closed;

    private FfmpegSource(Path file, FFmpegFrameGrabber grabber, long[] times, String codec, TruthFile.Truth truth) {
        this.file = file;
        this.grabber = grabber;
        this.times = times;
        boolean seq = times[0] == Long.MIN_VALUE;
        for (int i = 1; i < times.length && !seq; i++) seq = times[i] == times[i - 1];
        this.sequential = seq;
        this.codec = codec;
        this.truth = truth;
    }

    /** What a read of the packets found: the video stream, its codec and its frames' presentation times (µs). */
    record Probe(int stream, String codec, int width, int height, long[] times) {}

    /**
     * @param truthFile truth for the frames, or null to use {@code <name>.truth.json} beside the video when it exists
     */
    public static FfmpegSource open(Path file, Path truthFile) throws SourceException {
        if (!Files.isRegularFile(file)) throw new SourceException("video not found: " + file);
        try {
            if (Files.size(file) == 0) throw new SourceException("empty video: " + file + " is an empty file");
        } catch (IOException e) {
            throw new SourceException("cannot read video " + file + ": " + ImageFiles.oneLine(e));
        }
        VideoChecks.check(file);
        Ffmpeg.load();
        Probe p = probe(file);
        FFmpegFrameGrabber g = new FFmpegFrameGrabber(file.toFile());
        FfmpegSource s = null;
        boolean ok = false;
        try {
            g.setImageMode(FrameGrabber.ImageMode.RAW);
            g.setVideoStream(p.stream());
            g.setAudioStream(Integer.MAX_VALUE); // no audio stream has this index: audio is not opened
            g.setVideoOption("threads", "1");    // one thread per source; parallelism is the pipeline's
            String decoder = preferredDecoder(p.codec());
            if (decoder != null) g.setVideoCodecName(decoder);
            g.start();
            s = new FfmpegSource(file, g, p.times(), p.codec(), VideoFrames.truth(file, truthFile, p.times().length, g.getImageWidth(), g.getImageHeight()));
            s.pending = s.decode();
            if (s.pending == null)
                throw new SourceException("corrupt video " + file + ": none of its " + p.times().length + " " + p.codec() + " frames can be decoded");
            ok = true;
            return s;
        } catch (FrameGrabber.Exception e) {
            throw new SourceException("corrupt or unsupported video " + file + ": " + grabberMessage(e));
        } finally {
            if (!ok) {
                if (s != null) s.close();
                else closeQuietly(g);
            }
        }
    }

    private static void closeQuietly(FFmpegFrameGrabber g) {
        try {
            g.close();
        } catch (Exception | LinkageError ignored) {
            // nothing left to release
        }
    }

    /**
     * FFmpeg's own AV1 decoder needs a hardware decoder; in software AV1 goes through libdav1d or libaom when the
     * build has them. Null: FFmpeg's default decoder for the codec.
     */
    static String preferredDecoder(String codec) {
        if (!codec.equals("av1")) return null;
        for (String name : new String[]{"libdav1d", "libaom-av1"})
            if (avcodec.avcodec_find_decoder_by_name(name) != null) return name;
        return null;
    }

    /** JavaCV appends advice about its log callback to every message; the user does not need it. */
    private static String grabberMessage(Exception e) {
        String m = ImageFiles.oneLine(e);
        int cut = m.indexOf(" (For more details");
        return cut > 0 ? m.substring(0, cut) : m;
    }

    /** Reads every packet once, without decoding: the video stream, its codec, size and presentation times. */
    static Probe probe(Path file) throws SourceException {
        AVFormatContext fc = new AVFormatContext(null);
        int ret = avformat.avformat_open_input(fc, file.toAbsolutePath().toString(), null, null);
        if (ret < 0) throw new SourceException("not a video: FFmpeg cannot read " + file + " (" + Ffmpeg.error(ret) + ")");
        AVPacket pkt = avcodec.av_packet_alloc();
        try {
            if ((ret = avformat.avformat_find_stream_info(fc, (PointerPointer<?>) null)) < 0)
                throw new SourceException("not a video: FFmpeg finds no streams in " + file + " (" + Ffmpeg.error(ret) + ")");
            String format = fc.iformat().name().getString();
            for (String f : format.split(","))
                if (NOT_VIDEO_FORMATS.contains(f) || f.endsWith("_pipe"))
                    throw new SourceException("not a video: " + file + " reads as " + (f.equals("tty") ? "text" : "a single image")
                            + "; use a video file, or a folder for still frames");
            int stream = -1;
            for (int i = 0; i < fc.nb_streams(); i++) {
                AVStream st = fc.streams(i);
                if (st.codecpar().codec_type() == avutil.AVMEDIA_TYPE_VIDEO && (st.disposition() & avformat.AV_DISPOSITION_ATTACHED_PIC) == 0) {
                    stream = i;
                    break;
                }
            }
            if (stream < 0) {
                throw new SourceException("no video stream in " + file + " (" + fc.nb_streams() + " stream" + (fc.nb_streams() == 1 ? "" : "s")
                        + " of audio or data only)");
            }
            AVStream st = fc.streams(stream);
            AVCodecParameters par = st.codecpar();
            String codec = avcodec.avcodec_get_name(par.codec_id()).getString();
            if (avcodec.avcodec_find_decoder(par.codec_id()) == null && preferredDecoder(codec) == null)
                throw new SourceException("unsupported video " + file + ": this build of FFmpeg cannot decode " + codec);
            long[] times = new long[1024];
            int n = 0;
            int num = st.time_base().num(), den = st.time_base().den();
            while (avformat.av_read_frame(fc, pkt) >= 0) {
                try {
                    if (pkt.stream_index() != stream || (pkt.flags() & avcodec.AV_PKT_FLAG_DISCARD) != 0) continue;
                    long t = pkt.pts() != avutil.AV_NOPTS_VALUE ? pkt.pts() : pkt.dts();
                    if (n == times.length) times = Arrays.copyOf(times, n * 2);
                    // microseconds exactly as JavaCV computes a frame's timestamp
                    times[n++] = t == avutil.AV_NOPTS_VALUE ? Long.MIN_VALUE : 1000000L * t * num / den;
                } finally {
                    avcodec.av_packet_unref(pkt);
                }
            }
            if (n == 0) throw new SourceException("empty video: no " + codec + " frames in " + file);
            times = Arrays.copyOf(times, n);
            Arrays.sort(times);
            if (par.width() <= 0 || par.height() <= 0) throw new SourceException("corrupt video " + file + ": the video stream has no picture size");
            return new Probe(stream, codec, par.width(), par.height(), times);
        } finally {
            avcodec.av_packet_free(pkt);
            avformat.avformat_close_input(fc);
        }
    }

    /** The next decoded frame placed at its index, or null at the end of the file. */
    private SourceFrame decode() throws SourceException {
        while (true) {
            Frame f;
            try {
                f = grabber.grabImage();
            } catch (FrameGrabber.Exception e) {
                throw new SourceException("cannot read video " + file + ": " + grabberMessage(e));
            }
            if (f == null) return null;
            if (!(f.opaque instanceof AVFrame pic)) continue;
            int index = indexOf(f.timestamp);
            if (index <= lastIndex) continue; // a repeated or out-of-order picture
            GrayF32 img;
            try {
                img = luma.grey(pic);
            } catch (RuntimeException e) {
                continue;
            }
            lastIndex = index;
            if (width < 0) {
                width = img.width;
                height = img.height;
            }
            if (img.width != width || img.height != height) continue; // counted as skipped by the gap it leaves
            String name = VideoFrames.name(index);
            return new SourceFrame(index, name, img, truth.forFrame(name));
        }
    }

    /**
     * Place of a picture in the file: the packet with the nearest presentation time; the next place when the file's
     * packets lack distinct times.
     */
    private int indexOf(long timestamp) {
        if (sequential) return lastIndex + 1;
        int i = Arrays.binarySearch(times, timestamp);
        if (i >= 0) return i;
        int ins = -i - 1;
        if (ins == 0) return 0;
        if (ins == times.length) return times.length - 1;
        return timestamp - times[ins - 1] <= times[ins] - timestamp ? ins - 1 : ins;
    }

    @Override public String description() { return file.toString(); }
    @Override public int width() { return width; }
    @Override public int height() { return height; }
    @Override public int frameCount() { return times.length; }
    @Override public String referenceName() { return truth.reference(); }
    @Override public int skippedFrames() { return skipped; }

    /** FFmpeg's name of the video codec, e.g. {@code h264}, {@code hevc}, {@code mjpeg}. */
    public String codec() { return codec; }

    public boolean hasTruth() { return !truth.frames().isEmpty(); }

    @Override
    public Optional<SourceFrame> next() throws SourceException {
        if (closed) return Optional.empty();
        SourceFrame f = pending != null ? pending : decode();
        pending = null;
        // every place between the last frame handed out and this one (or the end) could not be decoded
        int gap = (f == null ? times.length : f.index()) - delivered - 1;
        if (gap > 0) {
            skipped += gap;
            VideoFrames.checkSkipped(skipped, times.length, file);
        }
        if (f == null) {
            close();
            return Optional.empty();
        }
        delivered = f.index();
        return Optional.of(f);
    }

    @Override
    public void close() {
        if (closed) return;
        closed = true;
        pending = null;
        try {
            grabber.close();
        } catch (Exception | LinkageError ignored) {
            // nothing left to release
        }
        luma.close();
    }
}
