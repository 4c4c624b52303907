package org.targetbench.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.junit.jupiter.api.Test;
import org.targetbench.export.ServoSetCsv;
import org.targetbench.export.ServoSetJson;
import org.targetbench.servo.ServoFixtures;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;

import static org.targetbench.cli.BadInputTest.assertBadInput;

/** Bad servo sets and settings: one line on stderr, exit code 2, no output. */
class ServoBadInputTest {
    private static final ObjectMapper M = new ObjectMapper();
    @TempDir static Path tmp;
    static ObjectNode good;

    @BeforeAll
    static void makeGoodSet() {
        good = ServoSetJson.toJson(ServoFixtures.centredSquare(100, 0.5));
    }

    private static Path write(String name, ObjectNode json) throws IOException {
        Path f = tmp.resolve(name + ".json");
        M.writerWithDefaultPrettyPrinter().writeValue(f.toFile(), json);
        return f;
    }

    private static void assertRehearseRefused(Path set, String fragment, String... extra) throws IOException {
        Path out = tmp.resolve("out-" + set.getFileName() + "-" + Math.abs(fragment.hashCode()));
        String[] args = new String[5 + extra.length];
        args[0] = "rehearse";
        args[1] = "--set";
        args[2] = set.toString();
        args[3] = "--out";
        args[4] = out.toString();
        System.arraycopy(extra, 0, args, 5, extra.length);
        assertBadInput(out, fragment, args);
    }

    @Test
    void fewerThanFourPoints() throws IOException {
        ObjectNode j = good.deepCopy();
        ((ArrayNode) j.get("points")).remove(3);
        assertRehearseRefused(write("three", j), "only 3 points");
    }

    @Test
    void collinearPoints() throws IOException {
        ObjectNode j = good.deepCopy();
        for (int i = 0; i < 4; i++) {
            ObjectNode p = (ObjectNode) j.get("points").get(i);
            double u = 200.0 + 40 * i; // x kept consistent with u through the set's camera
            p.put("v", j.get("camera").get("cy").asDouble()).put("y", 0.0).put("u", u)
                    .put("x", (u - j.get("camera").get("cx").asDouble()) / j.get("camera").get("fx").asDouble());
        }
        assertRehearseRefused(write("collinear", j), "lie on one line");
    }

    @Test
    void pixelEditedWhileNormalisedStayedStale() throws IOException {
        ObjectNode j = good.deepCopy();
        ObjectNode p = (ObjectNode) j.get("points").get(2);
        p.put("u", p.get("u").asDouble() + 40);
        assertRehearseRefused(write("stale-xy", j), "points[2]");
    }

    @Test
    void duplicatedPointsAreCalledDuplicates() throws IOException {
        ObjectNode j = good.deepCopy();
        ArrayNode pts = (ArrayNode) j.get("points");
        for (int i : new int[]{2, 3}) {
            ObjectNode p = (ObjectNode) pts.get(i), q = (ObjectNode) pts.get(i - 2);
            for (String k : new String[]{"u", "v", "x", "y"}) p.put(k, q.get(k).asDouble());
        }
        assertRehearseRefused(write("duplicates", j), "are the same point");
    }

    @Test
    void nanAndNonPositiveDepth() throws IOException {
        Path nan = tmp.resolve("nan.json");
        Files.writeString(nan, M.writerWithDefaultPrettyPrinter().writeValueAsString(good).replaceFirst("\"z_m\" : [0-9.Ee-]+", "\"z_m\" : NaN"));
        assertRehearseRefused(nan, "z_m must be finite");
        ObjectNode j = good.deepCopy();
        ((ObjectNode) j.get("points").get(2)).put("z_m", -0.5);
        assertRehearseRefused(write("negative", j), "points[2].z_m must be a depth > 0 m");
    }

    @Test
    void missingIntrinsics() throws IOException {
        ObjectNode j = good.deepCopy();
        ((ObjectNode) j.get("camera")).remove("fy");
        assertRehearseRefused(write("nofy", j), "camera.fy is missing");
        ObjectNode k = good.deepCopy();
        k.remove("camera");
        assertRehearseRefused(write("nocam", k), "camera is missing");
    }

    @ParameterizedTest
    @ValueSource(strings = {"0", "-0.5", "NaN"})
    void nonPositiveLambda(String lambda) throws IOException {
        assertRehearseRefused(write("good", good), "--lambda must be > 0", "--lambda", lambda);
    }

    @Test
    void unknownVersion() throws IOException {
        ObjectNode j = good.deepCopy();
        j.put("version", 2);
        assertRehearseRefused(write("v2", j), "version is 2");
        Path csv = tmp.resolve("v9.csv");
        ServoSetCsv.write(ServoFixtures.centredSquare(100, 0.5), csv);
        Files.writeString(csv, Files.readString(csv).replace("# version,1", "# version,9"));
        assertRehearseRefused(csv, "version is 9");
    }

    @Test
    void badSettings() throws IOException {
        Path g = write("good2", good);
        assertRehearseRefused(g, "unknown control law", "--law", "fastest");
        assertRehearseRefused(g, "--depth-error must be > 0", "--depth-error", "0");
        assertRehearseRefused(g, "--envelope takes 2 values", "--envelope", "1,2,3");
        assertRehearseRefused(g, "--noise must be >= 0", "--noise", "-1");
    }

    @Test
    void pickNamesTheMissingFile() throws IOException {
        Path dir = tmp.resolve("results-without-camera");
        Files.createDirectories(dir);
        Files.writeString(dir.resolve("summary.json"), "{\"format\": \"targetbench-compare-summary\", \"version\": 1, \"reference_frame\": \"a.png\","
                + " \"image_width\": 64, \"image_height\": 48, \"epsilon_px\": 1.5, \"ranking\": [{\"detector\": \"harris\"}]}");
        Files.writeString(dir.resolve("detections.csv"), "detector,frame,x,y,response,scale\nharris,a.png,10,10,1,2\n");
        assertBadInput(null, "camera.json not found", "pick", "--from", dir.toString());
        assertBadInput(null, "summary.json", "pick", "--from", tmp.toString());
    }
}
