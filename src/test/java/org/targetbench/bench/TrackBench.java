package org.targetbench.bench;

import boofcv.struct.image.GrayF32;
import org.opencv.core.Core;
import org.opencv.core.CvType;
import org.opencv.core.Mat;
import org.opencv.core.MatOfByte;
import org.opencv.core.MatOfFloat;
import org.opencv.core.MatOfPoint2f;
import org.opencv.core.Point;
import org.opencv.core.Size;
import org.opencv.core.TermCriteria;
import org.opencv.video.Video;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Trajectories;
import org.targetbench.detect.Detection;
import org.targetbench.detect.Detectors;
import org.targetbench.detect.ShiTomasiConfig;
import org.targetbench.export.AtomicOutput;
import org.targetbench.export.TrackWriter;
import org.targetbench.pipeline.DemoScenario;
import org.targetbench.pipeline.TrackResult;
import org.targetbench.pipeline.TrackRun;
import org.targetbench.perturb.MotionConfig;
import org.targetbench.perturb.MotionSource;
import org.targetbench.target.TargetDesign;
import org.targetbench.track.BoofKltReference;
import org.targetbench.track.KltConfig;
import org.targetbench.track.KltTracker;
import org.targetbench.track.RespawnPolicy;
import org.targetbench.track.TrackFrame;
import org.targetbench.track.TrackScenes;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;

/**
 * Speed and memory of the KLT tracker (a benchmark, not a test; surefire skips this package).
 *
 * <p>Speed: 300 points tracked frame to frame through a sequence of 640 x 480 8-bit frames of a smooth texture drifting
 * by up to a few pixels per frame, one thread, side by side with OpenCV 4.9's {@code calcOpticalFlowPyrLK} on the same
 * frames with the same window (15 x 15), pyramid (4 levels) and stopping rule (20 iterations or 0.01 px). Ours keeps
 * each frame's pyramid for the next; OpenCV's Java binding rebuilds both pyramids on every call. Reported: median
 * time per frame, frames per second and the ratio, for forward tracking alone and with the forward-backward check
 * (OpenCV: a second, backward call).
 *
 * <p>Memory: a 10,000-frame synthetic run (320 x 240, strong vibration so tracks die and are topped up) through the
 * whole pipeline with the CSV writer; heap in use after a full GC before the run, early in it (frame 500), at its
 * last frame (tracker, metrics and writer all live) and after it.
 *
 * <p>Run (time OpenCV with glibc's mmap and trim thresholds raised, as the detector benchmark does):
 * <pre>
 * mvn -q -DskipTests test-compile dependency:build-classpath -Dmdep.outputFile=target/cp.txt -Dmdep.includeScope=test
 * MALLOC_MMAP_THRESHOLD_=268435456 MALLOC_TRIM_THRESHOLD_=268435456 \
 *   java -cp target/classes:target/test-classes:$(cat target/cp.txt) org.targetbench.bench.TrackBench [--frames N] [--no-heap] [--engines]
 * </pre>
 */
public final class TrackBench {
    static final int W = 640, H = 480, POINTS = 300, SEQUENCE = 40, ROUNDS = 12;

    public static void main(String[] args) throws Exception {
        int heapFrames = 10_000;
        boolean heap = true, engines = false;
        for (int i = 0; i < args.length; i++) {
            if (args[i].equals("--frames")) heapFrames = Integer.parseInt(args[++i]);
            else if (args[i].equals("--no-heap")) heap = false;
            else if (args[i].equals("--engines")) engines = true;
        }
        if (System.getenv("MALLOC_MMAP_THRESHOLD_") == null || System.getenv("MALLOC_TRIM_THRESHOLD_") == null)
            System.out.println("note: MALLOC_MMAP_THRESHOLD_ / MALLOC_TRIM_THRESHOLD_ not set; OpenCV will look slower than it is");
        nu.pattern.OpenCV.loadLocally();
        Core.setNumThreads(1);
        if (engines) engines();
        else speed();
        if (heap) heap(heapFrames);
    }

