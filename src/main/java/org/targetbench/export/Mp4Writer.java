package org.targetbench.export;

import boofcv.struct.image.GrayF32;
import org.jcodec.codecs.h264.H264Encoder;
import org.jcodec.codecs.h264.encode.RateControl;
import org.jcodec.codecs.h264.io.model.SliceType;
import org.jcodec.common.Codec;
import org.jcodec.common.MuxerTrack;
import org.jcodec.common.VideoCodecMeta;
import org.jcodec.common.VideoEncoder;
import org.jcodec.common.io.NIOUtils;
import org.jcodec.common.io.SeekableByteChannel;
import org.jcodec.common.model.ColorSpace;
import org.jcodec.common.model.Packet;
import org.jcodec.common.model.Picture;
import org.jcodec.common.model.Size;
import org.jcodec.containers.mp4.muxer.MP4Muxer;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.file.Path;
import java.util.Arrays;

/**
 * H.264 in MP4 with JCodec 0.2.5's pure-Java encoder at a constant quantiser: grey frames become full-range YUV 4:2:0
 * pictures with neutral chroma (JCodec stores each sample as value - 128), an IDR frame every
 * {@value #KEY_INTERVAL} frames and P frames between.
 */
public final class Mp4Writer implements VideoWriter {
    /** Frames between key frames. */
    static final int KEY_INTERVAL = 30;
    /** Time units per second of the track. */
    private static final int TIMESCALE = 90_000;

    private final SeekableByteChannel channel;
    private final MP4Muxer muxer;
    private final H264Encoder encoder;
    private final double fps;
    private MuxerTrack track;
    private Picture picture;
    private ByteBuffer buffer;
    private int frames, width = -1, height = -1;

    Mp4Writer(Path file, int qp, double fps) throws IOException {
        org.targetbench.source.Mp4Source.class.getName(); // its static block quiets JCodec's logger
        this.fps = fps;
        this.channel = NIOUtils.writableChannel(file.toFile());
        this.muxer = MP4Muxer.createMP4MuxerToChannel(channel);
        this.encoder = new H264Encoder(new RateControl() {
            @Override public int startPicture(Size size, int maxSize, SliceType sliceType) { return qp; }
            @Override public int initialQpDelta() { return 0; }
            @Override public int accept(int bits) { return 0; }
        });
        encoder.setKeyInterval(KEY_INTERVAL);
    }

    /**
     * H.264 quantiser for a quality on the JPEG scale: qp = round(51 (100 - quality) / 100), clamped to 0..51, so
     * 100 is near lossless and 50 is a typical streaming quantiser of about 26 (a mapping of our own).
     */
    public static int quantiser(int quality) {
        return Math.max(0, Math.min(51, (int) Math.round(51 * (100 - quality) / 100.0)));
    }

    @Override
    public void write(GrayF32 frame) throws IOException {
        if (width < 0) {
            width = frame.width;
            height = frame.height;
            track = muxer.addVideoTrack(Codec.H264, VideoCodecMeta.createSimpleVideoCodecMeta(new Size(width, height), ColorSpace.YUV420J));
            picture = Picture.create(width, height, ColorSpace.YUV420J);
            buffer = ByteBuffer.allocate(Math.max(1 << 16, width * height * 3));
            Arrays.fill(picture.getPlaneData(1), (byte) 0);
            Arrays.fill(picture.getPlaneData(2), (byte) 0);
        } else if (frame.width != width || frame.height != height) {
            throw new IllegalArgumentException("frame is " + frame.width + "x" + frame.height + " but the video is " + width + "x" + height);
        }
        byte[] y = picture.getPlaneData(0);
        int stride = picture.getPlaneWidth(0);
        for (int r = 0; r < height; r++)
            for (int c = 0; c < width; c++) {
                float v = frame.unsafe_get(c, r);
                int g = v <= 0 ? 0 : v >= 255 ? 255 : (int) (v + 0.5f);
                y[r * stride + c] = (byte) (g - 128);
            }
        buffer.clear();
        VideoEncoder.EncodedFrame ef = encoder.encodeFrame(picture, buffer);
        long ticks = Math.round(TIMESCALE / fps);
        track.addFrame(Packet.createPacket(ef.getData(), frames * ticks, TIMESCALE, ticks, frames,
                ef.isKeyFrame() ? Packet.FrameType.KEY : Packet.FrameType.INTER, null));
        frames++;
    }

    @Override
    public void close() throws IOException {
        try {
            if (frames > 0) muxer.finish();
        } finally {
            NIOUtils.closeQuietly(channel);
        }
    }
}
