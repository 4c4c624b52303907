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
    public static final String HEADER = "rank,design,feasibility,best_detector,envelope_score,points,robust_points,best_cond,best_sigma_min,coverage,servo_note";

    private ShootoutWriter() {}

    public static void write(List<ShootoutRun.Entry> entries, Path file) throws IOException {
        try (BufferedWriter w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            w.write(HEADER + "\n");
            for (ShootoutRun.Entry e : entries)
                w.write(e.rank() + "," + Csv.text(e.design().id()) + "," + e.feasibility().overall() + "," + e.bestDetector().cliName() + ","
                        + Csv.num(e.envelopeScore(), 4) + "," + e.points() + "," + e.robustPoints() + "," + Csv.num(e.bestCondition(), 3) + ","
                        + Csv.num(e.bestSigmaMin(), 5) + "," + Csv.num(e.coverage(), 4) + "," + Csv.text(e.servoNote()) + "\n");
        }
    }
}
