package org.targetbench.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.targetbench.TestScenes;
import org.targetbench.source.ImageFiles;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Ctrl-C keeps what is done: sweep, compare and demo run in a child JVM, get SIGINT once they are under way, finish the
 * unit in hand, write complete files for the finished units into --out, say so in one line with the counts and exit
 * with 130. A file of an earlier run in --out comes through untouched, and no staging folder is left.
 */
class InterruptTest {
    @TempDir Path tmp;
    static final Map<String, String> PROGRESS = Map.of("TARGETBENCH_PROGRESS", "1");
    static final long READY_MS = 60_000, END_S = 60;

    /** An --out holding one file of an earlier run. */
    Path earlierOut() throws IOException {
        Path out = tmp.resolve("out");
        Files.createDirectories(out);
        Files.writeString(out.resolve("earlier.txt"), "kept");
        OutputGuardFixture.adopt(out, "earlier.txt");
        return out;
    }

    void assertClean(Path out) throws IOException {
        assertEquals("kept", Files.readString(out.resolve("earlier.txt")));
        try (Stream<Path> s = Files.list(out.getParent())) {
            assertTrue(s.noneMatch(p -> p.getFileName().toString().contains(".partial-")), "staging folder left behind");
        }
    }

    /** Every row of a CSV file has the header's column count and the file ends with a line break; returns the row count. */
    static int completeCsvRows(Path csv) throws IOException {
        String text = Files.readString(csv);
        assertTrue(text.endsWith("\n"), csv + " ends mid-row");
        List<String> lines = text.lines().toList();
        int cols = lines.get(0).split(",", -1).length;
        for (String l : lines) assertEquals(cols, l.split(",", -1).length, csv + ": " + l);
        return lines.size() - 1;
    }

    static Predicate progressed(String label) {
        Pattern p = Pattern.compile(Pattern.quote(label) + " \\[[#.]*\\] [1-9]\\d*/");
        return s -> p.matcher(s).find();
    }

    interface Predicate extends java.util.function.Predicate<String> {}

    @Test
    void sweepKeepsTheFinishedCells() throws Exception {
        Path out = earlierOut();
        ChildJvm c = ChildJvm.start(tmp, List.of("-Xmx512m"), PROGRESS, "sweep", "--target", "target-designs/fixture-cb15/target.json",
                "--detectors", "sift", "--levels", "8", "--views", "2", "--out", out.toString());
        assertTrue(c.awaitErr(progressed("sweeping"), READY_MS), "sweep never got under way: " + c.stderr());
        c.interrupt();
        assertEquals(130, c.waitFor(END_S), c.stderr());
        Matcher m = Pattern.compile("Stopped early: kept (\\d+) of (\\d+) cells").matcher(c.stdout());
        assertTrue(m.find(), c.stdout());
        int kept = Integer.parseInt(m.group(1)), total = Integer.parseInt(m.group(2));
        assertTrue(kept >= 1 && kept < total, c.stdout());
        assertEquals(kept, completeCsvRows(out.resolve("sweep.csv")), "one row per cell");
        completeCsvRows(out.resolve("ranking.csv"));
        assertTrue(Files.readString(out.resolve("report.html")).strip().endsWith("</html>"));
        assertClean(out);
    }

    @Test
    void compareKeepsTheFinishedFrames() throws Exception {
        Path frames = tmp.resolve("frames");
        Files.createDirectories(frames);
        for (int i = 0; i < 30; i++) ImageFiles.writePng(TestScenes.texture(240, 180, i), frames.resolve(String.format("f%02d.png", i)));
        StringBuilder truth = new StringBuilder("{\"reference\":\"f00.png\",\"homographies\":{");
        for (int i = 1; i < 30; i++) truth.append(i > 1 ? "," : "").append(String.format("\"f%02d.png\":[[1,0,0],[0,1,0],[0,0,1]]", i));
        Files.writeString(frames.resolve("truth.json"), truth.append("}}").toString());
        Path out = earlierOut();
        ChildJvm c = ChildJvm.start(tmp, List.of("-Xmx512m"), PROGRESS, "compare", "--frames", frames.toString(), "--detectors", "sift",
                "--out", out.toString());
        assertTrue(c.awaitErr(progressed("detecting"), READY_MS), "compare never got under way: " + c.stderr());
        c.interrupt();
        assertEquals(130, c.waitFor(END_S), c.stderr());
        Matcher m = Pattern.compile("Stopped by Ctrl-C: kept (\\d+) of 30 frames").matcher(c.stdout());
        assertTrue(m.find(), c.stdout());
        int kept = Integer.parseInt(m.group(1));
        assertTrue(kept >= 1 && kept < 30, c.stdout());
        assertEquals(kept - 1, completeCsvRows(out.resolve("repeatability.csv")), "one row per frame but the reference");
        completeCsvRows(out.resolve("detections.csv"));
        new ObjectMapper().readTree(out.resolve("summary.json").toFile());
        assertClean(out);
    }

    @Test
    void demoKeepsTheFinishedStages() throws Exception {
        Path out = earlierOut();
        ChildJvm c = ChildJvm.start(tmp, List.of("-Xmx1g"), PROGRESS, "demo", "--detectors", "fast", "--out", out.toString());
        assertTrue(c.awaitErr(progressed("stress sweep"), READY_MS), "demo never reached its sweep: " + c.stderr());
        c.interrupt();
        assertEquals(130, c.waitFor(END_S), c.stderr());
        assertTrue(c.stdout().contains("Stopped by Ctrl-C: kept 3 of 6 stages"), c.stdout());
        for (String f : new String[]{"target.json", "camera.json", "poses.json", "frames/truth.json", "summary.json", "sweep/report.html"})
            assertTrue(Files.isRegularFile(out.resolve(f)), f);
        completeCsvRows(out.resolve("repeatability.csv"));
        completeCsvRows(out.resolve("sweep/sweep.csv"));
        assertFalse(Files.exists(out.resolve("servo-set.json")), "a stage after the interrupt ran");
        assertClean(out);
    }
}
