package org.targetbench.arm;

import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;

import java.util.Arrays;
import java.util.List;

/**
 * A serial arm of six revolute joints: forward kinematics, the geometric Jacobian and manipulability.
 *
 * <p>One form covers DH tables and URDF chains: T(q) = F0 · Rot(a1, q1) · F1 · Rot(a2, q2) · … · Rot(a6, q6) · F6, with
 * Fi fixed transforms and ai unit joint axes in the frame before each joint. Standard DH folds Tz(d) Tx(a) Rx(α) (and
 * the joint offset) into the Fi after the joint [1]; modified DH puts Rx(α) Tx(a) before it [2]; a URDF joint's origin
 * (and any fixed joints between) is the F before it, its axis ai [5]. T(q) is the flange (tool) frame in the base frame.
 *
 * <p>The geometric Jacobian J (6 x 6, base frame) maps q̇ to the flange twist (v of the flange origin; ω): column i is
 * (zi × (p - pi); zi) with zi the world axis of joint i and pi a point on it [3, sec. 3.1, from memory].
 * Manipulability w = sqrt(det(J Jᵀ)) [4], which is |det J| for six joints; it is zero at a singularity. Units are mixed
 * (metres and radians), so w compares poses of one arm, not arms.
 *
 * <p>References: [1] J. Denavit, R. S. Hartenberg, ASME J. Appl. Mech. 22, 1955. [2] J. J. Craig, "Introduction to
 * Robotics", 2nd ed., 1989. [3] B. Siciliano, L. Sciavicco, L. Villani, G. Oriolo, "Robotics: Modelling, Planning and
 * Control", Springer 2009. [4] T. Yoshikawa, "Manipulability of robotic mechanisms", IJRR 4(2), 1985. [5] URDF joint
 * element, ROS wiki (open format).
 */
public final class ArmModel {
    public static final int JOINTS = 6;

    private final String name;
    private final String origin;
    private final boolean demo;
    private final double[][] fixed;
    private final double[][] axes;
    private final double[] lower, upper, maxSpeed;
    private final List<DhRow> dh;
    private final DhConvention convention;

    /**
     * @param name     display name
     * @param origin   where it came from ("demo", a file name)
     * @param demo     whether it is the invented demo arm (labelled so in every output)
     * @param fixed    F0..F6, 7 transforms
     * @param axes     a1..a6, unit vectors
     * @param lowerRad lower joint limits, radians (-inf allowed)
     * @param upperRad upper joint limits, radians
     * @param maxSpeedRadS joint speed limits, rad/s, &gt; 0 (+inf allowed)
     * @param dh       the DH table it was built from, or null
     */
    public ArmModel(String name, String origin, boolean demo, double[][] fixed, double[][] axes, double[] lowerRad, double[] upperRad,
                    double[] maxSpeedRadS, List<DhRow> dh, DhConvention convention) {
        if (fixed.length != JOINTS + 1 || axes.length != JOINTS)
            throw new IllegalArgumentException("an arm needs 6 joints (7 fixed transforms, 6 axes), got " + axes.length + " joints");
        if (lowerRad.length != JOINTS || upperRad.length != JOINTS || maxSpeedRadS.length != JOINTS)
            throw new IllegalArgumentException("an arm needs 6 lower, upper and speed limits");
        this.fixed = new double[JOINTS + 1][];
        this.axes = new double[JOINTS][];
        for (int i = 0; i <= JOINTS; i++) {
            if (fixed[i].length != 16 || !Rigid.isRotation(Rigid.rotation(fixed[i]), 1e-6))
                throw new IllegalArgumentException("fixed transform " + i + " is not rigid");
            this.fixed[i] = fixed[i].clone();
        }
        for (int i = 0; i < JOINTS; i++) {
            double[] a = axes[i];
            double n = Math.sqrt(a[0] * a[0] + a[1] * a[1] + a[2] * a[2]);
            if (!(n > 1e-9) || !Double.isFinite(n)) throw new IllegalArgumentException("joint " + (i + 1) + " axis is zero or not finite");
            this.axes[i] = new double[]{a[0] / n, a[1] / n, a[2] / n};
            if (Double.isNaN(lowerRad[i]) || Double.isNaN(upperRad[i]) || !(lowerRad[i] < upperRad[i]))
                throw new IllegalArgumentException("joint " + (i + 1) + " limits must satisfy lower < upper, got " + lowerRad[i] + ", " + upperRad[i]);
            if (!(maxSpeedRadS[i] > 0)) throw new IllegalArgumentException("joint " + (i + 1) + " speed limit must be > 0, got " + maxSpeedRadS[i]);
        }
        this.name = name;
        this.origin = origin;
        this.demo = demo;
        this.lower = lowerRad.clone();
        this.upper = upperRad.clone();
        this.maxSpeed = maxSpeedRadS.clone();
        this.dh = dh == null ? List.of() : List.copyOf(dh);
        this.convention = convention;
    }

