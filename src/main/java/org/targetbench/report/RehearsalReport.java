package org.targetbench.report;

import org.jfree.chart.JFreeChart;
import org.targetbench.export.AtomicOutput;
import org.targetbench.export.Safety;
import org.targetbench.servo.RehearsalConfig;
import org.targetbench.servo.RehearsalResult;
import org.targetbench.servo.RunOutcome;
import org.targetbench.servo.RunResult;
import org.targetbench.servo.RunTrace;
import org.targetbench.servo.ServoPoint;
import org.targetbench.servo.ServoSet;

import java.awt.Color;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.util.ArrayList;
import java.util.Base64;
import java.util.EnumMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The rehearsal's charts and a small self-contained {@code rehearsal.html} (the charts embedded as data URIs):
 * the image error against time for the traced runs, the camera paths in the reference camera frame, and a convergence
 * map of every start over the envelope.
 */
public final class RehearsalReport {
    public static final String ERROR_CHART = "rehearsal-error.png";
    public static final String PATHS_CHART = "rehearsal-paths.png";
    public static final String MAP_CHART = "rehearsal-map.png";
    public static final String HTML = "rehearsal.html";

    private RehearsalReport() {}

    /** Colour of each outcome in the convergence map. */
    static Color colour(RunOutcome o) {
        return switch (o) {
            case CONVERGED -> Charts.COLOURS[2];
            case TIMEOUT -> Charts.COLOURS[1];
            case LEFT_FIELD_OF_VIEW -> Charts.COLOURS[5];
            case TRACK_LOST -> Charts.COLOURS[3];
            case RETREATED -> Charts.COLOURS[0];
            case SINGULAR -> Color.BLACK;
        };
    }

    /** Writes the three charts and the HTML page under {@code prefix} ("" or "folder/"); returns the file names. */
    public static List<String> write(RehearsalResult r, ServoSet set, String setName, AtomicOutput out, String prefix) throws IOException {
        Charts.png(errorChart(r), out.file(prefix + ERROR_CHART), Charts.WIDTH, Charts.HEIGHT);
        Charts.png(pathsChart(r), out.file(prefix + PATHS_CHART), Charts.WIDTH, Charts.HEIGHT);
        Charts.png(mapChart(r), out.file(prefix + MAP_CHART), Charts.WIDTH, Charts.HEIGHT);
        Files.writeString(out.file(prefix + HTML), html(r, set, setName, out, prefix), StandardCharsets.UTF_8);
        return List.of(ERROR_CHART, PATHS_CHART, MAP_CHART, HTML);
    }

    private static String runName(RunTrace t) {
        return "run " + t.index() + " (" + t.outcome().label() + ")";
    }

    /** Image error against time for the sample runs, log scale, with the convergence threshold. */
    public static JFreeChart errorChart(RehearsalResult r) {
        RehearsalConfig c = r.config();
        List<Charts.Series> err = new ArrayList<>();
        for (RunTrace t : r.traces()) err.add(new Charts.Series(runName(t), t.timeS(), t.errorPx(), null));
        JFreeChart e = Charts.lines(String.format(Locale.ROOT, "Image error against time, %d sample runs (law %s, lambda %.2f 1/s)",
                r.traces().size(), c.law.cliName(), c.lambda), "time, s", "image error, px RMS over points (log scale)", err, true);
        Charts.horizontalLine(e, c.convergedPx, "converged below " + c.convergedPx + " px");
        return e;
    }

    /** Camera paths of the sample runs in the reference camera frame, with the goal. */
    public static JFreeChart pathsChart(RehearsalResult r) {
        List<Charts.Series> paths = new ArrayList<>();
        for (RunTrace t : r.traces()) {
            double[] lat = new double[t.timeS().length], ax = t.cameraZMm(), xs = t.cameraXMm(), ys = t.cameraYMm();
            for (int i = 0; i < lat.length; i++) lat[i] = Math.hypot(xs[i], ys[i]);
            paths.add(new Charts.Series(runName(t), lat, ax, null));
        }
        paths.add(new Charts.Series("reference pose (goal)", new double[]{0}, new double[]{0}, Color.BLACK));
        return Charts.lines("Camera paths in the reference camera frame, " + r.traces().size() + " sample runs",
                "distance from the reference optical axis, mm", "offset along the optical axis, mm (negative = retreat from the target)", paths, false);
    }

    /** Outcome of every run over its start offset: the convergence map of the envelope. */
    public static JFreeChart mapChart(RehearsalResult r) {
        Map<RunOutcome, List<RunResult>> by = new EnumMap<>(RunOutcome.class);
        for (RunResult x : r.runs()) by.computeIfAbsent(x.outcome(), k -> new ArrayList<>()).add(x);
        List<Charts.Series> map = new ArrayList<>();
        for (var en : by.entrySet()) {
            double[] xs = en.getValue().stream().mapToDouble(x -> x.start().rotationDeg()).toArray();
            double[] ys = en.getValue().stream().mapToDouble(x -> x.start().translationMm()).toArray();
            map.add(new Charts.Series(en.getKey().label() + " (" + en.getValue().size() + ")", xs, ys, colour(en.getKey())));
        }
        return Charts.scatter(String.format(Locale.ROOT, "Convergence over the start envelope, %d starts", r.runs().size()),
                "start rotation from the reference, deg", "start translation from the reference, mm", map);
    }

