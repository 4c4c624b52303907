package org.targetbench.source;

import boofcv.struct.distort.Point2Transform2_F64;
import boofcv.struct.image.GrayF32;
import georegression.struct.point.Point2D_F64;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.camera.Projection;
import org.targetbench.camera.SensorNoise;
import org.targetbench.target.TargetDesign;

import java.util.List;
import java.util.SplittableRandom;
import java.util.stream.IntStream;

/**
 * Renders a planar target seen by a camera at a pose, with ground truth.
 *
 * <p>Each pixel is the box-filtered mean of n x n sub-samples (n = {@link RenderConfig#supersample}). Each
 * sub-sample position is undistorted to a normalised ray (inverse of the Brown-Conrady model), intersected with the
 * target plane, and looked up in the design. Sub-sample (i, j) of pixel (u, v) sits at
 * (u - 1/2 + (i + 1/2)/n, v - 1/2 + (j + 1/2)/n), following the pixel-centre convention.
 *
 * <p>Caveats: no lens blur, vignetting or shading; the page is a perfect Lambertian plane lit evenly. Sensor noise is
 * additive Gaussian. The undistortion map of a distorted camera is cached per renderer; one renderer serves one
 * camera and may be shared between threads.
 */
public final class SyntheticRenderer {
    private final CameraModel camera;
    private final RenderConfig config;
    /** Normalised (x, y) of every sub-sample, interleaved, for distorted cameras; null otherwise. */
    private final float[] rayMap;

    /** A rendered view: the image, and each target feature visible in it. */
    public record Rendered(GrayF32 image, List<Projection.ProjectedFeature> features) {}

    public SyntheticRenderer(CameraModel camera, RenderConfig config) {
        config.checkValidity();
        this.camera = camera;
        this.config = config.copy();
        this.rayMap = camera.isDistorted() ? buildRayMap(camera, this.config.supersample) : null;
    }

    public CameraModel camera() { return camera; }

    private static float[] buildRayMap(CameraModel camera, int n) {
        int sw = camera.width() * n, sh = camera.height() * n;
        float[] map = new float[sw * sh * 2];
        IntStream.range(0, sh).parallel().forEach(sy -> {
            Point2Transform2_F64 undistort = camera.pixelToNormalised();
            Point2D_F64 out = new Point2D_F64();
            double v = (sy + 0.5) / n - 0.5;
            for (int sx = 0; sx < sw; sx++) {
                double u = (sx + 0.5) / n - 0.5;
                undistort.compute(u, v, out);
                map[(sy * sw + sx) * 2] = (float) out.x;
                map[(sy * sw + sx) * 2 + 1] = (float) out.y;
            }
        });
        return map;
    }

    /** Renders {@code design} at {@code pose} with the configured noise seed. */
    public Rendered render(TargetDesign design, Pose pose) {
        return render(design, pose, config.noiseSeed);
    }

    /** Renders {@code design} at {@code pose}; {@code noiseSeed} seeds the sensor noise of this frame. */
    public Rendered render(TargetDesign design, Pose pose, long noiseSeed) {
        int w = camera.width(), h = camera.height(), n = config.supersample;
        GrayF32 img = new GrayF32(w, h);
        double[] r = pose.rotation(), t = pose.translation();
        // plane normal in the camera frame is the third column of R; the plane passes through t
        double nx = r[2], ny = r[5], nz = r[8];
        double nDotT = nx * t[0] + ny * t[1] + nz * t[2];
        double ink = config.inkGrey, paper = config.paperGrey, bg = config.backgroundGrey;
        double invSamples = 1.0 / (n * n);
        int sw = w * n;
        IntStream.range(0, h).parallel().forEach(v -> {
            for (int u = 0; u < w; u++) {
                double sum = 0;
                for (int j = 0; j < n; j++) {
                    int sy = v * n + j;
                    for (int i = 0; i < n; i++) {
                        double x, y;
                        if (rayMap != null) {
                            int idx = (sy * sw + u * n + i) * 2;
                            x = rayMap[idx];
                            y = rayMap[idx + 1];
                        } else {
                            x = (u - 0.5 + (i + 0.5) / n - camera.cx()) / camera.fx();
                            y = (v - 0.5 + (j + 0.5) / n - camera.cy()) / camera.fy();
                        }
                        double denom = nx * x + ny * y + nz;
                        double lambda = denom == 0 ? -1 : nDotT / denom;
                        double grey = bg;
                        if (lambda > 0) {
                            double dx = lambda * x - t[0], dy = lambda * y - t[1], dz = lambda - t[2];
                            // P_t = Rᵀ (P_c - t), in millimetres
                            double px = (r[0] * dx + r[3] * dy + r[6] * dz) * 1000;
                            double py = (r[1] * dx + r[4] * dy + r[7] * dz) * 1000;
                            double refl = design.reflectance(px, py);
                            if (!Double.isNaN(refl)) grey = ink + refl * (paper - ink);
                        }
                        sum += grey;
                    }
                }
                img.unsafe_set(u, v, (float) (sum * invSamples));
            }
        });
        finish(img, noiseSeed);
        return new Rendered(img, Projection.visibleFeatures(design, camera, pose));
    }

    private void finish(GrayF32 img, long noiseSeed) {
        SplittableRandom rng = new SplittableRandom(noiseSeed);
        for (int i = 0; i < img.data.length; i++) {
            double g = img.data[i];
            if (config.noiseSigma > 0) g += config.noiseSigma * SensorNoise.gaussian(rng);
            if (config.quantise) g = Math.max(0, Math.min(255, Math.rint(g)));
            img.data[i] = (float) g;
        }
    }
}
