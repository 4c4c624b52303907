package org.targetbench.export;

import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.pdmodel.common.PDRectangle;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.targetbench.source.TargetFile;
import org.targetbench.target.PageSize;
import org.targetbench.target.PrintConfig;
import org.targetbench.target.PrintLayout;
import org.targetbench.target.TargetDesign;

import javax.imageio.ImageIO;
import java.awt.image.BufferedImage;
import java.awt.image.Raster;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Printed scale of every committed design: its PDF is rasterised by an independent renderer, poppler's
 * {@code pdftoppm -r 254} (Debian poppler-utils; 254 dpi is exactly 10 px per mm), and edges are measured in the
 * raster along a row and a column through the pattern. The pattern pitch (mean distance between successive
 * white-to-black edges) and the 100 mm verification bar must match the design to within 0.1 mm. The PDF's page box and
 * the SVG's physical size are checked too.
 */
class PrintedScaleTest {
    /** Allowed printed error, mm (a few dots of a 600 dpi print, 25.4 / 600 = 0.042 mm each: common practice, no source). */
    static final double TOL_MM = 0.1;
    /** Raster resolution, dots per inch: 254 dpi = 10 px/mm. */
    static final int DPI = 254;
    static final double PX_PER_MM = DPI / 25.4;
    /** Largest distance at which a measured edge is paired with a designed one, mm. */
    static final double PAIRING_MM = 0.5;
    static final Path DESIGNS = Path.of("target-designs");
    @TempDir Path tmp;

    static Stream<Path> designs() throws IOException {
        try (Stream<Path> s = Files.list(DESIGNS)) {
            List<Path> dirs = s.filter(d -> Files.exists(d.resolve("target.pdf"))).sorted().toList();
            assertTrue(dirs.size() >= 5, "at least five committed designs, found " + dirs);
            return dirs.stream();
        }
    }

    @ParameterizedTest
    @MethodSource("designs")
    void printsToScale(Path dir) throws Exception {
        TargetDesign d = TargetFile.read(dir.resolve("target.json"));
        PrintLayout layout = PrintLayout.of(d, PageSize.A4, new PrintConfig()).orElseThrow();
        try (PDDocument pdf = Loader.loadPDF(dir.resolve("target.pdf").toFile())) {
            PDRectangle box = pdf.getPage(0).getMediaBox();
            assertEquals(layout.page().widthMm(), box.getWidth() / TargetPdf.PT_PER_MM, 1e-3, "PDF page width, mm");
            assertEquals(layout.page().heightMm(), box.getHeight() / TargetPdf.PT_PER_MM, 1e-3, "PDF page height, mm");
        }
        String svg = Files.readString(dir.resolve("target.svg"));
        assertTrue(svg.contains("width=\"" + TargetSvg.n(layout.page().widthMm()) + "mm\" height=\"" + TargetSvg.n(layout.page().heightMm()) + "mm\""), "SVG in mm");

        Raster r = rasterise(dir.resolve("target.pdf"));
        assertEquals(Math.round(layout.page().widthMm() * PX_PER_MM), r.getWidth(), 1, "raster width");
        assertEquals(Math.round(layout.page().heightMm() * PX_PER_MM), r.getHeight(), 1, "raster height");

        // the verification bar, along its middle row
        PrintLayout.Box bar = layout.bar();
        List<double[]> barEdges = edges(r, bar.y() + bar.h() / 2, true);
        double[] left = nearest(barEdges, bar.x()), right = nearest(barEdges, bar.x() + bar.w());
        assertEquals(100, right[0] - left[0], TOL_MM, "printed bar length, mm");

        // the pattern, along a row and a column through the centre of its first shape
        double[] b = d.drawing().get(0).bounds();
        checkPitch(r, layout, d, true, (b[1] + b[3]) / 2);
        checkPitch(r, layout, d, false, (b[0] + b[2]) / 2);
    }