    /** A drifting texture: each frame moves by a seeded random step of up to 3 px. */
    static List<GrayF32> frames() {
        SplittableRandom rng = new SplittableRandom(5);
        List<GrayF32> out = new ArrayList<>();
        double x = 0, y = 0;
        for (int i = 0; i < SEQUENCE; i++) {
            out.add(TrackScenes.quantised(TrackScenes.texture(W, H, 9, x, y)));
            x += rng.nextDouble() * 6 - 3;
            y += rng.nextDouble() * 6 - 3;
        }
        return out;
    }

    static Mat mat(GrayF32 g) {
        Mat m = new Mat(g.height, g.width, CvType.CV_8UC1);
        byte[] b = new byte[g.width * g.height];
        for (int i = 0; i < b.length; i++) b[i] = (byte) Math.round(g.data[i]);
        m.put(0, 0, b);
        return m;
    }

    static void speed() {
        List<GrayF32> frames = frames();
        List<Mat> mats = frames.stream().map(TrackBench::mat).toList();
        ShiTomasiConfig st = new ShiTomasiConfig();
        st.maxFeatures = 2000;
        List<double[]> seeds = new ArrayList<>();
        for (Detection d : Detectors.create(st).detect(frames.get(0))) {
            boolean far = d.x() > 40 && d.y() > 40 && d.x() < W - 40 && d.y() < H - 40;
            for (double[] s : seeds) far &= Math.hypot(s[0] - d.x(), s[1] - d.y()) >= 8;
            if (far) seeds.add(new double[]{d.x(), d.y()});
            if (seeds.size() == POINTS) break;
        }
        System.out.printf(Locale.ROOT, "KLT speed: %d points, %dx%d, %d-frame sequence x %d rounds, one thread%n", seeds.size(), W, H, SEQUENCE, ROUNDS);
        System.out.printf(Locale.ROOT, "  load average %s%n", loadAverage());
        System.out.println("  row                                   ours p10 / p50 / p90 ms     OpenCV p10 / p50 / p90 ms    ratio of medians");
        for (boolean fb : new boolean[]{false, true})
            for (boolean corrected : new boolean[]{false, true}) {
                // rounds alternate between the two so that a change of machine load hits both alike
                List<Double> o = new ArrayList<>(), c = new ArrayList<>();
                for (int round = 0; round < ROUNDS; round++) {
                    double[] a = ours(frames, seeds, fb, corrected), b = opencv(mats, seeds, fb);
                    if (round < 2) continue; // warm-up
                    for (double v : a) o.add(v);
                    for (double v : b) c.add(v);
                }
                double[] ours = o.stream().mapToDouble(Double::doubleValue).toArray(), cv = c.stream().mapToDouble(Double::doubleValue).toArray();
                row((fb ? "KLT forward-backward" : "KLT forward only") + (corrected ? ", drift corr." : ", no drift corr."), ours, cv);
            }
        refinement(frames.get(0), mats.get(0));
        pipeline(frames, mats);
    }

    static String loadAverage() {
        try {
            return Files.readString(Path.of("/proc/loadavg")).trim();
        } catch (Exception e) {
            return "unknown";
        }
    }

    static void row(String name, double[] ours, double[] cv) {
        double[] o = pct(ours), c = pct(cv);
        System.out.printf(Locale.ROOT, "  %-36s  %6.2f / %6.2f / %6.2f      %6.2f / %6.2f / %6.2f         %.2fx%n",
                name, o[0], o[1], o[2], c[0], c[1], c[2], o[1] / c[1]);
    }

    /** p10, median, p90. */
    static double[] pct(double[] v) {
        double[] s = v.clone();
        Arrays.sort(s);
        return new double[]{s[(int) (0.1 * (s.length - 1))], s[s.length / 2], s[(int) (0.9 * (s.length - 1))]};
    }

