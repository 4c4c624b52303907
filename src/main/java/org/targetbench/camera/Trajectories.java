package org.targetbench.camera;

import java.util.SplittableRandom;

/**
 * Camera paths of an eye-in-hand cell around a planar target of {@code widthMm} x {@code heightMm}, all ending or
 * centred on the square-on view from {@code standoffM} (the servo's reference pose). Built on
 * {@link Pose#facing}: the target turns about its own centre, which is the camera orbiting that centre.
 *
 * <p>Invented for this tool; amplitudes are typical of a small cell (common practice, no source).
 */
public final class Trajectories {
    private Trajectories() {}

    /**
     * The arm approaches from an oblique far view to the square-on reference with a smooth start and stop
     * (cubic ease u²(3 - 2u)), then holds still.
     *
     * @param fromM        starting distance, metres
     * @param moveSeconds  duration of the approach; the camera holds still afterwards
     */
    public static Trajectory approach(double widthMm, double heightMm, double standoffM, double fromM, double moveSeconds) {
        check(standoffM, "standoff");
        check(fromM, "starting distance");
        check(moveSeconds, "approach duration");
        return t -> {
            double u = Math.min(1, Math.max(0, t / moveSeconds));
            double r = 1 - u * u * (3 - 2 * u);  // 1 at the start, 0 on arrival
            return Pose.facing(widthMm, heightMm, standoffM + (fromM - standoffM) * r, 12 * r, -9 * r, 15 * r, 0.03 * r, -0.02 * r);
        };
    }

    /**
     * The last stretch of an image-based servo convergence: from a rolled, slightly tilted far view the camera closes
     * in on the square-on reference while the roll and tilts die away, all on one smooth ease u²(3 - 2u) over the whole
     * duration (no hold). Roll dominates, as in an IBVS convergence from a rotated start (derived: the roll error is
     * what a point-feature law corrects slowest; common practice, no source, for the sizes).
     *
     * @param fromM       starting distance, metres (the zoom is fromM / standoffM)
     * @param fromRollDeg starting roll about the optical axis, degrees
     * @param moveSeconds duration of the convergence
     */
    public static Trajectory converge(double widthMm, double heightMm, double standoffM, double fromM, double fromRollDeg, double moveSeconds) {
        check(standoffM, "standoff");
        check(fromM, "starting distance");
        check(moveSeconds, "convergence duration");
        return t -> {
            double u = Math.min(1, Math.max(0, t / moveSeconds));
            double r = 1 - u * u * (3 - 2 * u);
            return Pose.facing(widthMm, heightMm, standoffM + (fromM - standoffM) * r, 6 * r, -5 * r, fromRollDeg * r, 0.01 * r, -0.008 * r);
        };
    }

    /**
     * The camera swings around the target centre at constant distance on a figure of eight: tilt about the target's
     * y axis A sin(2πt/T), about its x axis (A/3) sin(4πt/T).
     *
     * @param amplitudeDeg largest tilt A, degrees
     * @param periodSeconds period T of the swing
     */
    public static Trajectory orbit(double widthMm, double heightMm, double standoffM, double amplitudeDeg, double periodSeconds) {
        check(standoffM, "standoff");
        check(periodSeconds, "orbit period");
        return t -> {
            double a = 2 * Math.PI * t / periodSeconds;
            return Pose.facing(widthMm, heightMm, standoffM, amplitudeDeg / 3 * Math.sin(2 * a), amplitudeDeg * Math.sin(a), 0, 0, 0);
        };
    }

    /**
     * Hand-held shake around the reference view: on each of the five axes (two tilts, roll, two shifts) a sum of four
     * sines between 0.5 and 6 Hz with seeded random phases and amplitudes falling as 1/f, normalised so that an axis
     * never exceeds the given amplitude.
     *
     * @param rotationDeg    typical tilt and roll excursion, degrees
     * @param translationMm  typical sideways excursion, millimetres
     */
    public static Trajectory shake(double widthMm, double heightMm, double standoffM, double rotationDeg, double translationMm, long seed) {
        check(standoffM, "standoff");
        SplittableRandom rng = new SplittableRandom(seed);
        double[] freq = {0.5, 1.3, 2.9, 6.0};
        double[][] phase = new double[5][freq.length];
        for (double[] p : phase) for (int k = 0; k < p.length; k++) p[k] = rng.nextDouble() * 2 * Math.PI;
        // weights 1/f normalised to sum 1, so no axis ever exceeds its amplitude
        double norm = 0;
        for (double f : freq) norm += 1 / f;
        double[] weight = new double[freq.length];
        for (int k = 0; k < freq.length; k++) weight[k] = 1 / freq[k] / norm;
        return t -> {
            double[] v = new double[5];
            for (int axis = 0; axis < 5; axis++)
                for (int k = 0; k < freq.length; k++) v[axis] += weight[k] * Math.sin(2 * Math.PI * freq[k] * t + phase[axis][k]);
            return Pose.facing(widthMm, heightMm, standoffM, rotationDeg * v[0], rotationDeg * v[1], rotationDeg * v[2],
                    translationMm / 1000 * v[3], translationMm / 1000 * v[4]);
        };
    }

    /**
     * Cell vibration: the camera shakes sideways at one frequency, x = A sin(2πft) along a direction 30 degrees from
     * the image x axis (a machine's dominant mode seen by a flange camera).
     *
     * @param amplitudeMm  amplitude A, millimetres
     * @param frequencyHz  frequency f, hertz
     */
    public static Trajectory vibration(double widthMm, double heightMm, double standoffM, double amplitudeMm, double frequencyHz) {
        check(standoffM, "standoff");
        check(frequencyHz, "vibration frequency");
        double cx = Math.cos(Math.toRadians(30)), cy = Math.sin(Math.toRadians(30));
        return t -> {
            double s = amplitudeMm / 1000 * Math.sin(2 * Math.PI * frequencyHz * t);
            return Pose.facing(widthMm, heightMm, standoffM, 0, 0, 0, s * cx, s * cy);
        };
    }

    /** The camera holds the reference view: only noise and lighting change (for jitter). */
    public static Trajectory still(double widthMm, double heightMm, double standoffM) {
        check(standoffM, "standoff");
        Pose p = Pose.facing(widthMm, heightMm, standoffM, 0, 0, 0, 0, 0);
        return t -> p;
    }

    private static void check(double v, String what) {
        if (!(v > 0) || !Double.isFinite(v)) throw new IllegalArgumentException(what + " must be > 0, got " + v);
    }
}
