package org.targetbench.cli;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.targetbench.pipeline.DemoScenario;
import org.targetbench.source.TargetFile;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/** The sweep command as a user runs it: outputs, byte-for-byte reruns, and one-line refusals of bad input. */
class SweepCommandTest {
    @TempDir static Path tmp;
    static Path target;

    @BeforeAll
    static void writeTarget() throws IOException {
        target = tmp.resolve("target.json");
        TargetFile.write(DemoScenario.target(), target);
    }

    static String[] small(String out, String... more) {
        List<String> a = new java.util.ArrayList<>(List.of("sweep", "--target", target.toString(), "--views", "2", "--levels", "3",
                "--kinds", "noise,viewpoint.rotation", "--detectors", "fast,shi-tomasi", "--out", out));
        a.addAll(List.of(more));
        return a.toArray(String[]::new);
    }

    @Test
    void writesCsvRankingAndReportAndRerunsByteForByte() throws IOException {
        Path a = tmp.resolve("a"), b = tmp.resolve("b");
        Path env = tmp.resolve("envelope.json");
        Files.writeString(env, "{\"worst\": {\"noise.gaussian\": 10, \"viewpoint.rotation\": 90}}");
        Cli.Result r1 = Cli.run(small(a.toString(), "--envelope", env.toString()));
        assertEquals(0, r1.exit(), r1.err());
        assertTrue(r1.out().contains("Ranking over the operating envelope"), r1.out());
        Cli.Result r2 = Cli.run(small(b.toString(), "--envelope", env.toString()));
        assertEquals(0, r2.exit(), r2.err());
        for (String f : List.of("sweep.csv", "ranking.csv"))
            assertArrayEquals(Files.readAllBytes(a.resolve(f)), Files.readAllBytes(b.resolve(f)), f + " must be identical on rerun");
        List<String> rows = Files.readAllLines(a.resolve("sweep.csv"));
        assertEquals("detector,kind,parameter,level,value,frame,repeatability,localisation_px,count,coverage,klt_survival", rows.get(0));
        assertTrue(rows.get(1).endsWith(","), "survival left empty unless asked for: " + rows.get(1));
        assertEquals(1 + 2 * 2 * 3 * 2, rows.size(), "detectors x parameters x levels x frames");
        String html = Files.readString(a.resolve("report.html"));
        for (String s : List.of("Verdict over the operating envelope", "alt=\"repeatability vs noise.gaussian\"", "ISO 10218", "cells/s", "data:image/png;base64"))
            assertTrue(html.contains(s), "report lacks " + s);
        assertFalse(html.contains("src=\"http"), "report must open offline");
    }

    @Test
    void measuresKltSurvivalWhenAsked() throws IOException {
        Path out = tmp.resolve("klt");
        Cli.Result r = Cli.run(small(out.toString(), "--track-frames", "3"));
        assertEquals(0, r.exit(), r.err());
        List<String> rows = Files.readAllLines(out.resolve("sweep.csv"));
        for (String row : rows.subList(1, rows.size())) {
            double survival = Double.parseDouble(row.substring(row.lastIndexOf(',') + 1));
            assertTrue(survival >= 0 && survival <= 1, row);
            // the mildest level leaves Shi-Tomasi's points trackable through a slow drift
            if (row.startsWith("shi-tomasi,noise,gaussian,0,")) assertTrue(survival >= 0.9, row);
        }
        assertTrue(Files.readString(out.resolve("report.html")).contains("klt survival vs noise.gaussian"));
        bad("--track-frames must be 0..100", small(tmp.resolve("klt2").toString(), "--track-frames", "500"));
    }

    static void bad(String fragment, String... args) throws IOException {
        Path out = Path.of(args[java.util.Arrays.asList(args).indexOf("--out") + 1]);
        BadInputTest.assertBadInput(out, fragment, args);
    }

    @Test
    void unknownKind() throws IOException {
        bad("unknown kind \"glare\"", "sweep", "--target", target.toString(), "--kinds", "glare", "--out", tmp.resolve("k").toString());
    }

    @Test
    void levelsOutOfRange() throws IOException {
        bad("--levels must be 2..32", "sweep", "--target", target.toString(), "--levels", "1", "--out", tmp.resolve("l").toString());
        Path env = tmp.resolve("env-range.json");
        Files.writeString(env, "{\"worst\": {\"jpeg.quality\": 150}}");
        bad("jpeg.quality level 150.0 is out of range", "sweep", "--target", target.toString(), "--envelope", env.toString(),
                "--out", tmp.resolve("l2").toString());
    }

    @Test
    void malformedEnvelope() throws IOException {
        Path env = tmp.resolve("env-bad.json");
        Files.writeString(env, "{\"worst\": {\"blur.defocus\": 2.0,}");
        bad("malformed JSON", "sweep", "--target", target.toString(), "--envelope", env.toString(), "--out", tmp.resolve("e").toString());
        Files.writeString(env, "{\"worst\": {\"blur.defocus\": \"two\"}}");
        bad("must be a number", "sweep", "--target", target.toString(), "--envelope", env.toString(), "--out", tmp.resolve("e2").toString());
        Files.writeString(env, "{\"worst\": {\"blur.wobble\": 2}}");
        bad("unknown kind", "sweep", "--target", target.toString(), "--envelope", env.toString(), "--out", tmp.resolve("e3").toString());
    }

    @Test
    void noFrames() throws IOException {
        Path empty = tmp.resolve("no-frames");
        Files.createDirectories(empty);
        bad("no PNG or JPEG frames", "sweep", "--frames", empty.toString(), "--out", tmp.resolve("n").toString());
    }

    @Test
    void unwritableOutput() throws IOException {
        Path blocker = tmp.resolve("blocker");
        Files.writeString(blocker, "x");
        BadInputTest.assertBadInput(null, "blocker", "sweep", "--target", target.toString(), "--out", blocker.resolve("x").toString());
    }
}
