package org.targetbench.perturb;

import boofcv.abst.distort.FDistort;
import boofcv.alg.filter.blur.BlurImageOps;
import boofcv.alg.interpolate.InterpolationType;
import boofcv.alg.distort.PixelTransformHomography_F32;
import boofcv.struct.border.BorderType;
import boofcv.struct.convolve.Kernel2D_F32;
import boofcv.struct.image.GrayF32;
import georegression.struct.homography.Homography2D_F64;
import org.targetbench.camera.Homography;
import org.targetbench.camera.SensorNoise;

import java.util.SplittableRandom;

/**
 * Applies one {@link Perturbation} at one value to a frame: a pure function of (frame, parameter, value, seed).
 *
 * <p>Every result is rounded and clipped to 0..255, as an 8-bit sensor saturates. Blur uses BoofCV's Gaussian blur
 * (kernel radius ⌈3σ⌉, the common truncation, renormalised at the
 * border); warps use BoofCV's bilinear
 * interpolation, and pixels with no source are filled with the frame's mean grey. Motion blur visits only the
 * kernel's non-zero taps.
 *
 * <p>Models and their sources:
 * <ul>
 *   <li>low light: the frame as captured is the reference exposure (f = 1, unchanged); at f &lt; 1 its grey levels g
 *       become a simulated sensor reading, electrons n = f g K with K = {@link PerturbConfig#electronsPerGrey} and
 *       output (Poisson(n) + N(0, σ_read)) / K (photon transfer model, Janesick, "Photon Transfer", SPIE 2007 [1]);
 *       the frame's own noise is not modelled, so noise appears abruptly below f = 1;</li>
 *   <li>motion blur: a line kernel of the stated length L at the stated angle, integrated by sub-sampling and
 *       normalised to sum 1 (box PSF of uniform linear motion, [2] sec. 5.6);</li>
 *   <li>JPEG: {@link JpegSimulation};</li>
 *   <li>in-plane rotation and scale: similarity about the image centre;</li>
 *   <li>tilt by warp (when no target design is known): the frame is taken as a fronto-parallel plane seen by a
 *       camera of field of view {@link PerturbConfig#assumedFovDeg}, tilted about the horizontal line through the
 *       image centre: H = K (R + (e₃ - R e₃) e₃ᵀ) K⁻¹ (Hartley &amp; Zisserman 2004 [3], eq. 13.2 with the plane at unit
 *       depth rotated about its own centre).</li>
 * </ul>
 * References: [1] J. R. Janesick, Photon Transfer, SPIE Press 2007. [2] R. C. Gonzalez, R. E. Woods, Digital Image
 * Processing, 3rd ed. 2008. [3] R. Hartley, A. Zisserman, Multiple View Geometry, 2nd ed. 2004.
 */
public final class Perturber {
    private final PerturbConfig config;

    public Perturber(PerturbConfig config) {
        config.checkValidity();
        this.config = config.copy();
    }

    public Perturber() { this(new PerturbConfig()); }

    public Perturbed apply(Perturbation p, double value, GrayF32 frame, long seed) {
        p.checkValue(value);
        SplittableRandom rng = new SplittableRandom(seed);
        GrayF32 out;
        Homography warp = Homography.identity();
        switch (p) {
            case GAIN -> out = map(frame, g -> g * value);
            case OFFSET -> out = map(frame, g -> g + value);
            case GAMMA -> {
                double[] lut = new double[256];
                for (int g = 0; g < 256; g++) lut[g] = 255 * Math.pow(g / 255.0, value);
                out = map(frame, g -> g >= 0 && g <= 255 && g == Math.rint(g) ? lut[(int) g] : 255 * Math.pow(Math.max(0, g) / 255.0, value));
            }
            case GRADIENT -> {
                out = frame.createSameShape();
                double span = Math.max(1, frame.width - 1);
                for (int y = 0; y < frame.height; y++)
                    for (int x = 0; x < frame.width; x++)
                        out.unsafe_set(x, y, (float) (frame.unsafe_get(x, y) * (1 - value / 100.0 * x / span)));
            }
            case LOW_LIGHT -> out = value == 1 ? frame.clone() : lowLight(frame, value, rng);
            case DEFOCUS -> out = value == 0 ? frame.clone() : BlurImageOps.gaussian(frame, null, value, (int) Math.ceil(3 * value), null);
            case MOTION -> out = value == 0 ? frame.clone() : motionBlur(frame, value, config.motionAngleDeg);
            case GAUSSIAN_NOISE -> out = map(frame, g -> g + value * SensorNoise.gaussian(rng));
            case SALT_PEPPER -> {
                out = frame.clone();
                for (int i = 0; i < out.data.length; i++)
                    if (rng.nextDouble() < value) out.data[i] = rng.nextBoolean() ? 255f : 0f;
            }
            case JPEG_QUALITY -> out = JpegSimulation.apply(frame, (int) Math.round(value));
            case ROTATION -> {
                warp = similarity(frame, Math.toRadians(value), 1);
                out = warp(frame, warp);
            }
            case SCALE -> {
                warp = similarity(frame, 0, value);
                out = warp(frame, warp);
            }
            case TILT -> {
                warp = tiltWarp(frame.width, frame.height, value, config.assumedFovDeg);
                out = warp(frame, warp);
            }
            default -> throw new IllegalStateException("unhandled " + p);
        }
        quantise(out);
        return new Perturbed(out, warp);
    }

    private interface Op { double at(double grey); }

    private static GrayF32 map(GrayF32 in, Op op) {
        GrayF32 out = in.createSameShape();
        for (int i = 0; i < in.data.length; i++) out.data[i] = (float) op.at(in.data[i]);
        return out;
    }

