package org.targetbench.cli;

import org.targetbench.formats.PickRefusals;
import org.targetbench.Version;
import org.targetbench.export.AtomicOutput;
import org.targetbench.report.ServoSetExport;
import org.targetbench.export.ServoWriters;
import org.targetbench.pipeline.PickRun;
import org.targetbench.pipeline.Reasons;
import org.targetbench.report.RehearsalReport;
import org.targetbench.select.CandidateConfig;
import org.targetbench.select.Selection;
import org.targetbench.select.SelectConfig;
import org.targetbench.servo.RehearsalConfig;
import org.targetbench.servo.RehearsalResult;
import org.targetbench.servo.Rehearsal;
import org.targetbench.servo.ServoPoint;
import org.targetbench.servo.ServoSet;
import org.targetbench.servo.SetDiagnostics;
import org.targetbench.formats.ResultsFolder;
import org.targetbench.source.SourceException;

import java.io.IOException;
import java.io.PrintWriter;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/** The pick and rehearse steps shared by {@code pick}, {@code rehearse} and {@code demo}: running, writing, printing. */
final class ServoSteps {
    private ServoSteps() {}

    /** Chooses a set; a refusal becomes a {@link NoAcceptableSet}. */
    static PickRun.Result pick(ResultsFolder.Data data, String detector, SelectConfig sc) throws SourceException {
        return pick(data, detector, sc, java.util.Optional.empty());
    }

    /** As above, with survival and jitter measured on a tracking run of the same design ({@code pick --tracks}). */
    static PickRun.Result pick(ResultsFolder.Data data, String detector, SelectConfig sc,
                               java.util.Optional<org.targetbench.source.TrackRunFiles.Data> tracks) throws SourceException {
        PickRun.Result r;
        try {
            r = PickRun.run(data.pickInput(), detector, new CandidateConfig(), sc, Version.get(), ServoWriters.now(), tracks);
        } catch (PickRun.Refused e) {
            throw new SourceException(PickRefusals.explain(e, data.where()));
        }
        if (r.set().isEmpty()) throw new NoAcceptableSet(Reasons.selection(r.selection()));
        return r;
    }

    /** Writes stem.json, stem.csv and stem-selection.csv into the output. */
    static List<String> writePick(PickRun.Result r, AtomicOutput out, String stem) throws IOException {
        return writePick(r, java.util.Optional.empty(), 0, out, stem);
    }

    /**
     * Writes a picked set through the workbench's own export ({@link ServoSetExport}): the set, its selection file and
     * its {@code rehearsal} key (the rehearsal run on exactly this set, with its files under rehearsal/, or "not
     * rehearsed").
     */
    static List<String> writePick(PickRun.Result r, java.util.Optional<RehearsalResult> rehearsal, double elapsedS, AtomicOutput out, String stem)
            throws IOException {
        return ServoSetExport.write(r.set().orElseThrow(), java.util.Optional.of(r.selection()), rehearsal, elapsedS, out, stem, "rehearsal/");
    }

    static void printPick(PickRun.Result r, String from, PrintWriter w) {
        Selection s = r.selection();
        ServoSet set = r.set().orElseThrow();
        w.printf(Locale.ROOT, "Servo set from %s: detector %s, %s; %s.%n", from, r.detector(), Reasons.selection(s), Reasons.search(s.search()));
        w.println("Reference pose: " + r.poseMethod());
        w.printf(Locale.ROOT, "cond(L*) %.2f, sigma_min %.4f (translational columns scaled by Z*), image coverage %.0f%%%n",
                s.condition(), s.sigmaMin(), 100 * s.coverage());
        w.printf(Locale.ROOT, "%5s %8s %8s %8s %16s  %s%n", "id", "u px", "v px", "Z m", "target X,Y mm", "why chosen");
        for (ServoPoint p : set.points())
            w.printf(Locale.ROOT, "%5d %8.2f %8.2f %8.4f %16s  %s%n", p.id(), p.u(), p.v(), p.zM(),
                    String.format(Locale.ROOT, "%.1f,%.1f", p.targetXMm(), p.targetYMm()), p.reason());
        Map<Selection.Why, Integer> why = new LinkedHashMap<>();
        for (Selection.Rejected rj : s.rejected()) why.merge(rj.why(), 1, Integer::sum);
        String b = Reasons.tally(why, true);
        w.println("Rejected " + s.rejected().size() + " candidates" + (b.isEmpty() ? "" : " (" + b + ")") + "; every reason is in the selection CSV.");
        for (SetDiagnostics.Finding f : SetDiagnostics.check(set.points())) w.println("Warning: " + Reasons.finding(f));
        r.betterDesigned().ifPresent(x -> w.println("Note: " + Reasons.betterDesigned(x, r.detector()) + "."));
    }