    /**
     * The refinement stage alone on the same points: our SubpixelRefiner (window radius 4, 10 iterations, 0.01 px)
     * against OpenCV's cornerSubPix (winSize 4 x 4 half-size, zeroZone none, 10 iterations or 0.01 px), 500
     * Shi-Tomasi points of one frame, 200 runs after 30 warm-up runs.
     */
    static void refinement(GrayF32 frame, Mat mat) {
        ShiTomasiConfig st = new ShiTomasiConfig();
        st.refine.enabled = false;
        List<Detection> pts = Detectors.create(st).detect(frame);
        org.targetbench.detect.SubpixelRefiner refiner = new org.targetbench.detect.SubpixelRefiner(new org.targetbench.detect.RefineConfig());
        Point[] p = pts.stream().map(d -> new Point(d.x(), d.y())).toArray(Point[]::new);
        TermCriteria crit = new TermCriteria(TermCriteria.COUNT + TermCriteria.EPS, 10, 0.01);
        int runs = 200, warm = 30;
        double[] ours = new double[runs], cv = new double[runs];
        for (int i = -warm; i < runs; i++) {
            long t0 = System.nanoTime();
            refiner.refine(frame, pts);
            long t1 = System.nanoTime();
            MatOfPoint2f c = new MatOfPoint2f(p);
            long t2 = System.nanoTime();
            org.opencv.imgproc.Imgproc.cornerSubPix(mat, c, new Size(4, 4), new Size(-1, -1), crit);
            long t3 = System.nanoTime();
            if (i >= 0) {
                ours[i] = (t1 - t0) / 1e6;
                cv[i] = (t3 - t2) / 1e6;
            }
        }
        row("refinement, " + pts.size() + " points", ours, cv);
    }

    /**
     * Per-frame pipeline: Shi-Tomasi seeding every 30 frames (500 candidates, top-up to 300 tracks) plus KLT with the
     * forward-backward check, against OpenCV's goodFeaturesToTrack (500, quality 0.01, minDistance 8, blockSize 5)
     * every 30 frames plus calcOpticalFlowPyrLK forward and backward. Our tracker seeds through its own respawn path
     * on the seeding frames.
     */
    static void pipeline(List<GrayF32> frames, List<Mat> mats) {
        int total = 120;
        List<Double> ours = new ArrayList<>(), cv = new ArrayList<>();
        for (int round = 0; round < 4; round++) {
            KltConfig k = new KltConfig();
            k.maxTracks = POINTS;
            k.respawn = RespawnPolicy.OFF;
            ShiTomasiConfig st = new ShiTomasiConfig();
            KltTracker t = null;
            for (int i = 0; i < total; i++) {
                GrayF32 f = frames.get(i % frames.size());
                long t0 = System.nanoTime();
                if (i % 30 == 0) {
                    t = new KltTracker(k, st);
                    t.process(f, i);
                } else {
                    t.process(f, i);
                }
                long dt = System.nanoTime() - t0;
                if (round >= 1) ours.add(dt / 1e6);
            }
            TermCriteria crit = new TermCriteria(TermCriteria.COUNT + TermCriteria.EPS, 20, 0.01);
            Size win = new Size(15, 15);
            MatOfPoint2f prev = null;
            for (int i = 0; i < total; i++) {
                Mat m = mats.get(i % mats.size()), before = mats.get((i + mats.size() - 1) % mats.size());
                long t0 = System.nanoTime();
                if (i % 30 == 0) {
                    org.opencv.core.MatOfPoint corners = new org.opencv.core.MatOfPoint();
                    org.opencv.imgproc.Imgproc.goodFeaturesToTrack(m, corners, POINTS, 0.01, 8, new Mat(), 5, false, 0.04);
                    prev = new MatOfPoint2f(corners.toArray());
                } else {
                    MatOfPoint2f next = new MatOfPoint2f(), back = new MatOfPoint2f();
                    MatOfByte s1 = new MatOfByte(), s2 = new MatOfByte();
                    Video.calcOpticalFlowPyrLK(before, m, prev, next, s1, new MatOfFloat(), win, 3, crit, 0, 1e-4);
                    Video.calcOpticalFlowPyrLK(m, before, next, back, s2, new MatOfFloat(), win, 3, crit, 0, 1e-4);
                    prev = next;
                }
                long dt = System.nanoTime() - t0;
                if (round >= 1) cv.add(dt / 1e6);
            }
        }
        row("pipeline: seed/30 + KLT 300 + FB", ours.stream().mapToDouble(Double::doubleValue).toArray(),
                cv.stream().mapToDouble(Double::doubleValue).toArray());
    }

