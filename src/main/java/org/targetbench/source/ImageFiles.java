package org.targetbench.source;

import boofcv.struct.image.GrayF32;

import javax.imageio.ImageIO;
import javax.imageio.ImageReader;
import javax.imageio.stream.ImageInputStream;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Iterator;
import java.util.Locale;

/**
 * Reading and writing of 8-bit image files as grey images.
 *
 * <p>Colour images are converted with the ITU-R BT.601 luma weights Y = 0.299 R + 0.587 G + 0.114 B (ITU-R
 * Recommendation BT.601-7, 2011), the weights OpenCV's and most cameras' grey conversion use.
 */
public final class ImageFiles {
    private ImageFiles() {}

    /** True for file names this tool reads as frames (.png, .jpg, .jpeg, any case). */
    public static boolean isImageName(String name) {
        String n = name.toLowerCase(Locale.ROOT);
        return n.endsWith(".png") || n.endsWith(".jpg") || n.endsWith(".jpeg");
    }

    /** Width and height from the file header, without decoding the pixels; sizes above the cap are refused. */
    public static int[] readSize(Path file) throws SourceException {
        checkReadable(file);
        try (ImageInputStream in = ImageIO.createImageInputStream(file.toFile())) {
            if (in == null) throw new SourceException("cannot open image " + file);
            Iterator<ImageReader> readers = ImageIO.getImageReaders(in);
            if (!readers.hasNext()) throw new SourceException("not a readable PNG or JPEG image: " + file);
            ImageReader reader = readers.next();
            try {
                reader.setInput(in);
                int[] size = {reader.getWidth(0), reader.getHeight(0)};
                checkSize(size[0], size[1], file);
                return size;
            } finally {
                reader.dispose();
            }
        } catch (SourceException e) {
            throw e;
        } catch (IOException | RuntimeException e) {
            throw new SourceException("corrupt or unreadable image " + file + ": " + oneLine(e));
        }
    }

    /**
     * Decodes a PNG or JPEG file to grey levels 0..255, strictly: a file the decoder warns about (a truncated or
     * corrupt JPEG, for instance "premature end of data segment"), a JPEG without its end-of-image marker, or a
     * truncated PNG is an error naming the file, never a partly grey frame. 16-bit samples are scaled to 8 bits by
     * value / 257 (65535 maps to 255 exactly), with no gamma or colour-space conversion.
     */
    public static GrayF32 read(Path file) throws SourceException {
        int[] size = readSize(file);
        byte[] bytes;
        try {
            bytes = Files.readAllBytes(file);
        } catch (IOException | RuntimeException e) {
            throw new SourceException("cannot read image " + file + ": " + oneLine(e));
        }
        StrictImage.Decoded d = StrictImage.decode(bytes);
        if (d.image() == null) throw new SourceException(d.problem() + ": " + file);
        if (d.image().width != size[0] || d.image().height != size[1])
            throw new SourceException("corrupt image " + file + ": header says " + size[0] + "x" + size[1] + " but the pixels are "
                    + d.image().width + "x" + d.image().height);
        return d.image();
    }

    /**
     * Refuses a path that is not a readable regular file (a dangling link, a folder, a file without read
     * permission), naming it.
     */
    public static void checkReadable(Path file) throws SourceException {
        if (Files.isSymbolicLink(file) && !Files.exists(file)) throw new SourceException("dangling link (its target does not exist): " + file);
        if (Files.isDirectory(file)) throw new SourceException("is a folder, expected an image file: " + file);
        if (!Files.exists(file)) throw new SourceException("file not found: " + file);
        if (!Files.isRegularFile(file)) throw new SourceException("not a regular file: " + file);
        if (!Files.isReadable(file)) throw new SourceException("cannot read " + file + ": permission denied");
    }

    /** Refuses an image larger than {@link org.targetbench.camera.CameraModel#MAX_SIDE} on a side. */
    static void checkSize(int w, int h, Path file) throws SourceException {
        int cap = org.targetbench.camera.CameraModel.MAX_SIDE;
        if (w > cap || h > cap) throw new SourceException("image " + file + " is " + w + "x" + h + ", larger than this tool's cap of "
                + cap + "x" + cap + " px");
    }

    /** Grey levels of a buffered image, BT.601 luma for colour; 16-bit samples scaled by 1/257. */
    public static GrayF32 toGray(BufferedImage bi) {
        int w = bi.getWidth(), h = bi.getHeight();
        var raster = bi.getRaster();
        if (bi.getSampleModel().getSampleSize(0) > 8) return StrictImage.sixteenBit(bi);
        GrayF32 out = new GrayF32(w, h);
        boolean grey = bi.getType() == BufferedImage.TYPE_BYTE_GRAY;
        int[] px = new int[raster.getNumBands()];
        for (int y = 0; y < h; y++)
            for (int x = 0; x < w; x++) {
                float v;
                if (grey) {
                    v = raster.getSample(x, y, 0);
                } else {
                    int rgb = bi.getRGB(x, y);
                    int r = (rgb >> 16) & 0xFF, g = (rgb >> 8) & 0xFF, b = rgb & 0xFF;
                    v = (float) (0.299 * r + 0.587 * g + 0.114 * b);
                }
                out.unsafe_set(x, y, v);
            }
        return out;
    }

    /** 8-bit grey buffered image of a grey image (rounded, clipped to 0..255). */
    public static BufferedImage toBuffered(GrayF32 img) {
        BufferedImage bi = new BufferedImage(img.width, img.height, BufferedImage.TYPE_BYTE_GRAY);
        var raster = bi.getRaster();
        for (int y = 0; y < img.height; y++)
            for (int x = 0; x < img.width; x++)
                raster.setSample(x, y, 0, (int) Math.max(0, Math.min(255, Math.rint(img.unsafe_get(x, y)))));
        return bi;
    }

    /** Writes a grey image as an 8-bit PNG. */
    public static void writePng(GrayF32 img, Path file) throws IOException {
        writePng(toBuffered(img), file);
    }

    public static void writePng(BufferedImage bi, Path file) throws IOException {
        try (OutputStream out = Files.newOutputStream(file)) {
            if (!ImageIO.write(bi, "png", out)) throw new IOException("no PNG writer available");
        }
    }

    public static String oneLine(Throwable e) {
        String m = e.getMessage();
        if (m == null || m.isBlank()) m = e.getClass().getSimpleName();
        return m.replaceAll("\\s+", " ").trim();
    }
}
