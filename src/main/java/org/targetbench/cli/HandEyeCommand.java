package org.targetbench.cli;

import org.targetbench.arm.HandEye;
import org.targetbench.arm.HandEyeCalibration;
import org.targetbench.arm.Rigid;
import org.targetbench.camera.Calibration;
import org.targetbench.camera.CameraModel;
import org.targetbench.export.ArmWriters;
import org.targetbench.export.AtomicOutput;
import org.targetbench.export.Safety;
import org.targetbench.pipeline.ArmWords;
import org.targetbench.pipeline.HandEyeRun;
import org.targetbench.source.CameraFiles;
import org.targetbench.source.FlangePosesFile;
import org.targetbench.source.ImageFolderSource;
import org.targetbench.source.TargetFile;
import org.targetbench.target.TargetDesign;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;

@Command(name = "handeye", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Estimates the hand-eye transform of an eye-in-hand camera (the camera pose in the flange frame) from flange poses "
                + "and views of a checkerboard target (Park & Martin 1994), with per-view residuals and outlier flags.",
                "A board that looks the same turned by 180 degrees has each view's turn resolved through AX = XB consistency.",
                "Writes handeye.json (P_flange = rotation * P_camera + translation_m)."})
final class HandEyeCommand implements Callable<Integer> {
    @Spec CommandSpec spec;

    @Option(names = "--poses", required = true, paramLabel = "FLANGE_POSES.csv",
            description = "Flange pose in the robot base per frame: frame,x_m,y_m,z_m,rx,ry,rz (rotation vector, rad) or frame,x_m,y_m,z_m,qw,qx,qy,qz.")
    Path poses;
    @Option(names = "--frames", required = true, paramLabel = "DIR", description = "Folder of the camera's frames, named as in the poses file.")
    Path frames;
    @Option(names = "--target", required = true, paramLabel = "T.json", description = "The target design (a checkerboard design).")
    Path target;
    @Option(names = "--camera", required = true, paramLabel = "C", description = "Intrinsics: camera.json, OpenCV YAML or ROS YAML.")
    Path camera;
    @Option(names = "--out", required = true, paramLabel = "FILE", description = "The handeye.json to write.")
    Path out;

    @Override
    public Integer call() throws Exception {
        String fileName = out.getFileName() == null ? "" : out.getFileName().toString();
        if (!fileName.endsWith(".json")) throw new UserError("--out names the .json file to write (e.g. handeye.json), got " + out);
        TargetDesign design = TargetFile.read(target);
        Calibration.Board board = board(design);
        CameraModel cam = CameraFiles.read(camera);
        Map<String, double[]> flange = FlangePosesFile.read(poses);
        if (flange.size() < 3) throw new UserError(ArmWords.handEyeFailure(HandEyeCalibration.Outcome.tooFewViews(flange.size()), poses.toString()));
        HandEyeRun.Result r;
        try (ImageFolderSource src = ImageFolderSource.open(frames, null)) {
            if (src.width() != cam.width() || src.height() != cam.height())
                throw new UserError("frames in " + frames + " are " + src.width() + "x" + src.height() + " but the camera file is for " + cam.width() + "x" + cam.height());
            r = HandEyeRun.run(src, flange, cam, board, new ConsoleProgress("detecting"));
        }
        if (!r.outcome().ok()) {
            String why = ArmWords.handEyeFailure(r.outcome(), null);
            throw new UserError(why + (r.skipped().isEmpty() ? "" : " (" + r.skipped().size() + " frames skipped, first: " + r.skipped().get(0).frame()
                    + ": " + r.skipped().get(0).reason() + ")"));
        }
        HandEye he = r.outcome().handEye();
        Path dir = out.toAbsolutePath().getParent();
        try (AtomicOutput output = AtomicOutput.open(dir)) {
            ArmWriters.writeHandEye(he, output.file(fileName));
            output.commit();
        }
        print(he, r, spec.commandLine().getOut());
        return 0;
    }

    static Calibration.Board board(TargetDesign d) {
        if (!"checkerboard".equals(d.pattern()))
            throw new UserError("handeye finds the target pose on checkerboard designs; " + d.id() + " is a " + d.pattern() + " design");
        Object rows = d.parameters().get("rows"), cols = d.parameters().get("cols"), sq = d.parameters().get("square_mm");
        if (!(rows instanceof Number r) || !(cols instanceof Number c) || !(sq instanceof Number s))
            throw new UserError("checkerboard design " + d.id() + " lacks rows, cols or square_mm");
        return new Calibration.Board(c.intValue() - 1, r.intValue() - 1, s.doubleValue());
    }

    private void print(HandEye he, HandEyeRun.Result r, PrintWriter w) {
        double[] rv = Rigid.rotationVector(he.transform());
        double[] t = he.translationM();
        w.printf(Locale.ROOT, "Hand-eye from %d views (%s)%s:%n", r.used().size(), he.method(),
                r.symmetricBoard() ? "; the board looks the same turned by 180 deg, each view's turn resolved by AX = XB" : "");
        w.printf(Locale.ROOT, "  camera in flange: translation %.2f, %.2f, %.2f mm; rotation vector %.3f, %.3f, %.3f deg%n", t[0] * 1000, t[1] * 1000,
                t[2] * 1000, Math.toDegrees(rv[0]), Math.toDegrees(rv[1]), Math.toDegrees(rv[2]));
        w.printf(Locale.ROOT, "  %-24s %10s %10s%n", "view", "rot, deg", "trans, mm");
        for (HandEye.ViewResidual v : he.views())
            w.printf(Locale.ROOT, "  %-24s %10.3f %10.2f%s%s%n", v.view(), v.rotationDeg(), v.translationMm(), v.flipped() ? "  turned 180 deg" : "",
                    v.outlier() ? "  OUTLIER: check this view's flange pose and image; try without it" : "");
        for (HandEyeRun.Skipped s : r.skipped()) w.println("  skipped " + s.frame() + ": " + s.reason());
        w.println("Written to " + out.toAbsolutePath().normalize());
        w.println("Safety: " + Safety.NOTICE);
        w.flush();
    }
}
