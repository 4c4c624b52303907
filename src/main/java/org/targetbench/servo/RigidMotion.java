package org.targetbench.servo;

import georegression.struct.se.Se3_F64;
import georegression.transform.twist.TwistCoordinate_F64;
import georegression.transform.twist.TwistOps_F64;

/**
 * A free-flying rigid body (the camera) driven by a constant twist over each time step: the pose is integrated with
 * the exponential map of se(3), g(t + dt) = g(t) exp(dt ξ̂), where g is the camera pose in the world frame
 * (P_world = R P_camera + T) and ξ = (v, ω) is the body twist in the camera frame, the same twist that the
 * interaction matrix takes [1, sec. 2.3-2.4, from memory]. Exact for a twist held constant over the step.
 * Uses georegression's {@link TwistOps_F64#exponential}. Not thread safe.
 *
 * <p>References: [1] R. Murray, Z. Li, S. Sastry, "A Mathematical Introduction to Robotic Manipulation", CRC 1994.
 */
public final class RigidMotion {
    private final TwistCoordinate_F64 twist = new TwistCoordinate_F64();
    private final Se3_F64 step = new Se3_F64();
    private final Se3_F64 next = new Se3_F64();

    /**
     * Moves {@code cameraToWorld} in place by the body twist held for {@code dt} seconds.
     *
     * @param xi (vx, vy, vz) m/s and (ωx, ωy, ωz) rad/s in the camera frame
     */
    public void integrate(Se3_F64 cameraToWorld, double[] xi, double dt) {
        twist.v.setTo(xi[0], xi[1], xi[2]);
        twist.w.setTo(xi[3], xi[4], xi[5]);
        TwistOps_F64.exponential(twist, dt, step); // pose of the new camera frame in the old one
        step.concat(cameraToWorld, next);           // first step, then the old pose: g exp(dt ξ̂)
        cameraToWorld.setTo(next);
    }
}
