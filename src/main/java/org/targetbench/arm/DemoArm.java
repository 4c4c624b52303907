package org.targetbench.arm;

import java.util.List;

/**
 * The demo arm: a generic six-axis arm of about 0.9 m reach with a spherical wrist (joints 4, 5 and 6 meet in one
 * point). Its parameters are invented for the demo and realistic for the size, and it is not a model of any real
 * product. Standard DH; joint 2 has a -90° offset so that zero joints hold the upper arm upright.
 *
 * <p>With θ5 = 0 the axes of joints 4 and 6 coincide and point the same way (the wrist singularity), so only the sum
 * q4 + q6 moves the flange there.
 */
public final class DemoArm {
    public static final String NAME = "demo arm (invented, not a real product)";

    /** DH rows: a (m), α (rad), d (m), θ offset (rad). Invented. */
    public static final List<DhRow> DH = List.of(
            new DhRow(0.075, -Math.PI / 2, 0.400, 0),
            new DhRow(0.365, 0, 0, -Math.PI / 2),
            new DhRow(0.035, -Math.PI / 2, 0, 0),
            new DhRow(0, Math.PI / 2, 0.385, 0),
            new DhRow(0, -Math.PI / 2, 0, 0),
            new DhRow(0, 0, 0.080, 0));
    /** Joint limits, degrees. Invented. */
    public static final double[] LOWER_DEG = {-170, -110, -120, -185, -125, -350};
    public static final double[] UPPER_DEG = {170, 110, 155, 185, 125, 350};
    /** Joint speed limits, deg/s. Invented. */
    public static final double[] MAX_SPEED_DEG_S = {150, 150, 180, 250, 250, 350};
    /**
     * Joints of the demo's reference view, degrees: the flange points down at the table in front of the base.
     */
    public static final double[] REFERENCE_DEG = {0, 10, 20, 0, 60, 0};

    private DemoArm() {}

    public static ArmModel model() {
        return ArmModel.fromDh(NAME, "demo", true, DhConvention.STANDARD, DH, null, rad(LOWER_DEG), rad(UPPER_DEG), rad(MAX_SPEED_DEG_S));
    }

    /** A URDF description of the same arm (for the URDF reader's checks and as an example). */
    public static String urdf() {
        StringBuilder b = new StringBuilder("<?xml version=\"1.0\"?>\n<robot name=\"targetbench_demo_arm\">\n");
        b.append("  <!-- TargetBench demo arm: invented parameters, not a real product -->\n");
        for (int i = 0; i <= 6; i++) b.append("  <link name=\"link").append(i).append("\"/>\n");
        b.append("  <link name=\"flange\"/>\n");
        // standard DH link i: Rz(θ) Tz(d) Tx(a) Rx(α); joint i turns about z of frame i-1, then the fixed part goes into
        // the origin of the next joint
        double[] prev = Rigid.identity();
        for (int i = 0; i < 6; i++) {
            DhRow r = DH.get(i);
            double[] xyz = Rigid.translation(prev);
            double[] rpy = rpy(prev);
            b.append(String.format(java.util.Locale.ROOT,
                    "  <joint name=\"joint%d\" type=\"revolute\">\n    <parent link=\"link%d\"/>\n    <child link=\"link%d\"/>\n"
                            + "    <origin xyz=\"%.17g %.17g %.17g\" rpy=\"%.17g %.17g %.17g\"/>\n    <axis xyz=\"0 0 1\"/>\n"
                            + "    <limit lower=\"%.17g\" upper=\"%.17g\" velocity=\"%.17g\" effort=\"0\"/>\n  </joint>\n",
                    i + 1, i, i + 1, xyz[0], xyz[1], xyz[2], rpy[0], rpy[1], rpy[2], Math.toRadians(LOWER_DEG[i]), Math.toRadians(UPPER_DEG[i]),
                    Math.toRadians(MAX_SPEED_DEG_S[i])));
            prev = Rigid.mul(Rigid.rotZ(r.thetaOffsetRad()), Rigid.mul(Rigid.trans(r.aM(), 0, r.dM()), Rigid.rotX(r.alphaRad())));
        }
        double[] xyz = Rigid.translation(prev);
        double[] rpy = rpy(prev);
        b.append(String.format(java.util.Locale.ROOT, "  <joint name=\"flange_fixed\" type=\"fixed\">\n    <parent link=\"link6\"/>\n"
                + "    <child link=\"flange\"/>\n    <origin xyz=\"%.17g %.17g %.17g\" rpy=\"%.17g %.17g %.17g\"/>\n  </joint>\n",
                xyz[0], xyz[1], xyz[2], rpy[0], rpy[1], rpy[2]));
        return b.append("</robot>\n").toString();
    }

    /** Roll, pitch, yaw of a rotation with R = Rz(yaw) Ry(pitch) Rx(roll). */
    static double[] rpy(double[] m) {
        double pitch = Math.atan2(-m[8], Math.hypot(m[0], m[4]));
        double roll, yaw;
        if (Math.abs(Math.cos(pitch)) > 1e-9) {
            roll = Math.atan2(m[9], m[10]);
            yaw = Math.atan2(m[4], m[0]);
        } else {
            roll = Math.atan2(-m[6], m[5]);
            yaw = 0;
        }
        return new double[]{roll, pitch, yaw};
    }

    public static double[] rad(double[] deg) {
        double[] r = new double[deg.length];
        for (int i = 0; i < deg.length; i++) r[i] = Math.toRadians(deg[i]);
        return r;
    }
}
