package org.targetbench.source;

import boofcv.io.video.VideoMjpegCodec;
import boofcv.struct.image.GrayF32;

import java.io.BufferedInputStream;
import java.io.DataInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * Frames of a Motion-JPEG video: a raw stream of concatenated JPEG images ({@code .mjpeg}, {@code .mjpg}), split by
 * BoofCV's {@link VideoMjpegCodec} at the start-of-image and end-of-image markers, or the JPEG chunks of an AVI file
 * ({@code .avi}, located by {@link AviIndex}). Frames are decoded with the JDK's JPEG reader; colour frames become
 * BT.601 luma, as in {@link ImageFiles}.
 *
 * <p>Opening reads the whole file once to count the frames and check it is complete: a file with no JPEG frame, a
 * raw stream whose last frame has no end marker, or an AVI chunk that runs past the end of the file is refused, and
 * so is a first frame that cannot be decoded. Later, a single frame that cannot be decoded is skipped and counted;
 * more than {@value VideoFrames#MOST_SKIPPED} (or a tenth of the frames) makes the file corrupt.
 *
 * <p>Frame i (0-based, in file order) is named {@code frame_iii.png}, the name it would have if extracted, so that a
 * video and its extracted frames share one {@code truth.json}; the truth file of {@code clip.mjpeg} is
 * {@code clip.truth.json} beside it unless another is given.
 */
public final class MjpegSource implements FrameSource {
    private final Path file;
    private final boolean avi;
    private final List<AviIndex.Chunk> chunks;
    private final int frameCount;
    private final int width, height;
    private final TruthFile.Truth truth;
    private DataInputStream raw;
    private FileChannel channel;
    private GrayF32 first, last;
    private int position, skipped;
    private boolean closed;

    private MjpegSource(Path file, boolean avi, List<AviIndex.Chunk> chunks, int frameCount, GrayF32 first, TruthFile.Truth truth) {
        this.file = file;
        this.avi = avi;
        this.chunks = chunks;
        this.frameCount = frameCount;
        this.first = first;
        this.width = first.width;
        this.height = first.height;
        this.truth = truth;
    }

    /**
     * @param truthFile truth for the frames, or null to use {@code <name>.truth.json} beside the video when it exists
     */
    public static MjpegSource open(Path file, Path truthFile) throws SourceException {
        if (!Files.isRegularFile(file)) throw Missing.file(file, "video");
        boolean avi = VideoFrames.ext(file).equals("avi");
        List<AviIndex.Chunk> chunks = null;
        int count;
        GrayF32 first;
        if (avi) {
            chunks = AviIndex.read(file);
            if (chunks.isEmpty()) throw new SourceException("empty video: no frames in " + file);
            if (chunks.get(0).length() == 0) throw new SourceException("corrupt video " + file + ": the first frame is empty");
            count = chunks.size();
            first = decodeOrFail(readChunk(file, chunks.get(0)), file);
        } else {
            checkEndMarker(file);
            count = 0;
            byte[] firstJpeg = null;
            try (DataInputStream in = rawStream(file)) {
                byte[] jpeg;
                VideoMjpegCodec codec = new VideoMjpegCodec();
                while ((jpeg = codec.readFrame(in)) != null) {
                    if (count == 0) firstJpeg = jpeg;
                    count++;
                }
            } catch (IOException e) {
                throw new SourceException("cannot read video " + file + ": " + ImageFiles.oneLine(e));
            }
            if (count == 0) throw new SourceException("empty video: no JPEG frames in " + file);
            first = decodeOrFail(withEnd(firstJpeg), file);
        }
        return new MjpegSource(file, avi, chunks, count, first, VideoFrames.truth(file, truthFile, count, first.width, first.height));
    }

    private static GrayF32 decodeOrFail(byte[] jpeg, Path file) throws SourceException {
        GrayF32 g = VideoFrames.decodeJpeg(jpeg);
        if (g == null) throw new SourceException("corrupt video " + file + ": the first frame cannot be decoded as JPEG");
        return g;
    }

    /** A raw stream must end with a JPEG end-of-image marker (trailing zero padding allowed), or it was cut short. */
    private static void checkEndMarker(Path file) throws SourceException {
        try (FileChannel ch = FileChannel.open(file, StandardOpenOption.READ)) {
            long size = ch.size();
            if (size == 0) throw new SourceException("empty video: " + file + " is an empty file");
            int n = (int) Math.min(size, 4096);
            ByteBuffer b = ByteBuffer.allocate(n);
            AviIndex.readFully(ch, b, size - n);
            int end = n;
            while (end > 0 && b.get(end - 1) == 0) end--;
            if (end < 2 || (b.get(end - 2) & 0xFF) != 0xFF || (b.get(end - 1) & 0xFF) != 0xD9) {
                // a file with no JPEG start at all is not truncated but not MJPEG either
                ByteBuffer head = ByteBuffer.allocate((int) Math.min(size, 2));
                AviIndex.readFully(ch, head, 0);
                if (head.capacity() < 2 || (head.get(0) & 0xFF) != 0xFF || (head.get(1) & 0xFF) != 0xD8)
                    throw new SourceException("not an MJPEG video (no JPEG start marker at the beginning): " + file);
                throw new SourceException("truncated MJPEG video " + file + ": the last frame has no end marker");
            }
        } catch (IOException e) {
            throw new SourceException("cannot read video " + file + ": " + ImageFiles.oneLine(e));
        }
    }

    /**
     * The file as BoofCV's reader wants it. The reader asks {@code available()} before every byte; a file stream
     * answers that with a system call, so the remaining length is counted here instead.
     */
    private static DataInputStream rawStream(Path file) throws IOException {
        long size = Files.size(file);
        InputStream counted = new java.io.FilterInputStream(Files.newInputStream(file)) {
            private long read;

            @Override public int read() throws IOException {
                int b = super.read();
                if (b >= 0) read++;
                return b;
            }

            @Override public int read(byte[] b, int off, int len) throws IOException {
                int n = super.read(b, off, len);
                if (n > 0) read += n;
                return n;
            }

            @Override public int available() { return (int) Math.min(Integer.MAX_VALUE, Math.max(0, size - read)); }
        };
        return new DataInputStream(new BufferedInputStream(counted, 1 << 16));
    }

    /** BoofCV's reader drops the end-of-image marker; put it back for strict decoders. */
    private static byte[] withEnd(byte[] jpeg) {
        byte[] b = java.util.Arrays.copyOf(jpeg, jpeg.length + 2);
        b[jpeg.length] = (byte) 0xFF;
        b[jpeg.length + 1] = (byte) 0xD9;
        return b;
    }

    private static byte[] readChunk(Path file, AviIndex.Chunk c) throws SourceException {
        try (FileChannel ch = FileChannel.open(file, StandardOpenOption.READ)) {
            return readChunk(ch, c);
        } catch (IOException e) {
            throw new SourceException("cannot read video " + file + ": " + ImageFiles.oneLine(e));
        }
    }

    private static byte[] readChunk(FileChannel ch, AviIndex.Chunk c) throws IOException {
        ByteBuffer b = ByteBuffer.allocate(c.length());
        AviIndex.readFully(ch, b, c.offset());
        return b.array();
    }

    @Override public String description() { return file.toString(); }
    @Override public int width() { return width; }
    @Override public int height() { return height; }
    @Override public int frameCount() { return frameCount; }
    @Override public String referenceName() { return truth.reference(); }
    @Override public int skippedFrames() { return skipped; }

    /** True when a truth file gave anything beyond the reference frame. */
    public boolean hasTruth() { return !truth.frames().isEmpty(); }

    @Override
    public Optional<SourceFrame> next() throws SourceException {
        while (!closed && position < frameCount) {
            int i = position++;
            GrayF32 img;
            try {
                img = i == 0 ? first : decodeNext(i);
            } catch (IOException e) {
                throw new SourceException("cannot read video " + file + ": " + ImageFiles.oneLine(e));
            }
            first = null;
            if (img == null || img.width != width || img.height != height) {
                skipped++;
                VideoFrames.checkSkipped(skipped, frameCount, file);
                continue;
            }
            last = img;
            String name = VideoFrames.name(i);
            return Optional.of(new SourceFrame(i, name, img, truth.forFrame(name)));
        }
        return Optional.empty();
    }

    /** Frame i decoded, or null when it cannot be. */
    private GrayF32 decodeNext(int i) throws IOException {
        if (avi) {
            if (channel == null) channel = FileChannel.open(file, StandardOpenOption.READ);
            AviIndex.Chunk c = chunks.get(i);
            if (c.length() == 0) return last == null ? null : last.clone(); // a dropped frame repeats the previous one
            return VideoFrames.decodeJpeg(readChunk(channel, c));
        }
        if (raw == null) {
            raw = rawStream(file);
            new VideoMjpegCodec().readFrame(raw); // frame 0 was decoded when opening
        }
        byte[] jpeg = new VideoMjpegCodec().readFrame(raw);
        return jpeg == null ? null : VideoFrames.decodeJpeg(withEnd(jpeg));
    }

    @Override
    public void close() {
        closed = true;
        first = null;
        try {
            if (raw != null) raw.close();
            if (channel != null) channel.close();
        } catch (IOException ignored) {
            // nothing left to release
        }
        raw = null;
        channel = null;
    }
}
