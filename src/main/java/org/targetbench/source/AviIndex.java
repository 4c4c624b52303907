package org.targetbench.source;

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
 * Where the video frames of an AVI file are: the compressed-video chunks ({@code ##dc}, {@code ##db}) of its
 * {@code movi} lists, in file order, across the first {@code RIFF AVI } and any OpenDML {@code RIFF AVIX} that
 * follow. A chunk whose declared size runs past the end of the file means the file was cut short.
 *
 * <p>Layout from the RIFF AVI format as documented by Microsoft ("AVI RIFF File Reference"; from memory): a chunk
 * is a four-character code, a 32-bit little-endian size and the data padded to an even length; a list is a chunk
 * whose data begins with a list type.
 */
final class AviIndex {
    /** One frame's data: file offset and length in bytes (0 for a dropped frame, which repeats the previous one). */
    record Chunk(long offset, int length) {}

    private AviIndex() {}

    static List<Chunk> read(Path file) throws SourceException {
        try (FileChannel ch = FileChannel.open(file, StandardOpenOption.READ)) {
            long size = ch.size();
            if (size == 0) throw new SourceException("empty video: " + file + " is an empty file");
            if (size < 12) throw new SourceException("not an AVI file (too short): " + file);
            String riff = fourcc(ch, 0), type = fourcc(ch, 8);
            if (!riff.equals("RIFF") || !type.equals("AVI ")) throw new SourceException("not an AVI file (no RIFF AVI header): " + file);
            List<Chunk> out = new ArrayList<>();
            long pos = 0;
            while (pos + 8 <= size) {
                String id = fourcc(ch, pos);
                long len = u32(ch, pos + 4);
                if (pos + 8 + len > size) throw new SourceException("truncated AVI " + file + ": a " + id.trim() + " chunk at byte " + pos + " runs past the end of the file");
                if (id.equals("RIFF")) walk(ch, pos + 12, pos + 8 + len, out, file);
                pos += 8 + len + (len & 1);
            }
            return out;
        } catch (IOException e) {
            throw new SourceException("cannot read video " + file + ": " + ImageFiles.oneLine(e));
        }
    }

    /** Walks the chunks in [from, to), descending into lists; collects video chunks inside movi lists. */
    private static void walk(FileChannel ch, long from, long to, List<Chunk> out, Path file) throws IOException, SourceException {
        long pos = from;
        while (pos + 8 <= to) {
            String id = fourcc(ch, pos);
            long len = u32(ch, pos + 4);
            if (pos + 8 + len > to) throw new SourceException("truncated AVI " + file + ": a " + id.trim() + " chunk at byte " + pos + " runs past its list or the file");
            if (id.equals("LIST")) {
                walk(ch, pos + 12, pos + 8 + len, out, file);
            } else if (id.length() == 4 && (id.endsWith("dc") || id.endsWith("db")) && Character.isDigit(id.charAt(0))) {
                out.add(new Chunk(pos + 8, (int) len));
            }
            pos += 8 + len + (len & 1);
        }
    }

    private static String fourcc(FileChannel ch, long pos) throws IOException {
        ByteBuffer b = ByteBuffer.allocate(4);
        readFully(ch, b, pos);
        return new String(b.array(), StandardCharsets.ISO_8859_1);
    }

    private static long u32(FileChannel ch, long pos) throws IOException {
        ByteBuffer b = ByteBuffer.allocate(4).order(ByteOrder.LITTLE_ENDIAN);
        readFully(ch, b, pos);
        return b.getInt(0) & 0xFFFFFFFFL;
    }

    static void readFully(FileChannel ch, ByteBuffer b, long pos) throws IOException {
        while (b.hasRemaining()) {
            int n = ch.read(b, pos + b.position());
            if (n < 0) throw new IOException("unexpected end of file at byte " + (pos + b.position()));
        }
    }
}
