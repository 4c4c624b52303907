package org.targetbench.report;

import org.jfree.chart.JFreeChart;
import org.targetbench.arm.ArmModel;
import org.targetbench.arm.ArmRehearsalResult;
import org.targetbench.arm.ArmRunResult;
import org.targetbench.arm.ArmRunTrace;
import org.targetbench.pipeline.ArmWords;
import org.targetbench.arm.GainAdvice;
import org.targetbench.export.AtomicOutput;
import org.targetbench.export.Safety;
import org.targetbench.servo.ServoSet;

import javax.imageio.ImageIO;
import java.awt.Color;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.util.ArrayList;
import java.util.Base64;
import java.util.List;
import java.util.Locale;

/**
 * The arm rehearsal's charts (joint trajectories, manipulability over time, joint-limit margins), the three-view
 * drawing of the arm at the start, worst and final poses, and {@code arm-rehearsal.html} with the charts embedded.
 */
public final class ArmReport {
    public static final String JOINTS_CHART = "arm-joints.png";
    public static final String MANIPULABILITY_CHART = "arm-manipulability.png";
    public static final String MARGIN_CHART = "arm-limit-margin.png";
    public static final String DRAWING = "arm-views.png";
    public static final String HTML = "arm-rehearsal.html";

    private ArmReport() {}

    /** Writes the charts, the drawing and the page under {@code prefix}; returns the file names. */
    public static List<String> write(ArmRehearsalResult r, ServoSet set, String setName, AtomicOutput out, String prefix) throws IOException {
        Charts.png(jointsChart(r), out.file(prefix + JOINTS_CHART), Charts.WIDTH, Charts.HEIGHT);
        Charts.png(manipulabilityChart(r), out.file(prefix + MANIPULABILITY_CHART), Charts.WIDTH, Charts.HEIGHT);
        Charts.png(marginChart(r), out.file(prefix + MARGIN_CHART), Charts.WIDTH, Charts.HEIGHT);
        ImageIO.write(drawing(r, set), "png", out.file(prefix + DRAWING).toFile());
        Files.writeString(out.file(prefix + HTML), html(r, set, setName, out, prefix), StandardCharsets.UTF_8);
        return List.of(JOINTS_CHART, MANIPULABILITY_CHART, MARGIN_CHART, DRAWING, HTML);
    }

    /** The run drawn in detail: the traced run with the smallest manipulability. */
    static ArmRunTrace worstTrace(ArmRehearsalResult r) {
        ArmRunTrace best = null;
        double w = Double.POSITIVE_INFINITY;
        for (ArmRunTrace t : r.traces()) {
            double m = min(t.manipulability());
            if (best == null || m < w) { best = t; w = m; }
        }
        return best;
    }

    public static JFreeChart jointsChart(ArmRehearsalResult r) {
        ArmRunTrace t = worstTrace(r);
        List<Charts.Series> s = new ArrayList<>();
        if (t != null) for (int j = 0; j < ArmModel.JOINTS; j++) s.add(new Charts.Series("joint " + (j + 1), t.timeS(), t.jointsDeg()[j], null));
        return Charts.lines(t == null ? "Joint trajectories (no traced run)" : "Joint trajectories of run " + t.index() + " (" + t.outcome().label()
                + ", the traced run with the smallest manipulability)", "time, s", "joint angle, deg", s, false);
    }

    public static JFreeChart manipulabilityChart(ArmRehearsalResult r) {
        List<Charts.Series> s = new ArrayList<>();
        for (ArmRunTrace t : r.traces()) s.add(new Charts.Series("run " + t.index(), t.timeS(), t.manipulability(), null));
        JFreeChart c = Charts.lines("Manipulability sqrt(det(J J^T)) over time (Yoshikawa 1985), " + r.traces().size() + " runs", "time, s",
                "manipulability w (0 = singular)", s, false);
        Charts.horizontalLine(c, r.config().dampingThreshold, "damping starts below " + r.config().dampingThreshold);
        return c;
    }

    public static JFreeChart marginChart(ArmRehearsalResult r) {
        List<Charts.Series> s = new ArrayList<>();
        for (ArmRunTrace t : r.traces()) s.add(new Charts.Series("run " + t.index(), t.timeS(), t.marginDeg(), null));
        JFreeChart c = Charts.lines("Smallest joint-limit margin over time, " + r.traces().size() + " runs", "time, s",
                "distance of the nearest joint to its limit, deg", s, false);
        Charts.horizontalLine(c, 0, "limit");
        return c;
    }

    public static BufferedImage drawing(ArmRehearsalResult r, ServoSet set) {
        List<ArmDrawing.Pose> poses = new ArrayList<>();
        ArmRunResult run = r.worstRun().orElse(null);
        if (run != null) {
            poses.add(new ArmDrawing.Pose("start of run " + run.index(), run.startJointsRad(), Charts.COLOURS[0]));
            poses.add(new ArmDrawing.Pose("worst (smallest manipulability)", run.worstJointsRad(), Charts.COLOURS[5 % Charts.COLOURS.length]));
            poses.add(new ArmDrawing.Pose("final", run.finalJointsRad(), Charts.COLOURS[2]));
        } else poses.add(new ArmDrawing.Pose("reference", r.referenceJointsRad(), Color.BLACK));
        double w = 0, h = 0;
        for (var p : set.points()) {
            w = Math.max(w, p.targetXMm());
            h = Math.max(h, p.targetYMm());
        }
        return ArmDrawing.draw(r.arm(), r.handEye().transform(), set.camera(), r.baseToTarget(), Math.max(w, 10), Math.max(h, 10), poses);
    }

