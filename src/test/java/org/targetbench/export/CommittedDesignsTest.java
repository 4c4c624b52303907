package org.targetbench.export;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.targetbench.source.TargetFile;
import org.targetbench.target.PageSize;
import org.targetbench.target.PrintConfig;
import org.targetbench.target.PrintLayout;
import org.targetbench.target.TargetDesign;
import org.targetbench.target.TargetGenerators;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The committed designs in target-designs/ are what the generators and the sheet writer make today from the
 * parameters recorded in each target.json (so a change to either shows up here, and the files are regenerated with the
 * commands in target-designs/README.md).
 */
class CommittedDesignsTest {
    static Stream<Path> designs() throws Exception {
        return PrintedScaleTest.designs();
    }

    @ParameterizedTest
    @MethodSource("designs")
    void committedFilesMatchTheGenerators(Path dir) throws Exception {
        TargetDesign committed = TargetFile.read(dir.resolve("target.json"));
        assertEquals(dir.getFileName().toString(), committed.id(), "folder named after the target id");
        TargetDesign again = regenerate(committed);
        assertEquals(again, committed, "target.json matches its generator");
        PrintLayout layout = PrintLayout.of(again, PageSize.A4, new PrintConfig()).orElseThrow();
        assertEquals(TargetSvg.toSvg(layout), Files.readString(dir.resolve("target.svg")), "target.svg matches the sheet writer");
    }

    private static TargetDesign regenerate(TargetDesign d) {
        Map<String, Object> p = d.parameters();
        return switch (d.pattern()) {
            case "checkerboard" -> TargetGenerators.checkerboard(d.id(), i(p, "rows"), i(p, "cols"), x(p, "square_mm"), x(p, "margin_mm"));
            case "dots" -> TargetGenerators.dotGrid(d.id(), i(p, "rows"), i(p, "cols"), x(p, "pitch_mm"), x(p, "diameter_mm"), x(p, "margin_mm"));
            case "xcorners" -> TargetGenerators.xCornerField(d.id(), i(p, "count"), x(p, "min_spacing_mm"), x(p, "arm_mm"), x(p, "width_mm"),
                    x(p, "height_mm"), x(p, "margin_mm"), ((Number) p.get("seed")).longValue());
            case "squares" -> TargetGenerators.squareGrid(d.id(), i(p, "rows"), i(p, "cols"), x(p, "square_mm"), x(p, "pitch_mm"), x(p, "margin_mm"));
            case "markers" -> TargetGenerators.markerGrid(d.id(), i(p, "rows"), i(p, "cols"), x(p, "arm_mm"), x(p, "spacing_mm"), x(p, "margin_mm"));
            default -> throw new AssertionError("unexpected pattern " + d.pattern());
        };
    }

    private static int i(Map<String, Object> p, String k) { return ((Number) p.get(k)).intValue(); }
    private static double x(Map<String, Object> p, String k) { return ((Number) p.get(k)).doubleValue(); }
}
