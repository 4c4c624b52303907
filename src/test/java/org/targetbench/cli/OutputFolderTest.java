package org.targetbench.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.targetbench.source.ImageFiles;
import org.targetbench.TestScenes;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.*;

/**
 * One run per output folder, and user files are never overwritten silently: render into a folder of the user's own
 * frames is refused unless --overwrite; a rerun replaces its own files; a killed run's staging folder is removed by the
 * next run, which says so; a second run into a folder in use fails at once naming the holder's pid.
 */
class OutputFolderTest {
    @TempDir Path tmp;
    static final String TARGET = "target-designs/fixture-cb15/target.json", CAMERA = "target-designs/flange-camera.json";

    Path poses() throws Exception {
        return Files.writeString(tmp.resolve("poses.json"), "{\"poses\":[{\"distance_m\":0.4}]}");
    }

    @Test
    void renderIntoTheUsersFramesIsRefusedUnlessOverwrite() throws Exception {
        Path out = tmp.resolve("mine");
        Files.createDirectories(out);
        ImageFiles.writePng(TestScenes.texture(32, 24, 1), out.resolve("frame_000.png"));
        byte[] before = Files.readAllBytes(out.resolve("frame_000.png"));
        String[] args = {"render", "--target", TARGET, "--camera", CAMERA, "--poses", poses().toString(), "--out", out.toString()};
        Cli.Result r = Cli.run(args);
        assertEquals(2, r.exit(), r.err());
        assertEquals(1, r.err().strip().lines().count(), r.err());
        assertTrue(r.err().contains("did not write (frame_000.png)") && r.err().contains("--overwrite"), r.err());
        assertArrayEquals(before, Files.readAllBytes(out.resolve("frame_000.png")));
        try (var s = Files.list(out)) {
            assertEquals(List.of("frame_000.png"), s.map(p -> p.getFileName().toString()).toList(), "nothing else written");
        }
        Cli.Result forced = Cli.run(append(args, "--overwrite"));
        assertEquals(0, forced.exit(), forced.err());
        assertFalse(java.util.Arrays.equals(before, Files.readAllBytes(out.resolve("frame_000.png"))));
    }

    @Test
    void aRerunReplacesItsOwnFiles() throws Exception {
        Path out = tmp.resolve("own");
        String[] args = {"render", "--target", TARGET, "--camera", CAMERA, "--poses", poses().toString(), "--out", out.toString()};
        assertEquals(0, Cli.run(args).exit());
        Cli.Result again = Cli.run(args);
        assertEquals(0, again.exit(), again.err());
        assertTrue(again.err().isEmpty(), again.err());
    }

    @Test
    void aKilledRunsStagingFolderIsRemovedAndReported() throws Exception {
        Path out = tmp.resolve("res");
        Path stale = tmp.resolve(".res.partial-dead0001");
        Files.createDirectories(stale.resolve("overlays"));
        Files.writeString(stale.resolve("detections.csv"), "detector,frame,x,y,resp\nharris,a.png,1,");
        String[] args = {"render", "--target", TARGET, "--camera", CAMERA, "--poses", poses().toString(), "--out", out.toString()};
        Cli.Result r = Cli.run(args);
        assertEquals(0, r.exit(), r.err());
        assertFalse(Files.exists(stale));
        assertEquals(1, r.err().strip().lines().count(), r.err());
        assertTrue(r.err().contains("removed " + stale) && r.err().contains("killed"), r.err());
    }

    @Test
    void aSecondRunIntoAFolderInUseFailsNamingTheHolder() throws Exception {
        Path out = tmp.resolve("busy");
        ChildJvm first = ChildJvm.start(tmp, List.of("-Xmx512m"), Map.of("TARGETBENCH_PROGRESS", "1"), "sweep", "--target", TARGET,
                "--detectors", "sift", "--levels", "8", "--views", "2", "--out", out.toString());
        try {
            assertTrue(first.awaitErr(s -> s.contains("sweeping"), 60_000), first.stderr());
            Cli.Result second = Cli.run("render", "--target", TARGET, "--camera", CAMERA, "--poses", poses().toString(), "--out", out.toString());
            assertEquals(2, second.exit(), second.err());
            assertEquals(1, second.err().strip().lines().count(), second.err());
            assertTrue(second.err().contains("in use by another targetbench run (pid " + first.process.pid() + ")"), second.err());
        } finally {
            first.process.destroyForcibly();
            first.process.waitFor();
        }
    }

    static String[] append(String[] a, String... more) {
        String[] out = java.util.Arrays.copyOf(a, a.length + more.length);
        System.arraycopy(more, 0, out, a.length, more.length);
        return out;
    }
}