    private static String html(ArmRehearsalResult r, ServoSet set, String setName, AtomicOutput out, String prefix) throws IOException {
        var c = r.config();
        StringBuilder b = new StringBuilder();
        b.append("<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\"><title>Rehearsal on the arm</title>\n<style>")
                .append("body{font-family:sans-serif;max-width:1280px;margin:2em auto;color:#222}table{border-collapse:collapse}")
                .append("td,th{border:1px solid #ccc;padding:3px 8px;text-align:left}.safety{background:#fff4d6;border:1px solid #e6a700;padding:8px}")
                .append("img{max-width:100%;border:1px solid #ddd;margin:6px 0}</style></head><body>\n");
        b.append("<h1>Rehearsal on the arm</h1>\n<p class=\"safety\"><b>Safety.</b> ").append(esc(Safety.NOTICE)).append("</p>\n");
        b.append("<p class=\"safety\"><b>Not modelled.</b> ").append(esc(ArmWords.NOT_MODELLED)).append("</p>\n");
        b.append("<h2>Cell</h2>\n<p>").append(esc(String.format(Locale.ROOT,
                "Set %s (%d points). Arm: %s (%s). Hand-eye: %s, camera %.1f, %.1f, %.1f mm from the flange. Law %s, lambda %.3g 1/s, "
                        + "controller period %.0f ms, image latency %d periods; damping up to %.3g below manipulability %.3g; reference joints %s deg.",
                setName, set.points().size(), r.arm().name(), r.arm().origin(), r.handEye().method(), r.handEye().translationM()[0] * 1000,
                r.handEye().translationM()[1] * 1000, r.handEye().translationM()[2] * 1000, c.servo.law.cliName(), c.servo.lambda, c.servo.dtS * 1000,
                c.latencyFrames, c.dampingMax, c.dampingThreshold, degs(r.referenceJointsRad())))).append("</p>\n");
        b.append("<h2>Runs</h2>\n<p>").append(r.converged()).append(" of ").append(r.runs().size()).append(" runs converged.</p>\n");
        b.append("<table><tr><th>run</th><th>outcome</th><th>time, s</th><th>min manipulability (at s)</th><th>smallest limit margin</th>")
                .append("<th>peak joint speed / limit</th><th>damped, s</th><th>speed-scaled, s</th><th>flags</th></tr>\n");
        for (ArmRunResult x : r.runs())
            b.append(String.format(Locale.ROOT, "<tr><td>%d</td><td>%s</td><td>%.2f</td><td>%.3g (%.2f)</td><td>%.1f deg (joint %d)</td>"
                            + "<td>%.0f %% (joint %d)</td><td>%.2f</td><td>%.2f</td><td>%s</td></tr>\n", x.index(), x.outcome().label(), x.timeS(),
                    x.minManipulability(), x.minManipulabilityTimeS(), x.minLimitMarginDeg(), x.minLimitMarginJoint(), 100 * x.peakSpeedRatio(),
                    x.peakSpeedJoint(), x.dampedS(), x.speedScaledS(), esc(ArmWords.flags(x))));
        b.append("</table>\n<h2>Warnings</h2>\n<ul>\n");
        List<String> warnings = ArmWords.warnings(r);
        for (String w : warnings) b.append("<li>").append(esc(w)).append("</li>\n");
        if (warnings.isEmpty()) b.append("<li>None. A run without flags is not a clearance.</li>\n");
        b.append("</ul>\n");
        if (r.advice().isPresent()) {
            GainAdvice a = r.advice().get();
            b.append("<h2>Gain and latency</h2>\n<p>").append(esc(ArmWords.advice(a))).append("</p>\n<table><tr><th>lambda, 1/s</th><th>g = lambda T</th>")
                    .append("<th>converged</th><th>oscillating</th></tr>\n");
            for (GainAdvice.Row row : a.rows())
                b.append(String.format(Locale.ROOT, "<tr><td>%.3g</td><td>%.3f</td><td>%d of %d</td><td>%d</td></tr>\n", row.lambda(),
                        row.lambda() * a.periodS(), row.converged(), row.runs(), row.oscillating()));
            b.append("</table>\n");
        }
        b.append("<h2>Charts</h2>\n");
        for (String f : List.of(DRAWING, JOINTS_CHART, MANIPULABILITY_CHART, MARGIN_CHART))
            b.append("<p><img alt=\"").append(f).append("\" src=\"data:image/png;base64,")
                    .append(Base64.getEncoder().encodeToString(Files.readAllBytes(out.file(prefix + f)))).append("\"></p>\n");
        b.append("<p>Per-run figures: arm-rehearsal.csv. Summary: arm-rehearsal-summary.json.</p>\n</body></html>\n");
        return b.toString();
    }

    static String degs(double[] q) {
        StringBuilder s = new StringBuilder();
        for (int i = 0; i < q.length; i++) s.append(i == 0 ? "" : ", ").append(String.format(Locale.ROOT, "%.1f", Math.toDegrees(q[i])));
        return s.toString();
    }

    private static double min(double[] v) {
        double m = Double.POSITIVE_INFINITY;
        for (double x : v) m = Math.min(m, x);
        return m;
    }

    private static String esc(String s) {
        return s.replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;").replace("\"", "&quot;");
    }
}
