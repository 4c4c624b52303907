package org.targetbench.source;

import com.github.sarxos.webcam.Webcam;

import java.awt.Dimension;
import java.awt.image.BufferedImage;
import java.io.OutputStream;
import java.io.PrintStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.TimeUnit;
import java.util.function.Supplier;
import java.util.stream.Stream;

/**
 * Live cameras through webcam-capture 0.3.12 (its default driver: native grabbers loaded with BridJ; on Linux it
 * needs Debian's {@code libv4l-0}). Discovery waits at most a timeout, and every failure it can meet on a machine
 * without a camera (no device, no native library, a driver error) becomes "no camera", with the reason. The native
 * code may print to the console while it loads; that output is suppressed for the duration of the call.
 */
public final class Webcams {
    /** Longest wait for camera discovery. */
    public static final Duration DISCOVERY_TIMEOUT = Duration.ofSeconds(10);

    private Webcams() {}

    /** A camera found by discovery. */
    public record CameraInfo(int index, String name, List<String> sizes) {}

    /** What discovery found: the cameras, or none and why. */
    public record Discovery(List<CameraInfo> cameras, String problem) {
        public Discovery {
            cameras = List.copyOf(cameras);
        }
    }

    private static boolean linux() {
        return System.getProperty("os.name", "").toLowerCase(Locale.ROOT).contains("linux");
    }

    /** Lists the cameras; never throws. */
    public static Discovery discover(Duration timeout) {
        if (linux()) {
            try (Stream<Path> s = Files.list(Path.of("/dev"))) {
                if (s.noneMatch(p -> p.getFileName().toString().startsWith("video")))
                    return new Discovery(List.of(), "no video devices (/dev/video*) on this machine");
            } catch (Exception e) {
                // cannot look: let the driver decide
            }
        }
        try {
            List<Webcam> cams = quietly(() -> {
                try {
                    return Webcam.getWebcams(timeout.toMillis(), TimeUnit.MILLISECONDS);
                } catch (java.util.concurrent.TimeoutException e) {
                    throw new IllegalStateException("camera discovery timed out after " + timeout.toSeconds() + " s");
                }
            });
            List<CameraInfo> out = new ArrayList<>();
            for (int i = 0; i < cams.size(); i++) {
                Webcam w = cams.get(i);
                List<String> sizes = new ArrayList<>();
                try {
                    for (Dimension d : w.getViewSizes()) sizes.add(d.width + "x" + d.height);
                } catch (RuntimeException | LinkageError ignored) {
                    // sizes are a courtesy
                }
                out.add(new CameraInfo(i, w.getName(), sizes));
            }
            return new Discovery(out, out.isEmpty() ? "the camera driver found no camera" : "");
        } catch (Throwable t) {
            String hint = linux() ? " (on Debian, webcam support needs the libv4l-0 package: apt-get install libv4l-0)" : "";
            return new Discovery(List.of(), "the camera driver could not start: " + ImageFiles.oneLine(t) + hint);
        }
    }

    /**
     * Opens camera {@code index} at its largest offered size up to 640 x 480 (or its default).
     *
     * @throws SourceException when there is no camera, the index does not exist, or the camera cannot be opened
     */
    public static WebcamSource open(int index, Duration timeout) throws SourceException {
        return open(index, null, timeout);
    }

    /**
     * Opens camera {@code index} at {@code wxh} (one of {@link CameraInfo#sizes()}), or as
     * {@link #open(int, Duration)} does when {@code wxh} is null.
     */
    public static WebcamSource open(int index, String wxh, Duration timeout) throws SourceException {
        if (index < 0) throw new SourceException("webcam index must be >= 0, got " + index);
        Discovery d = discover(timeout);
        if (d.cameras().isEmpty())
            throw new SourceException(index == 0 ? "no camera found: " + d.problem() : "webcam " + index + " does not exist: no camera found (" + d.problem() + ")");
        if (index >= d.cameras().size())
            throw new SourceException("webcam " + index + " does not exist; found " + d.cameras().size() + " camera"
                    + (d.cameras().size() == 1 ? "" : "s") + ": " + String.join(", ", d.cameras().stream().map(c -> c.index() + " = " + c.name()).toList()));
        try {
            Webcam w = quietly(() -> Webcam.getWebcams().get(index));
            Dimension best = null;
            for (Dimension s : w.getViewSizes()) {
                if (wxh != null) {
                    if (wxh.equals(s.width + "x" + s.height)) best = s;
                } else if (s.width <= 640 && s.height <= 480 && (best == null || s.width * s.height > best.width * best.height)) {
                    best = s;
                }
            }
            if (wxh != null && best == null) throw new SourceException("webcam " + index + " does not offer " + wxh + "; it offers "
                    + String.join(", ", java.util.Arrays.stream(w.getViewSizes()).map(v -> v.width + "x" + v.height).toList()));
            if (best != null) w.setViewSize(best);
            if (!quietly(w::open)) throw new SourceException("webcam " + index + " (" + w.getName() + ") could not be opened; is another program using it?");
            Dimension size = w.getViewSize();
            Camera cam = new Camera() {
                @Override public String name() { return "webcam " + index + " (" + w.getName() + ")"; }
                @Override public int width() { return size.width; }
                @Override public int height() { return size.height; }
                @Override public BufferedImage grab() { return w.isOpen() ? w.getImage() : null; }
                @Override public void close() { w.close(); }
            };
            return new WebcamSource(cam, cam.name() + " at " + size.width + "x" + size.height);
        } catch (SourceException e) {
            throw e;
        } catch (Throwable t) {
            throw new SourceException("webcam " + index + " could not be opened: " + ImageFiles.oneLine(t));
        }
    }

    /** Runs {@code call} with the console silenced: native loaders print to stdout and stderr. */
    private static synchronized <T> T quietly(Supplier<T> call) {
        PrintStream out = System.out, err = System.err;
        PrintStream sink = new PrintStream(OutputStream.nullOutputStream());
        try {
            System.setOut(sink);
            System.setErr(sink);
            return call.get();
        } finally {
            System.setOut(out);
            System.setErr(err);
        }
    }
}
