package org.targetbench.source;

import boofcv.struct.image.GrayF32;
import org.jcodec.api.FrameGrab;
import org.jcodec.common.SeekableDemuxerTrack;
import org.jcodec.common.io.NIOUtils;
import org.jcodec.common.io.SeekableByteChannel;
import org.jcodec.common.logging.LogLevel;
import org.jcodec.common.logging.Logger;
import org.jcodec.common.model.Picture;
import org.jcodec.common.model.Rect;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.Optional;

/**
 * Frames of an H.264 video in an MP4 (or QuickTime) file, decoded in pure Java by JCodec 0.2.5. Only the luma plane
 * is used: JCodec holds each sample as value - 128 in a signed byte, so grey = byte + 128. Luma is taken as it is
 * coded: a limited-range ("TV") video shows black at 16 and white at 235, which only scales contrast.
 *
 * <p>Opening checks the file's top-level boxes (each box's declared size must fit the file, ISO/IEC 14496-12
 * sec. 4.2; from memory), so a cut-short file is refused at once, then decodes the first frame. Later, a frame that
 * fails to decode is skipped and counted; more than {@value VideoFrames#MOST_SKIPPED} (or a tenth of the frames)
 * makes the file corrupt. Frame names and the truth file follow {@link MjpegSource}.
 */
public final class Mp4Source implements FrameSource {
    static {
        quietJcodec();
    }

    private final Path file;
    private final SeekableByteChannel channel;
    private final FrameGrab grab;
    private final int frameCount;
    private final int width, height;
    private final TruthFile.Truth truth;
    private GrayF32 first;
    private int position, skipped;
    private boolean closed;

    private Mp4Source(Path file, SeekableByteChannel channel, FrameGrab grab, int frameCount, GrayF32 first, TruthFile.Truth truth) {
        this.file = file;
        this.channel = channel;
        this.grab = grab;
        this.frameCount = frameCount;
        this.first = first;
        this.width = first.width;
        this.height = first.height;
        this.truth = truth;
    }

    /** JCodec logs to stdout by default; this tool keeps its console to itself. */
    static void quietJcodec() {
        Logger.setLevel(LogLevel.ERROR);
        Logger.addSink(message -> { });
    }

    /**
     * @param truthFile truth for the frames, or null to use {@code <name>.truth.json} beside the video when it exists
     */
    public static Mp4Source open(Path file, Path truthFile) throws SourceException {
        if (!Files.isRegularFile(file)) throw new SourceException("video not found: " + file);
        checkBoxes(file);
        SeekableByteChannel ch = null;
        try {
            ch = NIOUtils.readableChannel(file.toFile());
            FrameGrab grab = FrameGrab.createFrameGrab(ch);
            int count = ((SeekableDemuxerTrack) grab.getVideoTrack()).getMeta().getTotalFrames();
            if (count <= 0) throw new SourceException("empty video: no frames in " + file);
            Picture p = grab.getNativeFrame();
            if (p == null) throw new SourceException("empty video: no frames in " + file);
            GrayF32 first = luma(p);
            Mp4Source s = new Mp4Source(file, ch, grab, count, first, VideoFrames.truth(file, truthFile, count));
            ch = null;
            return s;
        } catch (SourceException e) {
            throw e;
        } catch (Exception | LinkageError | AssertionError e) {
            throw new SourceException("corrupt or unsupported MP4 video " + file + ": " + ImageFiles.oneLine(e));
        } finally {
            if (ch != null) NIOUtils.closeQuietly(ch);
        }
    }

    /** Box types an MP4 or QuickTime file starts with (ISO/IEC 14496-12 and the QuickTime format; from memory). */
    private static final java.util.Set<String> FIRST_BOXES = java.util.Set.of("ftyp", "styp", "moov", "mdat", "free", "skip", "wide", "pnot", "uuid");