    /** An arm from a DH table of exactly 6 rows; {@code tool} (may be null) is appended after the last link. */
    public static ArmModel fromDh(String name, String origin, boolean demo, DhConvention convention, List<DhRow> rows, double[] tool,
                                  double[] lowerRad, double[] upperRad, double[] maxSpeedRadS) {
        if (rows.size() != JOINTS) throw new IllegalArgumentException("a DH table needs 6 joints, got " + rows.size());
        double[][] f = new double[JOINTS + 1][];
        double[][] ax = new double[JOINTS][];
        f[0] = Rigid.identity();
        for (int i = 0; i < JOINTS; i++) {
            DhRow r = rows.get(i);
            ax[i] = new double[]{0, 0, 1};
            if (convention == DhConvention.STANDARD) {
                // Rz(q + off) Tz(d) Tx(a) Rx(α) = Rz(q) · [Rz(off) Tz(d) Tx(a) Rx(α)]
                f[i + 1] = Rigid.mul(Rigid.rotZ(r.thetaOffsetRad()), Rigid.mul(Rigid.trans(r.aM(), 0, r.dM()), Rigid.rotX(r.alphaRad())));
            } else {
                // Rx(α) Tx(a) Rz(q + off) Tz(d): Rx Tx goes before the joint, Rz(off) Tz(d) after it
                f[i] = Rigid.mul(f[i], Rigid.mul(Rigid.rotX(r.alphaRad()), Rigid.trans(r.aM(), 0, 0)));
                f[i + 1] = Rigid.mul(Rigid.rotZ(r.thetaOffsetRad()), Rigid.trans(0, 0, r.dM()));
            }
        }
        if (tool != null) f[JOINTS] = Rigid.mul(f[JOINTS], tool);
        return new ArmModel(name, origin, demo, f, ax, lowerRad, upperRad, maxSpeedRadS, rows, convention);
    }

    /**
     * One joint of a serial chain from base to tip, as a URDF describes it: origin (xyz metres; rpy radians, R = Rz(yaw)
     * Ry(pitch) Rx(roll)) then, for a revolute joint, rotation about its axis.
     */
    public record ChainJoint(String name, boolean revolute, double[] xyz, double[] rpy, double[] axis, double lower, double upper, double velocity) {}

    /** An arm from a chain with exactly 6 revolute joints; fixed joints fold into the transforms around them. */
    public static ArmModel fromChain(String name, String origin, List<ChainJoint> chain) {
        double[][] fixed = new double[JOINTS + 1][];
        double[][] axes = new double[JOINTS][];
        double[] lo = new double[JOINTS], hi = new double[JOINTS], sp = new double[JOINTS];
        double[] acc = Rigid.identity();
        int n = 0;
        for (ChainJoint j : chain) {
            double[] o = Rigid.fromXyzRpy(j.xyz(), j.rpy());
            if (!j.revolute()) {
                acc = Rigid.mul(acc, o);
                continue;
            }
            if (n == JOINTS) throw new IllegalArgumentException("the chain has more than 6 revolute joints");
            fixed[n] = Rigid.mul(acc, o);
            acc = Rigid.identity();
            axes[n] = j.axis().clone();
            lo[n] = j.lower();
            hi[n] = j.upper();
            sp[n] = j.velocity();
            n++;
        }
        if (n != JOINTS) throw new IllegalArgumentException("the chain has " + n + " revolute joints; 6 are needed");
        fixed[JOINTS] = acc;
        return new ArmModel(name, origin, false, fixed, axes, lo, hi, sp, null, null);
    }

    public String name() { return name; }
    public String origin() { return origin; }
    public boolean isDemo() { return demo; }
    public double[] lowerRad() { return lower.clone(); }
    public double[] upperRad() { return upper.clone(); }
    public double[] maxSpeedRadS() { return maxSpeed.clone(); }
    public double lower(int i) { return lower[i]; }
    public double upper(int i) { return upper[i]; }
    public double maxSpeed(int i) { return maxSpeed[i]; }
    public List<DhRow> dh() { return dh; }
    public DhConvention convention() { return convention; }
    public double[] fixed(int i) { return fixed[i].clone(); }
    public double[] axis(int i) { return axes[i].clone(); }

