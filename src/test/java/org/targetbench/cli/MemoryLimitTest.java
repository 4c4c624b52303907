package org.targetbench.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import javax.imageio.ImageIO;
import java.awt.Color;
import java.awt.image.BufferedImage;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Bounded memory: a run too large for the heap is refused before it starts with one line naming the figure and
 * TARGETBENCH_JAVA_OPTS, exit code 2, never an OutOfMemoryError trace (child JVM with -Xmx256m).
 */
class MemoryLimitTest {
    @TempDir Path tmp;

    @Test
    void aLargeFrameInASmallHeapIsOneLine() throws Exception {
        Path frames = tmp.resolve("big");
        Files.createDirectories(frames);
        BufferedImage bi = new BufferedImage(4000, 3000, BufferedImage.TYPE_BYTE_GRAY);
        var g = bi.createGraphics();
        g.setColor(Color.WHITE);
        for (int i = 0; i < 40; i++) g.fillRect(100 * i, 75 * i, 60, 60);
        g.dispose();
        ImageIO.write(bi, "png", frames.resolve("a.png").toFile());
        ImageIO.write(bi, "png", frames.resolve("b.png").toFile());
        Path out = tmp.resolve("out");
        ChildJvm c = ChildJvm.start(tmp, List.of("-Xmx256m"), Map.of(), "compare", "--frames", frames.toString(), "--out", out.toString());
        assertEquals(2, c.waitFor(60), c.stderr());
        List<String> lines = c.stderr().strip().lines().toList();
        assertEquals(1, lines.size(), c.stderr());
        assertTrue(lines.get(0).startsWith("targetbench: error: 4000 x 3000 px frames") && lines.get(0).contains("TARGETBENCH_JAVA_OPTS=-Xmx"), lines.get(0));
        assertFalse(Files.exists(out) && Files.list(out).findAny().isPresent(), "output written");
    }

    @Test
    void anOutOfMemoryErrorIsOneLineWithExitTwo() {
        java.io.StringWriter s = new java.io.StringWriter();
        assertEquals(Main.EXIT_BAD_INPUT, Main.outOfMemory(new java.io.PrintWriter(s)));
        assertEquals(1, s.toString().strip().lines().count());
        assertTrue(s.toString().contains("TARGETBENCH_JAVA_OPTS=-Xmx"));
    }

    @Test
    void tooManyWorkersDropToFewerWithANote() {
        var dets = List.of(org.targetbench.detect.DetectorConfig.defaults(org.targetbench.detect.DetectorType.SIFT));
        long perWorker = org.targetbench.pipeline.MemoryBudget.perWorker(1000, 1000, dets, 2);
        StringBuilder note = new StringBuilder();
        org.targetbench.pipeline.MemoryBudget.onNotice(note::append);
        try {
            int threads = (int) Math.min(100_000, Runtime.getRuntime().maxMemory() / perWorker * 2 + 2);
            var plan = org.targetbench.pipeline.MemoryBudget.plan(1000, 1000, dets, threads, 2);
            assertTrue(plan.workers() >= 1 && plan.workers() < threads);
            assertTrue(note.toString().contains("TARGETBENCH_JAVA_OPTS"), note.toString());
        } finally {
            org.targetbench.pipeline.MemoryBudget.onNotice(m -> { });
        }
    }
}
