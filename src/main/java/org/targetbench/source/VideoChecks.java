package org.targetbench.source;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;

/**
 * Structure checks made before a video is handed to the decoder, where a cut-short or foreign file is cheap to see
 * and FFmpeg would otherwise quietly deliver fewer frames: MP4 and QuickTime files ({@code .mp4}, {@code .m4v},
 * {@code .mov}) must consist of whole top-level boxes and hold a movie header; AVI files must consist of whole chunks
 * and hold at least one video frame ({@link AviIndex}). Other containers go to FFmpeg unchecked.
 */
final class VideoChecks {
    private VideoChecks() {}

    static void check(Path file) throws SourceException {
        switch (VideoFrames.ext(file)) {
            case "mp4", "m4v", "mov" -> checkBoxes(file);
            case "avi" -> {
                if (AviIndex.read(file).isEmpty()) throw new SourceException("empty video: no frames in " + file);
            }
            default -> { }
        }
    }

    /** Box types an MP4 or QuickTime file starts with (ISO/IEC 14496-12 and the QuickTime format; from memory). */
    private static final java.util.Set<String> FIRST_BOXES = java.util.Set.of("ftyp", "styp", "moov", "mdat", "free", "skip", "wide", "pnot", "uuid");

    /** Refuses a file whose top-level boxes do not fit it, or that has no movie header. */
    static void checkBoxes(Path file) throws SourceException {
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

}