    /** Refuses a file whose top-level boxes do not fit it, or that has no movie header. */
    private static void checkBoxes(Path file) throws SourceException {
        try (FileChannel ch = FileChannel.open(file, StandardOpenOption.READ)) {
            long size = ch.size();
            if (size == 0) throw new SourceException("empty video: " + file + " is an empty file");
            long pos = 0;
            boolean moov = false, any = false;
            while (pos + 8 <= size) {
                ByteBuffer h = ByteBuffer.allocate(16).order(ByteOrder.BIG_ENDIAN);
                h.limit((int) Math.min(16, size - pos));
                AviIndex.readFully(ch, h, pos);
                long len = h.getInt(0) & 0xFFFFFFFFL;
                String type = new String(h.array(), 4, 4, StandardCharsets.ISO_8859_1);
                if (!any && !FIRST_BOXES.contains(type)) throw new SourceException("not an MP4 video (it does not start with an MP4 box): " + file);
                if (!type.chars().allMatch(c -> c >= 32 && c < 127))
                    throw new SourceException("corrupt MP4 video " + file + ": unreadable box at byte " + pos);
                if (len == 1) {
                    if (h.limit() < 16) throw new SourceException("truncated MP4 video " + file + ": the " + type + " box header is cut short");
                    len = h.getLong(8);
                } else if (len == 0) {
                    len = size - pos;
                }
                if (len < 8) throw new SourceException("corrupt MP4 video " + file + ": box " + type + " at byte " + pos + " has size " + len);
                if (pos + len > size)
                    throw new SourceException("truncated MP4 video " + file + ": the " + type + " box at byte " + pos + " runs past the end of the file");
                moov |= type.equals("moov");
                any = true;
                pos += len;
            }
            if (pos != size) throw new SourceException("truncated MP4 video " + file + ": " + (size - pos) + " stray bytes at the end");
            if (!moov) throw new SourceException(any ? "truncated or incomplete MP4 video " + file + ": no movie header (moov box)" : "not an MP4 video: " + file);
        } catch (IOException e) {
            throw new SourceException("cannot read video " + file + ": " + ImageFiles.oneLine(e));
        }
    }

    /** The luma plane of a decoded picture, cropped to the display window: grey = byte + 128. */
    static GrayF32 luma(Picture p) {
        Rect crop = p.getCrop();
        int x0 = crop == null ? 0 : crop.getX(), y0 = crop == null ? 0 : crop.getY();
        int w = crop == null ? p.getWidth() : crop.getWidth(), h = crop == null ? p.getHeight() : crop.getHeight();
        int stride = p.getPlaneWidth(0);
        byte[] y = p.getPlaneData(0);
        GrayF32 out = new GrayF32(w, h);
        for (int r = 0; r < h; r++) {
            int src = (r + y0) * stride + x0, dst = r * w;
            for (int c = 0; c < w; c++) out.data[dst + c] = y[src + c] + 128;
        }
        return out;
    }

    @Override public String description() { return file.toString(); }
    @Override public int width() { return width; }
    @Override public int height() { return height; }
    @Override public int frameCount() { return frameCount; }
    @Override public String referenceName() { return truth.reference(); }
    @Override public int skippedFrames() { return skipped; }

    public boolean hasTruth() { return !truth.frames().isEmpty(); }

    @Override
    public Optional<SourceFrame> next() throws SourceException {
        while (!closed && position < frameCount) {
            int i = position++;
            GrayF32 img;
            if (i == 0) {
                img = first;
                first = null;
            } else {
                Picture p;
                try {
                    p = grab.getNativeFrame();
                } catch (Exception | LinkageError | AssertionError e) {
                    // JCodec reports a frame it cannot decode by throwing: skip it and count it
                    skipped++;
                    VideoFrames.checkSkipped(skipped, frameCount, file);
                    continue;
                }
                if (p == null)
                    throw new SourceException("video " + file + " ended after " + i + " of its " + frameCount + " frames; the file is truncated or corrupt");
                img = luma(p);
                if (img.width != width || img.height != height) {
                    skipped++;
                    VideoFrames.checkSkipped(skipped, frameCount, file);
                    continue;
                }
            }
            String name = VideoFrames.name(i);
            return Optional.of(new SourceFrame(i, name, img, truth.forFrame(name)));
        }
        return Optional.empty();
    }

    @Override
    public void close() {
        if (closed) return;
        closed = true;
        first = null;
        NIOUtils.closeQuietly(channel);
    }
}
