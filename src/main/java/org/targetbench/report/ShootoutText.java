package org.targetbench.report;

import org.targetbench.pipeline.ShootoutRun;

import java.util.Locale;
import java.util.Optional;

/** The shoot-out's sentences about matched and generic detectors and dot bias, rendered in one place from the figures. */
public final class ShootoutText {
    /** What the side-by-side figures are. */
    public static final String SIDES_NOTE = "Each design is scored with the detector built for its features (x-corner saddles for "
            + "checkerboards, x-corner fields and markers; dot centres for dot grids; none for separate squares, whose L-corners are "
            + "what the generic corner detectors are built for) and with the best generic detector by envelope score: envelope score, "
            + "points on the square-on view, points robust across the envelope, localisation RMS against the projected features over "
            + "the views. The dot-centre bias is the distance between the centre of an imaged dot and the image of its centre "
            + "(Heikkila 2000); the bias-corrected RMS removes it using the known pose.";

    private ShootoutText() {}

    public static Optional<ShootoutRun.Side> matchedSide(ShootoutRun.Entry e) {
        return e.sides().stream().filter(ShootoutRun.Side::matched).findFirst();
    }

    public static Optional<ShootoutRun.Side> genericSide(ShootoutRun.Entry e) {
        return e.sides().stream().filter(s -> !s.matched()).findFirst();
    }

    /** "X-corner saddles: envelope 0.93, 48 points, 48 robust, RMS 0.03 px", or why there is none. */
    public static String matched(ShootoutRun.Entry e) {
        return matchedSide(e).map(ShootoutText::side).orElse("none (the generic detectors are this design's match)");
    }

    public static String generic(ShootoutRun.Entry e) {
        return genericSide(e).map(ShootoutText::side).orElse("-");
    }

    public static String dotBias(ShootoutRun.Entry e) {
        if (Double.isNaN(e.dotBiasPx())) return "- (no dots)";
        String s = String.format(Locale.ROOT, "%.3f px", e.dotBiasPx());
        Optional<ShootoutRun.Side> m = matchedSide(e);
        if (m.isPresent() && !Double.isNaN(m.get().correctedRmsPx()))
            s += String.format(Locale.ROOT, "; dot RMS %s px, %s px with the bias corrected from the pose",
                    num(m.get().localisationRmsPx(), 3), num(m.get().correctedRmsPx(), 3));
        return s;
    }

    static String side(ShootoutRun.Side s) {
        return String.format(Locale.ROOT, "%s: envelope %s, %d points, %d robust, RMS %s", s.detector().label(),
                num(s.envelopeScore(), 3), s.points(), s.robustPoints(),
                Double.isNaN(s.localisationRmsPx()) ? "- (no point within 3 px of a designed feature)" : num(s.localisationRmsPx(), 3) + " px");
    }

    private static String num(double v, int decimals) {
        return Double.isNaN(v) ? "-" : String.format(Locale.ROOT, "%." + decimals + "f", v);
    }
}
