package org.targetbench.perturb;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.stream.Collectors;

/**
 * One swept parameter of one kind of degradation, with its unit, its neutral value (no degradation) and its
 * documented default range of {@value #DEFAULT_LEVELS} levels. Written on the command line as {@code kind.name}, e.g.
 * {@code blur.motion}; a bare kind means its primary parameter (the first listed for that kind).
 */
public enum Perturbation {
    /** Exposure/gain factor applied to every grey level, then clipped at 255. */
    GAIN(PerturbKind.LIGHTING, "gain", "x", 1.0, 0.2, 2.0, false),
    /** Grey levels added to every pixel (black level shift), clipped to 0..255. */
    OFFSET(PerturbKind.LIGHTING, "offset", "grey levels", 0, -80, 80, false),
    /** Gamma applied to normalised grey levels, g' = 255 (g / 255)^γ. */
    GAMMA(PerturbKind.LIGHTING, "gamma", "", 1.0, 0.4, 2.5, false),
    /** Linear illumination fall-off across the frame, left to right: factor 1 at the left edge, 1 - p/100 at the right. */
    GRADIENT(PerturbKind.LIGHTING, "gradient", "%", 0, 0, 80, false),
    /** Exposure reduced to this fraction with photon shot noise and read noise of a small sensor. */
    LOW_LIGHT(PerturbKind.LIGHTING, "low-light", "x exposure", 1.0, 1.0, 0.05, false),
    /** Gaussian defocus blur of this standard deviation. */
    DEFOCUS(PerturbKind.BLUR, "defocus", "px sigma", 0, 0, 5, false),
    /** Linear motion blur of this length along {@link PerturbConfig#motionAngleDeg}. */
    MOTION(PerturbKind.BLUR, "motion", "px", 0, 0, 25, false),
    /** Additive Gaussian noise of this standard deviation. */
    GAUSSIAN_NOISE(PerturbKind.NOISE, "gaussian", "grey levels sigma", 0, 0, 25, false),
    /** Fraction of pixels set to 0 or 255 at random. */
    SALT_PEPPER(PerturbKind.NOISE, "salt-pepper", "fraction", 0, 0, 0.10, false),
    /** JPEG quality factor (IJG scale, 100 best). */
    JPEG_QUALITY(PerturbKind.JPEG, "quality", "IJG quality", 100, 95, 10, false),
    /** Out-of-plane tilt of the target about its horizontal axis. */
    TILT(PerturbKind.VIEWPOINT, "tilt", "deg", 0, 0, 60, true),
    /** In-plane rotation about the image centre. */
    ROTATION(PerturbKind.VIEWPOINT, "rotation", "deg", 0, 0, 180, true),
    /** Zoom about the image centre. */
    SCALE(PerturbKind.VIEWPOINT, "scale", "x", 1.0, 0.5, 2.0, true);

    /** Levels of a default sweep. */
    public static final int DEFAULT_LEVELS = 8;

    private final PerturbKind kind;
    private final String name;
    private final String unit;
    private final double neutral;
    private final double from;
    private final double to;
    private final boolean geometric;

    Perturbation(PerturbKind kind, String name, String unit, double neutral, double from, double to, boolean geometric) {
        this.kind = kind;
        this.name = name;
        this.unit = unit;
        this.neutral = neutral;
        this.from = from;
        this.to = to;
        this.geometric = geometric;
    }

    public PerturbKind kind() { return kind; }
    /** Parameter name within its kind. */
    public String parameterName() { return name; }
    /** {@code kind.name}, as written on the command line and in CSV files. */
    public String id() { return kind.cliName() + "." + name; }
    public String unit() { return unit; }
    /** Value that leaves the frame unchanged. */
    public double neutral() { return neutral; }
    /** First value of the default range. */
    public double from() { return from; }
    /** Last value of the default range (the harshest). */
    public double to() { return to; }
    /** True when the perturbation moves points (and so transforms the truth). */
    public boolean geometric() { return geometric; }

    /** Smallest and largest value this parameter accepts. */
    public double[] validRange() {
        return switch (this) {
            case GAIN -> new double[]{0.01, 10};
            case OFFSET -> new double[]{-255, 255};
            case GAMMA -> new double[]{0.1, 10};
            case GRADIENT -> new double[]{0, 100};
            case LOW_LIGHT -> new double[]{0.001, 1};
            case DEFOCUS -> new double[]{0, 20};
            case MOTION -> new double[]{0, 100};
            case GAUSSIAN_NOISE -> new double[]{0, 128};
            case SALT_PEPPER -> new double[]{0, 1};
            case JPEG_QUALITY -> new double[]{1, 100};
            case TILT -> new double[]{-80, 80};
            case ROTATION -> new double[]{-360, 360};
            case SCALE -> new double[]{0.1, 10};
        };
    }

    /** @throws IllegalArgumentException naming the value and the accepted range */
    public void checkValue(double v) {
        double[] r = validRange();
        if (!(v >= r[0] && v <= r[1]))
            throw new IllegalArgumentException(id() + " level " + v + " is out of range; accepted " + r[0] + " .. " + r[1]
                    + (unit.isEmpty() ? "" : " " + unit));
    }

    /** {@code n} values evenly spaced over the default range, the first the mildest. */
    public double[] defaultLevels(int n) {
        if (n < 2) throw new IllegalArgumentException("a sweep needs at least 2 levels, got " + n);
        double[] v = new double[n];
        for (int i = 0; i < n; i++) v[i] = from + (to - from) * i / (n - 1);
        if (this == JPEG_QUALITY) for (int i = 0; i < n; i++) v[i] = Math.rint(v[i]);
        return v;
    }

    /** Parses {@code kind.name} or a bare kind (its primary parameter). */
    public static Perturbation parse(String s) {
        String n = s.trim().toLowerCase(Locale.ROOT);
        for (Perturbation p : values()) if (p.id().equals(n)) return p;
        if (!n.contains(".")) return primary(PerturbKind.parse(n));
        throw new IllegalArgumentException("unknown kind \"" + s.trim() + "\"; choose from " + PerturbKind.allNames()
                + " or one of " + Arrays.stream(values()).map(Perturbation::id).collect(Collectors.joining(", ")));
    }

    /** The parameter a bare kind stands for. */
    public static Perturbation primary(PerturbKind kind) {
        return switch (kind) {
            case LIGHTING -> GAIN;
            case BLUR -> DEFOCUS;
            case NOISE -> GAUSSIAN_NOISE;
            case JPEG -> JPEG_QUALITY;
            case VIEWPOINT -> TILT;
        };
    }

    public static List<Perturbation> ofKind(PerturbKind kind) {
        List<Perturbation> out = new ArrayList<>();
        for (Perturbation p : values()) if (p.kind == kind) out.add(p);
        return out;
    }

    public String label() {
        return id() + (unit.isEmpty() ? "" : " (" + unit + ")");
    }

    @Override public String toString() { return id(); }

    static String fmt(double v) { return String.format(Locale.ROOT, "%g", v); }
}
