package org.targetbench.perturb;

import boofcv.struct.image.GrayF32;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;
import org.junit.jupiter.params.provider.ValueSource;
import org.targetbench.TestScenes;
import org.targetbench.camera.Homography;
import org.targetbench.source.ImageFiles;

import javax.imageio.IIOImage;
import javax.imageio.ImageIO;
import javax.imageio.ImageWriteParam;
import javax.imageio.ImageWriter;
import javax.imageio.stream.MemoryCacheImageOutputStream;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;

import static org.junit.jupiter.api.Assertions.*;

class PerturbationTest {
    private static final GrayF32 FRAME = TestScenes.checkerboardFrame();

    @ParameterizedTest
    @EnumSource(Perturbation.class)
    void everyLevelIsAPureSeededFunctionWithEightBitOutput(Perturbation p) {
        Perturber perturber = new Perturber();
        for (double v : p.defaultLevels(Perturbation.DEFAULT_LEVELS)) {
            Perturbed a = perturber.apply(p, v, FRAME, 42), b = perturber.apply(p, v, FRAME, 42);
            assertArrayEquals(a.image().data, b.image().data, p + " at " + v + " is not reproducible");
            for (float g : a.image().data) assertTrue(g >= 0 && g <= 255 && g == Math.rint(g), p + " gave " + g);
            assertEquals(FRAME.width, a.image().width);
        }
    }

    @ParameterizedTest
    @EnumSource(Perturbation.class)
    void theNeutralValueChangesNothing(Perturbation p) {
        Perturbed r = new Perturber().apply(p, p.neutral(), FRAME, 3);
        double worst = 0;
        for (int i = 0; i < FRAME.data.length; i++) worst = Math.max(worst, Math.abs(r.image().data[i] - FRAME.data[i]));
        // JPEG at quality 100 still quantises (table of ones): allow one grey level of DCT rounding
        assertTrue(worst <= (p == Perturbation.JPEG_QUALITY ? 1 : 1e-3), p + ": neutral value changed the frame by " + worst);
    }

    @Test
    void gainSaturatesLikeAnEightBitSensor() {
        Perturbed r = new Perturber().apply(Perturbation.GAIN, 2.0, FRAME, 1);
        float max = 0;
        for (float g : r.image().data) max = Math.max(max, g);
        assertEquals(255f, max, "paper at 2x gain must clip at 255");
    }

    @Test
    void motionKernelIntegratesToOneAndHasTheStatedLength() {
        for (double len : new double[]{3, 10, 25}) {
            var k = Perturber.motionKernel(len, 0);
            double sum = 0;
            for (float v : k.data) sum += v;
            assertEquals(1.0, sum, 1e-5, "kernel of " + len + " px");
        }
        // a one-pixel bright vertical line blurred horizontally spreads to the stated length, +-1 px
        // (box PSF of uniform motion: Gonzalez & Woods 2008, sec. 5.6)
        for (double len : new double[]{5, 12, 25}) {
            GrayF32 img = new GrayF32(121, 21);
            for (int y = 0; y < 21; y++) img.unsafe_set(60, y, 255);
            GrayF32 out = new Perturber().apply(Perturbation.MOTION, len, img, 1).image();
            int lit = 0;
            for (int x = 0; x < 121; x++) if (out.unsafe_get(x, 10) > 0) lit++;
            assertTrue(Math.abs(lit - len) <= 1, "length " + len + " px spread over " + lit + " px");
        }
    }

    @Test
    void jpegAtQuality95KeepsPsnrAbove40dB() throws Exception {
        // common practice, no source: quality 95 is "visually lossless", PSNR well above 40 dB
        GrayF32 out = new Perturber().apply(Perturbation.JPEG_QUALITY, 95, FRAME, 1).image();
        assertTrue(psnr(FRAME, out) > 40, "PSNR " + psnr(FRAME, out));
    }

    @ParameterizedTest
    @ValueSource(ints = {90, 50, 20})
    void jpegSimulationAgreesWithTheJdkEncoder(int quality) throws Exception {
        // Reference library: the JDK's baseline JPEG codec (libjpeg-derived, IJG quality tables) at the same quality.
        // Ours uses exact floating-point DCTs where the codec uses integer ones, so they differ by rounding only:
        // the mean absolute difference must stay below half a grey level.
        GrayF32 ours = JpegSimulation.apply(FRAME, quality);
        ImageWriter w = ImageIO.getImageWritersByFormatName("jpeg").next();
        ImageWriteParam param = w.getDefaultWriteParam();
        param.setCompressionMode(ImageWriteParam.MODE_EXPLICIT);
        param.setCompressionQuality(quality / 100f);
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        try (MemoryCacheImageOutputStream out = new MemoryCacheImageOutputStream(bytes)) {
            w.setOutput(out);
            w.write(null, new IIOImage(ImageFiles.toBuffered(FRAME), null, null), param);
        }
        w.dispose();
        GrayF32 ref = ImageFiles.toGray(ImageIO.read(new ByteArrayInputStream(bytes.toByteArray())));
        double sum = 0;
        for (int i = 0; i < ref.data.length; i++) sum += Math.abs(ref.data[i] - ours.data[i]);
        assertTrue(sum / ref.data.length < 0.5, "quality " + quality + ": mean |ours - JDK| " + sum / ref.data.length);
    }

    @Test
    void geometricWarpsMoveTruthConsistently() {
        // in-plane rotation by 90 degrees about the centre maps the centre to itself and turns a point 10 px to the
        // right of it into one 10 px below (y down)
        Perturbed r = new Perturber().apply(Perturbation.ROTATION, 90, FRAME, 1);
        Homography h = r.warp();
        double cx = (FRAME.width - 1) / 2.0, cy = (FRAME.height - 1) / 2.0;
        double[] c = h.apply(cx, cy), p = h.apply(cx + 10, cy);
        assertEquals(cx, c[0], 1e-9);
        assertEquals(cy, c[1], 1e-9);
        assertEquals(cx, p[0], 1e-9);
        assertEquals(cy + 10, p[1], 1e-9);
        // pixels follow the map: the perturbed image at H(q) equals the frame at q (bilinear, interior)
        double[] q = h.apply(300, 200);
        assertEquals(FRAME.unsafe_get(300, 200), r.image().unsafe_get((int) Math.round(q[0]), (int) Math.round(q[1])), 1.0);
    }

    @Test
    void tiltWarpKeepsTheCentreAndForeshortens() {
        Homography h = Perturber.tiltWarp(640, 480, 40, 60);
        double[] c = h.apply(319.5, 239.5);
        assertEquals(319.5, c[0], 1e-9);
        assertEquals(239.5, c[1], 1e-9);
        double[] up = h.apply(319.5, 139.5), down = h.apply(319.5, 339.5);
        assertTrue(Math.abs(up[1] - 239.5) < 100 && Math.abs(down[1] - 239.5) < 100, "a tilted plane is foreshortened");
    }

    @Test
    void outOfRangeValuesAreRefusedWithTheRange() {
        var e = assertThrows(IllegalArgumentException.class, () -> new Perturber().apply(Perturbation.JPEG_QUALITY, 0, FRAME, 1));
        assertTrue(e.getMessage().contains("jpeg.quality") && e.getMessage().contains("1.0 .. 100.0"), e.getMessage());
    }

    static double psnr(GrayF32 a, GrayF32 b) {
        double mse = 0;
        for (int i = 0; i < a.data.length; i++) mse += Math.pow(a.data[i] - b.data[i], 2);
        mse /= a.data.length;
        return 10 * Math.log10(255 * 255 / mse);
    }
}