    /** Pairs designed edges along a line with measured ones and compares their pitch and positions. */
    private static void checkPitch(Raster r, PrintLayout layout, TargetDesign d, boolean horizontal, double at) {
        double offAlong = horizontal ? layout.targetXMm() : layout.targetYMm();
        double offAcross = horizontal ? layout.targetYMm() : layout.targetXMm();
        List<double[]> designed = designedEdges(d, horizontal, at);
        assertFalse(designed.isEmpty(), "the line crosses the pattern");
        List<double[]> measured = edges(r, offAcross + at, horizontal);
        List<Double> falling = new ArrayList<>(), fallingMeasured = new ArrayList<>();
        double worst = 0;
        for (double[] e : designed) {
            double[] m = nearest(measured, offAlong + e[0]);
            assertNotNull(m, "no printed edge near " + e[0] + " mm");
            assertEquals(e[1], m[1], 0, "edge direction at " + e[0] + " mm");
            double err = m[0] - offAlong - e[0];
            assertTrue(Math.abs(err) < PAIRING_MM, "printed edge " + err + " mm from the design at " + e[0] + " mm");
            worst = Math.max(worst, Math.abs(err));
            if (e[1] < 0) { falling.add(e[0]); fallingMeasured.add(m[0] - offAlong); }
        }
        assertTrue(worst < TOL_MM, (horizontal ? "row" : "column") + ": worst edge position error " + worst + " mm");
        if (falling.size() >= 2) {
            double designedPitch = (falling.get(falling.size() - 1) - falling.get(0)) / (falling.size() - 1);
            double printedPitch = (fallingMeasured.get(fallingMeasured.size() - 1) - fallingMeasured.get(0)) / (fallingMeasured.size() - 1);
            assertEquals(designedPitch, printedPitch, TOL_MM, (horizontal ? "row" : "column") + " pitch, mm");
        }
    }

    /** Edges of the design along a line: {position mm, +1 black-to-white / -1 white-to-black}, found at 1 µm steps. */
    private static List<double[]> designedEdges(TargetDesign d, boolean horizontal, double at) {
        double len = horizontal ? d.widthMm() : d.heightMm(), step = 0.001;
        List<double[]> out = new ArrayList<>();
        boolean dark = false;
        for (double s = 0; s < len; s += step) {
            double refl = horizontal ? d.reflectance(s, at) : d.reflectance(at, s);
            boolean k = refl < 0.5;
            if (k != dark) out.add(new double[]{s - step / 2, k ? -1 : 1});
            dark = k;
        }
        return out;
    }

    /**
     * Edges in the raster along the page line at {@code atMm}: 50 % crossings between neighbouring pixels, linearly
     * interpolated; positions in page mm (pixel i's centre is at (i + 0.5) / 10 mm).
     */
    private static List<double[]> edges(Raster r, double atMm, boolean horizontal) {
        int line = (int) Math.floor(atMm * PX_PER_MM);
        int n = horizontal ? r.getWidth() : r.getHeight();
        double[] v = new double[n];
        for (int i = 0; i < n; i++) v[i] = horizontal ? r.getSample(i, line, 0) : r.getSample(line, i, 0);
        List<double[]> out = new ArrayList<>();
        double mid = 127.5;
        for (int i = 0; i + 1 < n; i++) {
            if ((v[i] - mid) * (v[i + 1] - mid) < 0 || (v[i] != v[i + 1] && v[i + 1] == mid)) {
                double t = (mid - v[i]) / (v[i + 1] - v[i]);
                out.add(new double[]{(i + t + 0.5) / PX_PER_MM, v[i + 1] > v[i] ? 1 : -1});
            }
        }
        return out;
    }

    private static double[] nearest(List<double[]> edges, double mm) {
        double[] best = null;
        for (double[] e : edges) if (best == null || Math.abs(e[0] - mm) < Math.abs(best[0] - mm)) best = e;
        return best;
    }

    private Raster rasterise(Path pdf) throws Exception {
        Path prefix = tmp.resolve(pdf.getParent().getFileName().toString());
        Process p;
        try {
            p = new ProcessBuilder("pdftoppm", "-r", Integer.toString(DPI), "-gray", "-png", "-singlefile", pdf.toString(), prefix.toString())
                    .redirectErrorStream(true).start();
        } catch (IOException e) {
            fail("pdftoppm (Debian package poppler-utils) is needed for the printed-scale test and was not found: "
                    + "install it with 'apt-get install -y poppler-utils' (.ci/run does this in CI)");
            throw e;
        }
        String output = new String(p.getInputStream().readAllBytes());
        assertTrue(p.waitFor(60, TimeUnit.SECONDS), "pdftoppm timed out");
        assertEquals(0, p.exitValue(), "pdftoppm failed: " + output);
        BufferedImage img = ImageIO.read(prefix.resolveSibling(prefix.getFileName() + ".png").toFile());
        assertNotNull(img, "pdftoppm wrote no PNG");
        return img.getRaster();
    }
}