    /** Refuses sets that must not be rehearsed (fewer than 4 points, collinear), with one line naming the file. */
    static void checkSet(ServoSet set, String name) {
        for (SetDiagnostics.Finding f : SetDiagnostics.check(set.points()))
            if (f.severity() == SetDiagnostics.Severity.ERROR) throw new UserError("servo set " + name + ": " + Reasons.finding(f));
    }

    /** Rehearses and writes rehearsal.csv, rehearsal-summary.json, the charts and rehearsal.html under {@code prefix}. */
    static RehearsalResult rehearse(ServoSet set, String name, RehearsalConfig c, AtomicOutput out, String prefix) throws IOException, InterruptedException {
        long t0 = System.nanoTime();
        RehearsalResult r;
        try {
            r = Rehearsal.run(set, c);
        } catch (IllegalArgumentException e) {
            throw new UserError("servo set " + name + ": " + e.getMessage());
        }
        writeRehearsal(r, set, name, (System.nanoTime() - t0) / 1e9, out, prefix);
        return r;
    }

    /** Writes a rehearsal's rehearsal.csv, rehearsal-summary.json, the charts and rehearsal.html under {@code prefix}. */
    static void writeRehearsal(RehearsalResult r, ServoSet set, String name, double elapsedS, AtomicOutput out, String prefix) throws IOException {
        ServoWriters.writeRehearsalCsv(r, out.file(prefix + "rehearsal.csv"));
        ServoWriters.writeRehearsalSummary(r, name, elapsedS, out.file(prefix + "rehearsal-summary.json"));
        RehearsalReport.write(r, set, name, out, prefix);
    }

    static void printRehearsal(RehearsalResult r, String name, PrintWriter w) {
        RehearsalConfig c = r.config();
        RehearsalResult.Summary s = r.summary();
        w.printf(Locale.ROOT, "Rehearsal of %s: %d starts, law %s, lambda %.2f 1/s, depth %s%s, noise %s, envelope ±(%.0f,%.0f,%.0f) mm ±(%.0f,%.0f,%.0f) deg%n",
                name, c.starts, c.law.cliName(), c.lambda, c.depthMode.cliName(),
                c.depthMode.cliName().equals("scaled") ? " x " + c.depthErrorFactor : "",
                Double.isNaN(c.noiseSigmaPx) ? "measured jitter (none measured = 0 px)" : String.format(Locale.ROOT, "%.2f px", c.noiseSigmaPx),
                c.envelopeMm[0], c.envelopeMm[1], c.envelopeMm[2], c.envelopeDeg[0], c.envelopeDeg[1], c.envelopeDeg[2]);
        w.printf(Locale.ROOT, "  converged            %d of %d (%.1f %%)%n", s.converged(), s.runs(), 100 * s.convergenceRate());
        w.printf(Locale.ROOT, "  time to converge     median %.2f s, p95 %.2f s%n", s.medianTimeS(), s.p95TimeS());
        w.printf(Locale.ROOT, "  final error          median %.3f px, p95 %.3f px (RMS over points)%n", s.medianFinalErrorPx(), s.p95FinalErrorPx());
        w.printf(Locale.ROOT, "  largest retreat      %.1f mm along the optical axis (%.2f x the reference distance)%n", s.maxRetreatMm(), s.maxDepthRatio());
        w.printf(Locale.ROOT, "  closest approach     %.3f m to the target plane (reference %.3f m)%n", s.minPlaneDistanceM(), r.referenceDistanceM());
        w.printf(Locale.ROOT, "  lost out of view     %d runs; lost track %d, timed out %d, retreated %d, singular %d%n",
                s.lostFieldOfView(), s.trackLost(), s.timeouts(), s.retreated(), s.singular());
        if (s.redrawnStarts() > 0)
            w.printf(Locale.ROOT, "  redrawn starts       %d (a point was out of view at the drawn start)%n", s.redrawnStarts());
        for (String warn : Reasons.warnings(r)) w.println("Warning: " + warn);
    }

    /** A run that completed but found no acceptable result: one line on stderr, exit code 1, nothing written. */
    static final class NoAcceptableSet extends RuntimeException {
        NoAcceptableSet(String message) { super(message); }
    }
}