    /**
     * {@code --engines}: the tracker against the engine it replaced ({@link BoofKltReference}, BoofCV's float KLT, same
     * rows to the bit: {@code KltEqualityTest}) on the speed rows' frames and points, rounds alternating; no OpenCV.
     */
    static void engines() {
        List<GrayF32> frames = frames();
        ShiTomasiConfig st = new ShiTomasiConfig();
        st.maxFeatures = 2000;
        List<double[]> seeds = new ArrayList<>();
        for (Detection d : Detectors.create(st).detect(frames.get(0))) {
            boolean far = d.x() > 40 && d.y() > 40 && d.x() < W - 40 && d.y() < H - 40;
            for (double[] s : seeds) far &= Math.hypot(s[0] - d.x(), s[1] - d.y()) >= 8;
            if (far) seeds.add(new double[]{d.x(), d.y()});
            if (seeds.size() == POINTS) break;
        }
        System.out.printf(Locale.ROOT, "KLT engines: %d points, %dx%d, load average %s%n", seeds.size(), W, H, loadAverage());
        System.out.println("  row                                   ours p10 / p50 / p90 ms     BoofCV engine p10 / p50 / p90   ratio of medians");
        for (boolean fb : new boolean[]{false, true})
            for (boolean corrected : new boolean[]{false, true}) {
                KltConfig k = new KltConfig();
                k.driftCorrection = corrected;
                k.maxTracks = POINTS;
                k.minSpacing = 0;
                k.forwardBackward = fb;
                List<Double> o = new ArrayList<>(), c = new ArrayList<>();
                for (int round = 0; round < ROUNDS; round++) {
                    KltTracker a = new KltTracker(k, null);
                    BoofKltReference b = new BoofKltReference(k, null);
                    a.start(frames.get(0), 0, seeds);
                    b.start(frames.get(0), 0, seeds);
                    for (int i = 1; i < frames.size(); i++) {
                        long t0 = System.nanoTime();
                        a.process(frames.get(i), i);
                        long t1 = System.nanoTime();
                        b.process(frames.get(i), i);
                        long t2 = System.nanoTime();
                        if (round >= 2) {
                            o.add((t1 - t0) / 1e6);
                            c.add((t2 - t1) / 1e6);
                        }
                    }
                }
                row((fb ? "KLT forward-backward" : "KLT forward only") + (corrected ? ", drift corr." : ", no drift corr."),
                        o.stream().mapToDouble(Double::doubleValue).toArray(), c.stream().mapToDouble(Double::doubleValue).toArray());
            }
    }

    /** One round of our tracker over the sequence: ms per frame. */
    static double[] ours(List<GrayF32> frames, List<double[]> seeds, boolean fb, boolean corrected) {
        KltConfig k = new KltConfig();
        k.driftCorrection = corrected;
        k.maxTracks = POINTS;
        k.minSpacing = 0;
        k.forwardBackward = fb;
        List<Double> ms = new ArrayList<>();
        int alive = 0;
        {
            KltTracker t = new KltTracker(k, null);
            t.start(frames.get(0), 0, seeds);
            for (int i = 1; i < frames.size(); i++) {
                long t0 = System.nanoTime();
                TrackFrame f = t.process(frames.get(i), i);
                long dt = System.nanoTime() - t0;
                ms.add(dt / 1e6);
                alive = f.alive();
            }
        }
        return ms.stream().mapToDouble(Double::doubleValue).toArray();
    }

