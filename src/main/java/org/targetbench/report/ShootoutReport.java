package org.targetbench.report;

import org.targetbench.Version;
import org.targetbench.camera.FeasibilityReport;
import org.targetbench.export.Safety;
import org.targetbench.export.TargetPreview;
import org.targetbench.perturb.Perturbation;
import org.targetbench.pipeline.ShootoutRun;
import org.targetbench.target.PageSize;
import org.targetbench.target.PrintConfig;
import org.targetbench.target.PrintLayout;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.function.Function;

/** The shoot-out section: one column per design, the figures that matter to a servo cell side by side. */
public final class ShootoutReport {
    private ShootoutReport() {}

    public static void write(List<ShootoutRun.Entry> entries, String camera, double standoffM, double tiltDeg,
                             Map<Perturbation, Double> envelope, Path file) throws IOException {
        StringBuilder h = new StringBuilder(Html.head("TargetBench target shoot-out"));
        h.append("<h1>Target shoot-out: which design for the fixture</h1>\n<p class=\"muted\">").append(entries.size())
                .append(" designs, camera ").append(Html.esc(camera)).append(String.format(Locale.ROOT, ", stand-off %.3f m, tilt up to %.0f deg", standoffM, tiltDeg))
                .append(" &middot; TargetBench ").append(Html.esc(Version.get())).append(" &middot; ")
                .append(OffsetDateTime.now(ZoneOffset.UTC).format(DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm 'UTC'"))).append("</p>\n");
        h.append(Html.safety(Safety.NOTICE));
        h.append("<p>Envelope: ").append(envelope.isEmpty() ? "every swept level." : Html.esc(envelope.toString())).append(" Ranked: feasibility "
                + "failures last, then designs with at least 4 robust points, then the lower best cond(L*), then more robust points, then more coverage.</p>\n");
        h.append("<table><tr><th></th>");
        for (var e : entries) h.append("<th>#").append(e.rank()).append(" ").append(Html.esc(e.design().id())).append("</th>");
        h.append("</tr>\n");
        row(h, entries, "preview", e -> preview(e).map(p -> Html.img(p, "sheet of " + e.design().id()).replace("<img ", "<img width=\"220\" ")).orElse("-"));
        row(h, entries, "design", e -> Html.esc(e.design().name()));
        row(h, entries, "feasibility", e -> e.feasibility().overall() + " (" + e.feasibility().count(FeasibilityReport.Status.WARN) + " warn, "
                + e.feasibility().count(FeasibilityReport.Status.FAIL) + " fail)");
        row(h, entries, "best detector (envelope score)", e -> Html.esc(e.bestDetector().label()) + String.format(Locale.ROOT, " (%.3f)", e.envelopeScore()));
        row(h, entries, "design-matched detector", e -> Html.esc(ShootoutText.matched(e)));
        row(h, entries, "best generic detector", e -> Html.esc(ShootoutText.generic(e)));
        row(h, entries, "dot-centre bias (worst over the views)", e -> Html.esc(ShootoutText.dotBias(e)));
        row(h, entries, "points, square on", e -> Integer.toString(e.points()));
        row(h, entries, "robust across the envelope", e -> Integer.toString(e.robustPoints()));
        row(h, entries, "best 4-point cond(L*)", e -> Double.isNaN(e.bestCondition()) ? "no acceptable set" : String.format(Locale.ROOT, "%.2f", e.bestCondition()));
        row(h, entries, "sigma_min of that set", e -> Double.isNaN(e.bestSigmaMin()) ? "-" : String.format(Locale.ROOT, "%.4f", e.bestSigmaMin()));
        row(h, entries, "image coverage (4 x 4 cells)", e -> String.format(Locale.ROOT, "%.0f %%", 100 * e.coverage()));
        row(h, entries, "servo choice", e -> Html.esc(e.servoNote()));
        h.append("</table>\n<p class=\"muted\">A point is robust when it is found again within 1.5 px in at least ")
                .append(String.format(Locale.ROOT, "%.0f %%", 100 * ShootoutRun.ROBUST_SHARE))
                .append(" of the envelope's conditions. cond(L*) has its translational columns scaled by the reference depth "
                        + "(unit-free); lower is better conditioned. " + Html.esc(ShootoutText.SIDES_NOTE) + "</p>\n</body></html>\n");
        Files.writeString(file, h.toString(), StandardCharsets.UTF_8);
    }

    private static Optional<byte[]> preview(ShootoutRun.Entry e) {
        for (PageSize p : PageSize.NAMED) {
            Optional<PrintLayout> l = PrintLayout.of(e.design(), p, new PrintConfig());
            if (l.isPresent()) return Optional.of(Charts.png(TargetPreview.draw(l.get(), 1)));
        }
        return Optional.empty();
    }

    private static void row(StringBuilder h, List<ShootoutRun.Entry> entries, String name, Function<ShootoutRun.Entry, String> cell) {
        h.append("<tr><th>").append(Html.esc(name)).append("</th>");
        for (var e : entries) h.append("<td>").append(cell.apply(e)).append("</td>");
        h.append("</tr>\n");
    }
}
