package org.targetbench.report;

import org.targetbench.detect.DetectorType;
import org.targetbench.track.TrackOutcome;

import java.awt.Color;

/**
 * One colour per detector, shared by overlays, charts and the app, chosen to stay distinct for common colour-blindness
 * (Okabe-Ito palette); and one colour per tracking outcome, a palette of its own so that an outcome never reads as a
 * detector: every outcome colour is at least {@link #OUTCOME_SEPARATION} (CIE76 colour difference, Lab) from every
 * detector colour and from every other outcome colour ({@code PaletteTest}).
 */
public final class Palette {
    private Palette() {}

    /**
     * Smallest CIE76 difference (Euclidean distance in CIE L*a*b*, D65) kept between an outcome colour and any detector
     * or other outcome colour. A difference of about 2.3 is just noticeable (Sharma and Bala, Digital Color Imaging
     * Handbook, 2003, from memory); 30 keeps the colours in different named categories (common practice, no source).
     */
    public static final double OUTCOME_SEPARATION = 30;

    /**
     * The colour of a tracking outcome: white for a track started on the frame, lime for one still tracked; the losses
     * magenta (forward-backward check), olive (left the image), crimson (residual too large), violet (diverged) and
     * cyan (too flat). Overlays draw them with a dark outline, so they read on light and dark image areas alike.
     */
    public static Color of(TrackOutcome o) {
        return switch (o) {
            case STARTED -> new Color(255, 255, 255);            // white
            case TRACKED -> new Color(128, 255, 0);              // lime
            case LOST_FORWARD_BACKWARD -> new Color(255, 0, 255); // magenta
            case LEFT_IMAGE -> new Color(128, 128, 0);           // olive
            case RESIDUAL_TOO_LARGE -> new Color(220, 20, 60);   // crimson
            case DIVERGED -> new Color(120, 40, 200);            // violet
            case TOO_FLAT -> new Color(0, 255, 255);             // cyan
        };
    }

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
