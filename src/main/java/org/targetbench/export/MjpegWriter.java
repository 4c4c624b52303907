package org.targetbench.export;

import boofcv.struct.image.GrayF32;
import org.targetbench.source.ImageFiles;

import javax.imageio.IIOImage;
import javax.imageio.ImageIO;
import javax.imageio.ImageWriteParam;
import javax.imageio.ImageWriter;
import javax.imageio.stream.MemoryCacheImageOutputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.List;

/**
 * Motion-JPEG writer: 8-bit grey JPEG frames (JDK encoder, IJG quality scale) written back to back as a raw stream,
 * or as the {@code 00dc} chunks of a minimal AVI 1.0 file with one video stream and an {@code idx1} index.
 *
 * <p>AVI layout from the RIFF AVI format as documented by Microsoft ("AVI RIFF File Reference": {@code avih} and
 * {@code strh} are 56 bytes, {@code strf} is a 40-byte BITMAPINFOHEADER, index offsets count from the {@code movi}
 * list type; from memory). Header sizes are patched in on {@link #close()}.
 */
public final class MjpegWriter implements VideoWriter {
    private static final int AVIF_HASINDEX = 0x10, AVIIF_KEYFRAME = 0x10;

    private final Path file;
    private final FileChannel out;
    private final float quality;
    private final double fps;
    private final boolean avi;
    private final List<long[]> index = new ArrayList<>(); // offset from movi type, size
    private long moviListStart;
    private int width = -1, height = -1, largest;

    MjpegWriter(Path file, int quality, double fps, boolean avi) throws IOException {
        this.file = file;
        this.quality = quality / 100f;
        this.fps = fps;
        this.avi = avi;
        this.out = FileChannel.open(file, StandardOpenOption.CREATE, StandardOpenOption.WRITE, StandardOpenOption.TRUNCATE_EXISTING);
    }

    /** One grey frame as a baseline JPEG at the given IJG quality (0..1). */
    static byte[] jpeg(GrayF32 frame, float quality) throws IOException {
        ImageWriter w = ImageIO.getImageWritersByFormatName("jpeg").next();
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        try (MemoryCacheImageOutputStream ios = new MemoryCacheImageOutputStream(bytes)) {
            w.setOutput(ios);
            ImageWriteParam p = w.getDefaultWriteParam();
            p.setCompressionMode(ImageWriteParam.MODE_EXPLICIT);
            p.setCompressionQuality(quality);
            w.write(null, new IIOImage(ImageFiles.toBuffered(frame), null, null), p);
        } finally {
            w.dispose();
        }
        return bytes.toByteArray();
    }

    @Override
    public void write(GrayF32 frame) throws IOException {
        if (width < 0) {
            width = frame.width;
            height = frame.height;
            if (avi) writeAviHeader();
        } else if (frame.width != width || frame.height != height) {
            throw new IllegalArgumentException("frame is " + frame.width + "x" + frame.height + " but the video is " + width + "x" + height);
        }
        byte[] j = jpeg(frame, quality);
        if (!avi) {
            put(ByteBuffer.wrap(j));
            return;
        }
        long at = out.position();
        ByteBuffer h = le(8);
        h.put("00dc".getBytes(StandardCharsets.ISO_8859_1)).putInt(j.length).flip();
        put(h);
        put(ByteBuffer.wrap(j));
        if ((j.length & 1) == 1) put(ByteBuffer.wrap(new byte[1]));
        index.add(new long[]{at - (moviListStart + 8), j.length});
        largest = Math.max(largest, j.length);
    }

    private static ByteBuffer le(int n) { return ByteBuffer.allocate(n).order(ByteOrder.LITTLE_ENDIAN); }

    private void put(ByteBuffer b) throws IOException {
        while (b.hasRemaining()) out.write(b);
    }

    private void fourcc(ByteBuffer b, String s) { b.put(s.getBytes(StandardCharsets.ISO_8859_1)); }

    /** RIFF, hdrl with avih and one strl, and the movi list header; sizes and counts are patched on close. */
    private void writeAviHeader() throws IOException {
        ByteBuffer b = le(12 + 12 + 64 + 12 + 64 + 48 + 12);
        fourcc(b, "RIFF"); b.putInt(0); fourcc(b, "AVI ");
        fourcc(b, "LIST"); b.putInt(4 + 64 + 12 + 64 + 48); fourcc(b, "hdrl");
        fourcc(b, "avih"); b.putInt(56);
        b.putInt((int) Math.round(1e6 / fps)); b.putInt(0); b.putInt(0); b.putInt(AVIF_HASINDEX);
        b.putInt(0); b.putInt(0); b.putInt(1); b.putInt(0); b.putInt(width); b.putInt(height);
        b.putInt(0); b.putInt(0); b.putInt(0); b.putInt(0);
        fourcc(b, "LIST"); b.putInt(4 + 64 + 48); fourcc(b, "strl");
        fourcc(b, "strh"); b.putInt(56);
        fourcc(b, "vids"); fourcc(b, "MJPG"); b.putInt(0); b.putShort((short) 0); b.putShort((short) 0); b.putInt(0);
        b.putInt(1000); b.putInt((int) Math.round(fps * 1000)); b.putInt(0); b.putInt(0); b.putInt(0); b.putInt(-1); b.putInt(0);
        b.putShort((short) 0); b.putShort((short) 0); b.putShort((short) width); b.putShort((short) height);
        fourcc(b, "strf"); b.putInt(40);
        b.putInt(40); b.putInt(width); b.putInt(height); b.putShort((short) 1); b.putShort((short) 24); fourcc(b, "MJPG");
        b.putInt(width * height * 3); b.putInt(0); b.putInt(0); b.putInt(0); b.putInt(0);
        moviListStart = b.position();
        fourcc(b, "LIST"); b.putInt(0); fourcc(b, "movi");
        b.flip();
        put(b);
    }

    @Override
    public void close() throws IOException {
        try {
            if (avi && width > 0) {
                long moviEnd = out.position();
                ByteBuffer idx = le(8 + 16 * index.size());
                fourcc(idx, "idx1"); idx.putInt(16 * index.size());
                for (long[] e : index) {
                    fourcc(idx, "00dc"); idx.putInt(AVIIF_KEYFRAME); idx.putInt((int) e[0]); idx.putInt((int) e[1]);
                }
                idx.flip();
                put(idx);
                long end = out.position();
                patch(4, end - 8);                                   // RIFF size
                patch(moviListStart + 4, moviEnd - moviListStart - 8);  // movi list size
                patch(12 + 12 + 8 + 16, index.size());               // avih total frames
                patch(12 + 12 + 8 + 28, largest);                    // avih suggested buffer size
                patch(12 + 12 + 64 + 12 + 8 + 32, index.size());     // strh length
                patch(12 + 12 + 64 + 12 + 8 + 36, largest);          // strh suggested buffer size
            }
        } finally {
            out.close();
        }
    }

    private void patch(long at, long value) throws IOException {
        ByteBuffer b = le(4);
        b.putInt((int) value).flip();
        while (b.hasRemaining()) out.write(b, at + b.position());
    }

    @Override public String toString() { return "MJPEG writer for " + file; }
}
