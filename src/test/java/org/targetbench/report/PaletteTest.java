package org.targetbench.report;

import org.junit.jupiter.api.Test;
import org.targetbench.detect.DetectorType;
import org.targetbench.track.TrackOutcome;

import java.awt.Color;
import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertTrue;

/** Tracking outcomes have colours of their own: none reads as a detector colour, none as another outcome. */
class PaletteTest {
    /** The sRGB to CIE L*a*b* conversion, checked on a published value before it is used. */
    @Test
    void labConversionMatchesAPublishedValue() {
        // sRGB (255, 0, 0) is L* 53.24, a* 80.09, b* 67.20 under D65 (Lindbloom's colour calculator, from memory)
        double[] red = lab(new Color(255, 0, 0));
        assertTrue(Math.abs(red[0] - 53.24) < 0.1 && Math.abs(red[1] - 80.09) < 0.3 && Math.abs(red[2] - 67.20) < 0.3,
                red[0] + " " + red[1] + " " + red[2]);
        double[] white = lab(Color.WHITE);
        assertTrue(Math.abs(white[0] - 100) < 0.01 && Math.abs(white[1]) < 0.05 && Math.abs(white[2]) < 0.05);
    }

    @Test
    void outcomeColoursAreApartFromDetectorColoursAndFromEachOther() {
        List<String> close = new ArrayList<>();
        TrackOutcome[] outcomes = TrackOutcome.values();
        for (int i = 0; i < outcomes.length; i++) {
            for (DetectorType d : DetectorType.values()) {
                double e = deltaE(Palette.of(outcomes[i]), Palette.of(d));
                if (e < Palette.OUTCOME_SEPARATION) close.add(outcomes[i] + " ~ " + d + " (" + Math.round(e) + ")");
            }
            for (int j = i + 1; j < outcomes.length; j++) {
                double e = deltaE(Palette.of(outcomes[i]), Palette.of(outcomes[j]));
                if (e < Palette.OUTCOME_SEPARATION) close.add(outcomes[i] + " ~ " + outcomes[j] + " (" + Math.round(e) + ")");
            }
        }
        assertTrue(close.isEmpty(), "too close: " + close);
    }

    /** CIE76 colour difference. */
    static double deltaE(Color a, Color b) {
        double[] p = lab(a), q = lab(b);
        return Math.sqrt((p[0] - q[0]) * (p[0] - q[0]) + (p[1] - q[1]) * (p[1] - q[1]) + (p[2] - q[2]) * (p[2] - q[2]));
    }

    /** sRGB (IEC 61966-2-1 transfer curve and D65 matrix) to CIE L*a*b* (CIE 15:2004). */
    static double[] lab(Color c) {
        double r = lin(c.getRed() / 255.0), g = lin(c.getGreen() / 255.0), b = lin(c.getBlue() / 255.0);
        double x = (0.4124564 * r + 0.3575761 * g + 0.1804375 * b) / 0.95047;
        double y = 0.2126729 * r + 0.7151522 * g + 0.0721750 * b;
        double z = (0.0193339 * r + 0.1191920 * g + 0.9503041 * b) / 1.08883;
        double fx = f(x), fy = f(y), fz = f(z);
        return new double[]{116 * fy - 16, 500 * (fx - fy), 200 * (fy - fz)};
    }

    private static double lin(double u) {
        return u <= 0.04045 ? u / 12.92 : Math.pow((u + 0.055) / 1.055, 2.4);
    }

    private static double f(double t) {
        double e = 216.0 / 24389;
        return t > e ? Math.cbrt(t) : (24389.0 / 27 * t + 16) / 116;
    }
}
