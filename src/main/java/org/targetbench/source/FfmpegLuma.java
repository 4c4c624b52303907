package org.targetbench.source;

import boofcv.struct.image.GrayF32;
import org.bytedeco.ffmpeg.avutil.AVComponentDescriptor;
import org.bytedeco.ffmpeg.avutil.AVFrame;
import org.bytedeco.ffmpeg.avutil.AVPixFmtDescriptor;
import org.bytedeco.ffmpeg.global.avutil;
import org.bytedeco.ffmpeg.global.swscale;
import org.bytedeco.ffmpeg.swscale.SwsContext;
import org.bytedeco.javacpp.BytePointer;
import org.bytedeco.javacpp.DoublePointer;
import org.bytedeco.javacpp.IntPointer;
import org.bytedeco.javacpp.PointerPointer;

/**
 * Grey levels 0..255 straight from a decoded FFmpeg picture, without a colour conversion: for every YUV or grey
 * pixel format the luma samples are read where the format's descriptor puts them (plane, step, offset, shift, bit
 * depth), so 4:2:0, 4:2:2, 4:4:4, semi-planar (NV12, P010) and packed (YUYV) pictures of 8 to 16 bits all work.
 *
 * <p>Range: a full-range picture (JPEG range: MJPEG, or a stream flagged {@code color_range=pc}; grey formats) keeps
 * its values, so a coded 16 stays a dark grey 16. A limited-range picture (MPEG/TV range, and YUV with the range
 * unspecified, which is how FFmpeg reads it) codes black as 16 and white as 235 (x 2^(depth-8) for deeper samples,
 * ITU-R BT.601/BT.709; from memory) and is stretched to 0..255: g = (Y - 16) * 255 / 219, clipped. Values are
 * rounded to whole grey levels, as an 8-bit grey decode would give.
 *
 * <p>RGB and paletted pictures (rare in video) go through FFmpeg's swscale to 8-bit grey.
 */
final class FfmpegLuma {
    private final float[] fullLut = new float[256], limitedLut = new float[256];
    private SwsContext sws;
    private byte[] row = new byte[0];

    FfmpegLuma() {
        for (int v = 0; v < 256; v++) {
            fullLut[v] = v;
            limitedLut[v] = (float) Math.max(0, Math.min(255, Math.rint((v - 16) * 255.0 / 219.0)));
        }
    }

    /** True when the picture's luma is coded in full (JPEG) range. */
    static boolean fullRange(AVFrame f) {
        int fmt = f.format();
        if (f.color_range() == avutil.AVCOL_RANGE_JPEG) return true;
        if (f.color_range() == avutil.AVCOL_RANGE_MPEG) return false;
        String name = pixFmtName(fmt);
        return name.startsWith("yuvj") || name.startsWith("gray") || name.startsWith("ya");
    }

    static String pixFmtName(int fmt) {
        BytePointer n = avutil.av_get_pix_fmt_name(fmt);
        return n == null ? "unknown" : n.getString();
    }

    /** The picture as grey levels 0..255 in a new image. */
    GrayF32 grey(AVFrame f) {
        int w = f.width(), h = f.height(), fmt = f.format();
        AVPixFmtDescriptor d = avutil.av_pix_fmt_desc_get(fmt);
        if (d == null) throw new IllegalStateException("unknown pixel format " + fmt);
        long flags = d.flags();
        if ((flags & (avutil.AV_PIX_FMT_FLAG_RGB | avutil.AV_PIX_FMT_FLAG_PAL | avutil.AV_PIX_FMT_FLAG_BITSTREAM | avutil.AV_PIX_FMT_FLAG_HWACCEL)) != 0)
            return viaSws(f);
        AVComponentDescriptor c = d.comp(0);
        int plane = c.plane(), step = c.step(), offset = c.offset(), shift = c.shift(), depth = c.depth();
        boolean full = fullRange(f);
        GrayF32 out = new GrayF32(w, h);
        int stride = f.linesize(plane);
        BytePointer data = f.data(plane);
        if (stride < 0) throw new IllegalStateException("negative line size");
        int rowBytes = Math.min(stride, offset + (w - 1) * step + (depth + shift > 8 ? 2 : 1));
        if (row.length < rowBytes) row = new byte[rowBytes];
        if (depth == 8 && shift == 0) {
            float[] lut = full ? fullLut : limitedLut;
            for (int y = 0; y < h; y++) {
                data.position((long) y * stride).get(row, 0, rowBytes);
                int o = y * w;
                for (int x = 0, i = offset; x < w; x++, i += step) out.data[o + x] = lut[row[i] & 0xFF];
            }
        } else {
            boolean be = (flags & avutil.AV_PIX_FMT_FLAG_BE) != 0;
            int max = (1 << depth) - 1;
            double lo = full ? 0 : 16 << (depth - 8), span = full ? max : 219 << (depth - 8);
            for (int y = 0; y < h; y++) {
                data.position((long) y * stride).get(row, 0, rowBytes);
                int o = y * w;
                for (int x = 0, i = offset; x < w; x++, i += step) {
                    int a = row[i] & 0xFF, b = row[i + 1] & 0xFF;
                    int v = ((be ? (a << 8) | b : (b << 8) | a) >> shift) & max;
                    out.data[o + x] = (float) Math.max(0, Math.min(255, Math.rint((v - lo) * 255.0 / span)));
                }
            }
        }
        data.position(0);
        return out;
    }

    /** RGB or paletted pictures: FFmpeg's own conversion to 8-bit grey. */
    private GrayF32 viaSws(AVFrame f) {
        int w = f.width(), h = f.height();
        sws = swscale.sws_getCachedContext(sws, w, h, f.format(), w, h, avutil.AV_PIX_FMT_GRAY8, swscale.SWS_POINT, null, null, (DoublePointer) null);
        if (sws == null) throw new IllegalStateException("no conversion from " + pixFmtName(f.format()) + " to grey");
        try (BytePointer dst = new BytePointer((long) w * h); IntPointer lines = new IntPointer(1)) {
            lines.put(0, w);
            swscale.sws_scale(sws, new PointerPointer<>(f.data(0), f.data(1), f.data(2), f.data(3)), f.linesize(), 0, h,
                    new PointerPointer<>(dst), lines);
            byte[] b = new byte[w * h];
            dst.get(b);
            GrayF32 out = new GrayF32(w, h);
            for (int i = 0; i < b.length; i++) out.data[i] = b[i] & 0xFF;
            return out;
        }
    }

    void close() {
        if (sws != null) swscale.sws_freeContext(sws);
        sws = null;
    }
}
