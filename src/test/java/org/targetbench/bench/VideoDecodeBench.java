package org.targetbench.bench;

import org.targetbench.source.FfmpegSource;
import org.targetbench.source.SourceFrame;

import java.nio.file.Path;
import java.util.Arrays;
import java.util.Locale;
import java.util.Optional;

/**
 * Decoding speed of the FFmpeg video source: milliseconds per frame to grey levels, for each file given, median of
 * five full passes after one warm-up pass (opening and the packet count included, divided over the frames). Not a
 * test (surefire skips this package); make 640 x 480 clips with Debian's ffmpeg, for instance from the demo frames,
 * and run from the repository root:
 * <pre>
 *   ./targetbench demo --out results/demo
 *   F="-y -stream_loop 24 -framerate 30 -i results/demo/frames/frame_%03d.png"
 *   ffmpeg $F -c:v libx264 -crf 20 -pix_fmt yuv420p /tmp/vga-h264.mp4
 *   ffmpeg $F -c:v libx265 -crf 20 -pix_fmt yuv420p -tag:v hvc1 /tmp/vga-hevc.mp4
 *   ffmpeg $F -c:v mjpeg -q:v 3 -pix_fmt yuvj420p /tmp/vga-mjpeg.avi
 *   mvn -B -q test-compile dependency:build-classpath -Dmdep.outputFile=target/test-classpath.txt -Dmdep.includeScope=test
 *   java -cp target/classes:target/test-classes:$(cat target/test-classpath.txt) org.targetbench.bench.VideoDecodeBench /tmp/vga-*
 * </pre>
 */
public final class VideoDecodeBench {
    private VideoDecodeBench() {}

    public static void main(String[] args) throws Exception {
        System.out.println("load average " + java.nio.file.Files.readString(Path.of("/proc/loadavg")).trim());
        for (String a : args) {
            Path p = Path.of(a);
            double[] ms = new double[6];
            int frames = 0;
            String size = "", codec = "";
            for (int run = 0; run < ms.length; run++) {
                long t0 = System.nanoTime();
                try (FfmpegSource s = FfmpegSource.open(p, null)) {
                    frames = 0;
                    Optional<SourceFrame> f;
                    while ((f = s.next()).isPresent()) frames++;
                    size = s.width() + "x" + s.height();
                    codec = s.codec();
                }
                ms[run] = (System.nanoTime() - t0) / 1e6 / Math.max(1, frames);
            }
            double[] timed = Arrays.copyOfRange(ms, 1, ms.length);
            Arrays.sort(timed);
            System.out.printf(Locale.ROOT, "%-28s %-6s %-8s %5d frames  %.2f ms/frame (median of %d passes)%n",
                    p.getFileName(), codec, size, frames, timed[timed.length / 2], timed.length);
        }
    }
}
