package org.targetbench.cli;

import boofcv.struct.image.GrayF32;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.targetbench.TestScenes;
import org.targetbench.source.ImageFiles;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Inputs are validated, never guessed: per command, each bad input gives exit code 2, exactly one stderr line naming
 * the file, field or value, and leaves nothing written or changed under --out and no staging folder. The --out of
 * every case already exists with one file of an earlier run in it, which must come through byte for byte.
 */
class StrictInputTest {
    @TempDir static Path tmp;
    static final Path DESIGNS = Path.of("target-designs");
    static final String TARGET = DESIGNS.resolve("fixture-cb15/target.json").toString();
    static final String CAMERA = DESIGNS.resolve("flange-camera.json").toString();

    static Path frames;      // two good PNG frames
    static byte[] jpeg;      // a good JPEG frame

    @BeforeAll
    static void setUp() throws IOException {
        frames = tmp.resolve("frames");
        Files.createDirectories(frames);
        GrayF32 a = TestScenes.texture(96, 72, 1), b = TestScenes.texture(96, 72, 2);
        ImageFiles.writePng(a, frames.resolve("a.png"));
        ImageFiles.writePng(b, frames.resolve("b.png"));
        var bo = new java.io.ByteArrayOutputStream();
        javax.imageio.ImageIO.write(ImageFiles.toBuffered(b), "jpg", bo);
        jpeg = bo.toByteArray();
    }

    static Path folderWith(String name, String file, byte[] bytes) throws IOException {
        Path d = tmp.resolve(name);
        Files.createDirectories(d);
        Files.copy(frames.resolve("a.png"), d.resolve("a.png"));
        if (file != null) Files.write(d.resolve(file), bytes);
        return d;
    }

    static Path text(String name, String content) throws IOException {
        Path f = tmp.resolve(name);
        Files.writeString(f, content);
        return f;
    }

    static String camera(String extra) {
        return "{\"format\":\"targetbench-camera\",\"version\":1,\"image_width\":640,\"image_height\":480,\"fx\":600,\"fy\":600,"
                + "\"cx\":319.5,\"cy\":239.5" + extra + "}";
    }

    static String poses(String pose) {
        return "{\"format\":\"targetbench-poses\",\"version\":1,\"poses\":[" + pose + "]}";
    }

    /** A case: name, the fragment the one stderr line must hold, and the command line with OUT for the output folder. */
    record Case(String name, String fragment, String... args) {
        @Override public String toString() { return name; }
    }