    /** The same arm without joint position and speed limits. */
    public ArmModel unlimited() {
        double[] inf = new double[JOINTS], ninf = new double[JOINTS];
        Arrays.fill(inf, Double.POSITIVE_INFINITY);
        Arrays.fill(ninf, Double.NEGATIVE_INFINITY);
        return new ArmModel(name, origin, demo, fixed, axes, ninf, inf, inf, dh, convention);
    }

    /** The flange pose T(q) in the base frame. */
    public double[] forward(double[] q) {
        double[][] frames = new double[JOINTS + 1][16];
        return frames(q, frames);
    }

    /**
     * Fills {@code out[i]} with the frame just before joint i's rotation (i = 0..5: its axis is ai in that frame) and
     * returns the flange pose; {@code out} needs 7 slots of 16 values, the last receives the flange pose.
     */
    public double[] frames(double[] q, double[][] out) {
        checkJoints(q);
        double[] cur = fixed[0].clone(), rot = new double[16], tmp = new double[16];
        for (int i = 0; i < JOINTS; i++) {
            System.arraycopy(cur, 0, out[i], 0, 16);
            Rigid.axisAngle(axes[i], q[i], rot);
            Rigid.mul(cur, rot, tmp);
            Rigid.mul(tmp, fixed[i + 1], cur);
        }
        System.arraycopy(cur, 0, out[JOINTS], 0, 16);
        return out[JOINTS];
    }

    /** The geometric Jacobian in the base frame, rows (vx, vy, vz, ωx, ωy, ωz) of the flange origin. */
    public DMatrixRMaj jacobian(double[] q) {
        DMatrixRMaj j = new DMatrixRMaj(6, JOINTS);
        jacobian(q, new double[JOINTS + 1][16], j);
        return j;
    }

    /** As {@link #jacobian(double[])} into {@code out} (6 x 6) with a caller's frame workspace; returns the flange pose. */
    public double[] jacobian(double[] q, double[][] frames, DMatrixRMaj out) {
        double[] t = frames(q, frames);
        double px = t[3], py = t[7], pz = t[11];
        for (int i = 0; i < JOINTS; i++) {
            double[] f = frames[i];
            double[] a = axes[i];
            double zx = f[0] * a[0] + f[1] * a[1] + f[2] * a[2];
            double zy = f[4] * a[0] + f[5] * a[1] + f[6] * a[2];
            double zz = f[8] * a[0] + f[9] * a[1] + f[10] * a[2];
            double dx = px - f[3], dy = py - f[7], dz = pz - f[11];
            out.set(0, i, zy * dz - zz * dy);
            out.set(1, i, zz * dx - zx * dz);
            out.set(2, i, zx * dy - zy * dx);
            out.set(3, i, zx);
            out.set(4, i, zy);
            out.set(5, i, zz);
        }
        return t;
    }

    /** w = sqrt(det(J Jᵀ)) [4]. */
    public double manipulability(double[] q) {
        return manipulability(jacobian(q));
    }

    /** For a square J, sqrt(det(J Jᵀ)) = |det J|, which keeps full precision near zero [4]. */
    public static double manipulability(DMatrixRMaj j) {
        if (j.numRows == j.numCols) return Math.abs(CommonOps_DDRM.det(j));
        DMatrixRMaj jjt = new DMatrixRMaj(6, 6);
        CommonOps_DDRM.multTransB(j, j, jjt);
        return Math.sqrt(Math.max(0, CommonOps_DDRM.det(jjt)));
    }

    /** Whether every joint is within its limits. */
    public boolean withinLimits(double[] q) {
        for (int i = 0; i < JOINTS; i++) if (q[i] < lower[i] || q[i] > upper[i]) return false;
        return true;
    }

    /** Smallest distance of any joint to either of its limits, radians (negative when outside). */
    public double limitMargin(double[] q) {
        double m = Double.POSITIVE_INFINITY;
        for (int i = 0; i < JOINTS; i++) m = Math.min(m, Math.min(q[i] - lower[i], upper[i] - q[i]));
        return m;
    }

    /** Reach estimate: the sum of the fixed translations' lengths, metres (an upper bound on the distance base-flange). */
    public double reachBoundM() {
        double s = 0;
        for (double[] f : fixed) s += Math.sqrt(f[3] * f[3] + f[7] * f[7] + f[11] * f[11]);
        return s;
    }

    private static void checkJoints(double[] q) {
        if (q.length != JOINTS) throw new IllegalArgumentException("6 joint values needed, got " + q.length);
    }
}
