package org.targetbench.report;

import org.targetbench.detect.DetectorType;

import java.awt.Color;

/** One colour per detector, shared by overlays, charts and the app. Chosen to stay distinct for common colour-blindness (Okabe-Ito palette). */
public final class Palette {
    private Palette() {}

    public static Color of(DetectorType t) {
        return switch (t) {
            case HARRIS -> new Color(230, 159, 0);     // orange
            case SHI_TOMASI -> new Color(86, 180, 233); // sky blue
            case FAST -> new Color(204, 121, 167);     // reddish purple
            case SURF -> new Color(0, 158, 115);       // bluish green
            case SIFT -> new Color(240, 228, 66);      // yellow
            case DOTS -> new Color(0, 114, 178);       // blue
            case XCORNER -> new Color(213, 94, 0);     // vermillion
        };
    }
}
