package org.targetbench.bench;

import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Pose;
import org.targetbench.servo.ControlLaw;
import org.targetbench.servo.Rehearsal;
import org.targetbench.servo.RehearsalConfig;
import org.targetbench.servo.RehearsalResult;
import org.targetbench.servo.RunResult;
import org.targetbench.servo.ServoFixtures;
import org.targetbench.servo.ServoSet;

import java.util.Arrays;
import java.util.Locale;

/**
 * Speed of the servo rehearsal: 1,000 starts of up to 2,000 control steps each, for sets of 4 and 8 points and every
 * control law, on all cores and on one. The convergence test is switched off (threshold 1e-9 px) so that every run
 * takes the full 2,000 steps: the worst case. Target: at most 5 s per configuration on 2 cores.
 *
 * <p>Run: {@code mvn -q test-compile dependency:build-classpath -Dmdep.outputFile=target/cp.txt} and then
 * {@code java -cp target/classes:target/test-classes:$(cat target/cp.txt) org.targetbench.bench.RehearsalBench}.
 * Prints one line per configuration; the median of 3 repetitions after one warm-up.
 */
public final class RehearsalBench {
    private static final int STARTS = 1000;
    private static final int STEPS = 2000;
    private static final int REPEATS = 3;

    private RehearsalBench() {}

    public static void main(String[] args) throws InterruptedException {
        int cores = Runtime.getRuntime().availableProcessors();
        System.out.printf(Locale.ROOT, "Rehearsal benchmark: %d starts x %d steps, %d cores, Java %s%n", STARTS, STEPS, cores,
                System.getProperty("java.version"));
        for (int points : new int[]{4, 8})
            for (ControlLaw law : ControlLaw.values())
                for (int threads : cores > 1 ? new int[]{cores, 1} : new int[]{1}) {
                    if (threads == 1 && law != ControlLaw.MEAN) continue; // one-thread baseline for one law only
                    measure(set(points, false), points, law, threads, "pinhole");
                }
        measure(set(8, true), 8, ControlLaw.MEAN, cores, "distorted, 0.2 px noise");
    }

    private static void measure(ServoSet set, int points, ControlLaw law, int threads, String what) throws InterruptedException {
        RehearsalConfig c = new RehearsalConfig();
        c.starts = STARTS;
        c.law = law;
        c.dtS = 0.01;
        c.timeoutS = STEPS * c.dtS;
        c.convergedPx = 1e-9;
        c.threads = threads;
        c.tracedRuns = 0;
        c.envelopeMm = new double[]{10, 10, 10};
        c.envelopeDeg = new double[]{5, 5, 10};
        if (what.contains("noise")) c.noiseSigmaPx = 0.2;
        Rehearsal.run(set, c); // warm-up
        double[] t = new double[REPEATS];
        long steps = 0;
        for (int i = 0; i < REPEATS; i++) {
            long t0 = System.nanoTime();
            RehearsalResult r = Rehearsal.run(set, c);
            t[i] = (System.nanoTime() - t0) / 1e9;
            steps = r.runs().stream().mapToLong(RunResult::steps).sum();
        }
        Arrays.sort(t);
        System.out.printf(Locale.ROOT, "%d points, law %-7s, %d thread%s, %-24s %6.2f s  (%d steps, %.2f us of CPU per step)%n", points, law.cliName(),
                threads, threads == 1 ? " " : "s", what, t[REPEATS / 2], steps, 1e6 * t[REPEATS / 2] * threads / steps);
    }

    private static ServoSet set(int points, boolean distorted) {
        CameraModel cam = distorted ? new CameraModel(640, 480, 532, 532, 319.5, 239.5, -0.12, 0.05, 0, 0.0005, -0.0004) : ServoFixtures.VGA;
        Pose pose = Pose.facing(200, 200, 0.4, 0, 0, 0, 0, 0);
        double[][] ring = new double[points][];
        for (int i = 0; i < points; i++) {
            double a = 2 * Math.PI * i / points + 0.3;
            ring[i] = new double[]{100 + 60 * Math.cos(a), 100 + 45 * Math.sin(a)};
        }
        return ServoFixtures.set(cam, pose, ring);
    }
}