    private static String html(RehearsalResult r, ServoSet set, String setName, AtomicOutput out, String prefix) throws IOException {
        RehearsalConfig c = r.config();
        RehearsalResult.Summary s = r.summary();
        StringBuilder b = new StringBuilder();
        b.append("<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\"><title>Servo rehearsal</title>\n<style>")
                .append("body{font-family:sans-serif;max-width:960px;margin:2em auto;color:#222}table{border-collapse:collapse}")
                .append("td,th{border:1px solid #ccc;padding:3px 8px;text-align:left}.safety{background:#fff4d6;border:1px solid #e6a700;padding:8px}")
                .append("img{max-width:100%;border:1px solid #ddd;margin:6px 0}</style></head><body>\n");
        b.append("<h1>Servo rehearsal</h1>\n<p class=\"safety\"><b>Safety.</b> ").append(esc(Safety.NOTICE)).append("</p>\n");
        b.append("<h2>Set</h2>\n<p>").append(esc(setName)).append(": ").append(set.points().size()).append(" points, detector ")
                .append(esc(set.detector())).append(", target ").append(esc(set.targetId())).append(String.format(Locale.ROOT,
                        ", cond(L*) %.2f, sigma_min %.4g. Reference pose: %s.</p>\n", set.condition(), set.sigmaMin(), esc(r.poseMethod())));
        b.append("<table><tr><th>id</th><th>u, px</th><th>v, px</th><th>Z, m</th><th>target X, Y, mm</th></tr>\n");
        for (ServoPoint p : set.points())
            b.append(String.format(Locale.ROOT, "<tr><td>%d</td><td>%.2f</td><td>%.2f</td><td>%.4f</td><td>%.1f, %.1f</td></tr>\n",
                    p.id(), p.u(), p.v(), p.zM(), p.targetXMm(), p.targetYMm()));
        b.append("</table>\n<h2>Settings</h2>\n<p>").append(String.format(Locale.ROOT,
                "%d starts; law %s; lambda %.3g 1/s; depth %s%s; noise %s; dt %.3g s; timeout %.3g s; converged below %.3g px RMS; "
                        + "envelope ±(%.0f, %.0f, %.0f) mm and ±(%.0f, %.0f, %.0f) deg about the reference camera's x, y, z; seed %d.",
                c.starts, c.law.cliName(), c.lambda, c.depthMode.cliName(), c.depthMode.cliName().equals("scaled") ? " x " + c.depthErrorFactor : "",
                Double.isNaN(c.noiseSigmaPx) ? "measured jitter" : c.noiseSigmaPx + " px", c.dtS, c.timeoutS, c.convergedPx,
                c.envelopeMm[0], c.envelopeMm[1], c.envelopeMm[2], c.envelopeDeg[0], c.envelopeDeg[1], c.envelopeDeg[2], c.seed)).append("</p>\n");
        b.append("<h2>Results</h2>\n<table>\n");
        row(b, "converged", String.format(Locale.ROOT, "%d of %d (%.1f %%)", s.converged(), s.runs(), 100 * s.convergenceRate()));
        row(b, "time to converge, median / p95", String.format(Locale.ROOT, "%.2f s / %.2f s", s.medianTimeS(), s.p95TimeS()));
        row(b, "final error, median / p95", String.format(Locale.ROOT, "%.3f px / %.3f px", s.medianFinalErrorPx(), s.p95FinalErrorPx()));
        row(b, "largest retreat along the optical axis", String.format(Locale.ROOT, "%.1f mm (%.2f x the reference distance)", s.maxRetreatMm(), s.maxDepthRatio()));
        row(b, "closest approach to the target plane", String.format(Locale.ROOT, "%.3f m (reference %.3f m)", s.minPlaneDistanceM(), r.referenceDistanceM()));
        row(b, "runs that lost a point out of view", Integer.toString(s.lostFieldOfView()));
        row(b, "starts drawn again (a point out of view)", Integer.toString(s.redrawnStarts()));
        row(b, "runs that lost a track / timed out / retreated / singular", s.trackLost() + " / " + s.timeouts() + " / " + s.retreated() + " / " + s.singular());
        b.append("</table>\n<h2>Warnings</h2>\n");
        if (r.warnings().isEmpty()) b.append("<p>None.</p>\n");
        else {
            b.append("<ul>\n");
            for (String w : org.targetbench.pipeline.Reasons.warnings(r)) b.append("<li>").append(esc(w)).append("</li>\n");
            b.append("</ul>\n");
        }
        b.append("<h2>Charts</h2>\n");
        for (String f : List.of(ERROR_CHART, PATHS_CHART, MAP_CHART))
            b.append("<p><img alt=\"").append(f).append("\" src=\"data:image/png;base64,")
                    .append(Base64.getEncoder().encodeToString(Files.readAllBytes(out.file(prefix + f)))).append("\"></p>\n");
        b.append("<p>Per-run figures: rehearsal.csv. Summary: rehearsal-summary.json.</p>\n</body></html>\n");
        return b.toString();
    }

    private static void row(StringBuilder b, String k, String v) {
        b.append("<tr><th>").append(esc(k)).append("</th><td>").append(esc(v)).append("</td></tr>\n");
    }

    private static String esc(String s) {
        return s.replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;").replace("\"", "&quot;");
    }
}
