package org.targetbench.detect;

import org.targetbench.target.FeatureKind;

import java.util.Arrays;
import java.util.Locale;
import java.util.stream.Collectors;

/** The point detectors on the bench. */
public enum DetectorType {
    /** Harris &amp; Stephens 1988 corner response det(M) - k trace(M)². */
    HARRIS("harris", "Harris"),
    /** Shi &amp; Tomasi 1994 minimum-eigenvalue corner response. */
    SHI_TOMASI("shi-tomasi", "Shi-Tomasi"),
    /** Rosten &amp; Drummond 2006 FAST segment test, both polarities. */
    FAST("fast", "FAST"),
    /** Bay et al. 2008 Fast-Hessian blob detector (the detector stage of SURF). */
    SURF("surf", "SURF-style"),
    /** Lowe 2004 difference-of-Gaussian extrema (the detector stage of SIFT). */
    SIFT("sift", "SIFT-style"),
    /** Dot centres: local threshold, filtered connected components, grey-weighted centroid or ellipse fit (design-matched for dot grids). */
    DOTS("dots", "Dot centres"),
    /** X-corner saddle points (Abeles 2019 intensity, via BoofCV) with sub-pixel saddle refinement (design-matched for checkerboards). */
    XCORNER("xcorner", "X-corners");

    private final String cliName;
    private final String label;

    DetectorType(String cliName, String label) {
        this.cliName = cliName;
        this.label = label;
    }

    /** Name used on the command line and in CSV files. */
    public String cliName() { return cliName; }

    /** True for the detectors built for one kind of target feature (dots, x-corners) rather than for any texture. */
    public boolean designMatched() { return this == DOTS || this == XCORNER; }

    /**
     * Whether this detector is built to find designed features of kind {@code k}. A design-matched detector finds its
     * own kind only: the x-corner saddle detector no L-corner or dot centre (an L-corner has no saddle), the dot
     * detector no corner (derived from what each responds to). The generic detectors are built for no designed kind
     * in particular and are judged on every designed feature, as before L-corners were listed. Scores that count found
     * truth (localisation error and the fraction of true features found) count only the kinds a detector finds.
     */
    public boolean finds(FeatureKind k) {
        return switch (this) {
            case XCORNER -> k == FeatureKind.X_CORNER;
            case DOTS -> k == FeatureKind.DOT_CENTRE;
            default -> true;
        };
    }

    /** Name shown to people. */
    public String label() { return label; }

    /** Parses a command-line name, case-insensitive. */
    public static DetectorType parse(String name) {
        String n = name.trim().toLowerCase(Locale.ROOT);
        for (DetectorType t : values()) if (t.cliName.equals(n)) return t;
        throw new IllegalArgumentException("unknown detector \"" + name.trim() + "\"; choose from " + allNames());
    }

    public static String allNames() {
        return Arrays.stream(values()).map(DetectorType::cliName).collect(Collectors.joining(", "));
    }
}
