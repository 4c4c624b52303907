package org.targetbench.export;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.targetbench.Version;
import org.targetbench.camera.CalibrationResult;
import org.targetbench.source.CameraFile;
import org.targetbench.source.CameraFiles;

import java.io.BufferedWriter;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.List;

/**
 * Writes a calibration's files beside each other (layouts in docs/formats.md): the intrinsics as {@code STEM.json},
 * {@code STEM.opencv.yml} and {@code STEM.ros.yaml}; the report {@code STEM.calibration.json}; one CSV row per frame
 * {@code STEM.views.csv}. The coverage image {@code STEM.coverage.png} is drawn by
 * {@code report.CoveragePlot}.
 */
public final class CalibrationWriter {
    public static final String FORMAT = "targetbench-calibration";
    private static final ObjectMapper MAPPER = new ObjectMapper();

    private CalibrationWriter() {}

    /** The file names written for {@code stem}, in the order written. */
    public static List<String> names(String stem) {
        return List.of(stem + ".json", stem + ".opencv.yml", stem + ".ros.yaml", stem + ".calibration.json", stem + ".views.csv");
    }

    public static List<String> write(CalibrationResult r, String source, AtomicOutput out, String stem) throws OutputException {
        List<String> n = names(stem);
        try {
            CameraFiles.write(r.camera(), out.file(n.get(0)), CameraFiles.Layout.JSON);
            CameraFiles.write(r.camera(), out.file(n.get(1)), CameraFiles.Layout.OPENCV);
            CameraFiles.write(r.camera(), out.file(n.get(2)), CameraFiles.Layout.ROS);
            MAPPER.writerWithDefaultPrettyPrinter().writeValue(out.file(n.get(3)).toFile(), report(r, source));
            try (BufferedWriter w = Files.newBufferedWriter(out.file(n.get(4)), StandardCharsets.UTF_8)) {
                w.write("frame,used,corners,rms_px,max_px,outlier\n");
                for (CalibrationResult.View v : r.views())
                    w.write(Csv.text(v.name()) + "," + v.found() + "," + v.cornerCount() + "," + Csv.num(v.rmsPx(), 4) + ","
                            + Csv.num(v.maxPx(), 4) + "," + v.outlier() + "\n");
            }
        } catch (IOException e) {
            throw new OutputException("cannot write the calibration into " + out.target() + ": " + AtomicOutput.oneLine(e));
        }
        return n;
    }

    static ObjectNode report(CalibrationResult r, String source) {
        ObjectNode root = MAPPER.createObjectNode();
        root.put("format", FORMAT).put("version", 1);
        root.put("tool", "TargetBench " + Version.get());
        root.put("created_utc", OffsetDateTime.now(ZoneOffset.UTC).format(DateTimeFormatter.ISO_OFFSET_DATE_TIME));
        root.put("frames", source);
        root.putObject("board").put("inner_cols", r.board().innerCols()).put("inner_rows", r.board().innerRows())
                .put("square_mm", r.board().squareMm());
        root.put("method", "BoofCV 1.2.2 x-corner chessboard detection and planar calibration (Zhang 2000), zero skew");
        root.set("camera", CameraFile.toJson(r.camera()));
        root.put("rms_px", r.rmsPx());
        root.put("views_used", r.usedViews()).put("views_offered", r.views().size());
        root.put("coverage_fraction", r.coverageFraction());
        root.putObject("coverage_grid").put("cols", r.coverageCols()).put("rows", r.coverageRows());
        ArrayNode views = root.putArray("views");
        for (CalibrationResult.View v : r.views()) {
            ObjectNode o = views.addObject().put("frame", v.name()).put("used", v.found()).put("corners", v.cornerCount());
            if (v.found()) o.put("rms_px", v.rmsPx()).put("max_px", v.maxPx()).put("outlier", v.outlier());
            else o.putNull("rms_px").putNull("max_px").put("outlier", false);
        }
        root.put("safety", Safety.NOTICE);
        return root;
    }
}
