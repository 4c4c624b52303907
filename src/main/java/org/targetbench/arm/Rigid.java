package org.targetbench.arm;

/**
 * Small helpers for rigid transforms as 4 x 4 homogeneous matrices stored row major in a {@code double[16]}
 * (the last row is 0 0 0 1). A transform T_ab maps a point in frame b to frame a: P_a = R P_b + t.
 */
public final class Rigid {
    private Rigid() {}

    public static double[] identity() {
        double[] m = new double[16];
        m[0] = m[5] = m[10] = m[15] = 1;
        return m;
    }

    /** From a row-major 3 x 3 rotation and a translation. */
    public static double[] of(double[] r, double[] t) {
        return new double[]{r[0], r[1], r[2], t[0], r[3], r[4], r[5], t[1], r[6], r[7], r[8], t[2], 0, 0, 0, 1};
    }

    public static double[] rotation(double[] m) {
        return new double[]{m[0], m[1], m[2], m[4], m[5], m[6], m[8], m[9], m[10]};
    }

    public static double[] translation(double[] m) {
        return new double[]{m[3], m[7], m[11]};
    }

    /** out = a b (out may alias neither). */
    public static void mul(double[] a, double[] b, double[] out) {
        for (int i = 0; i < 3; i++) {
            for (int j = 0; j < 4; j++) {
                double s = a[i * 4] * b[j] + a[i * 4 + 1] * b[4 + j] + a[i * 4 + 2] * b[8 + j];
                if (j == 3) s += a[i * 4 + 3];
                out[i * 4 + j] = s;
            }
        }
        out[12] = out[13] = out[14] = 0;
        out[15] = 1;
    }

    public static double[] mul(double[] a, double[] b) {
        double[] o = new double[16];
        mul(a, b, o);
        return o;
    }

    public static double[] inverse(double[] m) {
        double[] o = new double[16];
        for (int i = 0; i < 3; i++) {
            for (int j = 0; j < 3; j++) o[i * 4 + j] = m[j * 4 + i];
            o[i * 4 + 3] = -(m[i] * m[3] + m[4 + i] * m[7] + m[8 + i] * m[11]);
        }
        o[15] = 1;
        return o;
    }

    /** Translation by (x, y, z). */
    public static double[] trans(double x, double y, double z) {
        double[] m = identity();
        m[3] = x;
        m[7] = y;
        m[11] = z;
        return m;
    }

    public static double[] rotX(double a) {
        double c = Math.cos(a), s = Math.sin(a);
        return new double[]{1, 0, 0, 0, 0, c, -s, 0, 0, s, c, 0, 0, 0, 0, 1};
    }

    public static double[] rotY(double a) {
        double c = Math.cos(a), s = Math.sin(a);
        return new double[]{c, 0, s, 0, 0, 1, 0, 0, -s, 0, c, 0, 0, 0, 0, 1};
    }

    public static double[] rotZ(double a) {
        double c = Math.cos(a), s = Math.sin(a);
        return new double[]{c, -s, 0, 0, s, c, 0, 0, 0, 0, 1, 0, 0, 0, 0, 1};
    }

    /** Rotation by {@code angle} about the unit axis (Rodrigues' formula), written into {@code out}. */
    public static void axisAngle(double[] axis, double angle, double[] out) {
        double x = axis[0], y = axis[1], z = axis[2];
        double c = Math.cos(angle), s = Math.sin(angle), v = 1 - c;
        out[0] = c + x * x * v; out[1] = x * y * v - z * s; out[2] = x * z * v + y * s; out[3] = 0;
        out[4] = y * x * v + z * s; out[5] = c + y * y * v; out[6] = y * z * v - x * s; out[7] = 0;
        out[8] = z * x * v - y * s; out[9] = z * y * v + x * s; out[10] = c + z * z * v; out[11] = 0;
        out[12] = out[13] = out[14] = 0;
        out[15] = 1;
    }

