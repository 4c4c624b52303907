package org.targetbench.pipeline;

import org.targetbench.camera.CameraModel;
import org.targetbench.camera.Trajectories;
import org.targetbench.camera.Trajectory;
import org.targetbench.perturb.MotionConfig;
import org.targetbench.perturb.MotionSource;
import org.targetbench.target.TargetDesign;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The named synthetic motions of the demo scenario's target ({@link DemoScenario}): what {@code synthetic:NAME} means
 * on the command line. A name may carry settings, {@code NAME,key=value,...}; the keys are listed in
 * {@link #KEYS} and docs/formats.md.
 */
public final class MotionScenarios {
    /** Motion names, in the order they are listed to people. */
    public static final List<String> NAMES = List.of("approach", "converge", "orbit", "shake", "vibration", "still");
    /** Settings a name may carry, with what they mean. */
    public static final Map<String, String> KEYS = keys();

    /** Radial distortion of the lens {@code converge} is seen through (a wide-angle board lens; invented). */
    public static final double CONVERGE_K1 = -0.27;
    /** Starting and final distance of {@code converge}, metres: a 1.5x zoom. */
    public static final double CONVERGE_FROM_M = 0.40, CONVERGE_TO_M = 0.26;

    private MotionScenarios() {}

    private static Map<String, String> keys() {
        Map<String, String> k = new LinkedHashMap<>();
        k.put("frames", "number of frames");
        k.put("fps", "frame rate, frames per second");
        k.put("exposure_ms", "exposure for motion blur, ms (0: no blur)");
        k.put("noise", "sensor noise, grey levels standard deviation");
        k.put("drift", "lighting drift: gain varies by ± this fraction");
        k.put("drift_period_s", "period of the lighting drift, s");
        k.put("amplitude_mm", "vibration amplitude or shake translation, mm");
        k.put("frequency_hz", "vibration frequency, Hz");
        k.put("amplitude_deg", "orbit swing or shake rotation, degrees");
        k.put("roll_deg", "converge: starting roll, degrees");
        k.put("seed", "seed of noise and shake");
        return k;
    }

    /** One line per motion, for help texts. */
    public static String describe(String name) {
        return switch (name) {
            case "approach" -> "the arm closes in from 0.40 m and an oblique view to the square-on reference at 0.25 m, then holds still";
            case "converge" -> "a servo convergence through a wide-angle lens (k1 = " + CONVERGE_K1 + "): the camera closes from 0.40 m to 0.26 m (1.5x zoom) while a 20° roll dies away";
            case "orbit" -> "the camera swings ±25° around the target on a figure of eight at 0.25 m (period 5 s)";
            case "shake" -> "hand-held shake around the reference view: ±1° and ±2 mm, 0.5-6 Hz";
            case "vibration" -> "cell vibration: 0.3 mm at 12 Hz sideways at the reference view";
            case "still" -> "the camera holds the reference view; only noise changes (for jitter)";
            default -> throw new IllegalArgumentException("unknown motion " + name);
        };
    }

    /**
     * Builds the source for {@code spec} = {@code NAME[,key=value...]}.
     *
     * @throws IllegalArgumentException naming an unknown motion, an unknown key or a bad value
     */
    public static MotionSource open(String spec) {
        String[] parts = spec.trim().split(",");
        String name = parts[0].trim().toLowerCase(Locale.ROOT);
        if (!NAMES.contains(name))
            throw new IllegalArgumentException("unknown synthetic motion \"" + parts[0].trim() + "\"; choose from " + String.join(", ", NAMES));
        Map<String, Double> v = new LinkedHashMap<>();
        for (int i = 1; i < parts.length; i++) {
            String p = parts[i].trim();
            if (p.isEmpty()) continue;
            int eq = p.indexOf('=');
            String key = eq < 0 ? p : p.substring(0, eq).trim().toLowerCase(Locale.ROOT);
            if (eq < 0 || !KEYS.containsKey(key))
                throw new IllegalArgumentException("synthetic:" + name + ": unknown setting \"" + p + "\"; use key=value with keys " + String.join(", ", KEYS.keySet()));
            try {
                double d = Double.parseDouble(p.substring(eq + 1).trim());
                if (!Double.isFinite(d)) throw new NumberFormatException();
                v.put(key, d);
            } catch (NumberFormatException e) {
                throw new IllegalArgumentException("synthetic:" + name + ": " + key + " must be a finite number, got \"" + p.substring(eq + 1).trim() + "\"");
            }
        }
        MotionConfig c = new MotionConfig();
        c.frames = (int) Math.round(v.getOrDefault("frames", (double) c.frames));
        c.fps = v.getOrDefault("fps", c.fps);
        c.exposureMs = v.getOrDefault("exposure_ms", c.exposureMs);
        c.noiseSigma = v.getOrDefault("noise", DemoScenario.lighting().noiseSigma);
        c.lightingDrift = v.getOrDefault("drift", c.lightingDrift);
        c.lightingPeriodS = v.getOrDefault("drift_period_s", c.lightingPeriodS);
        c.seed = Math.round(v.getOrDefault("seed", 1.0));
        try {
            c.checkValidity();
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException("synthetic:" + name + ": " + e.getMessage());
        }
        TargetDesign d = DemoScenario.target();
        double w = d.widthMm(), h = d.heightMm(), s = DemoScenario.STANDOFF_M;
        double seconds = c.frames / c.fps;
        Trajectory t = switch (name) {
            case "approach" -> Trajectories.approach(w, h, s, 0.40, 2.0 / 3 * seconds);
            case "converge" -> Trajectories.converge(w, h, CONVERGE_TO_M, CONVERGE_FROM_M, v.getOrDefault("roll_deg", 20.0), seconds);
            case "orbit" -> Trajectories.orbit(w, h, s, v.getOrDefault("amplitude_deg", 25.0), 5.0);
            case "shake" -> Trajectories.shake(w, h, s, v.getOrDefault("amplitude_deg", 1.0), v.getOrDefault("amplitude_mm", 2.0), c.seed);
            case "vibration" -> Trajectories.vibration(w, h, s, v.getOrDefault("amplitude_mm", 0.3), v.getOrDefault("frequency_hz", 12.0));
            default -> Trajectories.still(w, h, s);
        };
        return new MotionSource(name, d, name.equals("converge") ? convergeCamera() : DemoScenario.camera(), t, DemoScenario.lighting(), c);
    }

    /** The demo's flange camera with the wide-angle lens of {@code converge}: radial distortion k1 only. */
    public static CameraModel convergeCamera() {
        CameraModel p = DemoScenario.camera();
        return new CameraModel(p.width(), p.height(), p.fx(), p.fy(), p.cx(), p.cy(), CONVERGE_K1, 0, 0, 0, 0);
    }
}
