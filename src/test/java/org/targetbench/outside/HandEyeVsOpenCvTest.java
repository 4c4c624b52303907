package org.targetbench.outside;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.opencv.calib3d.Calib3d;
import org.opencv.core.CvType;
import org.opencv.core.Mat;
import org.targetbench.arm.HandEyeCalibration;
import org.targetbench.arm.HandEyeFixtures;
import org.targetbench.arm.Rigid;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Our Park &amp; Martin hand-eye against OpenCV's {@code calibrateHandEye} (openpnp OpenCV 4.9, test scope, an independent
 * implementation of the same published method) on the same synthetic views.
 */
class HandEyeVsOpenCvTest {
    /** Same method, same data: the two must agree to this. */
    static final double AGREE_DEG = 1e-6, AGREE_MM = 1e-6; // measured: 0 deg and 1e-13 mm apart

    @BeforeAll
    static void load() {
        nu.pattern.OpenCV.loadLocally();
    }

    @Test
    void agreesWithOpenCvPark() {
        HandEyeFixtures.Views v = HandEyeFixtures.views(20, 0.2, 4);
        double[] ours = HandEyeCalibration.calibrate(v.flange(), v.targetInCamera(), v.names(), null).handEye().transform();
        double[] cv = openCv(v, Calib3d.CALIB_HAND_EYE_PARK);
        assertTrue(Math.toDegrees(Rigid.angleBetween(ours, cv)) < AGREE_DEG, "rotation differs by " + Math.toDegrees(Rigid.angleBetween(ours, cv)) + " deg");
        assertTrue(Rigid.distance(ours, cv) * 1000 < AGREE_MM, "translation differs by " + Rigid.distance(ours, cv) * 1000 + " mm");
        // and OpenCV's Tsai & Lenz recovers the same mount within the recovery tolerance
        double[] tsai = openCv(v, Calib3d.CALIB_HAND_EYE_TSAI);
        assertTrue(Math.toDegrees(Rigid.angleBetween(ours, tsai)) < 0.1);
        assertTrue(Rigid.distance(ours, tsai) * 1000 < 0.5);
    }

    static double[] openCv(HandEyeFixtures.Views v, int method) {
        List<Mat> rg = new ArrayList<>(), tg = new ArrayList<>(), rt = new ArrayList<>(), tt = new ArrayList<>();
        for (int i = 0; i < v.flange().size(); i++) {
            rg.add(rot(v.flange().get(i)));
            tg.add(trans(v.flange().get(i)));
            rt.add(rot(v.targetInCamera().get(i)));
            tt.add(trans(v.targetInCamera().get(i)));
        }
        Mat r = new Mat(), t = new Mat();
        Calib3d.calibrateHandEye(rg, tg, rt, tt, r, t, method);
        double[] rr = new double[9], tv = new double[3];
        for (int i = 0; i < 3; i++) {
            for (int j = 0; j < 3; j++) rr[i * 3 + j] = r.get(i, j)[0];
            tv[i] = t.get(i, 0)[0];
        }
        return Rigid.of(rr, tv);
    }

    static Mat rot(double[] m) {
        Mat r = new Mat(3, 3, CvType.CV_64F);
        for (int i = 0; i < 3; i++)
            for (int j = 0; j < 3; j++) r.put(i, j, m[i * 4 + j]);
        return r;
    }

    static Mat trans(double[] m) {
        Mat t = new Mat(3, 1, CvType.CV_64F);
        for (int i = 0; i < 3; i++) t.put(i, 0, m[i * 4 + 3]);
        return t;
    }
}
