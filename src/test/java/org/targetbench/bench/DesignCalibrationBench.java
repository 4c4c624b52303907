package org.targetbench.bench;

import boofcv.struct.image.GrayF32;
import org.targetbench.camera.Calibration;
import org.targetbench.camera.CalibrationConfig;
import org.targetbench.camera.CalibrationResult;
import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.export.TargetPdf;
import org.targetbench.export.TargetPreview;
import org.targetbench.export.TargetSvg;
import org.targetbench.source.ImageFiles;
import org.targetbench.source.RenderConfig;
import org.targetbench.source.SyntheticRenderer;
import org.targetbench.source.TargetFile;
import org.targetbench.target.PageSize;
import org.targetbench.target.PrintConfig;
import org.targetbench.target.PrintLayout;
import org.targetbench.target.TargetDesign;
import org.targetbench.target.TargetGenerators;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.stream.Stream;

/**
 * Speed of the two interactive steps of choosing a target, against the figures they should meet: a calibration on 14
 * VGA views within 5 s, and a design's PDF + SVG + PNG within 2 s. Not a test (surefire skips this package); run from
 * the repository root:
 * <pre>
 *   mvn -B -q test-compile dependency:build-classpath -Dmdep.outputFile=target/test-classpath.txt -Dmdep.includeScope=test
 *   java -cp target/classes:target/test-classes:$(cat target/test-classpath.txt) org.targetbench.bench.DesignCalibrationBench
 * </pre>
 * Each step is timed cold (the first call in a fresh JVM, as a user's single command sees it, without JVM start-up)
 * and warm (median of the following runs). Calibration is timed on the 13 reference photos (Debian opencv-doc; the
 * package lacks left10.jpg) and on 14 rendered VGA views; detection and the solve both count. Files are written to a
 * temporary folder, deleted afterwards.
 */
public final class DesignCalibrationBench {
    private static final int WARM_RUNS = 5;

    private DesignCalibrationBench() {}

    public static void main(String[] args) throws Exception {
        System.out.println(BenchInfo.describe());
        Path tmp = Files.createTempDirectory("tb-bench");
        try {
            designs(tmp);
            calibrationOnPhotos();
            calibrationOnRenders();
        } finally {
            try (Stream<Path> s = Files.walk(tmp)) {
                s.sorted((a, b) -> b.compareTo(a)).forEach(p -> p.toFile().delete());
            }
        }
    }

    private static void designs(Path tmp) throws Exception {
        List<Path> dirs;
        try (Stream<Path> s = Files.list(Path.of("target-designs"))) {
            dirs = s.filter(d -> Files.exists(d.resolve("target.json"))).sorted().toList();
        }
        System.out.println("Design sheets (layout + target.pdf + target.svg + preview.png), limit 2 s each:");
        for (Path d : dirs) {
            TargetDesign design = TargetFile.read(d.resolve("target.json"));
            double[] ms = new double[WARM_RUNS + 1];
            for (int i = 0; i <= WARM_RUNS; i++) {
                long t0 = System.nanoTime();
                PrintLayout layout = PrintLayout.of(design, PageSize.A4, new PrintConfig()).orElseThrow();
                TargetPdf.write(layout, tmp.resolve("t.pdf"));
                TargetSvg.write(layout, tmp.resolve("t.svg"));
                TargetPreview.write(layout, tmp.resolve("t.png"));
                ms[i] = (System.nanoTime() - t0) / 1e6;
            }
            report(design.id() + " (" + design.drawing().size() + " shapes)", ms);
        }
    }

    private static void calibrationOnPhotos() throws Exception {
        List<Path> files;
        try (Stream<Path> s = Files.list(Path.of("src/test/resources/reference/calibration"))) {
            files = s.filter(p -> p.getFileName().toString().endsWith(".jpg")).sorted().toList();
        }
        List<GrayF32> images = new ArrayList<>();
        for (Path f : files) images.add(ImageFiles.read(f));
        System.out.println("Calibration, limit 5 s for 14 VGA views:");
        report(images.size() + " reference photos (9x6 board)", timeCalibration(images, new Calibration.Board(9, 6, 25)));
    }

    private static void calibrationOnRenders() {
        TargetDesign board = TargetGenerators.checkerboard("bench-board", 7, 10, 20, 20);
        CameraModel cam = new CameraModel(640, 480, 610, 606, 324.3, 236.8, -0.12, 0.05, 0, 0.0005, -0.0004);
        RenderConfig rc = new RenderConfig();
        rc.noiseSigma = 1;
        SyntheticRenderer r = new SyntheticRenderer(cam, rc);
        List<GrayF32> images = new ArrayList<>();
        for (int i = 0; i < 14; i++) {
            double a = 2 * Math.PI * i / 14;
            Pose p = Pose.facing(board.widthMm(), board.heightMm(), 0.40 + 0.02 * (i % 3), 30 * Math.cos(a), 30 * Math.sin(a), 10 * (i % 5) - 20,
                    0.04 * Math.cos(a), 0.03 * Math.sin(a));
            images.add(r.render(board, p, i).image());
        }
        report("14 rendered VGA views (9x6 board)", timeCalibration(images, new Calibration.Board(9, 6, 20)));
    }

    private static double[] timeCalibration(List<GrayF32> images, Calibration.Board board) {
        double[] ms = new double[WARM_RUNS + 1];
        CalibrationResult last = null;
        for (int run = 0; run <= WARM_RUNS; run++) {
            long t0 = System.nanoTime();
            Calibration cal = new Calibration(board, new CalibrationConfig());
            List<String> names = new ArrayList<>();
            List<Optional<double[]>> found = new ArrayList<>();
            for (int i = 0; i < images.size(); i++) {
                names.add("view_" + i);
                found.add(cal.detect(images.get(i)));
            }
            last = (CalibrationResult) cal.solve(images.get(0).width, images.get(0).height, names, found);
            ms[run] = (System.nanoTime() - t0) / 1e6;
        }
        System.out.printf(Locale.ROOT, "    %d of %d views used, RMS %.3f px, fx %.2f fy %.2f cx %.2f cy %.2f%n", last.usedViews(), images.size(),
                last.rmsPx(), last.camera().fx(), last.camera().fy(), last.camera().cx(), last.camera().cy());
        return ms;
    }

    private static void report(String what, double[] ms) {
        double[] warm = Arrays.copyOfRange(ms, 1, ms.length);
        Arrays.sort(warm);
        System.out.printf(Locale.ROOT, "  %-44s cold %8.1f ms   warm median %8.1f ms%n", what, ms[0], warm[warm.length / 2]);
    }

    /** Machine facts printed with the figures. */
    static final class BenchInfo {
        static String describe() {
            return String.format(Locale.ROOT, "Java %s, %d cores, max heap %d MiB", System.getProperty("java.version"),
                    Runtime.getRuntime().availableProcessors(), Runtime.getRuntime().maxMemory() >> 20);
        }
    }
}
