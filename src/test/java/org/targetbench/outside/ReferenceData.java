package org.targetbench.outside;

import boofcv.struct.image.GrayF32;
import org.targetbench.camera.Homography;
import org.targetbench.detect.Detection;
import org.targetbench.source.ImageFiles;
import org.w3c.dom.Document;
import org.w3c.dom.Element;

import javax.xml.parsers.DocumentBuilderFactory;
import java.net.URL;
import java.nio.file.Path;
import java.util.List;

/**
 * Shared helpers of the outside-reference tests: the committed reference files (see
 * {@code src/test/resources/reference/PROVENANCE.md}), exact pixel-permutation and block-average views of an
 * image, and residual statistics of matched points.
 */
final class ReferenceData {
    private ReferenceData() {}

    /** Path of a file under {@code src/test/resources/reference/}. */
    static Path resource(String name) {
        URL url = ReferenceData.class.getResource("/reference/" + name);
        if (url == null) throw new IllegalStateException("missing test resource reference/" + name);
        try {
            return Path.of(url.toURI());
        } catch (java.net.URISyntaxException e) {
            throw new IllegalStateException(e);
        }
    }

    /** A reference image as the tool reads it (BT.601 luma, 0..255). */
    static GrayF32 image(String name) throws Exception {
        return ImageFiles.read(resource(name));
    }

    /**
     * Parses an OpenCV FileStorage XML 3x3 double matrix (the element named {@code node}: rows, cols, dt, data).
     */
    static Homography readOpenCvMatrix(String name, String node) throws Exception {
        DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
        f.setExpandEntityReferences(false);
        f.setFeature("http://apache.org/xml/features/disallow-doctype-decl", true);
        Document doc = f.newDocumentBuilder().parse(resource(name).toFile());
        Element m = (Element) doc.getElementsByTagName(node).item(0);
        if (m == null) throw new IllegalStateException(name + " has no matrix " + node);
        int rows = Integer.parseInt(text(m, "rows")), cols = Integer.parseInt(text(m, "cols"));
        if (rows != 3 || cols != 3 || !"d".equals(text(m, "dt")))
            throw new IllegalStateException(name + ": expected a 3x3 double matrix, got " + rows + "x" + cols + " " + text(m, "dt"));
        String[] tokens = text(m, "data").trim().split("\\s+");
        if (tokens.length != 9) throw new IllegalStateException(name + ": expected 9 values, got " + tokens.length);
        double[] h = new double[9];
        for (int i = 0; i < 9; i++) h[i] = Double.parseDouble(tokens[i]);
        return new Homography(h);
    }

    private static String text(Element parent, String tag) {
        return parent.getElementsByTagName(tag).item(0).getTextContent();
    }

    /** Copy of the top-left w x h region. */
    static GrayF32 crop(GrayF32 in, int w, int h) {
        return in.subimage(0, 0, w, h).clone();
    }

    /**
     * Exact clockwise quarter turn by pixel permutation (a transposition followed by a horizontal flip, no
     * interpolation): out(x', y') = in(y', h-1-x'), so a point (x, y) of {@code in} goes to (h-1-y, x). See
     * {@link #quarterTurnHomography}.
     */
    static GrayF32 quarterTurn(GrayF32 in) {
        GrayF32 out = new GrayF32(in.height, in.width);
        for (int y = 0; y < out.height; y++)
            for (int x = 0; x < out.width; x++)
                out.unsafe_set(x, y, in.unsafe_get(y, in.height - 1 - x));
        return out;
    }

    /** x' = (h-1) - y, y' = x in the pixel-centre convention, for an input of height h. */
    static Homography quarterTurnHomography(int inputHeight) {
        return new Homography(new double[]{0, -1, inputHeight - 1, 1, 0, 0, 0, 0, 1});
    }

    /**
     * Half-size image by 2x2 block averaging: out(i, j) = mean of in(2i..2i+1, 2j..2j+1). Output pixel centre i
     * covers input centres 2i and 2i+1, i.e. input coordinate 2i + 0.5. Odd last row/column dropped.
     */
    static GrayF32 halve(GrayF32 in) {
        GrayF32 out = new GrayF32(in.width / 2, in.height / 2);
        for (int y = 0; y < out.height; y++)
            for (int x = 0; x < out.width; x++)
                out.unsafe_set(x, y, (in.unsafe_get(2 * x, 2 * y) + in.unsafe_get(2 * x + 1, 2 * y)
                        + in.unsafe_get(2 * x, 2 * y + 1) + in.unsafe_get(2 * x + 1, 2 * y + 1)) / 4f);
        return out;
    }

    /** x' = (x - 0.5) / 2, y' = (y - 0.5) / 2: the map of {@link #halve} in the pixel-centre convention. */
    static Homography halveHomography() {
        return new Homography(new double[]{0.5, 0, -0.25, 0, 0.5, -0.25, 0, 0, 1});
    }

    /**
     * Pairs each reference point with its nearest frame point within {@code radius} of H·p (not one-to-one) and
     * summarises the offsets and scale ratios of those pairs.
     */
    static Residuals residuals(List<Detection> reference, List<Detection> frame, Homography h, double radius) {
        double sx = 0, sy = 0;
        int n = 0;
        double[] ratios = new double[reference.size()];
        for (Detection p : reference) {
            double[] m = h.apply(p.x(), p.y());
            Detection best = null;
            double bestD2 = radius * radius;
            for (Detection q : frame) {
                double dx = q.x() - m[0], dy = q.y() - m[1], d2 = dx * dx + dy * dy;
                if (d2 <= bestD2) { bestD2 = d2; best = q; }
            }
            if (best == null) continue;
            sx += best.x() - m[0];
            sy += best.y() - m[1];
            ratios[n++] = best.scale() / p.scale();
        }
        double[] r = java.util.Arrays.copyOf(ratios, n);
        java.util.Arrays.sort(r);
        double median = n == 0 ? Double.NaN : (n % 2 == 1 ? r[n / 2] : 0.5 * (r[n / 2 - 1] + r[n / 2]));
        return new Residuals(n == 0 ? Double.NaN : sx / n, n == 0 ? Double.NaN : sy / n, n, median);
    }

    /**
     * @param meanDx      mean of q.x - (H p).x over the nearest pairs, pixels of the frame
     * @param meanDy      likewise in y
     * @param pairs       number of reference points with a frame point within the radius
     * @param medianScale median of (frame scale) / (reference scale) over those pairs
     */
    record Residuals(double meanDx, double meanDy, int pairs, double medianScale) {}
}
