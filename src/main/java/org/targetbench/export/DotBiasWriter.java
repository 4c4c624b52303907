package org.targetbench.export;

import org.targetbench.pipeline.DotBiasTable;

import java.io.BufferedWriter;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

/** Writes {@code dot-bias.csv} (layout in docs/formats.md). */
public final class DotBiasWriter {
    public static final String HEADER = "frame,extra_tilt_deg,dots,mean_bias_px,worst_bias_px";

    private DotBiasWriter() {}

    public static void write(List<DotBiasTable.Row> rows, Path file) throws IOException {
        try (BufferedWriter w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            w.write(HEADER + "\n");
            for (DotBiasTable.Row r : rows)
                w.write(Csv.text(r.frame()) + "," + Csv.num(r.extraTiltDeg(), 3) + "," + r.dots() + "," + Csv.num(r.meanBiasPx(), 4) + ","
                        + Csv.num(r.worstBiasPx(), 4) + "\n");
        }
    }
}