    static Stream<Arguments> cases() throws IOException {
        List<Case> c = new ArrayList<>();
        byte[] half = Arrays.copyOf(jpeg, jpeg.length / 2);
        byte[] halfEoi = Arrays.copyOf(half, half.length + 2);
        halfEoi[half.length] = (byte) 0xFF;
        halfEoi[half.length + 1] = (byte) 0xD9;
        byte[] png = Files.readAllBytes(frames.resolve("b.png"));
        c.add(new Case("compare: JPEG cut in half", "b.jpg", "compare", "--frames", folderWith("cutjpeg", "b.jpg", half).toString(), "--out", "OUT"));
        c.add(new Case("compare: JPEG cut short, closed with EOI", "premature end", "compare", "--frames", folderWith("cuteoi", "b.jpg", halfEoi).toString(), "--out", "OUT"));
        c.add(new Case("sweep --frames: JPEG cut in half", "b.jpg", "sweep", "--frames", folderWith("cutjpeg2", "b.jpg", half).toString(), "--levels", "2", "--out", "OUT"));
        c.add(new Case("compare: PNG cut in half", "b.png", "compare", "--frames",
                folderWith("cutpng", "b.png", Arrays.copyOf(png, png.length * 2 / 3)).toString(), "--out", "OUT"));
        Path dangling = folderWith("dangling", null, null);
        Files.createSymbolicLink(dangling.resolve("b.png"), tmp.resolve("nowhere.png"));
        c.add(new Case("compare: dangling link among the frames", "dangling link", "compare", "--frames", dangling.toString(), "--out", "OUT"));
        Path dup = folderWith("dupkeys", "b.png", png);
        Files.writeString(dup.resolve("truth.json"), "{\"reference\":\"a.png\",\"homographies\":{\"b.png\":[[1,0,0],[0,1,0],[0,0,1]]},"
                + "\"homographies\":{\"b.png\":[[1,0,5],[0,1,0],[0,0,1]]}}");
        c.add(new Case("compare: duplicate key in truth.json", "Duplicate field 'homographies'", "compare", "--frames", dup.toString(), "--out", "OUT"));
        Path unknown = folderWith("unknownkey", "b.png", png);
        Files.writeString(unknown.resolve("truth.json"), "{\"reference\":\"a.png\",\"homographys\":{}}");
        c.add(new Case("compare: unknown top-level key in truth.json", "\"homographys\"", "compare", "--frames", unknown.toString(), "--out", "OUT"));
        Path outside = folderWith("outside", "b.png", png);
        Files.writeString(outside.resolve("truth.json"), "{\"reference\":\"a.png\",\"points\":{\"a.png\":[{\"id\":0,\"u\":600,\"v\":400}]}}");
        c.add(new Case("compare: truth for another image size", "lies outside the 96 x 72 frames", "compare", "--frames", outside.toString(), "--out", "OUT"));
        c.add(new Case("compare: --truth names a folder", "is a folder", "compare", "--frames", frames.toString(), "--truth", tmp.toString(), "--out", "OUT"));
        String poses = text("poses.json", poses("{\"distance_m\":0.4}")).toString();
        c.add(new Case("render: k1 = -5 folds the image", "folds the image", "render", "--target", TARGET, "--camera",
                text("fold.json", camera(",\"distortion\":{\"k1\":-5}")).toString(), "--poses", poses, "--out", "OUT"));
        c.add(new Case("render: k1 = 1e6", "magnifies", "render", "--target", TARGET, "--camera",
                text("huge.json", camera(",\"distortion\":{\"k1\":1e6}")).toString(), "--poses", poses, "--out", "OUT"));
        c.add(new Case("render: principal point outside", "principal point", "render", "--target", TARGET, "--camera",
                text("pp.json", camera("").replace("\"cx\":319.5", "\"cx\":5319.5")).toString(), "--poses", poses, "--out", "OUT"));
        c.add(new Case("render: 100000 px wide camera", "cap of 16384", "render", "--target", TARGET, "--camera",
                text("wide.json", camera("").replace("\"image_width\":640", "\"image_width\":100000")).toString(), "--poses", poses, "--out", "OUT"));
        c.add(new Case("render: pose behind the camera", "poses[0]", "render", "--target", TARGET, "--camera", CAMERA, "--poses",
                text("behind.json", poses("{\"rotation\":[[1,0,0],[0,1,0],[0,0,1]],\"translation_m\":[0,0,-0.3]}")).toString(), "--out", "OUT"));
        c.add(new Case("render: pose at z = 0", "behind", "render", "--target", TARGET, "--camera", CAMERA, "--poses",
                text("zero.json", poses("{\"rotation\":[[1,0,0],[0,1,0],[0,0,1]],\"translation_m\":[0,0,0]}")).toString(), "--out", "OUT"));
        c.add(new Case("render: edge-on pose", "edge-on", "render", "--target", TARGET, "--camera", CAMERA, "--poses",
                text("edge.json", poses("{\"distance_m\":0.5,\"tilt_y_deg\":88}")).toString(), "--out", "OUT"));
        String noFeatures = text("nofeatures.json", Files.readString(Path.of(TARGET)).replaceAll("(?s)\"features\"\\s*:\\s*\\[.*?\\]", "\"features\": []")).toString();
        c.add(new Case("render: design without features", "features is empty", "render", "--target", noFeatures, "--camera", CAMERA, "--poses", poses, "--out", "OUT"));
        c.add(new Case("check: design without features", "nofeatures.json", "check", "--target", noFeatures, "--camera", CAMERA, "--standoff-mm", "300"));
        String covered = text("covered.json", Files.readString(Path.of(TARGET)).replaceFirst("\"shapes\"\\s*:\\s*\\[",
                "\"shapes\": [").replaceFirst("(?s)(\"shapes\"\\s*:\\s*\\[.*?)\\]\\s*,\\s*\"features\"",
                "$1, {\"type\": \"rect\", \"x0\": 0, \"y0\": 0, \"x1\": 1000, \"y1\": 1000, \"grey\": 0.5}], \"features\"")).toString();
        c.add(new Case("shootout: design covered by a later shape", "all hidden", "shootout", "--targets", TARGET + "," + covered, "--camera", CAMERA,
                "--standoff-mm", "300", "--out", "OUT"));
        c.add(new Case("shootout: two designs with one id", "two designs have the id", "shootout", "--targets", TARGET + "," + TARGET, "--camera", CAMERA,
                "--standoff-mm", "300", "--out", "OUT"));
        String negative = text("negative.json", Files.readString(Path.of(TARGET)).replaceFirst("\"width_mm\"\\s*:\\s*[0-9.]+", "\"width_mm\": -5")).toString();
        c.add(new Case("render: negative design size (wording: once 'target')", "design: target size must be positive", "render", "--target", negative,
                "--camera", CAMERA, "--poses", poses, "--out", "OUT"));
        c.add(new Case("rehearse: --set names a folder (wording: not 'file not found')", "is a folder, expected a file", "rehearse", "--set",
                Files.createDirectories(tmp.resolve("set.json")).toString(), "--out", "OUT"));
        // a count of 0 is an error wherever it is not documented to mean something
        String set = text("good-set.json", org.targetbench.export.ServoSetJson.toJson(org.targetbench.servo.ServoFixtures.centredSquare(100, 0.5)).toString()).toString();
        c.add(new Case("rehearse: --starts 0", "--starts", "rehearse", "--set", set, "--starts", "0", "--out", "OUT"));
        c.add(new Case("sweep: --views 0", "--views", "sweep", "--target", TARGET, "--views", "0", "--out", "OUT"));
        c.add(new Case("sweep: --levels 0", "--levels", "sweep", "--target", TARGET, "--levels", "0", "--out", "OUT"));
        c.add(new Case("compare: --max-features 0", "0", "compare", "--frames", frames.toString(), "--max-features", "0", "--out", "OUT"));
        c.add(new Case("pick: --count 0", "--count", "pick", "--from", tmp.toString(), "--count", "0", "--out", "OUT/set.json"));
        c.add(new Case("record: --frame-count 0", "--frame-count must be >= 1", "record", "--source", frames.toString(), "--frame-count", "0", "--out", "OUT/clip.avi"));
        c.add(new Case("design: --count 0", "0", "design", "--pattern", "xcorners", "--count", "0", "--out", "OUT"));
        c.add(new Case("shootout: --views 0", "--views", "shootout", "--targets", TARGET + "," + DESIGNS.resolve("fixture-dots20/target.json"),
                "--camera", CAMERA, "--standoff-mm", "300", "--views", "0", "--out", "OUT"));
        c.add(new Case("calibrate: photo is a dangling link", "dangling link", "calibrate", "--frames", dangling.toString(), "--inner-corners", "9x6",
                "--square-mm", "25", "--out", "OUT/camera.json"));
        c.add(new Case("track: another clip's truth (same frame count and size)", "does not fit the footage", "track", "--source",
                "sample-video/approach.mp4", "--truth", "sample-video/orbit.truth.json", "--out", "OUT"));
        c.add(new Case("track: --frame-count 0", "--frame-count must be >= 1", "track", "--source", frames.toString(), "--frame-count", "0", "--out", "OUT"));
        return c.stream().map(Arguments::of);
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("cases")
    void refusedWithOneLine(Case k) throws IOException {
        Path out = tmp.resolve("out-" + Math.abs(k.name().hashCode()));
        Files.createDirectories(out);
        String[] args = Arrays.stream(k.args()).map(a -> a.startsWith("OUT") ? out + a.substring(3) : a).toArray(String[]::new);
        // an earlier run's file in --out must come through untouched
        Path earlier = out.resolve("earlier.txt");
        Files.writeString(earlier, "kept");
        OutputGuardFixture.adopt(out, "earlier.txt"); // an earlier run's file, so the output-folder guard is not what refuses the run
        Cli.Result r = Cli.run(args);
        assertEquals(2, r.exit(), "exit code; stderr was: " + r.err() + " stdout: " + r.out());
        String[] lines = r.err().strip().split("\\R");
        assertEquals(1, lines.length, "exactly one line on stderr: " + r.err());
        assertTrue(lines[0].startsWith("targetbench: error: "), lines[0]);
        assertTrue(lines[0].contains(k.fragment()), "'" + k.fragment() + "' not in: " + lines[0]);
        assertEquals("kept", Files.readString(earlier));
        try (Stream<Path> s = Files.walk(out)) {
            List<String> names = s.filter(Files::isRegularFile).map(p -> out.relativize(p).toString())
                    .filter(n -> !n.startsWith(".targetbench")).toList();
            assertEquals(List.of("earlier.txt"), names, "files written under --out");
        }
        try (Stream<Path> s = Files.list(out.getParent())) {
            assertTrue(s.noneMatch(p -> p.getFileName().toString().contains(".partial-")), "staging folder left behind");
        }
    }

    @Test
    void sixteenBitPngIsScaledByValueOver257() throws Exception {
        var bi = new java.awt.image.BufferedImage(4, 2, java.awt.image.BufferedImage.TYPE_USHORT_GRAY);
        bi.getRaster().setSample(0, 0, 0, 257 * 100);
        bi.getRaster().setSample(1, 0, 0, 65535);
        Path f = tmp.resolve("g16.png");
        javax.imageio.ImageIO.write(bi, "png", f.toFile());
        GrayF32 g = ImageFiles.read(f);
        assertEquals(100, g.get(0, 0), 1e-4); // the JDK's own conversion gives 168 (a gamma curve)
        assertEquals(255, g.get(1, 0), 1e-4);
        assertEquals(0, g.get(2, 0), 1e-4);
    }
}