    /** Rotation vector (axis times angle, radians) to a transform without translation. */
    public static double[] fromRotationVector(double rx, double ry, double rz) {
        double a = Math.sqrt(rx * rx + ry * ry + rz * rz);
        double[] m = identity();
        if (a > 0) axisAngle(new double[]{rx / a, ry / a, rz / a}, a, m);
        return m;
    }

    /** Rotation vector (axis times angle, radians, angle in [0, pi]) of the rotation part. */
    public static double[] rotationVector(double[] m) {
        double tr = m[0] + m[5] + m[10];
        double c = Math.max(-1, Math.min(1, (tr - 1) / 2));
        double ang = Math.acos(c);
        double x = m[9] - m[6], y = m[2] - m[8], z = m[4] - m[1];
        double s = Math.sqrt(x * x + y * y + z * z);
        if (ang < 1e-12) return new double[]{0, 0, 0};
        if (Math.PI - ang < 1e-6 || s < 1e-9) {
            // near pi: axis from the diagonal of (R + I) / 2
            double ax = Math.sqrt(Math.max(0, (m[0] + 1) / 2)), ay = Math.sqrt(Math.max(0, (m[5] + 1) / 2)), az = Math.sqrt(Math.max(0, (m[10] + 1) / 2));
            if (ax >= ay && ax >= az) { ay = Math.copySign(ay, m[1] + m[4]); az = Math.copySign(az, m[2] + m[8]); }
            else if (ay >= az) { ax = Math.copySign(ax, m[1] + m[4]); az = Math.copySign(az, m[6] + m[9]); }
            else { ax = Math.copySign(ax, m[2] + m[8]); ay = Math.copySign(ay, m[6] + m[9]); }
            double n = Math.sqrt(ax * ax + ay * ay + az * az);
            return new double[]{ax / n * ang, ay / n * ang, az / n * ang};
        }
        return new double[]{x / s * ang, y / s * ang, z / s * ang};
    }

    /** URDF origin: translation (x, y, z) then fixed-axis roll, pitch, yaw, R = Rz(yaw) Ry(pitch) Rx(roll). */
    public static double[] fromXyzRpy(double[] xyz, double[] rpy) {
        double[] r = mul(rotZ(rpy[2]), mul(rotY(rpy[1]), rotX(rpy[0])));
        r[3] = xyz[0];
        r[7] = xyz[1];
        r[11] = xyz[2];
        return r;
    }

    /** Angle of the relative rotation between two transforms, radians. */
    public static double angleBetween(double[] a, double[] b) {
        double tr = 0;
        for (int i = 0; i < 3; i++)
            for (int k = 0; k < 3; k++) tr += a[k * 4 + i] * b[k * 4 + i];
        return Math.acos(Math.max(-1, Math.min(1, (tr - 1) / 2)));
    }

    /** Distance between the translations of two transforms. */
    public static double distance(double[] a, double[] b) {
        return Math.sqrt(sq(a[3] - b[3]) + sq(a[7] - b[7]) + sq(a[11] - b[11]));
    }

    private static double sq(double v) { return v * v; }

    /**
     * Whether a row-major 3 x 3 matrix is a proper rotation within {@code tol} (RᵀR = I and det R = 1).
     */
    public static boolean isRotation(double[] r, double tol) {
        if (r.length != 9) return false;
        for (double v : r) if (!Double.isFinite(v)) return false;
        for (int i = 0; i < 3; i++)
            for (int j = 0; j < 3; j++) {
                double dot = r[i] * r[j] + r[3 + i] * r[3 + j] + r[6 + i] * r[6 + j];
                if (Math.abs(dot - (i == j ? 1 : 0)) > tol) return false;
            }
        double det = r[0] * (r[4] * r[8] - r[5] * r[7]) - r[1] * (r[3] * r[8] - r[5] * r[6]) + r[2] * (r[3] * r[7] - r[4] * r[6]);
        return Math.abs(det - 1) <= tol;
    }
}
