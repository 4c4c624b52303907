package org.targetbench.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.targetbench.arm.DemoArm;
import org.targetbench.arm.HandEye;
import org.targetbench.arm.HandEyeFixtures;
import org.targetbench.arm.Rigid;
import org.targetbench.camera.Pose;
import org.targetbench.export.ArmWriters;
import org.targetbench.export.ServoSetJson;
import org.targetbench.servo.ServoFixtures;
import org.targetbench.source.CameraFile;
import org.targetbench.source.ImageFiles;
import org.targetbench.source.RenderConfig;
import org.targetbench.source.SyntheticRenderer;
import org.targetbench.source.TargetFile;
import org.targetbench.target.TargetDesign;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import static org.junit.jupiter.api.Assertions.*;
import static org.targetbench.cli.BadInputTest.assertBadInput;

/** 'rehearse --arm' and 'handeye' as a user runs them, and their bad input. */
class ArmCliTest {
    @TempDir static Path tmp;
    static Path set, urdf, handEye;

    @BeforeAll
    static void files() throws IOException {
        set = tmp.resolve("set.json");
        new ObjectMapper().writeValue(set.toFile(), ServoSetJson.toJson(ServoFixtures.centredSquare(100, 0.4)));
        urdf = tmp.resolve("demo.urdf");
        Files.writeString(urdf, DemoArm.urdf());
        handEye = tmp.resolve("handeye.json");
        ArmWriters.writeHandEye(HandEye.demo(), handEye);
    }

    @Test
    void demoArmRehearsesAndWritesItsReport() throws IOException {
        Path out = tmp.resolve("demo-arm");
        Cli.Result r = Cli.run("rehearse", "--set", set.toString(), "--arm", "demo", "--starts", "4", "--latency-frames", "1", "--out", out.toString());
        assertEquals(0, r.exit(), r.err());
        assertTrue(r.out().contains("converged            4 of 4"), r.out());
        assertTrue(r.out().contains("no dynamics, no payload, no collisions"), r.out());
        for (String f : List.of("arm-rehearsal.html", "arm-rehearsal.csv", "arm-rehearsal-summary.json", "arm-joints.png", "arm-manipulability.png",
                "arm-limit-margin.png", "arm-views.png", "handeye.json", "arm.json"))
            assertTrue(Files.isRegularFile(out.resolve(f)), f);
        String html = Files.readString(out.resolve("arm-rehearsal.html"));
        assertTrue(html.contains("invented demo arm") && html.contains("ISO 10218") && html.contains("no collisions"));
        // the arm.json and handeye.json it wrote read back as the same cell
        Path again = tmp.resolve("demo-arm-again");
        Cli.Result r2 = Cli.run("rehearse", "--set", set.toString(), "--arm", out.resolve("arm.json").toString(), "--hand-eye",
                out.resolve("handeye.json").toString(), "--starts", "4", "--latency-frames", "1", "--out", again.toString());
        assertEquals(0, r2.exit(), r2.err());
        assertEquals(Files.readString(out.resolve("arm-rehearsal.csv")), Files.readString(again.resolve("arm-rehearsal.csv")));
    }

    @Test
    void urdfArmRehearsesAndFlagsAPathThroughTheWristSingularity() throws IOException {
        Path starts = tmp.resolve("starts.csv");
        Files.writeString(starts, "q1,q2,q3,q4,q5,q6\n0,10,20,30,6,-30\n");
        Path out = tmp.resolve("urdf-arm");
        Cli.Result r = Cli.run("rehearse", "--set", set.toString(), "--arm", urdf.toString(), "--tip", "flange", "--hand-eye", handEye.toString(),
                "--start-joints", starts.toString(), "--reference-joints", "0,10,20,30,-6,-30", "--lambda", "1", "--out", out.toString());
        assertEquals(0, r.exit(), r.err());
        String html = Files.readString(out.resolve("arm-rehearsal.html"));
        assertTrue(html.contains("wrist singularity crossed"), "flag in the report");
        assertTrue(r.out().contains("crossed or touched the wrist singularity"), r.out());
    }