    /** Rounds to whole grey levels and clips to 0..255. */
    static void quantise(GrayF32 img) {
        for (int i = 0; i < img.data.length; i++) img.data[i] = (float) Math.max(0, Math.min(255, Math.rint(img.data[i])));
    }

    private GrayF32 lowLight(GrayF32 in, double exposure, SplittableRandom rng) {
        double k = config.electronsPerGrey, read = config.readNoiseElectrons;
        GrayF32 out = in.createSameShape();
        for (int i = 0; i < in.data.length; i++) {
            double electrons = Math.max(0, in.data[i]) * exposure * k;
            out.data[i] = (float) ((SensorNoise.poisson(rng, electrons) + read * SensorNoise.gaussian(rng)) / k);
        }
        return out;
    }

    /**
     * Kernel of uniform linear motion of length {@code length} px at {@code angleDeg}, centred: 64 samples per pixel
     * of path, each counted in the pixel that contains it, normalised to sum 1.
     */
    public static Kernel2D_F32 motionKernel(double length, double angleDeg) {
        if (!(length > 0)) throw new IllegalArgumentException("motion length must be > 0 px, got " + length);
        double c = Math.cos(Math.toRadians(angleDeg)), s = Math.sin(Math.toRadians(angleDeg));
        int r = (int) Math.ceil(length / 2) + 1;
        int w = 2 * r + 1;
        float[] k = new float[w * w];
        int samples = Math.max(2, (int) Math.ceil(length * 64));
        for (int i = 0; i < samples; i++) {
            double t = -length / 2 + length * (i + 0.5) / samples;
            // each sample of the path lands in the pixel whose square contains it: the kernel is the length of path
            // inside each pixel, the box-integrated PSF of uniform motion
            int x = (int) Math.round(r + t * c), y = (int) Math.round(r + t * s);
            k[y * w + x] += 1f;
        }
        for (int i = 0; i < k.length; i++) k[i] /= samples;
        return new Kernel2D_F32(w, k);
    }

    /**
     * Convolution with the (sparse) motion kernel: only its non-zero taps are visited, and at the border the taps
     * that fall outside are left out and the rest renormalised, as BoofCV's normalised convolution does.
     */
    private static GrayF32 motionBlur(GrayF32 in, double length, double angleDeg) {
        Kernel2D_F32 k = motionKernel(length, angleDeg);
        int w = k.width, r = w / 2, n = 0;
        int[] dx = new int[w * w], dy = new int[w * w];
        float[] wt = new float[w * w];
        for (int y = 0; y < w; y++)
            for (int x = 0; x < w; x++) {
                float v = k.data[y * w + x];
                if (v > 0) { dx[n] = x - r; dy[n] = y - r; wt[n++] = v; }
            }
        GrayF32 out = in.createSameShape();
        for (int y = 0; y < in.height; y++)
            for (int x = 0; x < in.width; x++) {
                double sum = 0, norm = 0;
                boolean inside = x >= r && y >= r && x < in.width - r && y < in.height - r;
                for (int i = 0; i < n; i++) {
                    int sx = x + dx[i], sy = y + dy[i];
                    if (inside || (sx >= 0 && sy >= 0 && sx < in.width && sy < in.height)) {
                        sum += wt[i] * in.data[in.startIndex + sy * in.stride + sx];
                        norm += wt[i];
                    }
                }
                out.unsafe_set(x, y, (float) (sum / norm));
            }
        return out;
    }

    /** Rotation by {@code angle} and zoom by {@code scale} about the image centre, as a pixel homography. */
    public static Homography similarity(GrayF32 img, double angle, double scale) {
        double cx = (img.width - 1) / 2.0, cy = (img.height - 1) / 2.0;
        double c = Math.cos(angle) * scale, s = Math.sin(angle) * scale;
        return new Homography(new double[]{c, -s, cx - c * cx + s * cy, s, c, cy - s * cx - c * cy, 0, 0, 1});
    }

    /** Tilt of a fronto-parallel plane about the horizontal line through the image centre, see class notes. */
    static Homography tiltWarp(int width, int height, double tiltDeg, double fovDeg) {
        double f = (width / 2.0) / Math.tan(Math.toRadians(fovDeg) / 2);
        double cx = (width - 1) / 2.0, cy = (height - 1) / 2.0;
        double a = Math.toRadians(tiltDeg), ca = Math.cos(a), sa = Math.sin(a);
        // R about the x axis; M = R + (e3 - R e3) e3ᵀ. With R e3 = (0, -sin a, cos a) the third column becomes e3.
        double[] m = {1, 0, 0, 0, ca, 0, 0, sa, 1};
        Homography k = new Homography(new double[]{f, 0, cx, 0, f, cy, 0, 0, 1});
        return k.after(new Homography(m)).after(k.inverse());
    }

    /** Warps a frame by a pixel homography with bilinear interpolation; uncovered pixels get the frame's mean. */
    public static GrayF32 warp(GrayF32 in, Homography h) {
        double mean = 0;
        for (float v : in.data) mean += v;
        mean /= Math.max(1, in.data.length);
        GrayF32 out = in.createSameShape();
        Homography inv = h.inverse();
        Homography2D_F64 outToIn = new Homography2D_F64(inv.get(0, 0), inv.get(0, 1), inv.get(0, 2), inv.get(1, 0), inv.get(1, 1),
                inv.get(1, 2), inv.get(2, 0), inv.get(2, 1), inv.get(2, 2));
        new FDistort(in, out).interp(InterpolationType.BILINEAR).border(mean).transform(new PixelTransformHomography_F32(outToIn)).apply();
        return out;
    }
}
