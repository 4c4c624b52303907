package org.targetbench.cli;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.targetbench.TestScenes;
import org.targetbench.source.ImageFiles;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Bad user input: each case must give exactly one plain line on stderr naming what is wrong and where, exit code 2,
 * no stack trace, and no output files.
 */
class BadInputTest {
    @TempDir static Path tmp;
    static Path good;

    @BeforeAll
    static void makeGoodFolder() throws IOException {
        good = tmp.resolve("good");
        Files.createDirectories(good);
        ImageFiles.writePng(TestScenes.texture(64, 48, 1), good.resolve("a.png"));
        ImageFiles.writePng(TestScenes.texture(64, 48, 2), good.resolve("b.png"));
    }

    /** A copy of the good folder with one change. */
    static Path variant(String name) throws IOException {
        Path d = tmp.resolve(name);
        Files.createDirectories(d);
        try (Stream<Path> s = Files.list(good)) {
            for (Path p : s.toList()) Files.copy(p, d.resolve(p.getFileName()));
        }
        return d;
    }

    static void assertBadInput(Path out, String expectedFragment, String... args) throws IOException {
        Cli.Result r = Cli.run(args);
        assertEquals(2, r.exit(), "exit code; stderr was: " + r.err());
        String[] lines = r.err().strip().split("\\R");
        assertEquals(1, lines.length, "exactly one line on stderr: " + r.err());
        assertTrue(lines[0].startsWith("targetbench: error: "), lines[0]);
        assertTrue(lines[0].contains(expectedFragment), "'" + expectedFragment + "' not in: " + lines[0]);
        assertFalse(r.err().contains("\tat "), "stack trace printed");
        if (out != null) {
            assertTrue(!Files.exists(out) || isEmpty(out), "output left behind in " + out);
            try (Stream<Path> s = Files.list(out.toAbsolutePath().getParent())) {
                assertTrue(s.noneMatch(p -> p.getFileName().toString().contains(".partial-")), "staging folder left behind");
            }
        }
    }