    /** One round of OpenCV over the sequence: ms per frame. */
    static double[] opencv(List<Mat> mats, List<double[]> seeds, boolean fb) {
        TermCriteria crit = new TermCriteria(TermCriteria.COUNT + TermCriteria.EPS, 20, 0.01);
        Size win = new Size(15, 15);
        List<Double> ms = new ArrayList<>();
        Point[] start = seeds.stream().map(s -> new Point(s[0], s[1])).toArray(Point[]::new);
        {
            MatOfPoint2f prev = new MatOfPoint2f(start);
            for (int i = 1; i < mats.size(); i++) {
                MatOfPoint2f next = new MatOfPoint2f(), back = new MatOfPoint2f();
                MatOfByte status = new MatOfByte(), status2 = new MatOfByte();
                MatOfFloat err = new MatOfFloat(), err2 = new MatOfFloat();
                long t0 = System.nanoTime();
                Video.calcOpticalFlowPyrLK(mats.get(i - 1), mats.get(i), prev, next, status, err, win, 3, crit, 0, 1e-4);
                if (fb) Video.calcOpticalFlowPyrLK(mats.get(i), mats.get(i - 1), next, back, status2, err2, win, 3, crit, 0, 1e-4);
                long dt = System.nanoTime() - t0;
                ms.add(dt / 1e6);
                prev = next;
            }
        }
        return ms.stream().mapToDouble(Double::doubleValue).toArray();
    }

    static double median(double[] v) {
        double[] s = v.clone();
        Arrays.sort(s);
        return s[s.length / 2];
    }

    static long heapAfterGc() throws InterruptedException {
        Runtime rt = Runtime.getRuntime();
        for (int i = 0; i < 3; i++) {
            System.gc();
            Thread.sleep(50);
        }
        return rt.totalMemory() - rt.freeMemory();
    }

    static void heap(int frames) throws Exception {
        TargetDesign d = DemoScenario.target();
        CameraModel cam = CameraModel.pinhole(320, 240, 266, 266, 159.5, 119.5);
        MotionConfig c = new MotionConfig();
        c.frames = frames;
        c.exposureMs = 24;
        c.lightingDrift = 0.15;
        // at half the demo's focal length, 30 mm of ringing moves the image as 15 mm does at full size: blur that changes
        // from frame to frame ends tracks, and top-up replaces them
        c.exposureMs = 28;
        MotionSource src = new MotionSource("vibration", d, cam, Trajectories.vibration(d.widthMm(), d.heightMm(), DemoScenario.STANDOFF_M, 30, 3),
                DemoScenario.lighting(), c);
        KltConfig k = new KltConfig();
        k.respawn = RespawnPolicy.TOP_UP;
        k.maxTracks = 100;
        Path dir = Files.createTempDirectory("trackbench");
        long before = heapAfterGc();
        long[] mid = new long[2];
        int early = Math.min(500, frames - 1);
        long t0 = System.nanoTime();
        TrackResult r;
        try (AtomicOutput out = AtomicOutput.open(dir.resolve("run")); TrackWriter w = new TrackWriter(out)) {
            r = new TrackRun(k, new ShiTomasiConfig(), 30, false, 0).run(src, (rows, fig) -> {
                w.frame(rows, fig);
                if (rows.frame() == early || rows.frame() == frames - 1) {
                    try {
                        mid[rows.frame() == early ? 0 : 1] = heapAfterGc();
                    } catch (InterruptedException e) {
                        Thread.currentThread().interrupt();
                    }
                }
            }, (done, total, what) -> { }, () -> false);
            w.finish(r);
            out.commit();
        }
        long after = heapAfterGc();
        long csv = Files.size(dir.resolve("run/tracks.csv"));
        System.out.printf(Locale.ROOT, "Heap over a %d-frame synthetic run (320x240 vibration, top-up to %d tracks, %d tracks started, tracks.csv %d MB) in %.0f s:%n",
                r.score().frames(), k.maxTracks, r.score().tracksStarted(), csv >> 20, (System.nanoTime() - t0) / 1e9);
        System.out.printf(Locale.ROOT, "  heap after GC: before the run %.1f MB; during it, at frame %d %.1f MB and at the last frame %d %.1f MB; after it %.1f MB%n",
                before / 1e6, early, mid[0] / 1e6, frames - 1, mid[1] / 1e6, after / 1e6);
        try (var s = Files.walk(dir)) {
            s.sorted(java.util.Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
        }
    }
}
