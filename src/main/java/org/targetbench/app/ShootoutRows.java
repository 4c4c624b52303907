package org.targetbench.app;

import org.targetbench.camera.FeasibilityReport;
import org.targetbench.pipeline.ShootoutRun;
import org.targetbench.report.ShootoutText;

import java.util.Locale;

/** The shoot-out view's ranking table: its columns, one tooltip per column, and one row per design. */
final class ShootoutRows {
    private ShootoutRows() {}

    /** What the figures are, shown under the table (never a guarantee). */
    static final String NOTE = "Figures describe the rendered bench conditions, not a guarantee. Ranked: feasibility failures last, then designs with "
            + "at least 4 robust points, then the lower best cond(L*), then more robust points, then more coverage.";
    static final String[] COLUMNS = {"Rank", "Design", "Check", "Best detector", "Envelope score (0..1)", "Points", "Robust points",
            "cond(L*)", "σmin of L*", "Coverage", "Servo choice", "Design-matched detector", "Best generic detector", "Dot-centre bias"};
    static final String[] TIPS = {
            "Place in the ranking. Feasibility failures go last, then designs with at least 4 robust points, then the lower best cond(L*), "
                    + "then more robust points, then more coverage (the command line's order).",
            "The design's id (its target.json).",
            "The feasibility check at this stand-off and tilt: PASS, WARN or FAIL, coloured and in words, with the count of warnings and "
                    + "failures. Each line's threshold and its source are in the Targets view's check.",
            "The detector with the best envelope score on this design.",
            "Mean repeatability under the weakest swept condition inside the envelope (every swept level without an envelope file), 0..1: "
                    + "share of points found again within 1.5 px after mapping by the known homography (Schmid et al. 2000). No threshold: "
                    + "designs are compared.",
            "Points the best detector finds on the square-on view, count.",
            String.format(Locale.ROOT, "Points of the square-on view found again within 1.5 px in at least %.0f %% of the envelope's conditions, "
                    + "count. A servo set needs 4 (the ranking puts designs with fewer behind).", 100 * ShootoutRun.ROBUST_SHARE),
            "Condition number of the interaction matrix of the best 4-point servo set at the stand-off (translational columns scaled by "
                    + "the depth), unit-free; lower is better conditioned. No fixed threshold: designs are compared.",
            "Smallest singular value of that set's interaction matrix (same scaling), unit-free; larger is better.",
            "Share of a 4 x 4 grid of image cells holding at least one of the best detector's points, percent.",
            "Which detector gave the best-conditioned 4-point set, or why no acceptable set exists.",
            "The detector built for the design's features, with its envelope score (0..1), points, robust points and localisation RMS "
                    + "(pixels, against the projected features over the views).",
            "The best generic detector by envelope score, with the same figures.",
            "Worst perspective bias of the imaged dot centres over the views, pixels (Heikkila 2000); '-' for designs without dots."};

    /** One design's row, numbers with their units. */
    static Object[] row(ShootoutRun.Entry e) {
        FeasibilityReport f = e.feasibility();
        return new Object[]{e.rank(), e.design().id(),
                f.overall() + " (" + f.count(FeasibilityReport.Status.WARN) + " warn, " + f.count(FeasibilityReport.Status.FAIL) + " fail)",
                e.bestDetector().label(), Ui.fmt(e.envelopeScore(), 3), e.points(), e.robustPoints(), cond(e),
                Double.isNaN(e.bestSigmaMin()) ? "-" : Ui.fmt(e.bestSigmaMin(), 4), Ui.pct(e.coverage()).replace("%", " %"), e.servoNote(),
                ShootoutText.matched(e), ShootoutText.generic(e), ShootoutText.dotBias(e)};
    }

    static String cond(ShootoutRun.Entry e) {
        return Double.isNaN(e.bestCondition()) ? "no acceptable set" : Ui.fmt(e.bestCondition(), 2);
    }
}
