package org.targetbench.report;

import org.targetbench.Version;
import org.targetbench.detect.DetectorType;
import org.targetbench.export.Csv;
import org.targetbench.export.Safety;
import org.targetbench.perturb.Perturbation;
import org.targetbench.pipeline.SweepResult;
import org.targetbench.pipeline.SweepSummary;
import org.targetbench.pipeline.SweepSummary.LevelPoint;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The self-contained run report of a stress sweep ({@code report.html}, charts embedded): the verdict over the
 * operating envelope, the best detector per condition, curves of repeatability and localisation against each
 * parameter, the detectors' points on the target, the run's parameters and the safety notice.
 */
public final class SweepReport {
    private SweepReport() {}

    public static void write(SweepResult r, Map<Perturbation, Double> envelope, Path file) throws IOException {
        Files.writeString(file, html(r, envelope), StandardCharsets.UTF_8);
    }

    public static String html(SweepResult r, Map<Perturbation, Double> envelope) {
        StringBuilder h = new StringBuilder(Html.head("TargetBench stress sweep"));
        h.append("<h1>Stress sweep: which detector still works at the worst the cell will see</h1>\n");
        h.append("<p class=\"muted\">").append(Html.esc(r.description())).append(" &middot; ").append(r.baseFrames())
                .append(" base frames &middot; TargetBench ").append(Html.esc(Version.get())).append(" &middot; ")
                .append(OffsetDateTime.now(ZoneOffset.UTC).format(DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm 'UTC'"))).append("</p>\n");
        if (r.cancelled())
            h.append("<p class=\"safety\"><strong>Incomplete run.</strong> Stopped after ").append(r.cellsDone()).append(" of ")
                    .append(r.cellsTotal()).append(" cells; figures cover the finished cells only.</p>\n");
        h.append(Html.safety(Safety.NOTICE));
        envelopeSection(h, r, envelope);
        perParameterSection(h, r);
        chartsSection(h, r);
        overlaySection(h, r);
        settingsSection(h, r, envelope);
        h.append("<p class=\"muted\">Wall time ").append(String.format(Locale.ROOT, "%.1f s", r.wallSeconds())).append(", ")
                .append(r.cellsDone()).append(" cells (").append(String.format(Locale.ROOT, "%.1f", r.cellsDone() / Math.max(1e-9, r.wallSeconds())))
                .append(" cells/s, each cell all ").append(r.detectors().size()).append(" detectors).</p>\n</body></html>\n");
        return h.toString();
    }

    private static void envelopeSection(StringBuilder h, SweepResult r, Map<Perturbation, Double> envelope) {
        h.append("<h2>Verdict over the operating envelope</h2>\n<p>");
        if (envelope.isEmpty()) h.append("No envelope was given, so every swept level counts. ");
        else {
            List<String> parts = new ArrayList<>();
            for (var e : envelope.entrySet()) parts.add(e.getKey().id() + " up to " + Csv.num(e.getValue(), 4) + " " + e.getKey().unit());
            h.append("Envelope: ").append(Html.esc(String.join("; ", parts))).append(". ");
        }
        h.append("A detector's score is its mean repeatability at the levels inside the envelope, under its <em>weakest</em> condition.</p>\n");
        h.append("<table><tr><th>rank</th><th>detector</th><th>score</th><th>weakest condition</th></tr>\n");
        for (var x : SweepSummary.rankEnvelope(r, envelope))
            h.append("<tr><td class=\"num\">").append(x.rank()).append("</td><td>").append(Html.swatch(Palette.of(x.detector())))
                    .append(Html.esc(x.detector().label())).append("</td><td class=\"num\">").append(fmt(x.score())).append("</td><td>")
                    .append(x.weakest() == null ? "-" : Html.esc(x.weakest().label())).append("</td></tr>\n");
        h.append("</table>\n");
    }

    private static void perParameterSection(StringBuilder h, SweepResult r) {
        h.append("<h2>Best detector per condition</h2>\n<table><tr><th>condition</th><th>range swept</th>");
        for (int i = 1; i <= r.detectors().size(); i++) h.append("<th>").append(i == 1 ? "best" : "#" + i).append("</th>");
        h.append("</tr>\n");
        for (Perturbation p : r.parameters()) {
            double[] v = r.values().get(p);
            h.append("<tr><td>").append(Html.esc(p.label())).append("</td><td>").append(Csv.num(v[0], 3)).append(" &rarr; ")
                    .append(Csv.num(v[v.length - 1], 3)).append("</td>");
            for (var x : SweepSummary.rankParameter(r, p))
                h.append("<td>").append(Html.esc(x.detector().label())).append(" ").append(fmt(x.score())).append("</td>");
            h.append("</tr>\n");
        }
        h.append("</table><p class=\"muted\">Score: mean repeatability over all swept levels (Schmid, Mohr &amp; Bauckhage 2000), "
                + "each level averaged over the base frames.</p>\n");
    }

    private static void chartsSection(StringBuilder h, SweepResult r) {
        h.append("<h2>Curves</h2>\n<div class=\"charts\">\n");
        for (Perturbation p : r.parameters()) {
            String x = p.id() + (p.unit().isEmpty() ? "" : " (" + p.unit() + ")");
            h.append(Html.img(Charts.inlinePng(Charts.yRange(Charts.lines("Repeatability vs " + p.id(), x, "repeatability (fraction, eps "
                    + Csv.num(r.epsilon(), 2) + " px)", lines(r, p, true), false), 0, 1)), "repeatability vs " + p.id()));
            List<Charts.Series> surv = lines(r, p, LevelPoint::kltSurvival);
            if (surv.stream().anyMatch(l -> java.util.Arrays.stream(l.y()).anyMatch(v -> !Double.isNaN(v))))
                h.append(Html.img(Charts.inlinePng(Charts.yRange(Charts.lines("KLT survival vs " + p.id(), x,
                        "tracks alive after the slow motion (fraction)", surv, false), 0, 1.05)), "klt survival vs " + p.id()));
            List<Charts.Series> loc = lines(r, p, false);
            if (loc.stream().anyMatch(l -> java.util.Arrays.stream(l.y()).anyMatch(v -> !Double.isNaN(v))))
                h.append(Html.img(Charts.inlinePng(Charts.lines("Localisation error vs " + p.id(), x,
                        "RMS distance to true feature (px)", loc, false)), "localisation vs " + p.id()));
        }
        h.append("</div>\n<p class=\"muted\">Localisation counts true features with a detection within 3 px; blob detectors "
                + "(SURF-style, SIFT-style) rarely sit on corners, so their localisation curve may be missing.</p>\n");
    }

    private static List<Charts.Series> lines(SweepResult r, Perturbation p, boolean repeatability) {
        return lines(r, p, repeatability ? (LevelPoint x) -> x.repeatability().orElse(Double.NaN) : LevelPoint::localisationPx);
    }

    private static List<Charts.Series> lines(SweepResult r, Perturbation p, java.util.function.ToDoubleFunction<LevelPoint> figure) {
        List<Charts.Series> out = new ArrayList<>();
        for (DetectorType d : r.detectorTypes()) {
            List<LevelPoint> c = SweepSummary.curve(r, d, p);
            double[] xs = new double[c.size()], ys = new double[c.size()];
            for (int i = 0; i < c.size(); i++) {
                xs[i] = c.get(i).value();
                ys[i] = figure.applyAsDouble(c.get(i));
            }
            out.add(new Charts.Series(d.label(), xs, ys, Palette.of(d)));
        }
        return out;
    }

    private static void overlaySection(StringBuilder h, SweepResult r) {
        h.append("<h2>Points on the target</h2>\n<p>Each detector's points on the first unperturbed base frame"
                + (r.sampleTruth().isEmpty() ? "" : "; crosses mark the designed features") + ".</p>\n");
        h.append(Html.img(Charts.png(Overlay.draw(r.sampleImage(), r.sampleDetections(), r.sampleTruth())), "detections on the target"));
    }

    private static void settingsSection(StringBuilder h, SweepResult r, Map<Perturbation, Double> envelope) {
        h.append("<h2>Run settings</h2>\n<table>");
        row(h, "source", r.description());
        row(h, "base frames", Integer.toString(r.baseFrames()));
        row(h, "seed", Long.toString(r.seed()));
        row(h, "repeatability match radius", Csv.num(r.epsilon(), 3) + " px");
        for (Perturbation p : r.parameters()) {
            List<String> v = new ArrayList<>();
            for (double x : r.values().get(p)) v.add(Csv.num(x, 4));
            row(h, p.label(), String.join(", ", v));
        }
        for (var d : r.detectors()) row(h, d.type().label() + " settings", describe(d));
        h.append("</table>\n");
    }

    private static String describe(Object config) {
        List<String> parts = new ArrayList<>();
        for (var f : config.getClass().getFields()) {
            try {
                parts.add(f.getName() + "=" + f.get(config));
            } catch (IllegalAccessException e) {
                parts.add(f.getName() + "=?");
            }
        }
        return String.join(", ", parts);
    }

    private static void row(StringBuilder h, String k, String v) {
        h.append("<tr><th>").append(Html.esc(k)).append("</th><td>").append(Html.esc(v)).append("</td></tr>\n");
    }

    private static String fmt(double v) {
        return Double.isNaN(v) ? "-" : String.format(Locale.ROOT, "%.3f", v);
    }
}