    private static boolean isEmpty(Path dir) throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.findAny().isEmpty();
        }
    }

    private static String out(String name) { return tmp.resolve("out-" + name).toString(); }

    @Test
    void missingFolder() throws IOException {
        assertBadInput(Path.of(out("missing")), "not found", "compare", "--frames", tmp.resolve("nope").toString(), "--out", out("missing"));
    }

    @Test
    void emptyFolder() throws IOException {
        Path d = tmp.resolve("empty");
        Files.createDirectories(d);
        assertBadInput(Path.of(out("empty")), "no PNG or JPEG frames", "compare", "--frames", d.toString(), "--out", out("empty"));
    }

    @Test
    void corruptImage() throws IOException {
        Path d = variant("corrupt");
        Files.writeString(d.resolve("c.png"), "this is not a PNG");
        assertBadInput(Path.of(out("corrupt")), "c.png", "compare", "--frames", d.toString(), "--out", out("corrupt"));
    }

    @Test
    void truncatedImage() throws IOException {
        Path d = variant("truncated");
        byte[] png = Files.readAllBytes(d.resolve("b.png"));
        Files.write(d.resolve("b.png"), Arrays.copyOf(png, png.length / 2));
        assertBadInput(Path.of(out("truncated")), "b.png", "compare", "--frames", d.toString(), "--out", out("truncated"));
    }

    @Test
    void mixedSizes() throws IOException {
        Path d = variant("mixed");
        ImageFiles.writePng(TestScenes.texture(80, 48, 3), d.resolve("c.png"));
        assertBadInput(Path.of(out("mixed")), "mixed frame sizes", "compare", "--frames", d.toString(), "--out", out("mixed"));
    }

    @ParameterizedTest
    @ValueSource(strings = {
            "{\"reference\": \"a.png\", \"homographies\": {\"b.png\": [[1,0,0],[0,1,0],[0,0,NaN]]}}|finite",
            "{\"reference\": \"a.png\", \"homographies\": {\"b.png\": [[1,0,0],[0,1,0],[0,0,-Infinity]]}}|finite",
            "{\"reference\": \"a.png\", \"homographies\": {\"b.png\": [[1,0,0],[0,1,0]]}}|3x3",
            "{\"reference\": \"a.png\", \"homographies\": {\"b.png\": [[1,2,3],[2,4,6],[1,1,1]]}}|singular",
            "{\"reference\": \"a.png\", \"homographies\": {\"x.png\": [[1,0,0],[0,1,0],[0,0,1]]}}|x.png",
            "{\"reference\": \"a.png\", \"homographies\": |malformed JSON"})
    void badTruth(String caseText) throws IOException {
        String[] parts = caseText.split("\\|");
        Path d = variant("truth" + Math.abs(caseText.hashCode()));
        Files.writeString(d.resolve("truth.json"), parts[0]);
        String o = out("truth" + Math.abs(caseText.hashCode()));
        assertBadInput(Path.of(o), parts[1], "compare", "--frames", d.toString(), "--out", o);
    }

    @Test
    void unknownDetector() throws IOException {
        assertBadInput(Path.of(out("det")), "unknown detector \"orb\"", "compare", "--frames", good.toString(), "--detectors", "harris,orb", "--out", out("det"));
    }

    @ParameterizedTest
    @ValueSource(strings = {"0", "-1", "NaN"})
    void nonPositiveEpsilon(String eps) throws IOException {
        assertBadInput(Path.of(out("eps")), "--epsilon", "compare", "--frames", good.toString(), "--epsilon", eps, "--out", out("eps"));
    }

    @Test
    void unwritableOutput() throws IOException {
        Path blocker = tmp.resolve("a-file");
        Files.writeString(blocker, "x");
        assertBadInput(null, "a-file", "compare", "--frames", good.toString(), "--out", blocker.resolve("sub").toString());
        assertBadInput(null, "not a folder", "compare", "--frames", good.toString(), "--out", blocker.toString());
    }

    @Test
    void unknownOptionIsOneLine() throws IOException {
        assertBadInput(null, "--bogus", "compare", "--frames", good.toString(), "--out", out("bogus"), "--bogus");
        assertBadInput(null, "Missing required", "compare", "--frames", good.toString());
    }

    @Test
    void renderWithMissingOrBrokenInputs() throws IOException {
        Path t = tmp.resolve("bad-target.json");
        Files.writeString(t, "{\"id\": \"x\", \"width_mm\": -5, \"height_mm\": 10, \"shapes\": [], \"features\": []}");
        Path cam = tmp.resolve("cam.json");
        Files.writeString(cam, "{\"image_width\": 64, \"image_height\": 48, \"fx\": 50, \"fy\": 50, \"cx\": 32, \"cy\": 24}");
        Path poses = tmp.resolve("poses.json");
        Files.writeString(poses, "{\"poses\": [{\"distance_m\": 0.5}]}");
        assertBadInput(Path.of(out("r1")), "size must be positive", "render", "--target", t.toString(), "--camera", cam.toString(),
                "--poses", poses.toString(), "--out", out("r1"));
        assertBadInput(Path.of(out("r2")), "file not found", "render", "--target", tmp.resolve("none.json").toString(),
                "--camera", cam.toString(), "--poses", poses.toString(), "--out", out("r2"));
        Path badCam = tmp.resolve("badcam.json");
        Files.writeString(badCam, "{\"image_width\": 64, \"image_height\": 48, \"fx\": 50, \"cx\": 32, \"cy\": 24}");
        Path goodTarget = tmp.resolve("t.json");
        org.targetbench.source.TargetFile.write(TestScenes.checkerboard(), goodTarget);
        assertBadInput(Path.of(out("r3")), "fy is missing", "render", "--target", goodTarget.toString(),
                "--camera", badCam.toString(), "--poses", poses.toString(), "--out", out("r3"));
        assertBadInput(Path.of(out("r4")), "supersample", "render", "--target", goodTarget.toString(),
                "--camera", cam.toString(), "--poses", poses.toString(), "--supersample", "2", "--out", out("r4"));
    }
}
