package org.targetbench.bench;

import boofcv.BoofVersion;
import org.opencv.core.Core;
import org.targetbench.Version;

import java.io.IOException;
import java.io.PrintStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Optional;
import java.util.stream.Stream;

/** The header of the report: what ran where, so that numbers from different machines are not confused. */
final class BenchEnvironment {
    private BenchEnvironment() {}

    static void printHeader(BenchOptions options, BenchFrames frames, PrintStream out) {
        Runtime rt = Runtime.getRuntime();
        out.println("TargetBench detector speed benchmark (targetbench " + Version.get() + ")");
        out.printf(Locale.ROOT, "JVM      %s %s (%s), max heap %d MiB%n", System.getProperty("java.vm.name"),
                System.getProperty("java.runtime.version"), System.getProperty("java.vm.vendor"), rt.maxMemory() >> 20);
        out.printf(Locale.ROOT, "CPU      %d cores available to the JVM; %s; %s %s%n", rt.availableProcessors(),
                cpuModel().orElse("model unknown"), System.getProperty("os.name"), System.getProperty("os.arch"));
        out.printf(Locale.ROOT, "Ours     BoofCV %s, internal threading off%n", BoofVersion.VERSION);
        out.printf(Locale.ROOT, "OpenCV   %s (org.openpnp build), Core.setNumThreads(1): %d thread(s) for the comparison%n",
                Core.VERSION, Core.getNumThreads());
        out.printf(Locale.ROOT, "malloc   MALLOC_MMAP_THRESHOLD_=%s MALLOC_TRIM_THRESHOLD_=%s%n",
                env("MALLOC_MMAP_THRESHOLD_"), env("MALLOC_TRIM_THRESHOLD_"));
        out.printf(Locale.ROOT, "Frames   %d demo frames, %dx%d; ours gets grey float, OpenCV the same frames rounded to 8 bits%n",
                frames.count(), frames.width(), frames.height());
        out.printf(Locale.ROOT, "Runs     %d timed runs after %d warm-up runs per measurement (per thread when all cores)%n",
                options.runs(), options.warmup());
        out.printf(Locale.ROOT, "Load     %s%n", loadAverage()
                .map(l -> "1-min load average " + l + " at start (above about 0.5, other processes share the cores and slow every column)")
                .orElse("unknown"));
        if (options.quick()) out.println("QUICK SMOKE RUN: too few runs for a measurement; do not quote these numbers.");
        out.println();
    }

    private static String env(String name) {
        String v = System.getenv(name);
        return v == null ? "(unset)" : v;
    }

    /** The 1-minute load average from /proc/loadavg, where there is one. */
    private static Optional<String> loadAverage() {
        try {
            String[] f = Files.readString(Path.of("/proc/loadavg")).trim().split("\\s+");
            return f.length > 0 ? Optional.of(f[0]) : Optional.empty();
        } catch (IOException | RuntimeException e) {
            return Optional.empty();
        }
    }

    /** The first "model name" of /proc/cpuinfo, where there is one. */
    private static Optional<String> cpuModel() {
        Path info = Path.of("/proc/cpuinfo");
        if (!Files.isReadable(info)) return Optional.empty();
        try (Stream<String> lines = Files.lines(info)) {
            return lines.filter(l -> l.startsWith("model name")).findFirst()
                    .map(l -> l.substring(l.indexOf(':') + 1).trim());
        } catch (IOException | RuntimeException e) {
            return Optional.empty();
        }
    }
}
