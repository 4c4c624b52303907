package org.targetbench.export;

import org.targetbench.pipeline.ShootoutRun;

import java.io.BufferedWriter;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

/** Writes {@code shootout.csv} (layout in docs/formats.md). */
public final class ShootoutWriter {
    public static final String HEADER = "rank,design,feasibility,best_detector,envelope_score,points,robust_points,best_cond,best_sigma_min,coverage,servo_note,"
            + "matched_detector,matched_envelope_score,matched_points,matched_robust_points,matched_rms_px,"
            + "generic_detector,generic_envelope_score,generic_points,generic_robust_points,generic_rms_px,dot_bias_px,dot_corrected_rms_px";

    private ShootoutWriter() {}

    /** Five columns of one side; empty cells when there is none. */
    private static String side(java.util.Optional<ShootoutRun.Side> s) {
        if (s.isEmpty()) return ",,,,";
        ShootoutRun.Side x = s.get();
        return x.detector().cliName() + "," + Csv.num(x.envelopeScore(), 4) + "," + x.points() + "," + x.robustPoints() + "," + Csv.num(x.localisationRmsPx(), 4);
    }

    public static void write(List<ShootoutRun.Entry> entries, Path file) throws IOException {
        try (BufferedWriter w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            w.write(HEADER + "\n");
            for (ShootoutRun.Entry e : entries)
                w.write(e.rank() + "," + Csv.text(e.design().id()) + "," + e.feasibility().overall() + "," + e.bestDetector().cliName() + ","
                        + Csv.num(e.envelopeScore(), 4) + "," + e.points() + "," + e.robustPoints() + "," + Csv.num(e.bestCondition(), 3) + ","
                        + Csv.num(e.bestSigmaMin(), 5) + "," + Csv.num(e.coverage(), 4) + "," + Csv.text(e.servoNote()) + ","
                        + side(e.sides().stream().filter(ShootoutRun.Side::matched).findFirst()) + ","
                        + side(e.sides().stream().filter(x -> !x.matched()).findFirst()) + "," + Csv.num(e.dotBiasPx(), 4) + ","
                        + Csv.num(e.sides().stream().filter(ShootoutRun.Side::matched).findFirst().map(ShootoutRun.Side::correctedRmsPx).orElse(Double.NaN), 4) + "\n");
        }
    }
}