    @Test
    void badArmInputIsOneLine() throws IOException {
        String ok = DemoArm.urdf();
        Path prismatic = tmp.resolve("prismatic.urdf"), continuous = tmp.resolve("continuous.urdf"), fiveDh = tmp.resolve("five.json"),
                outside = tmp.resolve("outside.csv"), skew = tmp.resolve("skew.json");
        Files.writeString(prismatic, ok.replaceFirst("type=\"revolute\"", "type=\"prismatic\""));
        Files.writeString(continuous, ok.replaceFirst("type=\"revolute\"", "type=\"continuous\""));
        StringBuilder j = new StringBuilder("{\"name\":\"five\",\"convention\":\"standard\",\"joints\":[");
        for (int i = 0; i < 5; i++) j.append(i == 0 ? "" : ",").append("{\"a_m\":0.1,\"alpha_deg\":90,\"d_m\":0,\"min_deg\":-90,\"max_deg\":90,\"max_speed_deg_s\":100}");
        Files.writeString(fiveDh, j.append("]}").toString());
        Files.writeString(outside, "175,10,20,0,60,0\n");
        Files.writeString(skew, "{\"rotation\":[[1,0.1,0],[0,1,0],[0,0,1]],\"translation_m\":[0,0,0.05]}");
        String s = set.toString();
        assertBadInput(tmp.resolve("b1"), "prismatic", "rehearse", "--set", s, "--arm", prismatic.toString(), "--tip", "flange", "--hand-eye", handEye.toString(), "--out", tmp.resolve("b1").toString());
        assertBadInput(tmp.resolve("b2"), "continuous", "rehearse", "--set", s, "--arm", continuous.toString(), "--tip", "flange", "--hand-eye", handEye.toString(), "--out", tmp.resolve("b2").toString());
        assertBadInput(tmp.resolve("b3"), "no link named", "rehearse", "--set", s, "--arm", urdf.toString(), "--tip", "gripper", "--hand-eye", handEye.toString(), "--out", tmp.resolve("b3").toString());
        assertBadInput(tmp.resolve("b4"), "exactly 6", "rehearse", "--set", s, "--arm", fiveDh.toString(), "--hand-eye", handEye.toString(), "--out", tmp.resolve("b4").toString());
        assertBadInput(tmp.resolve("b5"), "outside its limits", "rehearse", "--set", s, "--arm", "demo", "--start-joints", outside.toString(), "--out", tmp.resolve("b5").toString());
        assertBadInput(tmp.resolve("b6"), "not a rigid transform", "rehearse", "--set", s, "--arm", "demo", "--hand-eye", skew.toString(), "--out", tmp.resolve("b6").toString());
    }

    /** Frames of the committed 9 x 7-square board (180° symmetric) rendered from flange poses with a known mount. */
    @Test
    void handEyeRecoversARenderedMountAndRefusesDegenerateViews() throws Exception {
        TargetDesign d = TargetFile.read(Path.of("target-designs/fixture-cb15/target.json"));
        List<double[]> corners = new ArrayList<>();
        for (int r = 0; r < 6; r++)
            for (int c = 0; c < 8; c++) corners.add(new double[]{30 + 15 * c, 30 + 15 * r});
        HandEyeFixtures.Views v = HandEyeFixtures.views(8, 0, 21, 0.0825, 0.0675, corners);
        Path frames = Files.createDirectories(tmp.resolve("he-frames"));
        StringBuilder csv = new StringBuilder("frame,x_m,y_m,z_m,rx,ry,rz\n");
        SyntheticRenderer renderer = new SyntheticRenderer(HandEyeFixtures.VGA, new RenderConfig());
        for (int i = 0; i < v.flange().size(); i++) {
            double[] c = v.trueTargetInCamera().get(i);
            String name = String.format(Locale.ROOT, "view_%02d", i);
            ImageFiles.writePng(renderer.render(d, new Pose(Rigid.rotation(c), Rigid.translation(c))).image(), frames.resolve(name + ".png"));
            double[] f = v.flange().get(i), rv = Rigid.rotationVector(f);
            csv.append(String.format(Locale.ROOT, "%s,%.9f,%.9f,%.9f,%.9f,%.9f,%.9f%n", name, f[3], f[7], f[11], rv[0], rv[1], rv[2]));
        }
        Path poses = tmp.resolve("flange.csv"), cam = tmp.resolve("camera.json"), out = tmp.resolve("he-out/handeye.json");
        Files.writeString(poses, csv.toString());
        CameraFile.write(HandEyeFixtures.VGA, cam);
        Cli.Result r = Cli.run("handeye", "--poses", poses.toString(), "--frames", frames.toString(), "--target", "target-designs/fixture-cb15/target.json",
                "--camera", cam.toString(), "--out", out.toString());
        assertEquals(0, r.exit(), r.err());
        JsonNode j = new ObjectMapper().readTree(out.toFile());
        double[] rot = new double[9], t = new double[3];
        for (int a = 0; a < 3; a++) {
            for (int b = 0; b < 3; b++) rot[a * 3 + b] = j.get("rotation").get(a).get(b).asDouble();
            t[a] = j.get("translation_m").get(a).asDouble();
        }
        double[] x = HandEyeFixtures.trueX(), got = Rigid.of(rot, t);
        // the same bounds as the 0.2 px unit check (0.1 deg, 0.5 mm); measured 0.015 deg and 0.05 mm on these renders
        assertTrue(Math.toDegrees(Rigid.angleBetween(x, got)) < 0.1, "rotation error " + Math.toDegrees(Rigid.angleBetween(x, got)) + " deg\n" + r.out());
        assertTrue(Rigid.distance(x, got) * 1000 < 0.5, "translation error " + Rigid.distance(x, got) * 1000 + " mm\n" + r.out());
        // two poses only: refused before anything is written
        Path two = tmp.resolve("two.csv");
        List<String> lines = Files.readAllLines(poses);
        Files.write(two, lines.subList(0, 3));
        Path out2 = tmp.resolve("he-two/handeye.json");
        assertBadInput(null, "at least 3 views", "handeye", "--poses", two.toString(), "--frames", frames.toString(), "--target",
                "target-designs/fixture-cb15/target.json", "--camera", cam.toString(), "--out", out2.toString());
        assertFalse(Files.exists(out2));
    }
}
