package org.targetbench.export;

import org.targetbench.perturb.Perturbation;
import org.targetbench.pipeline.SweepResult;
import org.targetbench.pipeline.SweepRow;
import org.targetbench.pipeline.SweepSummary;

import java.io.BufferedWriter;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

/** Writes {@code sweep.csv} and {@code ranking.csv} (layouts in docs/formats.md). Deterministic for a seed. */
public final class SweepWriter {
    private SweepWriter() {}

    public static void write(SweepResult r, Map<Perturbation, Double> envelope, AtomicOutput out) throws IOException {
        writeRows(r.rows(), out.file("sweep.csv"));
        writeRanking(r, envelope, out.file("ranking.csv"));
    }

    static void writeRows(List<SweepRow> rows, Path file) throws IOException {
        try (BufferedWriter w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            w.write("detector,kind,parameter,level,value,frame,repeatability,localisation_px,count,coverage,klt_survival\n");
            for (SweepRow r : rows)
                w.write(r.detector().cliName() + "," + r.parameter().kind().cliName() + "," + r.parameter().parameterName() + ","
                        + r.level() + "," + Csv.num(r.value(), 6) + "," + r.frame() + ","
                        + (r.repeatability().isPresent() ? Csv.num(r.repeatability().getAsDouble(), 4) : "") + ","
                        + Csv.num(r.localisationPx(), 4) + "," + r.count() + "," + Csv.num(r.coverage(), 4) + "," + Csv.num(r.kltSurvival(), 4) + "\n");
        }
    }

    static void writeRanking(SweepResult r, Map<Perturbation, Double> envelope, Path file) throws IOException {
        try (BufferedWriter w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            w.write("scope,rank,detector,score,weakest_parameter,refinement\n");
            Map<org.targetbench.detect.DetectorType, String> refine = new java.util.EnumMap<>(org.targetbench.detect.DetectorType.class);
            for (var c : r.detectors()) refine.put(c.type(), Csv.text(c.refine.describe()));
            for (var x : SweepSummary.rankEnvelope(r, envelope))
                w.write("envelope," + x.rank() + "," + x.detector().cliName() + "," + Csv.num(x.score(), 4) + ","
                        + (x.weakest() == null ? "" : x.weakest().id()) + "," + refine.get(x.detector()) + "\n");
            for (Perturbation p : r.parameters())
                for (var x : SweepSummary.rankParameter(r, p))
                    w.write(p.id() + "," + x.rank() + "," + x.detector().cliName() + "," + Csv.num(x.score(), 4) + "," + p.id()
                            + "," + refine.get(x.detector()) + "\n");
        }
    }
}
