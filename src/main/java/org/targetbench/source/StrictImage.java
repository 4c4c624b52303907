package org.targetbench.source;

import boofcv.struct.image.GrayF32;

import javax.imageio.ImageIO;
import javax.imageio.ImageReader;
import javax.imageio.stream.ImageInputStream;
import java.awt.image.BufferedImage;
import java.awt.image.Raster;
import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;

/**
 * Strict decoding of one PNG or JPEG image held in memory, shared by image files and the frames of MJPEG videos.
 *
 * <p>The JDK's decoders fill what they could not decode with grey and carry on, reporting the damage only as a
 * warning. Here any warning (collected with an {@link javax.imageio.event.IIOReadWarningListener}), an exception, or
 * a JPEG stream that does not end with its end-of-image marker (EOI, 0xFFD9; ITU-T T.81 (1992) section B.2.1, trailing
 * zero padding allowed) makes the image undecodable. A JPEG cut short and then closed with an EOI still makes the
 * decoder warn "premature end of data segment", so it is caught too.
 *
 * <p>16-bit samples are scaled to 8-bit grey levels by value / 257, which maps 0..65535 onto 0..255 exactly
 * (65535 / 257 = 255); no gamma or colour-space conversion is applied. Colour images use BT.601 luma on the scaled
 * samples.
 */
final class StrictImage {
    private StrictImage() {}

    /** A decoded image, or null with the reason. */
    record Decoded(GrayF32 image, String problem) {}

    static Decoded decode(byte[] bytes) {
        boolean jpeg = bytes.length >= 2 && (bytes[0] & 0xFF) == 0xFF && (bytes[1] & 0xFF) == 0xD8;
        if (jpeg && !endsWithEoi(bytes)) return new Decoded(null, "truncated JPEG (no end-of-image marker)");
        BufferedImage bi;
        try {
            bi = readBuffered(bytes);
        } catch (IOException | RuntimeException e) {
            return new Decoded(null, "corrupt or truncated image (" + ImageFiles.oneLine(e) + ")");
        }
        if (bi == null) return new Decoded(null, "not a readable PNG or JPEG image");
        return new Decoded(ImageFiles.toGray(bi), null);
    }

    /**
     * Decodes with the first matching ImageIO reader; null when no reader knows the format. Throws when the decoder
     * warns, when the image exceeds the size cap (checked from the header, before the pixels are allocated) or fails.
     */
    static BufferedImage readBuffered(byte[] bytes) throws IOException {
        List<String> warnings = new ArrayList<>();
        try (ImageInputStream in = ImageIO.createImageInputStream(new ByteArrayInputStream(bytes))) {
            Iterator<ImageReader> readers = in == null ? null : ImageIO.getImageReaders(in);
            if (readers == null || !readers.hasNext()) return null;
            ImageReader reader = readers.next();
            try {
                reader.addIIOReadWarningListener((source, warning) -> warnings.add(warning));
                reader.setInput(in, true, true);
                int w = reader.getWidth(0), h = reader.getHeight(0);
                int cap = org.targetbench.camera.CameraModel.MAX_SIDE;
                if (w > cap || h > cap) throw new IOException("image is " + w + "x" + h + ", larger than the cap of " + cap + "x" + cap + " px");
                BufferedImage bi = reader.read(0);
                if (!warnings.isEmpty()) throw new IOException("decoder: " + warnings.get(0));
                return bi;
            } finally {
                reader.dispose();
            }
        }
    }

    /** True when the stream ends with 0xFFD9, ignoring trailing zero bytes some cameras pad frames with. */
    static boolean endsWithEoi(byte[] b) {
        int n = b.length;
        while (n > 0 && b[n - 1] == 0) n--;
        return n >= 4 && (b[n - 2] & 0xFF) == 0xFF && (b[n - 1] & 0xFF) == 0xD9;
    }

    /** Grey levels of an image with more than 8 bits per sample: value / 257, BT.601 luma for colour. */
    static GrayF32 sixteenBit(BufferedImage bi) {
        Raster r = bi.getRaster();
        int w = bi.getWidth(), h = bi.getHeight(), bands = r.getNumBands();
        int colourBands = bi.getColorModel().getNumColorComponents();
        int[] bits = bi.getSampleModel().getSampleSize();
        GrayF32 out = new GrayF32(w, h);
        for (int y = 0; y < h; y++)
            for (int x = 0; x < w; x++) {
                double v;
                if (colourBands >= 3 && bands >= 3) {
                    v = 0.299 * scaled(r.getSample(x, y, 0), bits[0]) + 0.587 * scaled(r.getSample(x, y, 1), bits[1])
                            + 0.114 * scaled(r.getSample(x, y, 2), bits[2]);
                } else {
                    v = scaled(r.getSample(x, y, 0), bits[0]);
                }
                out.unsafe_set(x, y, (float) v);
            }
        return out;
    }

    /** A sample of {@code bits} bits as a grey level 0..255 (value / 257 for 16 bits). */
    private static double scaled(int sample, int bits) {
        return sample * 255.0 / ((1 << bits) - 1);
    }
}
